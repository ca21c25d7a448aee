package nearfit.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The quick lane (a plain command line read without the option parser's model, {@link PlainLine}) gives exactly
 * what the parser's lane gives, for every command it takes, and leaves every other line to the parser.
 */
class QuickLaneTest {
    @TempDir
    Path dir;

    private record Outcome(int status, String out, String err) {
    }

    /** Load and run times, and the time of the run in a check report, are what two runs may differ in. */
    private static String withoutTiming(String text) {
        return text.replaceAll("loaded ([0-9.]+) MB in [0-9.]+ s \\([0-9]+ MB/s\\)", "loaded $1 MB")
                .replaceAll(" in [0-9.]+ s", " in (time) s")
                .replaceAll("\"(run|ran|time|checked)[a-z_]*\"\\s*:\\s*\"[^\"]*\"", "\"$1\": (time)")
                .replaceAll("20[0-9]{2}-[0-9]{2}-[0-9]{2}T[0-9:.]+Z \\(this run\\)", "(this run)");
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

    private static boolean plain(String... args) {
        return Main.plainLine(args, new PrintWriter(new StringWriter()), new PrintWriter(new StringWriter())) != null;
    }

    private static void sameInBothLanes(String... line) {
        assertTrue(plain(line), "plain: " + String.join(" ", line));
        Outcome viaParser = parsed(line);
        assertEquals(viaParser, quick(line), String.join(" ", line));
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
            sameInBothLanes(line);
        }
        assertEquals(0, parsed("describe", f).status());
        assertEquals(2, parsed("describe", missing).status());
    }

    @Test
    void plainLinesOfTheModelCommandsGiveWhatTheParserGives() throws IOException {
        String f = WindSiteCsv.write(dir.resolve("wind.csv"), 3, 120, 7, 2, 60, 0.2).toString();
        String m1 = dir.resolve("parsed.nfm").toString();
        String m2 = dir.resolve("quick.nfm").toString();
        Outcome fitParsed = parsed("fit", f, "-x", "wind_ms", "-y", "power_kw", "--k", "7", "-o", m1, "--quiet");
        Outcome fitQuick = quick("fit", f, "-x", "wind_ms", "-y", "power_kw", "--k", "7", "-o", m2, "--quiet");
        assertTrue(plain("fit", f, "-x", "wind_ms", "-y", "power_kw", "--k", "7", "-o", m2, "--quiet"));
        assertEquals(0, fitParsed.status(), fitParsed.toString());
        assertEquals(fitParsed.status(), fitQuick.status());
        assertEquals(fitParsed.out(), fitQuick.out().replace(m2, m1));
        String[][] lines = {
            {"tune", f, "-x", "wind_ms", "-y", "power_kw", "--kmax", "8"},
            {"tune", f, "-x", "wind_ms,temp_c", "-y", "power_kw", "--kmax=6", "--cv", "loo", "--format", "csv"},
            {"tune", f, "-y", "power_kw", "-x", "wind_ms", "--cv", "group", "--group", "turbine", "--threads", "1",
                "--metric", "manhattan", "--format", "json", "--quiet"},
            {"tune", f, "-x", "wind_ms", "-y", "power_kw", "--estimate", "median", "--sample", "50", "--debug"},
            {"fit", f, "-x", "wind_ms", "-y", "power_kw", "-o", m2, "--quiet"},
            {"fit", f, "-x", "wind_ms", "-y", "power_kw", "-o", "-"},
            {"predict", m1, f, "--quiet"},
            {"predict", m1, f, "-o", "-", "--where", "turbine != T01"},
            {"predict", m1, f, "--loo"},
            {"check", m1, f, "--quiet"},
            {"check", m1, f, "--limit", "50%", "--format", "json", "--threshold", "2.5"},
            {"check", m1, f, "--min-rows", "100000"},
            {"plot", f, "-x", "wind_ms", "-y", "power_kw", "--k", "5", "--size", "60x20", "--ascii"},
            {"tune", dir.resolve("none.csv").toString(), "-x", "wind_ms", "-y", "power_kw"},
            {"tune", f, "-x", "wind_ms", "-y", "no_such_column"},
            {"predict", dir.resolve("none.nfm").toString(), f},
        };
        for (String[] line : lines) {
            sameInBothLanes(line);
        }
        assertEquals(0, parsed(lines[0]).status());
        assertEquals(2, parsed(lines[lines.length - 1]).status());
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
            {"describe", "a.csv", "--quiet=true"},
            {"--debug", "describe", "a.csv"},
            {"tune", "a.csv", "-x", "w"},
            {"tune", "a.csv", "-x", "w", "-y", "p", "--k", "3"},
            {"tune", "a.csv", "-x", "w", "-y", "p", "--kmax", "0"},
            {"tune", "a.csv", "-x", "w", "-y", "p", "--kmax", "5", "--kmax", "6"},
            {"tune", "a.csv", "-xw", "-y", "p"},
            {"tune", "a.csv", "-x=w", "-y", "p"},
            {"tune", "a.csv", "-x", "w", "-y", "p", "--cv", "sometimes"},
            {"tune", "a.csv", "-x", "w", "-y", "p", "--threshold", "-1"},
            {"fit", "a.csv", "-x", "w", "-y", "p"},
            {"predict", "m.nfm"},
            {"check", "m.nfm", "a.csv", "--version"},
            {"view", "a.csv"},
            {"completion"},
            {"nosuch", "a.csv"},
            {},
        };
        for (String[] line : lines) {
            assertNull(Main.plainLine(line, new PrintWriter(new StringWriter()), new PrintWriter(new StringWriter())),
                    String.join(" ", line));
        }
        // And the parser's own message for two of them, unchanged by the lane.
        assertEquals(2, quick("describe", "a.csv", "--format", "xml").status());
        Outcome refused = quick("tune", "a.csv", "-x", "w", "-y", "p", "--kmax", "0");
        assertEquals(2, refused.status());
        assertTrue(refused.err().contains("--kmax"), refused.err());
    }

    @Test
    void theLaneReadsTheParserAnnotationsFromTheClassFile() {
        DeclaredAnnotations.OfClass tune = DeclaredAnnotations.of(TuneCommand.class);
        assertNotNull(tune);
        DeclaredAnnotations.Annotation command = tune.annotations().get(0);
        assertEquals(picocli.CommandLine.Command.class.getName(), command.type());
        assertEquals("tune", command.elements().get("name"));
        assertEquals(Boolean.TRUE, command.elements().get("mixinStandardHelpOptions"));
        DeclaredAnnotations.OfClass tuning = DeclaredAnnotations.of(TuningOptions.class);
        DeclaredAnnotations.FieldAnnotations cv = tuning.fields().stream().filter(f -> f.name().equals("cv"))
                .findFirst().orElseThrow();
        var option = cv.annotations().get(0).elements();
        assertEquals(java.util.List.of("--cv"), option.get("names") instanceof java.util.List<?> l ? l
                : java.util.List.of(option.get("names")));
        assertEquals("auto", option.get("defaultValue"));
        assertEquals(HeldOutWords.class.getName(), ((java.util.List<?>) option.get("converter")).get(0));
    }
}
