package nearfit.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.OutputStream;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.TimeUnit;
import java.util.zip.GZIPOutputStream;

import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * How commands open the files they are given: named pipes, {@code <(zcat x)} and {@code /dev/stdin} are
 * read as streams by every command (before: "no such file"), a non-ASCII name opens under {@code LC_ALL=C}
 * by the bytes given (before: an internal error), and running out of heap while a gzip file loads says
 * "while loading", naming the file.
 */
class InputPathsTest {
    @TempDir
    static Path dir;

    @BeforeAll
    static void writeLogAndFit() throws Exception {
        WindSiteCsv.write(dir.resolve("jan.csv"), 2, 200, 21, 0, 0, 0);
        CliRun.Result r = CliRun.inProcess("fit", dir.resolve("jan.csv").toString(), "-x", "wind_ms", "-y", "power_kw",
                "--k", "10", "-o", dir.resolve("ref.nfm").toString(), "--quiet");
        assertEquals(0, r.status(), r.toString());
    }

    private static String[] argsFor(String command, Path file) {
        String ref = dir.resolve("ref.nfm").toString();
        List<String> a = switch (command) {
            case "predict", "check" -> new ArrayList<>(List.of(command, ref, file.toString()));
            default -> new ArrayList<>(List.of(command, file.toString(), "-x", "wind_ms", "-y", "power_kw"));
        };
        a.addAll(command.equals("tune") ? List.of("--kmax", "10") : List.of());
        a.addAll(command.equals("fit") || command.equals("plot") ? List.of("--k", "10") : List.of());
        a.add("--quiet");
        if (command.equals("fit")) {
            a.addAll(List.of("-o", dir.resolve("from-pipe.nfm").toString(), "--force"));
        }
        if (command.equals("plot")) {
            a.add("--ascii");
        }
        return a.toArray(new String[0]);
    }

    /** A named pipe fed by another thread, as {@code <(zcat x)} is fed by the shell. */
    @ParameterizedTest(name = "{0}")
    @ValueSource(strings = {"fit", "tune", "plot", "predict", "check"})
    void everyCommandReadsANamedPipeAsAStream(String command) throws Exception {
        Path fifo = dir.resolve(command + ".fifo");
        assertEquals(0, new ProcessBuilder("mkfifo", fifo.toString()).start().waitFor());
        byte[] log = Files.readAllBytes(dir.resolve("jan.csv"));
        CompletableFuture<Void> feeder = CompletableFuture.runAsync(() -> {
            try (OutputStream out = Files.newOutputStream(fifo)) {
                out.write(log);
            } catch (IOException e) {
                throw new UncheckedIOException(e);
            }
        });
        CliRun.Result r = CliRun.inProcess(argsFor(command, fifo));
        if (!feeder.isDone()) {
            // The command failed before it opened the pipe: open it here, so the feeder ends.
            try (java.io.InputStream in = new java.io.FileInputStream(fifo.toFile())) {
                in.transferTo(OutputStream.nullOutputStream());
            }
        }
        feeder.get(60, TimeUnit.SECONDS);
        assertEquals(0, r.status(), r::toString);
        assertEquals("", r.err());
        CliRun.Result fromFile = CliRun.inProcess(argsFor(command, dir.resolve("jan.csv")));
        if (!command.equals("fit")) {
            assertEquals(BadModelCorpusTest.withoutRunFacts(fromFile.out().replace(dir.resolve("jan.csv").toString(), "FILE")),
                    BadModelCorpusTest.withoutRunFacts(r.out().replace(fifo.toString(), "FILE")),
                    "the same output as from the file itself");
        }
    }

    @Test
    void checkReadsDevStdinAndFitReadsAProcessSubstitution() throws Exception {
        Process check = new ProcessBuilder(OutputSafetyTest.nearfit("check", "ref.nfm", "/dev/stdin", "--quiet"))
                .directory(dir.toFile()).redirectInput(dir.resolve("jan.csv").toFile()).start();
        String out = new String(check.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
        CliRun.Result r = OutputSafetyTest.finish(check);
        assertEquals(0, r.status(), r::toString);
        assertTrue(out.contains("\nrows 400, scored 400,"), out);
        try (OutputStream gz = new GZIPOutputStream(Files.newOutputStream(dir.resolve("jan.csv.gz")))) {
            gz.write(Files.readAllBytes(dir.resolve("jan.csv")));
        }
        // Process substitution needs bash's own line: nearfit reads /dev/fd/N, a pipe.
        Process p = new ProcessBuilder("bash", "-c", "exec " + quoted(OutputSafetyTest.nearfit("fit", "--quiet", "-x",
                "wind_ms", "-y", "power_kw", "--k", "10", "-o", "zcat.nfm")) + " <(zcat jan.csv.gz)")
                .directory(dir.toFile()).start();
        String fitOut = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
        CliRun.Result zcat = OutputSafetyTest.finish(p);
        assertEquals(0, zcat.status(), zcat::toString);
        assertTrue(fitOut.startsWith("fitted k = 10 on 400 reference rows from /dev/fd/"), fitOut);
    }

    private static String quoted(List<String> words) {
        StringBuilder line = new StringBuilder();
        for (String w : words) {
            line.append(" '").append(w.replace("'", "'\\''")).append('\'');
        }
        return line.toString();
    }

    /** Cron's locale: the JVM decodes arguments and file names as ASCII, yet the file opens by its bytes. */
    @Test
    void underTheCLocaleANonAsciiFileNameOpensByTheBytesGiven() throws Exception {
        String name = "$'relev\\xc3\\xa9.csv'";
        String predicted = "$'pr\\xc3\\xa9dit.csv'";
        String java = quoted(OutputSafetyTest.nearfit());
        Process p = new ProcessBuilder("bash", "-c", "cp jan.csv " + name + " && export LC_ALL=C && "
                + java + " describe --quiet " + name + " && "
                + java + " fit --quiet -x wind_ms -y power_kw --k 10 -o c-locale.nfm " + name + " && "
                + java + " predict --quiet c-locale.nfm " + name + " -o " + predicted + " && "
                + java + " check --quiet c-locale.nfm " + name + " && cp c-locale.nfm $'mod\\xc3\\xa8le.nfm' && "
                + java + " predict --quiet $'mod\\xc3\\xa8le.nfm' " + name + " -o from-renamed.csv")
                .directory(dir.toFile()).start();
        String out = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
        CliRun.Result r = OutputSafetyTest.finish(p);
        assertEquals(0, r.status(), () -> r + out);
        assertEquals("", r.err());
        assertTrue(out.contains(".csv: 400 rows kept, 0 dropped, 5 columns, delimiter comma, header row"), out);
        assertTrue(out.contains("fitted k = 10 on 400 reference rows"), out);
        assertTrue(out.contains("rows 400, scored 400,"), out);
        assertEquals(401, Files.readAllLines(dir.resolve("pr\u00e9dit.csv")).size(), "the output has the name given");
        // A model file whose name the locale cannot spell opens too (through a link with a plain name).
        assertEquals(Files.readAllLines(dir.resolve("pr\u00e9dit.csv")), Files.readAllLines(dir.resolve("from-renamed.csv")));
    }

    /** Before: the gzip path (one thread inflating, one parsing) said "out of memory after loading". */
    @Test
    void runningOutOfHeapWhileAGzipFileLoadsSaysWhileLoading() throws Exception {
        Path gz = dir.resolve("big.csv.gz");
        try (OutputStream out = new GZIPOutputStream(Files.newOutputStream(gz), 1 << 16)) {
            out.write("wind_ms,power_kw,rotor_rpm,air_temp_c\n".getBytes(StandardCharsets.UTF_8));
            StringBuilder sb = new StringBuilder();
            for (int i = 0; i < 2_000_000; i++) {
                sb.append(i % 250 / 10.0).append(',').append(i % 2000).append(".5,").append(i % 17).append(".25,")
                        .append(i % 40 - 10).append('\n');
                if (sb.length() > 1 << 16) {
                    out.write(sb.toString().getBytes(StandardCharsets.UTF_8));
                    sb.setLength(0);
                }
            }
            out.write(sb.toString().getBytes(StandardCharsets.UTF_8));
        }
        String[] r = CommandRobustnessTest.child("48m", "describe", "--quiet", gz.toString());
        assertEquals("2", r[0], r[1]);
        assertEquals("nearfit: " + gz + ": out of memory while loading; give Java more heap "
                + "(for example NEARFIT_JAVA_OPTS=-Xmx16g)\n", r[1]);
    }
}
