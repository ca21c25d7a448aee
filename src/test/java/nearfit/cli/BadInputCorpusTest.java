package nearfit.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.BufferedWriter;
import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * The bad-input corpus (src/test/resources/bad-input, written by its make-corpus.py) through the
 * commands, in-process through {@link Main#run}: each input ends with exit status 2 and the one line
 * below, or with status 0 where the input is acceptable, and never with a stack trace.
 */
class BadInputCorpusTest {
    @TempDir
    Path dir;

    /**
     * One corpus file and what {@code describe} must do with it. {@code FILE} in a message stands for
     * the path given on the command line; for status 0 the message is a line the report must contain.
     */
    record Case(String file, int status, String message) {
        @Override
        public String toString() {
            return file;
        }
    }

    static List<Case> corpus() {
        return List.of(
                new Case("empty.csv", 2, "nearfit: FILE: empty file: no header and no rows"),
                new Case("header-only.csv", 2, "nearfit: FILE: header only: no data rows"),
                new Case("binary.bin", 2, "nearfit: FILE: not a CSV text file: binary data (a NUL byte) at byte 0"),
                new Case("truncated.csv.gz", 2, "nearfit: FILE: truncated or damaged gzip stream before any row "
                        + "(Unexpected end of ZLIB input stream)"),
                new Case("quote-never-closed.csv", 2, "nearfit: FILE:13: the quote opened on this line is never closed"),
                // Lines 11 and 12 use ; and tab: each is one field, a short row, dropped whole.
                new Case("mixed-delimiters.csv", 0, "ragged rows: 2 dropped (2 short, 0 long; none of their cells is used)"),
                new Case("all-missing-power.csv", 0, "power_kw    number        0       30    0"),
                new Case("constant-input.csv", 0, "air_temp_c  number       40        0    0"),
                // NaN, nan, NAN are missing tokens; the ten spellings of infinity are bad cells.
                new Case("nan-and-infinity.csv", 0, "bad cells: 10 (read as missing)"),
                // Bytes that are not UTF-8 are decoded with replacement characters, not refused.
                new Case("latin1-bytes.csv", 0, "latin1-bytes.csv: 30 rows kept, 0 dropped, 5 columns, delimiter comma, header row"),
                new Case("windows-line-endings.csv", 0, "windows-line-endings.csv: 30 rows kept, 0 dropped, 5 columns, delimiter comma, header row"),
                new Case("good.csv", 0, "bad cells: 0 (read as missing)"),
                // Escape sequences in a header name and in labels are shown as visible escapes.
                new Case("escape-sequences.csv", 0, "  turbine\\e]2;pwned\\a\\e[2J: 8 distinct; most frequent T01 (4) T02 (4) "
                        + "T03\\e[31m (4) T04 (4) T05 (4)"),
                // air_temp_c twice beside air_temp_c_2: the second becomes air_temp_c_3, and the report says so.
                new Case("repeated-names.csv", 0, "warning: header names renamed to keep them unique: column 6 "
                        + "(\"air_temp_c\" again) as air_temp_c_3"),
                new Case("gzip-magic-only.gz", 2, "nearfit: FILE: truncated gzip stream: the file ends inside the gzip "
                        + "header (it holds the gzip magic bytes, but no compressed data)"),
                // Parquet, written by DuckDB (scripts/reference/make-parquet-fixtures): recognised by the magic bytes.
                new Case("parquet-good.parquet", 0, "parquet-good.parquet: 60 rows kept, 0 dropped, 5 columns, Parquet"),
                new Case("parquet-lz4.parquet", 0, "parquet-lz4.parquet: 60 rows kept, 0 dropped, 5 columns, Parquet"),
                new Case("parquet-truncated.parquet", 2, "nearfit: FILE: truncated or damaged: the Parquet file does not "
                        + "end with PAR1"),
                new Case("parquet-magic-only.parquet", 2, "nearfit: FILE: truncated or damaged: a footer of 0 bytes in a "
                        + "file of 16"),
                new Case("parquet-brotli.parquet", 2, "nearfit: FILE: pages compressed with BROTLI are not supported "
                        + "(SNAPPY, GZIP, ZSTD, LZ4_RAW or none are)"),
                new Case("relev\u00e9-donn\u00e9es.csv", 0, "relev\u00e9-donn\u00e9es.csv: 30 rows kept, 0 dropped, 5 columns, "
                        + "delimiter comma, header row"));
    }

    /**
     * What {@code plot}, {@code tune} and {@code fit} (response power_kw, inputs wind_ms and air_temp_c)
     * must do with each corpus file: the loader's message when it refuses the file, the engine's when no
     * model can be made, else status 0 with output and nothing on standard error.
     */
    static List<Case> modelCorpus() {
        List<Case> out = new java.util.ArrayList<>();
        for (Case c : corpus()) {
            out.add(switch (c.file()) {
                case "all-missing-power.csv" -> new Case(c.file(), 2,
                        "nearfit: no usable reference rows: power_kw is missing in all 30 rows");
                case "constant-input.csv" -> new Case(c.file(), 2, "nearfit: column air_temp_c: is constant (7.5) in "
                        + "the reference rows, so it cannot be scaled; leave it out");
                // The renaming is said on standard error by every command, as a load warning.
                case "repeated-names.csv" -> new Case(c.file(), 0, "nearfit: " + c.message());
                default -> c.status() == 2 ? c : new Case(c.file(), 0, "");
            });
        }
        return out;
    }

    static List<org.junit.jupiter.params.provider.Arguments> modelRuns() {
        List<org.junit.jupiter.params.provider.Arguments> runs = new java.util.ArrayList<>();
        for (String command : List.of("plot", "tune", "fit")) {
            for (Case c : modelCorpus()) {
                runs.add(org.junit.jupiter.params.provider.Arguments.of(command, c));
            }
        }
        return runs;
    }

    private String[] modelArgs(String command, Path file) {
        List<String> a = new java.util.ArrayList<>(List.of(command, file.toString(), "-x", "wind_ms,air_temp_c",
                "-y", "power_kw", "--quiet"));
        switch (command) {
            case "plot" -> a.addAll(List.of("--ascii", "--size", "60x20"));
            case "fit" -> a.addAll(List.of("-o", dir.resolve(file.getFileName() + ".nfm").toString()));
            default -> { }
        }
        return a.toArray(new String[0]);
    }

    @ParameterizedTest(name = "{0} {1}")
    @MethodSource("modelRuns")
    void plotTuneAndFitEndEachBadInputWithItsStatusAndOneLine(String command, Case c) throws IOException {
        Path file = copy(c.file());
        CliRun.Result r = run(modelArgs(command, file));
        assertEquals(c.status(), r.status(), () -> command + " " + c.file() + ": " + r);
        assertFalse(r.err().contains("\tat ") || r.err().contains("Exception"), () -> "a stack trace: " + r.err());
        if (c.status() == 2) {
            assertEquals(c.message().replace("FILE", file.toString()) + "\n", r.err());
        } else {
            assertEquals(c.message().isEmpty() ? "" : c.message() + "\n", r.err());
            assertTrue(r.out().indexOf('\u001b') < 0, () -> "an escape character on standard output: " + r.out());
            if (command.equals("fit")) {
                assertTrue(Files.size(dir.resolve(c.file() + ".nfm")) > 0, "the model file is written");
            } else {
                assertFalse(r.out().isBlank(), "the " + command + " output");
            }
        }
    }

    private static CliRun.Result run(String... args) {
        return CliRun.inProcess(args);
    }

    private Path copy(String name) throws IOException {
        try (InputStream in = BadInputCorpusTest.class.getResourceAsStream("/bad-input/" + name)) {
            Path p = dir.resolve(name);
            Files.write(p, in.readAllBytes());
            return p;
        }
    }

    /** Status 2 with exactly one line and no trace; or status 0 with the expected line in the report. */
    static void assertOutcome(Case c, Path file, CliRun.Result r) {
        assertEquals(c.status(), r.status(), () -> c.file() + ": " + r);
        assertFalse(r.err().contains("\tat ") || r.err().contains("Exception"), () -> "a stack trace: " + r.err());
        if (c.status() == 2) {
            assertEquals(c.message().replace("FILE", file.toString()) + "\n", r.err());
        } else {
            assertTrue(r.out().contains(c.message().replace("FILE", file.toString())), () -> r.out());
        }
    }

    @ParameterizedTest(name = "describe {0}")
    @MethodSource("corpus")
    void describeEndsEachBadInputWithItsStatusAndOneLine(Case c) throws IOException {
        Path file = copy(c.file());
        assertOutcome(c, file, run("describe", "--quiet", file.toString()));
    }

    @Test
    void describeReportsBytesThatAreNotUtf8AsReplacementCharactersInTheirLabels() throws IOException {
        CliRun.Result r = run("describe", "--quiet", copy("latin1-bytes.csv").toString());
        assertEquals(0, r.status());
        assertTrue(r.out().contains("turbine: 11 distinct"), r.out());
    }

    @Test
    void describeNamesTheLineOfALineOfSeveralMegabytes() throws IOException {
        Path p = dir.resolve("wide.csv");
        try (BufferedWriter w = Files.newBufferedWriter(p, StandardCharsets.UTF_8)) {
            w.write("wind_ms,note\n1,ok\n2,\"");
            w.write("x".repeat(6 << 20));
            w.write("\"\n3,ok\n");
        }
        CliRun.Result r = run("describe", "--quiet", p.toString());
        assertEquals(2, r.status(), r.toString());
        assertEquals("nearfit: " + p + ":3: line over 1 MB (a quote never closed, or not a CSV file?)\n", r.err());
    }

    @Test
    void describeReadsAMillionNumbersFollowedByTextAsBadCellsOfANumberColumn() throws IOException {
        Path p = dir.resolve("turns.csv");
        try (BufferedWriter w = Files.newBufferedWriter(p, StandardCharsets.UTF_8)) {
            w.write("wind_ms,power_kw\n");
            for (int i = 0; i < 1_000_000; i++) {
                w.write((i % 250) / 10.0 + "," + (i % 2000) + "\n");
            }
            for (int i = 0; i < 40; i++) {
                w.write("7.5,offline\n");
            }
        }
        CliRun.Result r = run("describe", "--quiet", p.toString());
        assertEquals(0, r.status(), r.toString());
        assertTrue(r.out().contains("bad cells: 40 (read as missing)\n  line 1000002, column power_kw: \"offline\"\n"), r.out());
    }

    /** {@code a,a,a_2}: the name a_2 keeps meaning the header's own column, not the renamed second a. */
    @Test
    void aRepeatedNameNeverTakesANameTheHeaderHolds() throws IOException {
        Path file = copy("repeated-names.csv");
        Path model = dir.resolve("repeated.nfm");
        CliRun.Result fit = run("fit", file.toString(), "-x", "air_temp_c_2", "-y", "power_kw", "--k", "3", "-o",
                model.toString(), "--quiet");
        assertEquals(0, fit.status(), fit::toString);
        CliRun.Result predicted = run("predict", model.toString(), file.toString(), "--quiet");
        assertEquals(0, predicted.status(), predicted::toString);
        List<String> lines = predicted.out().lines().toList();
        List<String> header = List.of(lines.get(0).split(","));
        assertTrue(header.contains("air_temp_c_2") && !header.contains("air_temp_c_3"), lines.get(0));
        // The header's air_temp_c_2 holds 0, -1, -2, ...; the second air_temp_c (now air_temp_c_3) 0, 1, 2, ...
        String[] row = lines.get(3).split(",");
        assertEquals("4", row[0], lines.get(3));
        assertEquals(-2.0, Double.parseDouble(row[header.indexOf("air_temp_c_2")]), lines.get(3));
    }

    @Test
    void checkAndPlotShowEscapeSequencesOfAGroupColumnVisibly() throws IOException {
        Path file = copy("escape-sequences.csv");
        String group = "turbine\u001b]2;pwned\u0007\u001b[2J";
        Path model = dir.resolve("escape.nfm");
        CliRun.Result fit = run("fit", file.toString(), "-x", "wind_ms", "-y", "power_kw", "--k", "3", "--group", group,
                "-o", model.toString(), "--quiet");
        assertEquals(0, fit.status(), fit::toString);
        CliRun.Result check = run("check", model.toString(), file.toString(), "--threshold", "0.01", "--quiet");
        assertEquals(1, check.status(), check::toString);
        assertTrue(check.out().contains("turbine\\e]2;pwned\\a\\e[2J") && check.out().contains("T03\\e[31m"), check.out());
        StringBuilder csv = new StringBuilder("wind\u001b]2;x\u0007_ms,power\n");
        for (int i = 0; i < 40; i++) {
            csv.append(i).append(',').append(i * i % 17).append('\n');
        }
        Path named = Files.writeString(dir.resolve("named.csv"), csv);
        CliRun.Result plot = run("plot", named.toString(), "-x", "wind\u001b]2;x\u0007_ms", "-y", "power", "--k", "3",
                "--quiet");
        assertEquals(0, plot.status(), plot::toString);
        assertTrue(plot.out().contains("wind\\e]2;x\\a_ms"), plot::toString);
        for (CliRun.Result r : List.of(check, plot)) {
            assertTrue(r.out().indexOf('\u001b') < 0 && r.out().indexOf('\u0007') < 0, r::toString);
            assertTrue(r.err().indexOf('\u001b') < 0 && r.err().indexOf('\u0007') < 0, r::toString);
        }
    }

    @Test
    void anErrorMessageQuotingTheFilesColumnsShowsTheirEscapesVisibly() throws IOException {
        Path file = copy("escape-sequences.csv");
        CliRun.Result r = run("tune", file.toString(), "-x", "wind_ms", "-y", "power_kw", "--where", "nothing = 1",
                "--quiet");
        assertEquals(2, r.status(), r::toString);
        assertEquals("nearfit: --where: no column \"nothing\" in " + file + " (columns: time, turbine\\e]2;pwned\\a\\e[2J, "
                + "wind_ms, power_kw, air_temp_c)\n", r.err());
    }
}
