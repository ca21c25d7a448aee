package nearfit.tui.loop;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;

import org.junit.jupiter.api.Test;

import com.googlecode.lanterna.TerminalSize;
import com.googlecode.lanterna.input.KeyType;

import nearfit.tui.bench.ScriptedWorkbench;
import nearfit.tui.keys.KeyTable;
import nearfit.tui.keys.ViewState;
import nearfit.tui.paint.Look;

public class ExplorerTest {
    @Test
    void firstFrameShowsTheFileRowsModelAndPlot() throws Exception {
        try (VirtualScreen v = VirtualScreen.standard(new ScriptedWorkbench())) {
            String text = v.text();
            assertTrue(v.row(0).contains("site-test.csv") && v.row(0).contains("rows 1,000 of 1,000"), v.row(0));
            assertTrue(v.row(1).contains("power_kw ~ wind_ms") && v.row(1).contains("k=20"), v.row(1));
            assertTrue(v.row(1).contains("metric euclidean") && v.row(1).contains("band q10-q90"), v.row(1));
            assertTrue(text.contains("plot power_kw vs wind_ms curve fit 120.0"), text);
            assertTrue(text.contains("\u28ff"), "braille cells from the plot are on screen");
        }
    }

    @Test
    void plusMovesKUpTheLadderAndTheFrameFollows() throws Exception {
        try (VirtualScreen v = VirtualScreen.standard(new ScriptedWorkbench())) {
            v.type("+");
            assertTrue(v.row(1).contains("k=30"), v.row(1));
            assertTrue(v.text().contains("curve fit 130.0"), "the plot shows the curve for the new k");
            assertTrue(v.row(38).contains("fit 130.0"), v.row(38));
            v.type("--");
            assertTrue(v.row(1).contains("k=15"), v.row(1));
        }
    }

    @Test
    void enterInTheInputsPickerClosesItWithTheInputsSpaceAdded() throws Exception {
        try (VirtualScreen v = VirtualScreen.standard(new ScriptedWorkbench())) {
            v.type("i").key(KeyType.ArrowDown).key(KeyType.ArrowDown).type(" ");
            assertTrue(v.row(1).contains("power_kw ~ wind_ms + air_temp_c"), v.row(1));
            v.key(KeyType.Enter);
            assertTrue(v.row(1).contains("power_kw ~ wind_ms + air_temp_c"), v.row(1));
            assertFalse(v.text().contains("choose the model inputs"), "the picker is closed");
        }
    }

    @Test
    void eachPickerMarksOnlyItsOwnCurrentChoiceAsNow() throws Exception {
        try (VirtualScreen v = VirtualScreen.standard(new ScriptedWorkbench())) {
            v.type("g").key(KeyType.ArrowDown).key(KeyType.Enter).type("y");
            String picker = v.text();
            assertTrue(picker.contains("power_kw  (now)"), picker);
            assertFalse(picker.contains("turbine  (now)"), "the group column is not the response: " + picker);
            v.key(KeyType.Escape).type("g");
            assertTrue(v.text().contains("turbine  (now)"), v.text());
            assertFalse(v.text().contains("power_kw  (now)"), v.text());
            v.key(KeyType.Escape).type("x");
            assertTrue(v.text().contains("wind_ms  (now)"), v.text());
        }
    }

    @Test
    void kPromptSetsAnExactKAndRejectsNonsense() throws Exception {
        try (VirtualScreen v = VirtualScreen.standard(new ScriptedWorkbench())) {
            v.type("k").type("42").key(KeyType.Enter);
            assertTrue(v.row(1).contains("k=42"), v.row(1));
            v.type("kabc").key(KeyType.Enter);
            assertTrue(v.row(1).contains("k=42"), v.row(1));
            assertTrue(v.row(38).contains("k must be a whole number"), v.row(38));
        }
    }

    @Test
    void helpListsEveryKeyAndEscapeClosesIt() throws Exception {
        try (VirtualScreen v = VirtualScreen.standard(new ScriptedWorkbench())) {
            v.type("?");
            java.util.List<String> pages = new java.util.ArrayList<>();
            for (int i = 0; i < 6; i++) {
                pages.add(helpBody(v.text()));
                v.key(KeyType.PageDown);
            }
            for (KeyTable k : KeyTable.values()) {
                assertTrue(pages.stream().anyMatch(p -> p.contains(k.meaning())), "help shows " + k.key());
            }
            v.key(KeyType.Escape);
            assertFalse(v.text().contains(KeyTable.EXPORT.meaning()), "help closed");
        }
    }

    /** The text inside the help box, its wrapped lines joined with single spaces. */
    public static String helpBody(String screen) {
        StringBuilder sb = new StringBuilder();
        for (String line : screen.split("\n")) {
            int a = line.indexOf('\u2502');
            int b = line.lastIndexOf('\u2502');
            if (a >= 0 && b > a) {
                sb.append(' ').append(line, a + 1, b);
            }
        }
        return sb.toString().replaceAll("\\s+", " ");
    }

    @Test
    void tuningPanelShowsTheTableAndEnterAdoptsTheHighlightedK() throws Exception {
        try (VirtualScreen v = VirtualScreen.standard(new ScriptedWorkbench())) {
            assertTrue(v.row(0).contains("best k 15, one-SE k 30"), v.row(0));
            v.type("t");
            String panel = v.text();
            assertTrue(panel.contains("RMSE against log k") && panel.contains("chart best 15"), panel);
            v.key(KeyType.ArrowDown).key(KeyType.Enter);
            assertTrue(v.row(1).contains("k=21"), "the line below k=20 is k=21: " + v.row(1));
            v.type("*");
            assertTrue(v.row(1).contains("k=15"), v.row(1));
            v.type("1");
            assertTrue(v.row(1).contains("k=30"), v.row(1));
        }
    }

    @Test
    void flaggedTableListsRowsAndEnterMarksTheRow() throws Exception {
        try (VirtualScreen v = VirtualScreen.standard(new ScriptedWorkbench())) {
            assertTrue(v.row(38).contains("flagged 2 (0.20 %)") && v.row(38).contains("LOO RMSE 85.25"), v.row(38));
            v.type("F");
            String table = v.text();
            assertTrue(table.contains("flagged rows: 2"), table);
            assertTrue(table.indexOf("2026-03-02 10:10") < table.indexOf("2026-03-01 01:10"),
                    "rows in the order given, largest |z| first");
            v.key(KeyType.Enter);
            assertEquals(41, v.explorer.state().markedRow());
            assertEquals(0.5, v.explorer.state().crosshair(), 1e-9, "wind 12.5 of 0..25 is the middle");
            assertTrue(v.row(38).contains("line 43 marked"), v.row(38));
        }
    }

    @Test
    void resizingTheTerminalRedrawsForTheNewSize() throws Exception {
        ScriptedWorkbench wb = new ScriptedWorkbench();
        try (VirtualScreen v = VirtualScreen.standard(wb)) {
            int before = wb.curveCalls.get();
            v.terminal.setTerminalSize(new TerminalSize(90, 24));
            v.explorer.draw();
            v.explorer.settle();
            assertEquals(before + 1, wb.curveCalls.get(), "a new width asks for a curve with new steps");
            assertTrue(v.row(23).startsWith("? help"), v.row(22));
            assertEquals(90, v.explorer.results().curve().size());
        }
    }

    @Test
    void aWindowBelowTheMinimumShowsAMessageInsteadOfTheLayout() throws Exception {
        try (VirtualScreen v = new VirtualScreen(new ScriptedWorkbench(),
                ViewState.initial("power_kw", List.of("wind_ms"), 20), 50, 12, new Look(false, true))) {
            // The message wraps at the window's width, so words are compared with the line breaks as spaces.
            String text = String.join(" ", v.text().strip().split("\\s+"));
            assertTrue(text.contains("at least 60x18") && text.contains("this one is 50x12"), text);
            assertFalse(text.contains("k=20"), text);
        }
    }

    @Test
    void theMinimumSizeMessageWrapsSoItAlwaysSaysHowToQuit() throws Exception {
        for (int[] size : new int[][] {{40, 10}, {20, 8}, {59, 17}}) {
            try (VirtualScreen v = new VirtualScreen(new ScriptedWorkbench(),
                    ViewState.initial("power_kw", List.of("wind_ms"), 20), size[0], size[1], new Look(false, true))) {
                String joined = String.join(" ", v.text().strip().split("\\s+"));
                assertTrue(joined.contains("Enlarge it, or press q to quit."), size[0] + "x" + size[1] + ": " + v.text());
                assertTrue(joined.contains("this one is " + size[0] + "x" + size[1]), v.text());
            }
        }
    }

    @Test
    void aResultOfAnOlderGenerationIsDropped() throws Exception {
        ScriptedWorkbench wb = new ScriptedWorkbench();
        wb.holdCurveForK = 30;
        try (VirtualScreen v = VirtualScreen.standard(wb)) {
            v.explorer.press(new com.googlecode.lanterna.input.KeyStroke('+', false, false));
            v.explorer.press(new com.googlecode.lanterna.input.KeyStroke('+', false, false));
            // k=50 answers at once; k=30 answers only now, after it was superseded.
            wb.release.countDown();
            v.explorer.settle();
            assertEquals(150.0, v.explorer.results().curve().fit()[0], "the curve is k=50's");
            assertTrue(v.row(1).contains("k=50"), v.row(1));
        }
    }

    @Test
    void aRowConditionIsCheckedAndShownInTheHeader() throws Exception {
        try (VirtualScreen v = VirtualScreen.standard(new ScriptedWorkbench())) {
            v.type("/wind_ms > 5").key(KeyType.Enter);
            assertTrue(v.row(0).contains("rows 400 shown of 1,000") && v.row(0).contains("where wind_ms > 5")
                    && v.row(0).contains("reference: all rows"), v.row(0));
            v.type("/").key(KeyType.Backspace);
            v.type("nonsense").key(KeyType.Enter);
            assertTrue(v.row(38).contains("not column op value"), v.row(38));
        }
    }

    @Test
    void changingKDoesNotRerunTuning() throws Exception {
        ScriptedWorkbench wb = new ScriptedWorkbench();
        try (VirtualScreen v = VirtualScreen.standard(wb)) {
            v.type("++-");
            assertEquals(1, wb.tuneCalls.get(), "tuning covers every k at once");
            v.type("m");
            assertEquals(2, wb.tuneCalls.get(), "a new metric needs new tuning");
        }
    }

    @Test
    void asciiLookDrawsNoBoxLines() throws Exception {
        try (VirtualScreen v = new VirtualScreen(new ScriptedWorkbench(),
                ViewState.initial("power_kw", List.of("wind_ms"), 20), 120, 40, new Look(true, false))) {
            v.type("?");
            String text = v.text();
            assertTrue(text.contains("+-----"), text);
            assertFalse(text.contains("\u256d") || text.contains("\u2500"), "no box-drawing characters");
        }
    }
}
