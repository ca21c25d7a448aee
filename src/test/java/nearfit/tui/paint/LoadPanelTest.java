package nearfit.tui.paint;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import com.googlecode.lanterna.input.KeyType;
import nearfit.table.ColumnGaps;
import nearfit.table.LoadNotes;
import nearfit.tui.bench.CoreWorkbench;
import nearfit.tui.bench.JobControl;
import nearfit.tui.bench.Workbench;
import nearfit.tui.keys.ViewState;
import nearfit.tui.loop.VirtualScreen;

/** The load-report panel ({@code L}) on a small log made here, loaded by the real loader. */
class LoadPanelTest {
    @TempDir
    Path dir;

    /**
     * 60 records of one turbine, the header on line 1 and record r on line r + 1. Planted: a blank wind on line
     * 10, {@code ERR} power on line 15, a short line (no power) on 20, a long line (a fifth field) on 25 and
     * {@code calm} as a wind on 30.
     */
    private Path plantedLog() throws Exception {
        StringBuilder sb = new StringBuilder("time,turbine,wind_ms,power_kw\n");
        for (int line = 2; line <= 61; line++) {
            String time = String.format(Locale.ROOT, "2025-01-01T%02d:%02d:00Z", (line * 10) / 60, (line * 10) % 60);
            double wind = 3 + (line % 17) * 0.7;
            String w = line == 10 ? "" : line == 30 ? "calm" : Double.toString(wind);
            String p = line == 15 ? "ERR" : Double.toString(Math.round(40 * wind * wind));
            sb.append(time).append(",T01,").append(w);
            if (line != 20) {
                sb.append(',').append(p);
            }
            sb.append(line == 25 ? ",extra\n" : "\n");
        }
        Path csv = dir.resolve("planted.csv");
        Files.writeString(csv, sb.toString(), StandardCharsets.UTF_8);
        return csv;
    }

    private VirtualScreen open(Path csv) throws Exception {
        Workbench wb = CoreWorkbench.open(csv, "planted.csv", JobControl.NONE);
        return new VirtualScreen(wb, ViewState.initial("power_kw", List.of("wind_ms"), 5), 120, 40,
                new Look(false, true));
    }

    @Test
    void thePanelListsTheRaggedLinesAndEachColumnsBlankAndBadCellsWithTheirLines() throws Exception {
        try (VirtualScreen v = open(plantedLog())) {
            v.type("L");
            String panel = v.text();
            assertTrue(panel.contains("60 data rows read, 58 kept, 2 dropped"), panel);
            assertTrue(panel.contains("ragged lines: 2 dropped (1 short, 1 long; none of their cells is used)"), panel);
            assertTrue(panel.contains("line 20:") && panel.contains("line 25:"), panel);
            assertTrue(panel.contains("bad cells: 2 in all"), panel);
            assertTrue(find(panel, "wind_ms\\s+1\\s+1\\s+blank at 10; bad at 30 \"calm\""), panel);
            // The short line is dropped whole: its missing power is not a blank cell of power_kw.
            assertTrue(find(panel, "power_kw\\s+0\\s+1\\s+bad at 15 \"ERR\""), panel);
            assertFalse(panel.contains("turbine  "), "a column with no gaps is not listed: " + panel);
        }
    }

    @Test
    void theHeaderCountsTheNotesAndLClosesThePanel() throws Exception {
        try (VirtualScreen v = open(plantedLog())) {
            // Ragged lines, blank and bad cells in wind_ms, bad cells in power_kw.
            assertTrue(v.row(0).contains("(4 load notes, L)"), v.row(0));
            v.type("L");
            assertTrue(v.text().contains("load report: 4 notes"), v.text());
            v.type("L");
            assertFalse(v.text().contains("load report:"), "L closes the panel");
            v.type("L").key(KeyType.Escape);
            assertFalse(v.text().contains("load report:"), "Esc closes it too");
        }
    }

    @Test
    void thePanelListsTheLoadersWarningsAboutTheFileAfterItsFirstLine() throws Exception {
        Workbench wb = CoreWorkbench.open(plantedLog(), "planted.csv", JobControl.NONE);
        LoadNotes notes = wb.loadNotes();
        String grew = "planted.csv: grew from 2400 to 2480 bytes while it was read; only the first 2400 bytes were read";
        LoadNotes warned = new LoadNotes(notes.report().withWarning(grew).withWarning("planted.csv: was modified"),
                notes.columns());
        List<String> lines = LoadPanel.lines(warned);
        assertTrue(lines.get(0).contains("60 data rows read"), lines.get(0));
        assertEquals("warning: " + grew, lines.get(1));
        assertEquals("warning: planted.csv: was modified", lines.get(2));
        assertTrue(lines.get(3).startsWith("ragged lines: 2"), lines.get(3));
        assertFalse(String.join("\n", LoadPanel.lines(notes)).contains("warning"), "no warning, no line");
    }

    @Test
    void eachLoadWarningIsOneMoreNoteInTheCountAndThePanelsTitle() throws Exception {
        LoadNotes notes = CoreWorkbench.open(plantedLog(), "planted.csv", JobControl.NONE).loadNotes();
        LoadNotes warned = new LoadNotes(notes.report().withWarning(
                "planted.csv: was modified while it was read (same size, 2400 bytes); if it was rewritten, load it again"),
                notes.columns());
        assertEquals(4, notes.count());
        // The header's "(N load notes, L)" marker is ScreenPainter's print of this count.
        assertEquals(5, warned.count());
        assertTrue(LoadPanel.title(warned).startsWith("load report: 5 notes"), LoadPanel.title(warned));
    }

    @Test
    void aCleanFileHasNoMarkerAndThePanelSaysSo() throws Exception {
        Path csv = dir.resolve("clean.csv");
        StringBuilder sb = new StringBuilder("wind_ms,power_kw\n");
        for (int i = 0; i < 40; i++) {
            sb.append(i * 0.5).append(',').append(i * 30).append('\n');
        }
        Files.writeString(csv, sb.toString(), StandardCharsets.UTF_8);
        try (VirtualScreen v = open(csv)) {
            assertFalse(v.row(0).contains("load note"), v.row(0));
            v.type("L");
            assertTrue(v.text().contains("load report: no notes"), v.text());
            assertTrue(v.text().contains("no column has blank or bad cells"), v.text());
        }
    }

    @Test
    void theKeysLineNamesTheLoadReportWhenTheWindowIsWideEnough() throws Exception {
        try (VirtualScreen v = open(plantedLog())) {
            v.terminal.setTerminalSize(new com.googlecode.lanterna.TerminalSize(140, 40));
            v.explorer.draw();
            v.explorer.settle();
            assertTrue(v.row(39).contains("F flagged  L load  g group"), v.row(39));
            assertTrue(v.row(39).contains("/ condition  e export"), v.row(39));
        }
    }

    private static boolean find(String text, String regex) {
        return java.util.regex.Pattern.compile(regex).matcher(text).find();
    }

    @Test
    void aColumnWithMoreBadCellsThanTheLoaderKeepsSaysMissingNotBlank() throws Exception {
        Path csv = dir.resolve("many-bad.csv");
        StringBuilder sb = new StringBuilder("wind_ms,power_kw\n");
        // 12 bad cells in 200 rows: few enough (under 1 in 10) for the column to stay a number column.
        for (int i = 0; i < 200; i++) {
            sb.append(i * 0.5).append(',').append(i < 12 ? "ERR" : Integer.toString(i * 30)).append('\n');
        }
        Files.writeString(csv, sb.toString(), StandardCharsets.UTF_8);
        Workbench wb = CoreWorkbench.open(csv, "many-bad.csv", JobControl.NONE);
        ColumnGaps power = wb.loadNotes().columns().get(0);
        assertEquals("power_kw", power.column());
        assertEquals(12, power.bad());
        assertEquals(0, power.blank());
        // Only 10 bad cells are kept as examples, so a missing cell cannot be called blank.
        assertFalse(power.blankOnly());
        assertEquals(List.of(2L, 3L, 4L), power.firstLines());
    }

    /** The six malformed lines of the default demo log, as data-demo/README.md lists them (fault 7). */
    private static final List<Long> DEMO_MALFORMED = List.of(30739L, 88849L, 158901L, 221216L, 289586L, 375196L);

    @Test
    void theDemoLogsPanelListsItsSixMalformedLines() throws Exception {
        // The panel's lines straight from the workbench: the explorer's tuning and flags on 420 480 rows would
        // take the test from seconds to half a minute.
        Workbench wb = CoreWorkbench.open(demoLog(), "site-log.csv.gz", JobControl.NONE);
        String panel = String.join("\n", LoadPanel.lines(wb.loadNotes()));
        assertTrue(panel.contains("420,480 data rows read, 420,477 kept, 3 dropped"), panel);
        for (long line : DEMO_MALFORMED) {
            assertTrue(panel.contains("line " + line + ":") || panel.contains(" " + line + " \"ERR\""),
                    "line " + line + " in the panel:\n" + panel);
        }
        // data-demo/README.md: 3008 blank cells in the default file; its two short lines (30739, 221216) are
        // dropped whole, so no cell is padded into them any more.
        long blank = 0;
        for (ColumnGaps g : wb.loadNotes().columns()) {
            blank += g.blank();
        }
        assertEquals(3008, blank);
    }

    /** The demo log of the build (scripts/test makes it), or one generated here with the same script. */
    private Path demoLog() throws Exception {
        Path built = Path.of("data-demo", "site-log.csv.gz");
        if (Files.isRegularFile(built)) {
            return built;
        }
        Path out = dir.resolve("site-log.csv.gz");
        Process p = new ProcessBuilder(Path.of(System.getProperty("java.home"), "bin", "java").toString(),
                "--source", "17", "scripts/make-demo-log", "--out", out.toString()).inheritIO().start();
        assertEquals(0, p.waitFor());
        return out;
    }

    /**
     * A Parquet data set written by DuckDB (scripts/reference/make-parquet-fixtures; wind_ms is null in every 53rd
     * row): the panel heads the places "first rows" and names each by its file within the folder and its row index,
     * and that file, read alone, has no wind at that index.
     */
    @Test
    void aParquetDataSetsMissingCellsAreListedByFileWithinTheFolderAndRowIndex() throws Exception {
        Path set = Path.of(LoadPanelTest.class.getResource("/parquet/site-set").toURI());
        nearfit.table.Table table = nearfit.table.CsvLoader.load(set, set.toString(), nearfit.table.LoadOptions.DEFAULT);
        List<String> lines = LoadPanel.lines(LoadNotes.of(table));
        String heading = lines.stream().filter(l -> l.startsWith("column ")).findFirst().orElseThrow();
        assertTrue(heading.endsWith("first rows"), heading);
        String wind = lines.stream().filter(l -> l.startsWith("wind_ms ")).findFirst().orElseThrow();
        // Nulls are blank cells (no text was there to be bad).
        String places = wind.substring(wind.indexOf("blank at ") + "blank at ".length());
        List<String> listed = List.of(places.split(", "));
        assertEquals(LoadNotes.FIRST_LINES, listed.size(), wind);
        for (String place : listed) {
            int colon = place.lastIndexOf(':');
            assertTrue(place.startsWith("unit="), place);
            Path file = set.resolve(place.substring(0, colon));
            nearfit.table.Table alone = nearfit.table.CsvLoader.load(file, file.toString(), nearfit.table.LoadOptions.DEFAULT);
            assertTrue(alone.column("wind_ms").isMissing(Integer.parseInt(place.substring(colon + 1))), place);
        }
    }
}
