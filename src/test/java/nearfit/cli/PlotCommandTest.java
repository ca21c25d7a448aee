package nearfit.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.awt.image.BufferedImage;
import java.io.IOException;
import java.nio.file.Path;

import javax.imageio.ImageIO;

import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class PlotCommandTest {
    @TempDir
    static Path dir;
    static String log;

    @BeforeAll
    static void writeLog() throws IOException {
        log = WindSiteCsv.write(dir.resolve("site.csv"), 2, 200, 31, 0, 0, 0).toString();
    }

    @Test
    void textGoesToStandardOutputInBrailleWithoutEscapeCodesWhenNotATerminal() {
        CliRun.Result r = CliRun.inProcess("plot", log, "-x", "wind_ms", "-y", "power_kw", "--k", "10",
                "--size", "60x20", "--quiet");
        assertEquals(0, r.status(), r.toString());
        assertFalse(r.out().contains("\u001b"), "no escape codes");
        assertTrue(r.out().codePoints().anyMatch(c -> c > 0x2800 && c <= 0x28FF), "braille dots (U+2800 block)");
        assertEquals(20, r.out().lines().count());
        assertTrue(r.out().contains("k = 10"), r.out());
    }

    @Test
    void asciiUsesOnlyAsciiCharacters() {
        CliRun.Result r = CliRun.inProcess("plot", log, "-x", "wind_ms", "-y", "power_kw", "--k", "10", "--ascii",
                "--quiet");
        assertEquals(0, r.status(), r.toString());
        assertTrue(r.out().chars().allMatch(c -> c < 128), r.out());
        assertEquals(30, r.out().lines().count());
    }

    @Test
    void pngHasTheRequestedPixels() throws IOException {
        Path png = dir.resolve("curve.png");
        CliRun.Result r = CliRun.inProcess("plot", log, "-x", "wind_ms,temp_c", "-y", "power_kw", "--png",
                png.toString(), "--size", "640x400", "--quiet");
        assertEquals(0, r.status(), r.toString());
        BufferedImage img = ImageIO.read(png.toFile());
        assertEquals(640, img.getWidth());
        assertEquals(400, img.getHeight());
    }

    @Test
    void aBadSizeIsAUsageErrorNamingTheOption() {
        CliRun.Result r = CliRun.inProcess("plot", log, "-x", "wind_ms", "-y", "power_kw", "--size", "wide");
        assertEquals(2, r.status());
        assertTrue(r.err().startsWith("nearfit: Invalid value for option '--size': \"wide\""), r.err());
    }
}
