package nearfit.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;

import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Each batch command once as a real process ({@code java -cp ... nearfit.cli.Main}), exit statuses asserted. */
class BatchProcessTest {
    @TempDir
    static Path dir;

    @BeforeAll
    static void writeLogsAndFit() throws Exception {
        WindSiteCsv.write(dir.resolve("jan.csv"), 2, 200, 21, 0, 0, 0);
        WindSiteCsv.write(dir.resolve("feb.csv"), 2, 200, 22, 1, 0, 0.3);
        CliRun.Result r = CliRun.process(dir, "fit", "jan.csv", "-x", "wind_ms", "-y", "power_kw", "--k", "10",
                "--group", "turbine", "-o", "ref.nfm", "--quiet");
        assertEquals(0, r.status(), r.toString());
    }

    @Test
    void fitAsAProcessWritesAModel() {
        assertTrue(Files.isRegularFile(dir.resolve("ref.nfm")));
    }

    @Test
    void checkAsAProcessExits0OnHealthyAnd1OnUnderPerformingData() throws Exception {
        assertEquals(0, CliRun.process(dir, "check", "ref.nfm", "jan.csv", "--quiet").status());
        CliRun.Result failed = CliRun.process(dir, "check", "ref.nfm", "feb.csv", "--quiet");
        assertEquals(1, failed.status(), failed.toString());
        assertTrue(failed.out().contains("FAILED"), failed.out());
    }

    @Test
    void predictAsAProcessWritesCsvToStandardOutput() throws Exception {
        CliRun.Result r = CliRun.process(dir, "predict", "ref.nfm", "jan.csv", "--quiet");
        assertEquals(0, r.status(), r.toString());
        assertEquals(401, r.out().lines().count());
    }

    @Test
    void tuneAsAProcessPrintsTheTable() throws Exception {
        CliRun.Result r = CliRun.process(dir, "tune", "jan.csv", "-x", "wind_ms", "-y", "power_kw", "--kmax", "20",
                "--quiet");
        assertEquals(0, r.status(), r.toString());
        assertTrue(r.out().contains("one-SE k = "), r.out());
    }

    @Test
    void aBadOptionAsAProcessExits2WithOneLineAndNoStackTrace() throws Exception {
        CliRun.Result r = CliRun.process(dir, "check", "ref.nfm", "jan.csv", "--limit", "lots");
        assertEquals(2, r.status());
        assertEquals("nearfit: Invalid value for option '--limit': \"lots\" is not a percentage from 0 to 100", r.err().strip());
    }

    /**
     * A write cut short (here by a file-size limit of 8 KiB, so the disk seems full part-way) leaves
     * the previous file as it was and no partial file beside it.
     */
    @Test
    void anInterruptedWriteLeavesThePreviousFileAndNoPartialFile() throws Exception {
        Path out = dir.resolve("predictions.csv");
        Files.writeString(out, "previous\n");
        CliRun.Result r = CliRun.processWithShellPrefix(dir, "ulimit -f 8", "predict", "ref.nfm", "jan.csv",
                "-o", "predictions.csv", "--force", "--quiet");
        assertEquals(2, r.status(), r.toString());
        assertTrue(r.err().contains("predictions.csv: cannot write"), r.err());
        assertEquals("previous\n", Files.readString(out));
        try (Stream<Path> files = Files.list(dir)) {
            List<String> partial = files.map(p -> p.getFileName().toString()).filter(n -> n.endsWith(".part")).toList();
            assertEquals(List.of(), partial);
        }
    }

    @Test
    void withoutTheLimitTheSameWriteSucceeds() throws IOException, InterruptedException {
        CliRun.Result r = CliRun.process(dir, "predict", "ref.nfm", "jan.csv", "-o", "full.csv", "--quiet");
        assertEquals(0, r.status(), r.toString());
        assertTrue(Files.size(dir.resolve("full.csv")) > 8 * 1024, "the output is larger than the limit above");
    }
}
