package nearfit.tui.bench;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.Arrays;
import java.util.List;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import nearfit.knn.HeldOutBlocks;
import nearfit.knn.HeldOutScheme;
import nearfit.knn.KnnModel;
import nearfit.knn.KnnSettings;
import nearfit.knn.ReferenceData;
import nearfit.knn.Tuning;
import nearfit.knn.TuningTable;
import nearfit.table.CsvLoader;
import nearfit.table.LoadOptions;
import nearfit.tui.keys.FitKey;
import nearfit.tui.results.HeldOutChoice;
import nearfit.tui.results.TuningFigures;

/** The explorer's held-out choices run the core's schemes over the reference rows in the model's order. */
class HeldOutTuningTest {
    private static final int DAYS = 4;
    private static final int PER_DAY = 8;

    @Test
    void daysAndGroupsHeldOutGiveTheCoresTablesForTheirBlocks(@TempDir Path dir) throws Exception {
        int n = DAYS * PER_DAY;
        double[] wind = new double[n];
        double[] power = new double[n];
        long[] millis = new long[n];
        StringBuilder csv = new StringBuilder("time,unit,wind,power\n");
        // File order interleaves the days (row i is on day i mod 4), so a table row is not its day's
        // position. Each day has its own wind range (5 per day, 0.25 between rows) and power 30 above the
        // previous day's, so a row's nearest rows are of its own day unless the day is held out.
        long start = java.time.Instant.parse("2026-03-01T00:00:00Z").toEpochMilli();
        for (int i = 0; i < n; i++) {
            int day = i % DAYS;
            int hour = i / DAYS * 3;
            wind[i] = 5 * day + hour / 12.0;
            power[i] = 10 * wind[i] + 30 * day;
            millis[i] = start + day * 86_400_000L + hour * 3_600_000L;
            csv.append(java.time.Instant.ofEpochMilli(millis[i])).append(",U").append(i % 3).append(',')
                    .append(wind[i]).append(',')
                    .append(power[i]).append('\n');
        }
        Path file = Files.writeString(dir.resolve("days.csv"), csv, StandardCharsets.UTF_8);
        Workbench wb = CoreWorkbench.of(CsvLoader.load(file, file.toString(), LoadOptions.DEFAULT), "days.csv");
        FitKey m = new FitKey("", "power", List.of("wind"), KnnSettings.defaults().withK(1));

        TuningTable days = wb.tune(m, HeldOutChoice.DAYS, null, JobControl.NONE);

        // The same rows, times and settings straight through the core, times looked up by each canonical
        // position's table row (the test's own times, not the table's parse).
        int[] ids = new int[n];
        Arrays.setAll(ids, i -> i);
        KnnModel model = KnnModel.fit(ReferenceData.numeric(new String[] {"wind"}, new double[][] {wind.clone()},
                "power", power.clone(), ids), m.settings());
        int[] canonical = model.data().rowIds();
        long[] times = new long[n];
        for (int i = 0; i < n; i++) {
            times[i] = millis[canonical[i]];
        }
        HeldOutBlocks blocks = HeldOutBlocks.of(new HeldOutScheme.ByBlock(Duration.ofDays(1)), n, null, times);
        assertEquals(DAYS, blocks.count());
        // k up to the rows outside the largest block: 32 - 8.
        TuningTable expected = Tuning.heldOut(model, n - PER_DAY, blocks, -1, Tuning.DEFAULT_SEED, nearfit.knn.Progress.NONE);

        assertEquals(n - PER_DAY, days.kmax());
        assertArrayEquals(expected.rmse(), days.rmse(), 1e-12);
        assertArrayEquals(expected.rmseSe(), days.rmseSe(), 1e-12);
        assertEquals(expected.bestK(), days.bestK());
        assertEquals(expected.oneSeK(), days.oneSeK());
        assertEquals(DAYS, days.blocks());
        assertTrue(days.seOverBlocks());
        assertEquals(new HeldOutScheme.ByBlock(Duration.ofDays(1)), days.scheme());

        // Leave-one-out on the same rows sees each row's own day and so errs less: the choice reaches the core.
        TuningTable loo = wb.tune(m, HeldOutChoice.LEAVE_ONE_OUT, null, JobControl.NONE);
        assertFalse(loo.seOverBlocks());
        assertTrue(loo.rmse()[0] < days.rmse()[0], loo.rmse()[0] + " vs " + days.rmse()[0]);

        // By group: the units U0, U1, U2 (row i is unit i mod 3), codes from the test's own rows.
        TuningTable byUnit = wb.tune(m, HeldOutChoice.GROUP, "unit", JobControl.NONE);
        int[] units = new int[n];
        for (int i = 0; i < n; i++) {
            units[i] = canonical[i] % 3;
        }
        HeldOutBlocks unitBlocks = HeldOutBlocks.of(new HeldOutScheme.ByGroup(), n, units, null);
        assertEquals(3, unitBlocks.count());
        TuningTable expectedByUnit = Tuning.heldOut(model, n - unitBlocks.largest(), unitBlocks, -1,
                Tuning.DEFAULT_SEED, nearfit.knn.Progress.NONE);
        assertArrayEquals(expectedByUnit.rmse(), byUnit.rmse(), 1e-9);
        assertArrayEquals(expectedByUnit.rmseSe(), byUnit.rmseSe(), 1e-9);
        assertEquals(3, byUnit.blocks());
        assertEquals(new HeldOutScheme.ByGroup(), byUnit.scheme());

        // The panel's figures say where k came from.
        TuningFigures figures = TuningCriterion.figures(days);
        assertEquals("k by days held out", figures.scheme().words());
        assertEquals("k by leave-one-out", TuningCriterion.figures(loo).scheme().words());
        assertEquals("k by group", TuningCriterion.figures(byUnit).scheme().words());
    }
}
