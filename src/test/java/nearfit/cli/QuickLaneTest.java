package nearfit.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The quick lane (a plain {@code describe} line read without the option parser) gives exactly what the
 * parser's lane gives, and leaves every other line to the parser.
 */
class QuickLaneTest {
    @TempDir
    Path dir;

    private record Outcome(int status, String out, String err) {
    }

    /** The load time is the one thing two runs may differ in. */
    private static String withoutTiming(String text) {
        return text.replaceAll("loaded ([0-9.]+) MB in [0-9.]+ s \\([0-9]+ MB/s\\)", "loaded $1 MB");
    }

    private static Outcome quick(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int status = Main.run(args, new PrintWriter(out), new PrintWriter(err));
        return new Outcome(status, withoutTiming(out.toString()), withoutTiming(err.toString()));
    }

    private static Outcome parsed(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int status = Main.run(args, new PrintWriter(out), new PrintWriter(err), picocli.CommandLine.defaultFactory());
        return new Outcome(status, withoutTiming(out.toString()), withoutTiming(err.toString()));
    }

    @Test
    void plainDescribeLinesGiveWhatTheParserGives() throws IOException {
        String f = Files.writeString(dir.resolve("site.csv"), "time,turbine,wind_ms\n"
                + "2025-03-01T00:00:00Z,T01,4\n2025-03-01T00:10:00Z,T02,6\n2025-03-01T00:20:00Z,T01,\n"
                + "2025-03-01T00:30:00Z,T01,8,extra\n2025-03-01T00:40:00Z,T03,fast\n").toString();
        String missing = dir.resolve("none.csv").toString();
        String[][] lines = {
            {"describe", f},
            {"describe", f, "--quiet"},
            {"describe", "--format", "json", f},
            {"describe", "--format=JSON", f, "--quiet"},
            {"describe", f, "--format", "table", "--debug"},
            {"describe", missing},
            {"describe", dir.toString()},
        };
        for (String[] line : lines) {
            assertNotNull(DescribeCommand.fromPlainLine(line), String.join(" ", line));
            Outcome viaParser = parsed(line);
            assertEquals(viaParser, quick(line), String.join(" ", line));
        }
        assertEquals(0, parsed("describe", f).status());
        assertEquals(2, parsed("describe", missing).status());
    }

    @Test
    void everyOtherLineIsLeftToTheParser() {
        String[][] lines = {
            {"describe"},
            {"describe", "--help"},
            {"describe", "-h", "a.csv"},
            {"describe", "a.csv", "b.csv"},
            {"describe", "a.csv", "--quiet", "--quiet"},
            {"describe", "a.csv", "--format", "xml"},
            {"describe", "a.csv", "--format", "json", "--format", "table"},
            {"describe", "a.csv", "--format"},
            {"describe", "--format", "--quiet", "a.csv"},
            {"describe", "--forma", "json", "a.csv"},
            {"describe", "--", "a.csv"},
            {"describe", "@args.txt"},
            {"describe", ""},
            {"--debug", "describe", "a.csv"},
            {"tune", "a.csv"},
        };
        for (String[] line : lines) {
            assertNull(DescribeCommand.fromPlainLine(line), String.join(" ", line));
        }
        // And the parser's own message for one of them, unchanged by the lane.
        assertEquals(2, quick("describe", "a.csv", "--format", "xml").status());
    }
}
