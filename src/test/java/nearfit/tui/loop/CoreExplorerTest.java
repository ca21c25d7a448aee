package nearfit.tui.loop;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.awt.image.BufferedImage;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import javax.imageio.ImageIO;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import com.googlecode.lanterna.input.KeyType;

import nearfit.plot.Palette;
import nearfit.plot.Role;
import nearfit.table.CsvLoader;
import nearfit.table.LoadOptions;
import nearfit.tui.bench.CoreWorkbench;
import nearfit.tui.bench.Workbench;
import nearfit.tui.keys.ExportKind;
import nearfit.tui.keys.ViewState;
import nearfit.tui.paint.Look;
import nearfit.tui.results.CurveResult;
import nearfit.tui.results.FlaggedRows;
import nearfit.tui.session.TmuxViewTest;

/** The explorer on the real core packages: a small generated log, keys on the virtual terminal, real files. */
class CoreExplorerTest {
    private static Workbench load(Path dir) throws Exception {
        Path csv = dir.resolve("small-site.csv");
        Files.writeString(csv, TmuxViewTest.smallLog(), StandardCharsets.UTF_8);
        return CoreWorkbench.of(CsvLoader.load(csv, csv.toString(), LoadOptions.DEFAULT), csv.toString());
    }

    private static VirtualScreen open(Workbench wb) throws Exception {
        return new VirtualScreen(wb, ViewState.initial("power_kw", List.of("wind_ms"), 20), 120, 40,
                new Look(false, true));
    }

    @Test
    void pngExportHasTheAskedSizeAndCurvePixels(@TempDir Path dir) throws Exception {
        Workbench wb = load(dir);
        Path png = dir.resolve("view.png");
        try (VirtualScreen v = open(wb)) {
            v.type("e3");
            // Clear the offered name, then type the file and its size.
            for (int i = 0; i < ExportKind.PNG.defaultFile().length(); i++) {
                v.key(KeyType.Backspace);
            }
            v.type(png + " 640x400").key(KeyType.Enter);
            assertTrue(v.row(38).contains("wrote"), v.row(38));
        }
        BufferedImage img = ImageIO.read(png.toFile());
        assertEquals(640, img.getWidth());
        assertEquals(400, img.getHeight());
        int curve = Palette.paper().rgb(Role.CURVE) & 0xffffff;
        int count = 0;
        for (int y = 0; y < img.getHeight(); y++) {
            for (int x = 0; x < img.getWidth(); x++) {
                if ((img.getRGB(x, y) & 0xffffff) == curve) {
                    count++;
                }
            }
        }
        assertTrue(count > 100, "curve pixels in the picture: " + count);
    }

    @Test
    void anExistingFileIsReplacedOnlyAfterYes(@TempDir Path dir) throws Exception {
        Workbench wb = load(dir);
        Path out = dir.resolve("curve.csv");
        Files.writeString(out, "keep me\n");
        try (VirtualScreen v = open(wb)) {
            v.type("e1");
            for (int i = 0; i < ExportKind.CURVE_CSV.defaultFile().length(); i++) {
                v.key(KeyType.Backspace);
            }
            v.type(out.toString()).key(KeyType.Enter);
            assertTrue(v.text().contains("exists. Replace it?"), v.text());
            v.type("n");
            assertEquals("keep me\n", Files.readString(out));
            v.type("e1");
            for (int i = 0; i < ExportKind.CURVE_CSV.defaultFile().length(); i++) {
                v.key(KeyType.Backspace);
            }
            v.type(out.toString()).key(KeyType.Enter).type("y");
        }
        List<String> lines = Files.readAllLines(out);
        assertEquals("wind_ms,fit,band_lo,band_hi,window_width,neighbours", lines.get(0));
        assertEquals(121, lines.size(), "one line per curve point, one per terminal column");
    }

    @Test
    void flaggedRowsCarryTheirSourceLinesAndThePlantedOutliersComeFirst(@TempDir Path dir) throws Exception {
        Workbench wb = load(dir);
        try (VirtualScreen v = open(wb)) {
            FlaggedRows f = v.explorer.results().flags();
            assertTrue(f.result().flaggedCount() >= 2, "flags: " + f.result().flaggedCount());
            // Rows 100 and 900 of smallLog() have power 5 kW where the curve is far higher; the header is line 1,
            // so data row r sits on line r + 2.
            List<Long> top = List.of(f.rows().get(0).line(), f.rows().get(1).line());
            assertTrue(top.contains(102L) && top.contains(902L), "largest |z| lines: " + top);
            v.type("F");
            assertTrue(v.text().contains("flagged rows:"), v.text());
        }
    }

    @Test
    void aCategoryResponseDrawsTheVoteShareOfTheHighlightedClass(@TempDir Path dir) throws Exception {
        Workbench wb = load(dir);
        try (VirtualScreen v = new VirtualScreen(wb, ViewState.initial("turbine", List.of("wind_ms"), 20), 120, 40,
                new Look(false, true))) {
            CurveResult c = v.explorer.results().curve();
            for (double share : c.fit()) {
                assertTrue(share >= 0 && share <= 1, "a vote share: " + share);
            }
            assertTrue(v.row(1).contains("share of T01"), v.row(1));
            v.type("n");
            assertTrue(v.row(1).contains("share of T02"), v.row(1));
        }
    }

    @Test
    void aTimeDisplayInputShowsDatesOnTheAxisAndADurationAsTheWindowWidth(@TempDir Path dir) throws Exception {
        Workbench wb = load(dir);
        try (VirtualScreen v = open(wb)) {
            // The x picker opens at wind_ms; t jumps to time.
            v.type("x").type("t").key(KeyType.Enter);
            assertTrue(v.row(1).contains("power_kw ~ time"), v.row(1));
            String axis = v.row(35);
            assertTrue(axis.contains("2026-03-0"), "calendar ticks: " + v.text());
            assertFalse(v.text().contains("e12") || v.text().contains("e+12"), "no epoch milliseconds: " + v.text());
            String status = v.row(38);
            assertTrue(status.matches("time 2026-03-\\d\\d \\d\\d:\\d\\d: fit .*"), status);
            // The neighbour count may give way to fit the line; the width keeps its unit.
            assertTrue(status.matches(".*  width \\d+(\\.\\d)? (s|min|h|d)  (n |\\|).*"), status);
            String strip = v.row(37);
            int bar = firstBar(strip);
            assertTrue(bar > 1 && strip.charAt(bar - 1) == ' ', "a space before the bars: " + strip);
            assertTrue(strip.substring(0, bar).strip().matches("\\d+(\\.\\d)? ?(s|min|h|d)"), strip);
        }
    }

    private static int firstBar(String row) {
        for (int i = 0; i < row.length(); i++) {
            if (row.charAt(i) >= '\u2581' && row.charAt(i) <= '\u2588') {
                return i;
            }
        }
        return -1;
    }

    @Test
    void aComparisonWithNoOtherGroupsSaysSoUntilItIsTurnedOff(@TempDir Path dir) throws Exception {
        Workbench wb = load(dir);
        try (VirtualScreen v = open(wb)) {
            v.type("g").key(KeyType.ArrowDown).key(KeyType.Enter).type("n").type("o");
            // The arrow moves the crosshair and clears the "rows match" note that covers the status line.
            // R: the row condition narrows the reference too, so no other group is left to compare with.
            v.type("R").type("/turbine = T01").key(KeyType.Enter).key(KeyType.ArrowRight);
            String said = "no rows of the other groups under this row condition";
            assertTrue(v.row(38).contains(said), v.row(38));
            v.type("o");
            assertFalse(v.row(38).contains(said), "comparison off: " + v.row(38));
            assertTrue(v.row(38).contains("wind_ms") && v.row(38).contains("fit"), v.row(38));
            v.type("o");
            assertTrue(v.row(38).contains(said), "comparison on again: " + v.row(38));
            v.type("/").key(KeyType.Backspace);
            for (int i = 0; i < "turbine = T01".length(); i++) {
                v.key(KeyType.Backspace);
            }
            v.key(KeyType.Enter).key(KeyType.ArrowRight);
            assertFalse(v.row(38).contains(said), "condition cleared: " + v.row(38));
            assertTrue(v.explorer.results().failure().isEmpty(), v.explorer.results().failure());
        }
    }

    @Test
    void residualsOverTimeUseTheTimeAxisAndGroupsCompareWithTheOthers(@TempDir Path dir) throws Exception {
        Workbench wb = load(dir);
        try (VirtualScreen v = open(wb)) {
            v.type("T");
            assertTrue(v.text().contains("residual of power_kw"), v.text());
            assertTrue(v.text().contains("2026-03"), "time ticks on the axis: " + v.text());
            v.type("T").type("g").key(KeyType.ArrowDown).key(KeyType.Enter).type("n").type("o");
            assertTrue(v.row(1).contains("group turbine T01 vs others"), v.row(1));
            assertTrue(v.explorer.results().failure().isEmpty(), v.explorer.results().failure());
            assertEquals(120, v.explorer.results().curve().size());
        }
    }
}
