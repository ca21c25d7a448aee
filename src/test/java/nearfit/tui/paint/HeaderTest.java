package nearfit.tui.paint;

import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Map;

import org.junit.jupiter.api.Test;

import com.googlecode.lanterna.input.KeyType;

import nearfit.tui.bench.JobControl;
import nearfit.tui.bench.ScriptedWorkbench;
import nearfit.tui.bench.TuningCriterion;
import nearfit.tui.keys.ViewState;
import nearfit.tui.loop.VirtualScreen;
import nearfit.tui.results.FrameInput;
import nearfit.tui.results.Results;

class HeaderTest {
    private static final String CONDITION = "turbine = T05 and wind_ms > 7.5 and wind_ms < 11 and air_temp_c > -5";
    private final ScriptedWorkbench wb = new ScriptedWorkbench();

    private final ViewState state = ViewState.initial("power_kw", List.of("wind_ms", "air_temp_c"), 20).edit()
            .condition(CONDITION).groupColumn("turbine").group(1).compare(true).build();

    private FrameInput frame() {
        return new FrameInput("/srv/exports/2026-11/wind-site/site-log.csv.gz", 431_000, wb.columns(),
                Map.of("air_temp_c", 12.34), null, List.of("T01", "T02", "T03"), List.of(), Double.NaN,
                wb.loadNotes());
    }

    /** Tuning done (best k 15, one-SE k 30) and flags 40 % through. */
    private Results results() {
        return new Results(null, Double.NaN, TuningCriterion.figures(wb.tune(null, nearfit.tui.results.HeldOutChoice.LEAVE_ONE_OUT, null, JobControl.NONE)), Double.NaN, null, 0.4, 1_234, "");
    }

    @Test
    void kOneSeKBandAndFlagProgressStayVisibleAt100And140Columns() {
        for (int width : new int[] {100, 140}) {
            String one = Header.first(state, results(), frame(), width, false);
            String two = Header.second(state, frame(), width, false);
            assertTrue(one.length() <= width && two.length() <= width, one + "\n" + two);
            assertTrue(one.contains("best k 15, one-SE k 30") && one.contains("flags 40 %"), width + ": " + one);
            assertTrue(two.contains("k=20") && two.contains("band q10-q90"), width + ": " + two);
            // At 100 columns the long condition keeps its first clause whole (the file name gives way first).
            assertTrue(one.contains("where turbine = T05 and "), width + ": " + one);
            assertTrue(width == 100 || one.contains("site-log.csv.gz"), width + ": " + one);
            assertFalse(one.contains("T0…") || one.contains("7.…"), width + ": " + one);
            assertTrue(one.contains("ref"), width + ": " + one);
        }
    }

    @Test
    void theHeaderAndTheTuningPanelSayWhichSchemeTheKComeFrom() throws Exception {
        try (VirtualScreen v = VirtualScreen.standard(wb)) {
            assertTrue(v.row(0).contains("best k 15, one-SE k 30 (k by leave-one-out)"), v.row(0));
            v.type("H");
            assertTrue(v.row(0).contains("best k 15, one-SE k 30 (k by days held out)"), v.row(0));
            v.type("t");
            assertTrue(v.text().contains("tuning, k by days held out: held-out RMSE against log k"), v.text());
            v.key(KeyType.Escape).type("g").key(KeyType.ArrowDown).key(KeyType.Enter).type("H");
            assertTrue(v.row(0).contains("(k by group)"), v.row(0));
        }
        // In a narrow header the scheme stays, in shorter words, while the file name has gone.
        Results days = new Results(null, Double.NaN, TuningCriterion.figures(wb.tune(null,
                nearfit.tui.results.HeldOutChoice.DAYS, null, JobControl.NONE)), Double.NaN, null, 0.4, 1_234, "");
        String one = Header.first(state, days, frame(), 100, false);
        assertTrue(one.contains("best k 15, one-SE k 30, days held out") && one.length() <= 100, one);
    }

    @Test
    void theFilePathGivesWayBeforeTheRowCondition() {
        // One column fewer than the full line: the path alone gives way.
        int full = Header.first(state, results(), frame(), 1000, false).length();
        String one = Header.first(state, results(), frame(), full - 1, false);
        assertFalse(one.contains("/srv/exports"), one);
        assertTrue(one.startsWith("nearfit  site-log.csv.gz") && one.contains(CONDITION), one);
    }

    @Test
    void aWideWindowShowsEverythingInFull() {
        String one = Header.first(state, results(), frame(), 300, false);
        String two = Header.second(state, frame(), 300, false);
        assertTrue(one.startsWith("nearfit  /srv/exports/2026-11/wind-site/site-log.csv.gz  rows 1,234 shown of 431,000"),
                one);
        assertTrue(one.contains("reference: all rows"), one);
        assertTrue(two.contains("metric euclidean, weights uniform, scale z, band q10-q90"), two);
        assertTrue(two.contains("[air_temp_c=12.34 q50]") && two.contains("group turbine T02 vs others"), two);
    }

    @Test
    void theExplorersHeaderKeepsKAndTheOneSeKAt100ColumnsWithALongCondition() throws Exception {
        try (VirtualScreen v = new VirtualScreen(wb, ViewState.initial("power_kw", List.of("wind_ms", "air_temp_c"), 20),
                100, 30, new Look(false, true))) {
            v.type("g").key(KeyType.ArrowDown).key(KeyType.Enter).type("n").type("o");
            v.type("/" + CONDITION).key(KeyType.Enter);
            assertTrue(v.row(0).contains("best k 15, one-SE k 30"), v.row(0));
            assertTrue(v.row(1).contains("k=20") && v.row(1).contains("band q10-q90"), v.row(1));
        }
    }
}
