package nearfit.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.File;
import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;

import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * Where output goes wrong, in child JVMs: a full disk or a closed descriptor on standard output, a
 * reader that stops early, standard input given as the output file, a signal mid-write, a picture
 * written to a full disk, and output names near the file system's limit.
 */
class OutputSafetyTest {
    @TempDir
    static Path dir;

    @BeforeAll
    static void writeLogsAndFit() throws Exception {
        WindSiteCsv.write(dir.resolve("jan.csv"), 2, 200, 21, 0, 0, 0);
        CliRun.Result r = CliRun.process(dir, "fit", "jan.csv", "-x", "wind_ms", "-y", "power_kw", "--k", "10",
                "--group", "turbine", "-o", "ref.nfm", "--quiet");
        assertEquals(0, r.status(), r.toString());
    }

    /** {@code java -cp <test class path> nearfit.cli.Main args}. */
    static List<String> nearfit(String... args) {
        String java = Path.of(System.getProperty("java.home"), "bin", "java").toString();
        String cp = System.getProperty("surefire.test.class.path", System.getProperty("java.class.path"));
        List<String> command = new ArrayList<>(List.of(java, "-cp", cp, "nearfit.cli.Main"));
        command.addAll(List.of(args));
        return command;
    }

    /** Runs the process to its end (120 s at most) and returns its status and standard error. */
    static CliRun.Result finish(Process p) throws IOException, InterruptedException {
        String err = new String(p.getErrorStream().readAllBytes(), StandardCharsets.UTF_8);
        if (!p.waitFor(120, TimeUnit.SECONDS)) {
            p.destroyForcibly();
            throw new AssertionError("nearfit did not finish within 120 s");
        }
        return new CliRun.Result(p.exitValue(), "", err);
    }

    static List<List<String>> commandsWithOutput() {
        return List.of(
                List.of("describe", "jan.csv", "--quiet"),
                List.of("tune", "jan.csv", "-x", "wind_ms", "-y", "power_kw", "--kmax", "5", "--quiet"),
                List.of("predict", "ref.nfm", "jan.csv", "--quiet"),
                List.of("check", "ref.nfm", "jan.csv", "--quiet"),
                List.of("plot", "jan.csv", "-x", "wind_ms", "-y", "power_kw", "--k", "10", "--quiet"),
                List.of("--help"),
                List.of("--version"),
                List.of("completion", "bash"));
    }

    /** Before: status 0 (1 for a failed check) and nothing said; a redirect to a full disk left an empty file. */
    @ParameterizedTest(name = "{0}")
    @MethodSource("commandsWithOutput")
    void aFullDiskUnderStandardOutputEndsWithStatus2AndOneLine(List<String> args) throws Exception {
        Process p = new ProcessBuilder(nearfit(args.toArray(new String[0]))).directory(dir.toFile())
                .redirectOutput(new File("/dev/full")).start();
        CliRun.Result r = finish(p);
        assertEquals(2, r.status(), r::toString);
        assertEquals("nearfit: standard output: cannot write: No space left on device\n", r.err());
    }

    @Test
    void aClosedStandardOutputEndsWithStatus2AndOneLine() throws Exception {
        CliRun.Result r = CliRun.processWithShellPrefix(dir, "exec >&-", "describe", "jan.csv", "--quiet");
        assertEquals(2, r.status(), r::toString);
        assertEquals("nearfit: standard output: cannot write: Bad file descriptor\n", r.err());
    }

    /** As {@code nearfit predict ... | head -1}: the reader goes away; the run stays quiet and successful. */
    @Test
    void aReaderThatStopsEarlyEndsTheRunQuietlyWithStatus0() throws Exception {
        WindSiteCsv.write(dir.resolve("long.csv"), 2, 20_000, 5, 0, 0, 0);
        Process p = new ProcessBuilder(nearfit("predict", "ref.nfm", "long.csv", "--quiet")).directory(dir.toFile())
                .start();
        try (InputStream out = p.getInputStream()) {
            while (out.read() != '\n') {
                // the header line, then the reader stops: 3 MB of rows are still to come, more than a pipe holds
            }
        }
        CliRun.Result r = finish(p);
        assertEquals(0, r.status(), r::toString);
        assertEquals("", r.err());
    }

    /** Before: {@code predict m.nfm - -o s.csv --force < s.csv} replaced s.csv. */
    @Test
    void theFileOnStandardInputIsNeverReplaced() throws Exception {
        Path s = Files.copy(dir.resolve("jan.csv"), dir.resolve("stdin.csv"));
        byte[] before = Files.readAllBytes(s);
        Process p = new ProcessBuilder(nearfit("predict", "ref.nfm", "-", "-o", "stdin.csv", "--force", "--quiet"))
                .directory(dir.toFile()).redirectInput(s.toFile()).start();
        CliRun.Result r = finish(p);
        assertEquals(2, r.status(), r::toString);
        assertEquals("nearfit: stdin.csv: is this run's standard input; choose another output file\n", r.err());
        assertEquals(new String(before, StandardCharsets.UTF_8), Files.readString(s));
    }

    /** Before: a SIGTERM left a hidden part file as large as the output beside it. */
    @Test
    void sigtermDuringPredictLeavesThePreviousFileAndNoPartFile() throws Exception {
        Path sub = Files.createDirectories(dir.resolve("sigterm"));
        Files.copy(dir.resolve("ref.nfm"), sub.resolve("ref.nfm"));
        WindSiteCsv.write(sub.resolve("big.csv"), 2, 150_000, 8, 0, 0, 0);
        Files.writeString(sub.resolve("out.csv"), "previous\n");
        Process p = new ProcessBuilder(nearfit("predict", "ref.nfm", "big.csv", "-o", "out.csv", "--force", "--quiet"))
                .directory(sub.toFile()).redirectOutput(ProcessBuilder.Redirect.DISCARD)
                .redirectError(ProcessBuilder.Redirect.DISCARD).start();
        boolean sawPart = false;
        long end = System.currentTimeMillis() + 120_000;
        while (!sawPart && p.isAlive() && System.currentTimeMillis() < end) {
            sawPart = !parts(sub).isEmpty();
            Thread.sleep(sawPart ? 0 : 10);
        }
        p.destroy(); // SIGTERM
        assertTrue(p.waitFor(60, TimeUnit.SECONDS));
        assertTrue(sawPart, "predict began writing before it was stopped");
        assertEquals(143, p.exitValue(), "stopped by SIGTERM mid-write, not finished");
        assertEquals("previous\n", Files.readString(sub.resolve("out.csv")));
        assertEquals(List.of(), parts(sub));
    }

    private static List<String> parts(Path folder) throws IOException {
        try (Stream<Path> files = Files.list(folder)) {
            return files.map(f -> f.getFileName().toString()).filter(n -> n.endsWith(".part")).toList();
        }
    }

    /** Before: {@code Exception in thread "StreamCloser" java.lang.NullPointerException} after the error line. */
    @Test
    void aPictureWrittenToAFullDiskEndsWithOneLine() throws Exception {
        CliRun.Result r = CliRun.processWithShellPrefix(dir, "ulimit -f 8", "plot", "jan.csv", "-x", "wind_ms", "-y",
                "power_kw", "--k", "10", "--png", "full.png", "--quiet");
        assertEquals(2, r.status(), r::toString);
        // The system's font library may first say it could not write its own cache under the same limit
        // ("write cache: ..."); nearfit's part is its one line, last, and no trace.
        assertTrue(r.err().endsWith("\nnearfit: full.png: cannot write: File too large\n")
                || r.err().equals("nearfit: full.png: cannot write: File too large\n"), r::toString);
        assertEquals(1, r.err().lines().filter(l -> l.startsWith("nearfit:")).count(), r::toString);
        assertTrue(!r.err().contains("Exception") && !r.err().contains("\tat "), r::toString);
        assertTrue(Files.notExists(dir.resolve("full.png")));
    }

    /** Before: the work ran, then the temporary name (the target's own plus 25 characters) was too long. */
    @Test
    void aNameOf244CharactersIsWrittenAndAnOverlongOneRefusedBeforeTheWork() {
        String name = "p".repeat(240) + ".csv";
        CliRun.Result written = CliRun.inProcess("predict", dir.resolve("ref.nfm").toString(),
                dir.resolve("jan.csv").toString(), "-o", dir.resolve(name).toString(), "--quiet");
        assertEquals(0, written.status(), written::toString);
        assertTrue(Files.isRegularFile(dir.resolve(name)));
        Path overlong = dir.resolve("q".repeat(300) + ".nfm");
        // The input does not exist: the output's name is what fails first.
        CliRun.Result refused = CliRun.inProcess("fit", dir.resolve("absent.csv").toString(), "-x", "wind_ms", "-y",
                "power_kw", "-o", overlong.toString(), "--quiet");
        assertEquals(2, refused.status(), refused::toString);
        assertEquals("nearfit: " + overlong + ": file name too long (304 bytes; file systems take 255)\n", refused.err());
    }
}
