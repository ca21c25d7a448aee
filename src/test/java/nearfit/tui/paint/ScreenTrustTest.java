package nearfit.tui.paint;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import com.googlecode.lanterna.TextColor;
import com.googlecode.lanterna.input.KeyType;

import nearfit.knn.TuningTable;
import nearfit.table.CsvLoader;
import nearfit.table.LoadOptions;
import nearfit.tui.bench.CoreWorkbench;
import nearfit.tui.bench.JobControl;
import nearfit.tui.bench.ScriptedWorkbench;
import nearfit.tui.bench.Workbench;
import nearfit.tui.keys.Ask;
import nearfit.tui.keys.FitKey;
import nearfit.tui.keys.KeyTable;
import nearfit.tui.keys.Pickers;
import nearfit.tui.keys.ViewState;
import nearfit.tui.loop.ExplorerTest;
import nearfit.tui.loop.VirtualScreen;
import nearfit.tui.results.CurveRequest;
import nearfit.tui.results.CurveResult;
import nearfit.tui.results.FlaggedRows;
import nearfit.tui.results.FrameInput;
import nearfit.tui.results.Ink;
import nearfit.tui.results.Results;
import nearfit.tui.session.TmuxViewTest;

/**
 * What the screen can be trusted with in the field: numbers are never cut, every key in help can be reached,
 * a marked row is on the plot, shapes tell groups apart without colour, text from a file cannot drive the
 * terminal. Lanterna's virtual terminal at the sizes of a small SSH window (80x24) and a common one (100x30).
 */
class ScreenTrustTest {
    private static Workbench small(Path dir) throws Exception {
        Path csv = dir.resolve("small-site.csv");
        Files.writeString(csv, TmuxViewTest.smallLog(), StandardCharsets.UTF_8);
        return CoreWorkbench.of(CsvLoader.load(csv, csv.toString(), LoadOptions.DEFAULT), csv.toString());
    }

    private static VirtualScreen at(Workbench wb, int width, int height, Look look) throws Exception {
        return new VirtualScreen(wb, ViewState.initial("power_kw", List.of("wind_ms"), 20), width, height, look);
    }

    private static final Look COLOUR = new Look(false, true);

    /** The plot rows of the screen (between the header and the strip). */
    private static String plotRows(VirtualScreen v, int height) {
        String[] rows = v.text().split("\n", -1);
        return String.join("\n", java.util.Arrays.asList(rows).subList(2, height - 3));
    }

    @Test
    void theStatusLineAt80ColumnsDropsWholeFieldsNeverDigits() throws Exception {
        try (VirtualScreen v = at(new ScriptedWorkbench(), 80, 24, COLOUR)) {
            String status = v.row(22);
            assertFalse(status.contains("…") || status.contains("~"), status);
            assertTrue(status.contains("fit 120.0") && status.contains("LOO RMSE 85.25")
                    && status.contains("flagged 2"), status);
            String keys = v.row(23);
            assertFalse(keys.contains("…"), keys);
            assertTrue(keys.startsWith("? help  q quit"), keys);
        }
    }

    @Test
    void theStatusLineSaysWhenTheFitLiesOutsideTheBand() {
        ViewState s = ViewState.initial("power_kw", List.of("wind_ms"), 20);
        CurveRequest q = new CurveRequest("wind_ms", java.util.Map.of(), 0, 10, 2, null, -1, false, -1);
        // The mean of skewed neighbours (curtailed rows among full-power ones) below a q10-q90 band.
        CurveResult c = new CurveResult(new double[] {0, 10}, new double[] {1948, 1948}, new double[] {1966, 1966},
                new double[] {2000, 2000}, new double[] {0.1, 0.1}, new int[] {20, 20});
        Results r = Results.none(100).withCurve(c, Double.NaN);
        FrameInput in = new FrameInput("f.csv", 100, new ScriptedWorkbench().columns(), java.util.Map.of(), q,
                List.of(), List.of(), Double.NaN, new ScriptedWorkbench().loadNotes());
        assertTrue(ScreenPainter.status(s, r, in, 200, false).contains("fit outside band"));
        CurveResult inside = new CurveResult(new double[] {0, 10}, new double[] {1980, 1980},
                new double[] {1966, 1966}, new double[] {2000, 2000}, new double[] {0.1, 0.1}, new int[] {20, 20});
        assertFalse(ScreenPainter.status(s, Results.none(100).withCurve(inside, Double.NaN), in, 200, false)
                .contains("outside"));
    }

    @Test
    void theFlaggedTableAt80ColumnsPutsZFirstAndKeepsZFitAndResidualWhole() throws Exception {
        try (VirtualScreen v = at(new ScriptedWorkbench(), 80, 24, COLOUR)) {
            v.type("g").key(KeyType.ArrowDown).key(KeyType.Enter).type("F");
            String[] rows = v.text().split("\n");
            String heading = rows[3];
            assertTrue(heading.matches("\\s*│\\s+z\\s+fit\\s+residual.*"), heading);
            assertTrue(rows[4].contains("-7.500") && rows[4].contains("1900") && rows[4].contains("-1600"), rows[4]);
            assertTrue(rows[5].contains("4.100") && rows[5].contains("400.0") && rows[5].contains("500.0"), rows[5]);
            assertFalse(v.text().contains("…"), v.text());
        }
    }

    @Test
    void helpScrollsWithAVisiblePositionAt100x30And80x24() throws Exception {
        for (int[] size : new int[][] {{100, 30}, {80, 24}}) {
            try (VirtualScreen v = at(new ScriptedWorkbench(), size[0], size[1], COLOUR)) {
                v.type("?");
                String first = v.text();
                assertTrue(first.matches("(?s).*lines 1-\\d+ of \\d+ ↓.*"), first);
                java.util.List<String> pages = new java.util.ArrayList<>();
                for (int i = 0; i < 8; i++) {
                    pages.add(ExplorerTest.helpBody(v.text()));
                    v.key(KeyType.PageDown);
                }
                assertTrue(v.text().matches("(?s).*lines \\d+-(\\d+) of \\1 ↑[ ,].*"), "the end, nothing below: " + v.text());
                for (KeyTable k : KeyTable.values()) {
                    assertTrue(pages.stream().anyMatch(p -> p.contains(k.meaning())),
                            size[0] + "x" + size[1] + ": help shows " + k.key() + " whole");
                }
            }
        }
    }

    @Test
    void theLoadReportWrapsALongLineInsteadOfCuttingIt(@TempDir Path dir) throws Exception {
        Path csv = dir.resolve("bad-cells.csv");
        StringBuilder sb = new StringBuilder("wind_ms,power_kw\n");
        for (int i = 0; i < 300; i++) {
            sb.append(i % 97 == 5 ? "ERR" : String.valueOf(i * 0.05)).append(',').append(i * 3).append('\n');
        }
        Files.writeString(csv, sb.toString(), StandardCharsets.UTF_8);
        Workbench wb = CoreWorkbench.of(CsvLoader.load(csv, csv.toString(), LoadOptions.DEFAULT), csv.toString());
        try (VirtualScreen v = at(wb, 80, 24, COLOUR)) {
            v.type("L");
            String body = ExplorerTest.helpBody(v.text());
            assertTrue(body.contains("bad at 7 \"ERR\", 104 \"ERR\", 201 \"ERR\""), body);
            assertFalse(v.text().contains("…"), v.text());
        }
    }

    @Test
    void theTuningPanelAt80ColumnsShowsTheOneSeKAndSaysWhenItsRmseIsFromASample() throws Exception {
        ScriptedWorkbench sampled = new ScriptedWorkbench() {
            @Override
            public TuningTable tune(FitKey model, nearfit.tui.results.HeldOutChoice choice, String groupColumn,
                    JobControl control) {
                TuningTable t = super.tune(model, choice, groupColumn, control);
                return new TuningTable("sampled leave-one-out", 500, 1000, t.rmse(), t.rmseSe(), t.mae(), t.maeSe(),
                        t.press(), t.predictedR2(), t.errorRate(), t.errorRateSe(), t.bestK(), t.oneSeK());
            }
        };
        try (VirtualScreen v = at(sampled, 80, 24, COLOUR)) {
            v.type("t");
            String text = v.text();
            assertTrue(text.contains("1 one-SE   30"), text);
            assertTrue(text.contains("* lowest   15"), text);
            assertTrue(text.contains("RMSE on 500 sampled rows"), text);
            assertTrue(text.contains("sampled (500 of 1,000 rows)"), text);
        }
    }

    @Test
    void enterInTheFlaggedTableMarksTheRowOnThePlotAndKeepsTheZoom(@TempDir Path dir) throws Exception {
        try (VirtualScreen v = at(small(dir), 100, 30, COLOUR)) {
            // Zoom in twice around 11 m/s, where the planted 5 kW rows lie (wind 11.33).
            double from = v.explorer.request().from();
            double to = v.explorer.request().to();
            ViewState s = v.explorer.state();
            double at = (11.33 - from) / (to - from);
            for (int i = 0; i < 100 && v.explorer.state().crosshair() < at; i++) {
                v.key(KeyType.ArrowRight);
            }
            v.type("]]");
            double zoomFrom = v.explorer.state().zoomFrom();
            double zoomTo = v.explorer.state().zoomTo();
            assertFalse(Double.isNaN(zoomFrom));
            assertFalse(plotRows(v, 30).contains("◆"), "nothing marked yet");
            v.type("F").key(KeyType.Enter);
            ViewState marked = v.explorer.state();
            assertTrue(marked.markedRow() >= 0);
            assertEquals(zoomFrom, marked.zoomFrom(), 1e-12, "the zoom stays");
            assertEquals(zoomTo, marked.zoomTo(), 1e-12);
            assertTrue(plotRows(v, 30).contains("◆"), "the row is marked on the plot: " + v.text());
            assertTrue(v.row(28).contains("marked on the plot"), v.row(28));
            assertEquals(s.response(), marked.response());
        }
    }

    @Test
    void withoutColourTheHighlightedGroupHasItsOwnGlyph(@TempDir Path dir) throws Exception {
        try (VirtualScreen v = at(small(dir), 100, 30, new Look(false, false))) {
            v.type("g").key(KeyType.ArrowDown).key(KeyType.Enter);
            String all = plotRows(v, 30);
            v.type("n");
            String highlighted = plotRows(v, 30);
            assertNotEquals(all, highlighted, "the highlighted group must show without colour");
            assertTrue(highlighted.contains(String.valueOf(Pen.HIGHLIGHT_GLYPH)), highlighted);
            assertFalse(all.contains(String.valueOf(Pen.HIGHLIGHT_GLYPH)), all);
        }
    }

    @Test
    void residualsOverTimeFollowTheComparisonWithTheOtherGroups(@TempDir Path dir) throws Exception {
        try (VirtualScreen v = at(small(dir), 100, 30, COLOUR)) {
            v.type("T").type("g").key(KeyType.ArrowDown).key(KeyType.Enter).type("n");
            String alone = plotRows(v, 30);
            v.type("o");
            String compared = plotRows(v, 30);
            assertTrue(compared.contains("against the others' curve"), compared);
            assertNotEquals(alone.substring(alone.indexOf('\n')), compared.substring(compared.indexOf('\n')),
                    "the highlighted group's residuals are taken against the others' curve");
        }
    }

    @Test
    void theHeaderKeepsMetricWeightsAndScaleAt100ColumnsWithThreeInputs() throws Exception {
        ScriptedWorkbench wb = new ScriptedWorkbench();
        try (VirtualScreen v = new VirtualScreen(wb, ViewState.initial("power_kw",
                List.of("wind_ms", "air_temp_c", "time"), 20), 100, 30, COLOUR)) {
            v.type("g").key(KeyType.ArrowDown).key(KeyType.Enter).type("n").type("o").type("r");
            for (String keys : new String[] {"m", "w", "s", "mws"}) {
                v.type(keys);
                ViewState s = v.explorer.state();
                String header = v.row(1);
                assertTrue(header.contains(s.metric().word()) && header.contains(s.weighting().word())
                        && header.contains("scale " + s.scaling().word()), keys + ": " + header);
            }
            assertTrue(v.row(1).contains("manhattan") || v.row(1).contains("chebyshev"), v.row(1));
        }
    }

    @Test
    void pickersAreAsTallAsTheirContentAndOpenAtTheCurrentChoice() throws Exception {
        try (VirtualScreen v = at(new ScriptedWorkbench(), 100, 30, COLOUR)) {
            v.type("x");
            String[] rows = v.text().split("\n");
            // Two choices (time, air_temp_c and wind_ms less the response): the box closes right under them.
            assertTrue(rows[2].contains("choose the display input"), rows[2]);
            int bottom = -1;
            for (int i = 3; i < rows.length; i++) {
                if (rows[i].contains("╰")) {
                    bottom = i;
                    break;
                }
            }
            assertEquals(3 + 3, bottom, v.text());
            assertEquals("wind_ms", Pickers.options(Ask.DISPLAY_INPUT, v.explorer.state(),
                    new ScriptedWorkbench().columns()).get(v.explorer.state().cursor()));
            v.type("q");
            assertFalse(v.explorer.state().quit(), "q in a picker does not reach the plot");
            v.type("a");
            v.key(KeyType.Enter);
            assertEquals("air_temp_c", v.explorer.state().displayInput());
        }
    }

    @Test
    void aPromptEditsAtItsCaret() throws Exception {
        try (VirtualScreen v = at(new ScriptedWorkbench(), 100, 30, COLOUR)) {
            v.type("/wind_ms > 5");
            v.key(KeyType.Home).key(KeyType.Delete).type("W");
            assertEquals("Wind_ms > 5", v.explorer.state().typed());
            v.key(KeyType.End).key(KeyType.ArrowLeft).type("1");
            assertEquals("Wind_ms > 15", v.explorer.state().typed());
            v.key(new com.googlecode.lanterna.input.KeyStroke('u', true, false));
            assertEquals("5", v.explorer.state().typed());
            v.key(KeyType.ArrowRight).key(KeyType.Backspace);
            assertEquals("", v.explorer.state().typed());
        }
    }

    @Test
    void anInformationalMessageIsNotDrawnInTheWarningColour() throws Exception {
        try (VirtualScreen v = at(new ScriptedWorkbench(), 100, 30, COLOUR)) {
            v.type("m");
            assertTrue(v.row(28).startsWith("metric manhattan"), v.row(28));
            TextColor note = v.terminal.getBufferCharacter(0, 28).getForegroundColor();
            v.type("o");
            assertTrue(v.row(28).startsWith("highlight a group first"), v.row(28));
            TextColor warning = v.terminal.getBufferCharacter(0, 28).getForegroundColor();
            assertEquals(InkColours.foreground(Ink.WARNING, COLOUR), warning);
            assertNotEquals(warning, note);
        }
    }

    @Test
    void theWindowWidthStripSaysWhatItShowsAndItsUnit(@TempDir Path dir) throws Exception {
        try (VirtualScreen v = at(small(dir), 100, 30, COLOUR)) {
            assertTrue(v.row(26).contains("window width") && v.row(26).contains("in wind_ms units"), v.row(26));
            assertTrue(v.row(26).endsWith("wind_ms"), "the axis name stays: " + v.row(26));
        }
    }

    @Test
    void theRowConditionNarrowsWhatIsShownAndRMakesItNarrowTheReference(@TempDir Path dir) throws Exception {
        try (VirtualScreen v = at(small(dir), 120, 40, COLOUR)) {
            v.type("g").key(KeyType.ArrowDown).key(KeyType.Enter);
            // A window of a few hours holding one planted row: the reference stays the whole log, so it is flagged.
            v.type("/time >= 2026-03-01T16:00:00Z and time < 2026-03-01T18:00:00Z").key(KeyType.Enter);
            assertTrue(v.row(0).matches(".*(reference: all rows|ref: all rows|ref all).*"), v.row(0));
            assertEquals("", v.explorer.state().model().condition());
            v.type("F");
            FlaggedRows f = v.explorer.results().flags();
            assertEquals(1, f.rows().size(), v.text());
            assertEquals("T01", f.rows().get(0).group());
            assertTrue(v.text().contains("T01"), v.text());
            v.key(KeyType.Escape).type("R");
            assertTrue(v.row(0).matches(".*(reference: condition|ref: condition|ref cond).*"), v.row(0));
            assertEquals(v.explorer.state().condition(), v.explorer.state().model().condition());
        }
    }

    @Test
    void textFromTheFileCannotDriveTheTerminal(@TempDir Path dir) throws Exception {
        String esc = "\u001b]2;owned\u0007\u001b[2J";
        Path csv = dir.resolve("escapes.csv");
        StringBuilder sb = new StringBuilder("time,\"unit" + esc + "\",wind_ms,power_kw\n");
        for (int i = 0; i < 300; i++) {
            sb.append(String.format(java.util.Locale.ROOT, "2026-03-01T%02d:%02d:00Z,\"T%d%s\",%.2f,%.1f%n", i / 60 % 24,
                    i % 60, i % 3, i % 3 == 0 ? esc : "", 3 + (i * 7 % 100) * 0.15, 10.0 * i % 1900));
        }
        sb.append("2026-03-02T00:00:00Z,T1,x").append(esc).append(",5\n");
        Files.writeString(csv, sb.toString(), StandardCharsets.UTF_8);
        Workbench wb = CoreWorkbench.of(CsvLoader.load(csv, "escapes" + esc + ".csv", LoadOptions.DEFAULT),
                "escapes" + esc + ".csv");
        try (VirtualScreen v = at(wb, 120, 40, COLOUR)) {
            assertClean(v, "first frame");
            v.type("g");
            assertClean(v, "group picker");
            assertTrue(v.text().contains("unit\\e]2;owned\\a\\e[2J"), v.text());
            v.key(KeyType.ArrowDown).key(KeyType.Enter).type("n");
            assertClean(v, "group highlighted");
            assertTrue(v.row(1).contains("T0\\e]2;owned\\a"), v.row(1));
            v.type("F");
            assertClean(v, "flagged table");
            v.key(KeyType.Escape).type("L");
            assertClean(v, "load report");
            v.key(KeyType.Escape).type("T");
            assertClean(v, "residuals over time");
        }
    }

    private static void assertClean(VirtualScreen v, String where) {
        String text = v.text();
        for (int i = 0; i < text.length(); i++) {
            char c = text.charAt(i);
            assertTrue(c == '\n' || (c >= 0x20 && c != 0x7f && !(c >= 0x80 && c <= 0x9f)),
                    where + ": control character " + (int) c + " on the screen:\n" + text);
        }
    }
}
