package nearfit.tui;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;

import com.googlecode.lanterna.input.KeyStroke;
import nearfit.knn.EstimateKind;
import nearfit.table.CsvLoader;
import nearfit.table.LoadOptions;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The c key switches the curve between the neighbours' mean and median, and the header names it. */
class EstimateKeyTest {
    private final ScriptedWorkbench wb = new ScriptedWorkbench();
    private final KeyContext cx = new KeyContext(wb.columns(), Results.none(1000), 0, 25, 3, 0, true, 5);

    @Test
    void cSwitchesBetweenMeanAndMedianAndTheFitFollows() {
        ViewState s = ViewState.initial("power_kw", List.of("wind_ms"), 20);
        assertEquals(EstimateKind.MEAN, s.estimate());
        ViewState median = KeyPress.next(s, new KeyStroke('c', false, false), cx).state();
        assertEquals(EstimateKind.MEDIAN, median.estimate());
        assertEquals(EstimateKind.MEDIAN, median.model().settings().estimate());
        assertEquals(EstimateKind.MEAN, KeyPress.next(median, new KeyStroke('c', false, false), cx).state().estimate());
    }

    @Test
    void theCommandLineEstimateStartsTheView() {
        List<ColumnInfo> site = List.of(new ColumnInfo("wind_ms", ColumnKind.NUMBER, 0),
                new ColumnInfo("power_kw", ColumnKind.NUMBER, 0));
        ViewState s = new StartSettings(List.of(), null, 0, EstimateKind.MEDIAN).initialState(site, 1000);
        assertEquals(EstimateKind.MEDIAN, s.estimate());
    }

    @Test
    void theWorkbenchDrawsTheMedianCurveWhenAskedForIt(@TempDir Path dir) throws Exception {
        // Every third row of a flat 100 kW line at 40 kW: the mean of ten neighbours is about 80, the median 100.
        StringBuilder sb = new StringBuilder("wind_ms,power_kw\n");
        for (int i = 0; i < 300; i++) {
            sb.append(5 + i * 0.01).append(',').append(i % 3 == 0 ? 40 : 100).append('\n');
        }
        Path csv = Files.writeString(dir.resolve("flat.csv"), sb.toString());
        Workbench wb = CoreWorkbench.of(CsvLoader.load(csv, csv.toString(), LoadOptions.DEFAULT), csv.toString());
        ViewState s = ViewState.initial("power_kw", List.of("wind_ms"), 10);
        CurveRequest q = new CurveRequest("wind_ms", Map.of(), 6, 7, 5, null, -1, false, -1);
        CurveResult mean = wb.curve(s.model(), q, JobControl.NONE);
        CurveResult median = wb.curve(s.edit().estimate(EstimateKind.MEDIAN).build().model(), q, JobControl.NONE);
        for (int i = 0; i < 5; i++) {
            assertEquals(100.0, median.fit()[i], "median at " + q.at(i));
            assertTrue(mean.fit()[i] < 85, "mean at " + q.at(i) + ": " + mean.fit()[i]);
        }
    }

    @Test
    void theHeaderNamesTheMedianAndAKeyPressAsksForANewCurve() throws Exception {
        try (VirtualScreen v = VirtualScreen.standard(wb)) {
            assertTrue(v.row(1).endsWith("band q10-q90") || v.row(1).contains("band q10-q90 "), v.row(1)); // the mean, unnamed
            assertFalse(v.row(1).contains("median"), v.row(1));
            int before = wb.curveCalls.get();
            v.type("c");
            assertTrue(v.row(1).contains("band q10-q90 median"), v.row(1));
            assertTrue(v.text().contains("estimate median"), v.text()); // the status line names the new choice
            assertTrue(wb.curveCalls.get() > before, "the median curve was asked for");
        }
    }
}
