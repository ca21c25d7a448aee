package nearfit.tui;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;

import com.googlecode.lanterna.input.KeyStroke;
import nearfit.knn.EstimateKind;
import org.junit.jupiter.api.Test;

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
        assertEquals(EstimateKind.MEDIAN, KnnChoices.settings(median.model()).estimate());
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
    void theHeaderSaysMeanOrMedianAndAKeyPressAsksForANewCurve() throws Exception {
        try (VirtualScreen v = VirtualScreen.standard(wb)) {
            assertTrue(v.row(1).contains("band q10-q90, mean"), v.row(1));
            int before = wb.curveCalls.get();
            v.type("c");
            assertTrue(v.row(1).contains("band q10-q90, median"), v.row(1));
            assertTrue(wb.curveCalls.get() > before, "the median curve was asked for");
        }
    }
}
