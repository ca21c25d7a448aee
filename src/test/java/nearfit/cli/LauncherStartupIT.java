package nearfit.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.attribute.FileTime;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The launcher {@code scripts/nearfit} and the start-up cache the build made (after the package phase, on the
 * packaged jar). A cache may only ever make a command start faster: when it is missing, stale, made for
 * another runtime or damaged, the command runs as without it and prints nothing about it.
 */
class LauncherStartupIT {
    private static final Path ROOT = Path.of("").toAbsolutePath();
    private static final Path JAR = ROOT.resolve("target/nearfit.jar");
    private static final String JAVA17 = "/usr/lib/jvm/java-17-openjdk-amd64/bin/java";

    @TempDir
    Path tmp;

    record Run(int status, String out, String err) {
    }

    /** The cache the build made for the newest runtime, or null when there is no runtime of 24 or newer. */
    private static Path builtCache() throws IOException {
        Path dir = ROOT.resolve("target/startup");
        if (!Files.isDirectory(dir)) {
            return null;
        }
        try (Stream<Path> files = Files.list(dir)) {
            return files.filter(p -> p.getFileName().toString().endsWith(".aot")
                    && !p.getFileName().toString().endsWith("-describe.aot")).findFirst().orElse(null);
        }
    }

    private Run launch(Path root, Map<String, String> env, String... args) throws Exception {
        List<String> cmd = new ArrayList<>(List.of("bash", root.resolve("scripts/nearfit").toString()));
        cmd.addAll(List.of(args));
        ProcessBuilder pb = new ProcessBuilder(cmd).directory(tmp.toFile());
        pb.environment().remove("NEARFIT_STARTUP_CACHE");
        pb.environment().remove("NEARFIT_JAVA");
        pb.environment().putAll(env);
        Path out = tmp.resolve("out.txt");
        Path err = tmp.resolve("err.txt");
        pb.redirectOutput(out.toFile()).redirectError(err.toFile());
        Process p = pb.start();
        assertTrue(p.waitFor(120, TimeUnit.SECONDS), "launcher finished");
        return new Run(p.exitValue(), Files.readString(out, StandardCharsets.UTF_8), Files.readString(err, StandardCharsets.UTF_8));
    }

    /** A copy of the launcher and the jar in a folder of its own, with no sources, so nothing is rebuilt. */
    private Path copiedRoot() throws IOException {
        Path root = tmp.resolve("root");
        Files.createDirectories(root.resolve("scripts"));
        Files.createDirectories(root.resolve("target/startup"));
        for (String s : List.of("nearfit", "java-select")) {
            Files.copy(ROOT.resolve("scripts").resolve(s), root.resolve("scripts").resolve(s));
        }
        Files.copy(JAR, root.resolve("target/nearfit.jar"), StandardCopyOption.COPY_ATTRIBUTES);
        return root;
    }

    private Path csv() throws IOException {
        return Files.writeString(tmp.resolve("small.csv"), "load_pct,discharge_c\n10,70\n20,75\n30,81\n");
    }

    @Test
    void theBuiltCacheIsUsedAndActuallyLoadsTheToolsClasses() throws Exception {
        Path cache = builtCache();
        assumeTrue(cache != null, "no Java 24 or newer on this machine: the build made no cache");
        Run r = launch(ROOT, Map.of(), "--version");
        assertEquals(0, r.status(), r.err());
        assertTrue(r.out().contains("start-up cache: " + cache), r.out());
        assertEquals("", r.err());
        // The runtime maps the tool's classes from the cache (class+load says "shared objects file").
        String java = r.out().replaceAll("(?s).*\\((/[^)]*)\\).*", "$1") + "/bin/java";
        Process p = new ProcessBuilder(java, "-Xmx8g", "-XX:AOTCache=" + cache, "-Xlog:class+load=info",
                "-jar", JAR.toString(), "describe", csv().toString()).redirectErrorStream(true).start();
        String log = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
        assertTrue(p.waitFor(60, TimeUnit.SECONDS));
        assertEquals(0, p.exitValue(), log);
        assertTrue(log.lines().anyMatch(l -> l.contains("nearfit.table.CsvLoader ") && l.contains("shared objects file")),
                "CsvLoader came from the cache");
    }

    @Test
    void withoutACacheTheCommandRunsAndSaysNone() throws Exception {
        Path root = copiedRoot();
        Run r = launch(root, Map.of(), "describe", csv().toString());
        assertEquals(0, r.status(), r.err());
        assertTrue(r.out().contains("discharge_c"), r.out());
        assertEquals("", r.err());
        assertTrue(launch(root, Map.of(), "--version").out().contains("start-up cache: none"));
    }

    @Test
    void aCacheOlderThanTheJarIsLeftOut() throws Exception {
        Path cache = builtCache();
        assumeTrue(cache != null, "no Java 24 or newer on this machine");
        Path root = copiedRoot();
        Path stale = root.resolve("target/startup").resolve(cache.getFileName());
        Files.copy(cache, stale);
        Files.setLastModifiedTime(stale, FileTime.fromMillis(Files.getLastModifiedTime(root.resolve("target/nearfit.jar")).toMillis() - 60_000));
        Run r = launch(root, Map.of(), "--version");
        assertEquals(0, r.status());
        assertTrue(r.out().contains("start-up cache: none"), r.out());
        assertEquals("", r.err());
    }

    @Test
    void aDamagedOrForeignCacheIsIgnoredQuietly() throws Exception {
        Path cache = builtCache();
        assumeTrue(cache != null, "no Java 24 or newer on this machine");
        Path root = copiedRoot();
        // Named for this runtime and newer than the jar, so the launcher passes it: the runtime must refuse it silently.
        Files.write(root.resolve("target/startup").resolve(cache.getFileName()), new byte[] {1, 2, 3, 4, 5, 6, 7, 8});
        // The real cache, recorded for the jar at another path: also refused by the runtime.
        Run damaged = launch(root, Map.of(), "describe", csv().toString());
        assertEquals(0, damaged.status(), damaged.err());
        assertTrue(damaged.out().contains("load_pct"), damaged.out());
        assertEquals("", damaged.err());
        Files.copy(cache, root.resolve("target/startup").resolve(cache.getFileName()), StandardCopyOption.REPLACE_EXISTING);
        Run moved = launch(root, Map.of(), "describe", csv().toString());
        assertEquals(0, moved.status(), moved.err());
        assertEquals("", moved.err());
        assertEquals(damaged.out().lines().limit(4).toList(), moved.out().lines().limit(4).toList()); // all but the timing
    }

    @Test
    void anotherRuntimeNeverGetsTheCache() throws Exception {
        assumeTrue(Files.isExecutable(Path.of(JAVA17)), "no Java 17 at " + JAVA17);
        Run r = launch(ROOT, Map.of("NEARFIT_JAVA", JAVA17), "--version");
        assertEquals(0, r.status(), r.err());
        assertTrue(r.out().contains("Java 17."), r.out());
        assertTrue(r.out().contains("start-up cache: none"), r.out());
        assertFalse(r.err().contains("aot") || r.err().contains("cds"), r.err());
        assertEquals("", r.err());
    }
}
