package nearfit.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Map;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class ViewCommandTest {
    private static String[] run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int status = Main.run(args, new PrintWriter(out), new PrintWriter(err));
        return new String[] {Integer.toString(status), err.toString()};
    }

    @Test
    void withoutATerminalViewExitsWith2AndPointsToPlot(@TempDir Path dir) throws Exception {
        // Surefire runs without a console, as a pipe or a cron job would.
        Path csv = dir.resolve("small.csv");
        Files.writeString(csv, "wind_ms,power_kw\n1,2\n3,4\n");
        String[] r = run("view", csv.toString());
        assertEquals("2", r[0]);
        assertTrue(r[1].contains("interactive terminal") && r[1].contains("nearfit plot"), r[1]);
        assertEquals(1, r[1].strip().lines().count(), r[1]);
    }

    @Test
    void aMissingFileIsNamedOnOneLine(@TempDir Path dir) {
        String[] r = run("view", dir.resolve("absent.csv").toString());
        assertEquals("2", r[0]);
        assertTrue(r[1].startsWith("nearfit: ") && r[1].contains("absent.csv: no such file"), r[1]);
    }

    @Test
    void theDemoLogIsFoundUnderNearfitHome() {
        assertEquals(Path.of("/opt/nf/data-demo/site-log.csv.gz"), ViewCommand.demoLog(Map.of("NEARFIT_HOME", "/opt/nf")));
        assertEquals(Path.of("data-demo/site-log.csv.gz"), ViewCommand.demoLog(Map.of()));
    }
}
