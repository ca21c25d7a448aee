package nearfit.spark;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.OutputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.zip.GZIPOutputStream;

import org.apache.logging.log4j.LogManager;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * Bad input ends a fleet job with one line from the driver and exit status 2, and leaves no output folder;
 * cells that are not numbers are counted and read as missing, never failing the job.
 */
class FleetBadInputTest {
    private static Path dir;
    private static String model;
    private static final String HEADER = "time,turbine,wind_ms,air_density,power_kw";

    @BeforeAll
    static void files() throws Exception {
        model = FleetTestData.model().toString();
        dir = Files.createTempDirectory("nearfit-spark-bad");
        FleetTestData.spark();
    }

    private static void assertOneLineExit2(FleetTestData.Result r, String says) {
        assertEquals(2, r.status(), r.toString());
        List<String> lines = r.err().strip().lines().toList();
        assertEquals(1, lines.size(), r.err());
        assertTrue(lines.get(0).startsWith("nearfit-spark: ") && lines.get(0).contains(says), r.err());
    }

    @Test
    void aMissingModelInputIsOneLine() throws Exception {
        Path csv = dir.resolve("no-density.csv");
        Files.writeString(csv, "time,turbine,wind_ms,power_kw\n2025-01-01T00:00:00Z,T01,7.5,900\n");
        assertOneLineExit2(FleetTestData.fleet("check", model, csv.toString()), "air_density");
    }

    @Test
    void aDamagedModelIsOneLineNamingIt() throws Exception {
        byte[] b = Files.readAllBytes(Path.of(model));
        Path damaged = dir.resolve("damaged.nfm");
        Files.write(damaged, java.util.Arrays.copyOf(b, b.length / 2));
        Path csv = dir.resolve("one.csv");
        Files.writeString(csv, HEADER + "\n2025-01-01T00:00:00Z,T01,7.5,1.22,900\n");
        assertOneLineExit2(FleetTestData.fleet("check", damaged.toString(), csv.toString()), damaged.toString());
    }

    @Test
    void aPathThatMatchesNothingIsOneLine() {
        assertOneLineExit2(FleetTestData.fleet("check", model, dir.resolve("absent.csv").toString()),
                "no such file or folder");
        assertOneLineExit2(FleetTestData.fleet("check", model, dir.resolve("nothing-*.parquet").toString()),
                "matches no file");
    }

    @Test
    void anEmptyFolderOrFileIsOneLine() throws Exception {
        Path empty = Files.createDirectories(dir.resolve("empty"));
        assertOneLineExit2(FleetTestData.fleet("check", model, empty.toString()), "is empty");
        Path zero = Files.createFile(dir.resolve("zero.csv"));
        assertOneLineExit2(FleetTestData.fleet("check", model, zero.toString()), "is empty");
    }

    @Test
    void aHeaderWithoutRowsScoresNothingAndIsOneLine() throws Exception {
        Path csv = dir.resolve("header-only.csv");
        Files.writeString(csv, HEADER + "\n");
        assertOneLineExit2(FleetTestData.fleet("check", model, csv.toString()), "no row scored");
    }

    @Test
    void cellsThatAreNotNumbersAreCountedNotFatal() throws Exception {
        Path csv = dir.resolve("bad-cells.csv");
        Files.writeString(csv, HEADER + "\n2025-01-01T00:00:00Z,T01,NA,1.22,900\n"
                + "2025-01-01T00:10:00Z,T01,7.5,1.22,9x0\n2025-01-01T00:20:00Z,T01,7.5,1.22,900\n");
        FleetTestData.Result r = FleetTestData.fleet("check", model, csv.toString(), "--format", "json");
        assertTrue(r.status() == 0 || r.status() == 1, r.toString());
        assertEquals(3, r.json().get("rows").asLong());
        assertEquals(1, r.json().get("scored").asLong());
        assertTrue(r.err().contains("2 cells"), r.err());
    }

    @Test
    void aJobThatFailsLeavesNoOutputFolder() throws Exception {
        // A gzip file cut short: the task reading it fails inside the write, after the output folder exists.
        Path gz = dir.resolve("cut.csv.gz");
        java.io.ByteArrayOutputStream bytes = new java.io.ByteArrayOutputStream();
        try (OutputStream out = new GZIPOutputStream(bytes)) {
            StringBuilder sb = new StringBuilder(HEADER + "\n");
            for (int i = 0; i < 20_000; i++) {
                sb.append("2025-01-01T00:00:00Z,T01,").append(3 + i % 10).append(".5,1.22,").append(i % 2000).append('\n');
            }
            out.write(sb.toString().getBytes(java.nio.charset.StandardCharsets.US_ASCII));
        }
        byte[] whole = bytes.toByteArray();
        Files.write(gz, java.util.Arrays.copyOf(whole, whole.length * 2 / 3));
        Path out = dir.resolve("flagged-out");
        FleetTestData.Result r = FleetTestData.fleet("check", model, gz.toString(), "-o", out.toString());
        assertEquals(2, r.status(), r.toString());
        assertEquals(1, r.err().strip().lines().count(), r.err());
        assertFalse(Files.exists(out), "a failed job left " + out);
        try (java.util.stream.Stream<Path> left = Files.list(dir)) {
            assertEquals(List.of(), left.filter(p -> p.getFileName().toString().startsWith(".flagged-out")).toList(),
                    "a failed job left its hidden work folder");
        }
    }

    @Test
    void anExistingOutputFolderIsKeptWithoutForce() throws Exception {
        Path csv = dir.resolve("two.csv");
        Files.writeString(csv, HEADER + "\n2025-01-01T00:00:00Z,T01,7.5,1.22,900\n");
        Path out = Files.createDirectories(dir.resolve("kept"));
        Files.writeString(out.resolve("mine.txt"), "keep me");
        assertOneLineExit2(FleetTestData.fleet("check", model, csv.toString(), "-o", out.toString()), "--force");
        assertTrue(Files.exists(out.resolve("mine.txt")));
    }

    @Test
    void anInputIsNeverTheOutputFolder() throws Exception {
        Path in = Files.createDirectories(dir.resolve("inputs"));
        Path csv = in.resolve("one.csv");
        Files.writeString(csv, HEADER + "\n2025-01-01T00:00:00Z,T01,7.5,1.22,900\n");
        assertOneLineExit2(FleetTestData.fleet("predict", model, in.toString(), "-o", in.toString(), "--force"),
                "input of this run");
        assertOneLineExit2(FleetTestData.fleet("predict", model, csv.toString(), "-o", in.toString(), "--force"),
                "input of this run");
        assertOneLineExit2(FleetTestData.fleet("predict", model, in.toString(), "-o", in.resolve("out").toString()),
                "input of this run");
        try (java.util.stream.Stream<Path> left = Files.list(in)) {
            assertEquals(List.of(csv), left.toList(), "the input folder is untouched");
        }
    }

    /** Spark's logging is fatal errors only in the tests and in the launcher's configuration (quiet runs). */
    @Test
    void sparkLogsOnlyErrors() throws Exception {
        assertFalse(LogManager.getLogger("org.apache.spark.SparkContext").isErrorEnabled());
        String launcher = new String(FleetBadInputTest.class.getResourceAsStream("/nearfit-spark-log4j2.properties")
                .readAllBytes(), java.nio.charset.StandardCharsets.UTF_8);
        assertTrue(launcher.contains("rootLogger.level = fatal"), launcher);
    }

    /** The tests run under at most 1 GiB of heap (surefire's argLine), as the issue asks. */
    @Test
    void theTestHeapIsAtMostOneGibibyte() {
        assertTrue(Runtime.getRuntime().maxMemory() <= 1L << 30, Runtime.getRuntime().maxMemory() + " bytes");
    }
}
