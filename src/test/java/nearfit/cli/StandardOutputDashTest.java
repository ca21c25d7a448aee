package nearfit.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.awt.image.BufferedImage;
import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;

import javax.imageio.ImageIO;

import nearfit.model.JsonTrees;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * {@code -o -} (and {@code plot --png -}) is standard output, as {@code -} already is for an input file (Unix
 * convention); progress and notes stay on standard error, and check's report moves there.
 */
class StandardOutputDashTest {
    @TempDir
    static Path dir;
    static Path healthy;
    static Path weak;
    static String model;

    @BeforeAll
    static void fitAReference() throws IOException {
        healthy = WindSiteCsv.write(dir.resolve("healthy.csv"), 3, 300, 11, 0, 0, 0);
        weak = WindSiteCsv.write(dir.resolve("weak.csv"), 3, 300, 12, 2, 150, 0.25);
        model = dir.resolve("ref.nfm").toString();
        CliRun.Result r = CliRun.inProcess("fit", healthy.toString(), "-x", "wind_ms", "-y", "power_kw",
                "--k", "15", "--group", "turbine", "-o", model, "--quiet");
        assertEquals(0, r.status(), r.toString());
    }

    @Test
    void predictWithDashWritesTheCsvToStandardOutputAndNoFileNamedDash() throws Exception {
        // A slice of 40 rows: the child's output must fit the pipe, since it is read once the child ends.
        Path slice = dir.resolve("slice.csv");
        Files.write(slice, Files.readAllLines(healthy).subList(0, 41));
        CliRun.Result plain = CliRun.inProcess("predict", model, slice.toString(), "--quiet");
        CliRun.Result dash = CliRun.process(dir, "predict", model, slice.toString(), "-o", "-");
        assertEquals(0, dash.status(), dash.toString());
        assertEquals(plain.out(), dash.out());
        assertTrue(dash.out().startsWith("line,time,turbine,wind_ms,power_kw,fit,band_lo,band_hi,resid,z,beyond\n"));
        assertFalse(Files.exists(dir.resolve("-")), "a file named - was written");
        assertFalse(dash.err().contains("line,"), "the CSV went to standard error: " + dash.err());
    }

    @Test
    void checkWithDashWritesTheFlaggedRowsToStandardOutputAndTheReportToStandardError() throws IOException {
        Path file = dir.resolve("flagged.csv");
        CliRun.Result toFile = CliRun.inProcess("check", model, weak.toString(), "--quiet", "--format", "json",
                "-o", file.toString(), "--force");
        CliRun.Result dash = CliRun.inProcess("check", model, weak.toString(), "--quiet", "--format", "json",
                "-o", "-");
        assertEquals(Main.EXIT_CHECK_FAILED, dash.status(), dash.toString());
        assertEquals(Files.readString(file), dash.out());
        assertTrue(dash.out().lines().count() > 10, "T02's weak rows are flagged: " + dash.out());
        String report = dash.err().strip();
        Object json = JsonTrees.parse(report);
        assertTrue(json instanceof java.util.Map<?, ?>, report);
        // The same report as with a file, but for the time of the run.
        assertEquals(toFile.out().strip().replaceAll("\"run_at\":\"[^\"]*\"", ""),
                report.replaceAll("\"run_at\":\"[^\"]*\"", ""));
        assertFalse(Files.exists(Path.of("-")), "a file named - was written");
    }

    @Test
    void plotPngWithDashWritesThePictureBytesToStandardOutput() throws IOException {
        ByteArrayOutputStream bytes = new ByteArrayOutputStream();
        StringWriter err = new StringWriter();
        int status = Main.run(new String[] {"plot", healthy.toString(), "-x", "wind_ms", "-y", "power_kw", "--k", "15",
                "--png", "-", "--size", "300x200", "--quiet"}, new StandardOutputWriter(bytes), new PrintWriter(err));
        assertEquals(0, status, err.toString());
        byte[] png = bytes.toByteArray();
        assertArrayEquals(new byte[] {(byte) 0x89, 'P', 'N', 'G'}, Arrays.copyOf(png, 4));
        BufferedImage picture = ImageIO.read(new ByteArrayInputStream(png));
        assertEquals(300, picture.getWidth());
        assertEquals(200, picture.getHeight());
        assertEquals("", err.toString());
    }

    @Test
    void aStandardOutputThatTakesOnlyTextRefusesThePictureInOneLine() {
        CliRun.Result r = CliRun.inProcess("plot", healthy.toString(), "-x", "wind_ms", "-y", "power_kw", "--k", "15",
                "--png", "-", "--quiet");
        assertEquals(Main.EXIT_USAGE, r.status(), r.toString());
        assertEquals(List.of("nearfit: standard output: takes no binary data in this run; name a file"),
                r.err().lines().toList());
    }

    @Test
    void fitRefusesDashSinceAModelIsReadBackByName() {
        CliRun.Result r = CliRun.inProcess("fit", healthy.toString(), "-x", "wind_ms", "-y", "power_kw", "--k", "15",
                "-o", "-", "--quiet");
        assertEquals(Main.EXIT_USAGE, r.status(), r.toString());
        assertTrue(r.err().startsWith("nearfit: -o -: a model file is read back by name"), r.err());
        assertEquals("", r.out());
    }
}
