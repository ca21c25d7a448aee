package nearfit.tui.bench;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import nearfit.knn.HeldOutScheme;
import nearfit.knn.KnnSettings;
import nearfit.knn.TuningTable;
import nearfit.table.CsvLoader;
import nearfit.table.LoadOptions;
import nearfit.tui.keys.FitKey;
import nearfit.tui.keys.ViewState;
import nearfit.tui.loop.VirtualScreen;
import nearfit.tui.paint.Look;
import nearfit.tui.results.HeldOutChoice;

/**
 * Holding out by group when one group holds every reference row (issue #12's edge): nothing outside the group is
 * left to predict a row from, so tuning gives leave-one-out's table, says so, and the panel says why; no failure.
 */
class HeldOutOneGroupTest {
    /** 40 rows of unit U1 with power, then 10 of U2 whose power is missing: every reference row is U1's. */
    private static Workbench oneGroupHoldsEveryReferenceRow(Path dir) throws Exception {
        StringBuilder csv = new StringBuilder("unit,wind,power\n");
        for (int i = 0; i < 40; i++) {
            double wind = 3 + i * 0.3;
            csv.append("U1,").append(wind).append(',').append(Math.round(20 * wind * wind + (i % 5) * 7)).append('\n');
        }
        for (int i = 0; i < 10; i++) {
            csv.append("U2,").append(4 + i).append(",\n");
        }
        Path file = Files.writeString(dir.resolve("one-group.csv"), csv, StandardCharsets.UTF_8);
        return CoreWorkbench.of(CsvLoader.load(file, file.toString(), LoadOptions.DEFAULT), file.toString());
    }

    @Test
    void tuningByGroupGivesLeaveOneOutsTableAndSaysSo(@TempDir Path dir) throws Exception {
        Workbench wb = oneGroupHoldsEveryReferenceRow(dir);
        FitKey m = new FitKey("", "power", List.of("wind"), KnnSettings.defaults().withK(1));
        TuningTable byGroup = wb.tune(m, HeldOutChoice.GROUP, "unit", JobControl.NONE);
        TuningTable loo = wb.tune(m, HeldOutChoice.LEAVE_ONE_OUT, null, JobControl.NONE);
        assertEquals(new HeldOutScheme.LeaveOneOut(), byGroup.scheme());
        assertEquals(loo.kmax(), byGroup.kmax());
        assertArrayEquals(loo.rmse(), byGroup.rmse(), 0.0);
        assertEquals("k by leave-one-out", TuningCriterion.figures(byGroup).scheme().words());
    }

    @Test
    void theTuningPanelSaysWhyAndNoFailureIsShown(@TempDir Path dir) throws Exception {
        Workbench wb = oneGroupHoldsEveryReferenceRow(dir);
        ViewState first = ViewState.initial("power", List.of("wind"), 5).edit().groupColumn("unit")
                .heldOut(HeldOutChoice.GROUP).build();
        try (VirtualScreen v = new VirtualScreen(wb, first, 140, 40, new Look(false, true))) {
            assertEquals("", v.explorer.results().failure(), v.text());
            assertTrue(v.row(0).contains("(k by leave-one-out)"), v.row(0));
            v.type("t");
            assertTrue(v.text().contains("tuning, k by leave-one-out (by group does not apply: one group holds every "
                    + "reference row)"), v.text());
        }
    }
}
