package nearfit.spark;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStreamReader;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Queue;
import java.util.TreeSet;
import java.util.concurrent.ConcurrentLinkedQueue;
import java.util.stream.Stream;
import java.util.zip.GZIPInputStream;

import com.fasterxml.jackson.databind.JsonNode;
import org.apache.spark.sql.Dataset;
import org.apache.spark.sql.Row;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;

/**
 * Task failures in local[2,2] (each task tried at most twice, as Spark's spark.task.maxFailures counts
 * attempts): a task that fails once, after its writer has opened its file, is retried and the job's output and
 * counts equal a clean run's, with only the committed part files; a job whose task fails on every attempt ends
 * in one line and exit status 2 and leaves no output folder, or with --force the previous one as it was.
 * Faults come from a {@link TaskProbe} set here (no option reaches it), keyed on the task's partition and
 * {@code TaskContext.attemptNumber()}. Expected behaviour: Spark's task retry and its file committer's
 * task-attempt cleanup (Spark's documentation of spark.task.maxFailures and of the Hadoop output committers).
 */
class FleetRetryTest {
    private static final String HEADER = "time,turbine,wind_ms,wind_dir_deg,air_temp_c,air_density,power_kw,"
            + "rotor_rpm,gearbox_oil_c";
    /** Rows per block in these jobs, so each task scores several blocks and a fault can come mid-write. */
    private static final int BLOCK_ROWS = 1000;
    /** Rows of the inputs: the demo log's last two weeks, 18 to 31 December (8 turbines, every 10 minutes). */
    private static final int ROWS = 16_128;
    /** The failing task's partial files found in its attempt folder each time a fault fired (one JVM: local mode). */
    private static final Queue<Integer> FAULTS = new ConcurrentLinkedQueue<>();
    private static String model;
    private static String inputs;

    /**
     * Fails the attempts below {@code failedAttempts} of partition {@code partition} before its third block,
     * when the task's Parquet writer has taken two blocks and opened its file, noting how many partial files
     * of this task it saw under {@code parent}.
     */
    record FailAt(int partition, int failedAttempts, String parent) implements TaskProbe {
        @Override
        public void beforeBlock(int p, int attempt, int block) {
            if (p == partition && attempt < failedAttempts && block == 2) {
                FAULTS.add(partialFiles(Path.of(parent), p));
                throw new IllegalStateException("injected fault in partition " + p + ", attempt " + attempt);
            }
        }
    }

    /** The demo log's last two weeks as three CSV files of 5 376 rows, one task each. */
    @BeforeAll
    static void files() throws Exception {
        model = FleetTestData.model().toString();
        Path dir = Files.createTempDirectory("nearfit-spark-retry-in");
        List<Writer> parts = new ArrayList<>();
        for (int f = 0; f < 3; f++) {
            Writer w = Files.newBufferedWriter(dir.resolve("december-" + f + ".csv"));
            w.write(HEADER + "\n");
            parts.add(w);
        }
        try (BufferedReader in = new BufferedReader(new InputStreamReader(new GZIPInputStream(
                Files.newInputStream(FleetTestData.DEMO_LOG)), StandardCharsets.UTF_8))) {
            assertEquals(HEADER, in.readLine());
            long n = 0;
            for (String line = in.readLine(); line != null; line = in.readLine()) {
                if (line.compareTo("2025-12-18") >= 0) {
                    parts.get((int) (n++ * 3 / ROWS)).write(line + "\n");
                }
            }
            assertEquals(ROWS, n);
        }
        for (Writer w : parts) {
            w.close();
        }
        inputs = dir.toString();
        FleetTestData.spark();
    }

    @BeforeEach
    void clearFaults() {
        FAULTS.clear();
    }

    private static FleetTestData.Result job(TaskProbe probe, String... args) {
        return FleetTestData.fleetWith(o -> {
            o.blockRows = BLOCK_ROWS;
            o.probe = probe;
        }, args);
    }

    @Test
    void aTaskThatFailsOnceIsRetriedAndTheOutputEqualsACleanRun() throws Exception {
        Path parent = Files.createTempDirectory("nearfit-spark-retry-out");
        Path clean = parent.resolve("clean");
        Path retried = parent.resolve("retried");
        FleetTestData.Result a = job(TaskProbe.NONE, "predict", model, inputs, "-o", clean.toString());
        assertEquals(0, a.status(), a.toString());
        assertTrue(FAULTS.isEmpty());
        FleetTestData.Result b = job(new FailAt(1, 1, parent.toString()), "predict", model, inputs, "-o",
                retried.toString());
        assertEquals(0, b.status(), b.toString());
        assertEquals(List.of(1), List.copyOf(FAULTS), "the fault fires once, with the attempt's file open");

        Dataset<Row> x = FleetTestData.spark().read().parquet(clean.toString());
        Dataset<Row> y = FleetTestData.spark().read().parquet(retried.toString());
        assertEquals(ROWS, x.count());
        assertEquals(x.count(), y.count());
        assertEquals(0, x.except(y).count(), "rows of the clean run missing after the retry");
        assertEquals(0, y.except(x).count(), "rows after the retry the clean run has not");
        assertEquals(x.select("file", "row").distinct().count(), y.count(), "no row written twice");
        assertEquals(x.groupBy("turbine").count().collectAsList().stream().sorted(FleetRetryTest::byFirst).toList(),
                y.groupBy("turbine").count().collectAsList().stream().sorted(FleetRetryTest::byFirst).toList());

        assertEquals(partNumbers(clean), partNumbers(retried), "one committed part file per task");
        assertEquals(3, partNumbers(retried).size());
        assertOnlyCommittedFiles(retried);
        assertEquals(List.of("clean", "retried"), names(parent), "nothing else left beside the outputs");
    }

    @Test
    void aCheckWhoseTaskFailsOnceCountsEveryRowOnce() throws Exception {
        Path parent = Files.createTempDirectory("nearfit-spark-retry-check");
        FleetTestData.Result clean = job(TaskProbe.NONE, "check", model, inputs, "--format", "json");
        FleetTestData.Result retried = job(new FailAt(0, 1, parent.toString()), "check", model, inputs,
                "--format", "json", "-o", parent.resolve("flagged").toString());
        assertEquals(clean.status(), retried.status(), retried.toString());
        assertEquals(List.of(1), List.copyOf(FAULTS), "the fault fired once, with the attempt's file open");
        for (String field : new String[] {"rows", "scored", "flagged", "passed", "beyond_reference", "by_group",
            "worst"}) {
            assertEquals(clean.json().get(field), retried.json().get(field), field);
        }
        JsonNode f = retried.json().get("flagged");
        assertTrue(f.asLong() > 0, "the two weeks have flagged rows");
        assertEquals(f.asLong(), FleetTestData.spark().read().parquet(parent.resolve("flagged").toString()).count());
        assertOnlyCommittedFiles(parent.resolve("flagged"));
    }

    @Test
    void aJobWhoseTaskFailsEveryAttemptWritesNothing() throws Exception {
        Path parent = Files.createTempDirectory("nearfit-spark-retry-fail");
        Path out = parent.resolve("predicted");
        FleetTestData.Result r = job(new FailAt(1, Integer.MAX_VALUE, parent.toString()), "predict", model, inputs,
                "-o", out.toString());
        assertEquals(2, r.status(), r.toString());
        List<String> lines = r.err().strip().lines().toList();
        assertEquals(1, lines.size(), r.err());
        assertEquals("nearfit-spark: injected fault in partition 1, attempt 1 (the job failed; " + out
                + " not written)", lines.get(0));
        assertEquals(List.of(1, 1), List.copyOf(FAULTS), "two attempts, each failed with its file open");
        assertFalse(Files.exists(out), "a failed job left " + out);
        assertEquals(List.of(), names(parent), "a failed job left its work beside the output");
    }

    @Test
    void withForceAFailedJobKeepsThePreviousOutputAndASucceedingOneReplacesIt() throws Exception {
        Path parent = Files.createTempDirectory("nearfit-spark-retry-force");
        Path out = Files.createDirectories(parent.resolve("predicted"));
        Files.writeString(out.resolve("previous.txt"), "the previous run's");
        FleetTestData.Result r = job(new FailAt(2, Integer.MAX_VALUE, parent.toString()), "predict", model, inputs,
                "-o", out.toString(), "--force");
        assertEquals(2, r.status(), r.toString());
        assertEquals(1, r.err().strip().lines().count(), r.err());
        assertTrue(r.err().strip().endsWith("(the job failed; " + out + " left as it was)"), r.err());
        assertEquals(List.of(1, 1), List.copyOf(FAULTS));
        assertEquals(List.of("previous.txt"), names(out));
        assertEquals("the previous run's", Files.readString(out.resolve("previous.txt")));
        assertEquals(List.of("predicted"), names(parent));

        FleetTestData.Result ok = job(TaskProbe.NONE, "predict", model, inputs, "-o", out.toString(), "--force");
        assertEquals(0, ok.status(), ok.toString());
        assertFalse(Files.exists(out.resolve("previous.txt")));
        assertEquals(ROWS, FleetTestData.spark().read().parquet(out.toString()).count());
        assertOnlyCommittedFiles(out);
        assertEquals(List.of("predicted"), names(parent));
    }

    /** The folder holds part files, Spark's _SUCCESS and their checksums only: no _temporary, no attempt's file. */
    private static void assertOnlyCommittedFiles(Path dir) throws IOException {
        for (String n : names(dir)) {
            String plain = n.startsWith(".") && n.endsWith(".crc") ? n.substring(1, n.length() - 4) : n;
            assertTrue(plain.equals("_SUCCESS") || plain.matches("part-\\d{5}-[0-9a-f-]{36}-c000\\.snappy\\.parquet"),
                    dir + " holds " + n);
            assertTrue(Files.isRegularFile(dir.resolve(n)), n);
        }
        assertTrue(names(dir).contains("_SUCCESS"));
    }

    /** The task numbers of a folder's part files; a duplicate fails. */
    private static TreeSet<Integer> partNumbers(Path dir) throws IOException {
        TreeSet<Integer> out = new TreeSet<>();
        for (String n : names(dir)) {
            if (n.startsWith("part-")) {
                assertTrue(out.add(Integer.parseInt(n.substring(5, 10))), "two part files of task " + n);
            }
        }
        return out;
    }

    private static List<String> names(Path dir) throws IOException {
        try (Stream<Path> s = Files.list(dir)) {
            return s.map(p -> p.getFileName().toString()).sorted().toList();
        }
    }

    /** Part files of task {@code partition} under task-attempt folders (_temporary) anywhere below {@code dir}. */
    static int partialFiles(Path dir, int partition) {
        String prefix = String.format("part-%05d-", partition);
        try (Stream<Path> s = Files.walk(dir)) {
            return (int) s.filter(p -> p.toString().contains("/_temporary/")
                    && p.getFileName().toString().startsWith(prefix) && Files.isRegularFile(p)).count();
        } catch (IOException e) {
            throw new java.io.UncheckedIOException(e);
        }
    }

    private static int byFirst(Row a, Row b) {
        return String.valueOf(a.getString(0)).compareTo(String.valueOf(b.getString(0)));
    }
}
