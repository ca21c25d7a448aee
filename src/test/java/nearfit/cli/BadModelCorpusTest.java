package nearfit.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTimeoutPreemptively;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.function.UnaryOperator;

import nearfit.model.ModelEdits;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * The bad-model corpus, generated here from a model fitted by {@code fit} on an invented site log,
 * through {@code predict} and {@code check} in-process: each damaged or hostile model file ends with
 * status 2 and exactly the one line below naming the file, or, where the damage cannot change what
 * the model says, with the original model's output; never with a stack trace, and within a bound
 * enforced by the test (the bound catches a spin, it measures nothing).
 */
class BadModelCorpusTest {
    private static final Duration BOUND = Duration.ofSeconds(60);

    @TempDir
    static Path dir;
    static Path healthy;
    static Path weak;
    static byte[] euclidean;
    static byte[] mahalanobis;

    @BeforeAll
    static void fitTheReferences() throws IOException {
        healthy = WindSiteCsv.write(dir.resolve("healthy.csv"), 3, 100, 11, 0, 0, 0);
        weak = WindSiteCsv.write(dir.resolve("weak.csv"), 3, 100, 12, 2, 50, 0.25);
        euclidean = fit("ref.nfm", "wind_ms", "euclidean");
        mahalanobis = fit("ref-mahalanobis.nfm", "wind_ms,temp_c", "mahalanobis");
    }

    private static byte[] fit(String name, String inputs, String metric) throws IOException {
        Path model = dir.resolve(name);
        CliRun.Result r = CliRun.inProcess("fit", healthy.toString(), "-x", inputs, "-y", "power_kw", "--k", "15",
                "--metric", metric, "-o", model.toString(), "--quiet");
        assertEquals(0, r.status(), r.toString());
        return Files.readAllBytes(model);
    }

    /**
     * One corpus file: how it is made from the fitted model, and the line {@code predict} and
     * {@code check} must end with ({@code FILE} stands for its path), or {@code null} for the
     * original model's output.
     */
    record Case(String file, UnaryOperator<byte[]> make, boolean fromMahalanobis, String message) {
        @Override
        public String toString() {
            return file;
        }
    }

    private static UnaryOperator<byte[]> field(String path, Object value) {
        return b -> ModelEdits.withManifest(b, m -> ModelEdits.set(m, path, value));
    }

    static List<Case> corpus() {
        String spread = "nearfit: FILE: manifest field \"scaling.spread[0]\" is ";
        return List.of(
                new Case("manifest-crc-mismatch.nfm",
                        b -> ModelEdits.editManifestInPlace(b, "\"threshold\":3.5", "\"threshold\":9.5", false), false,
                        "nearfit: FILE: is damaged: entry manifest.json fails its CRC-32 check"),
                new Case("threshold-edited-crc-fixed.nfm",
                        b -> ModelEdits.editManifestInPlace(b, "\"threshold\":3.5", "\"threshold\":9.5", true), false,
                        "nearfit: FILE: is damaged: manifest.json does not match the SHA-256 in manifest.sha256"),
                new Case("spread-zero.nfm", field("scaling.spread[0]", 0.0), false,
                        spread + "0; a spread must be positive"),
                new Case("spread-subnormal.nfm", field("scaling.spread[0]", 1e-320), false,
                        spread + "1.0E-320; a spread must be positive and at least 2.2250738585072014E-308"),
                new Case("spread-negative.nfm", field("scaling.spread[0]", -2.0), false,
                        spread + "-2; a spread must be positive"),
                new Case("k-4294967306.nfm", field("k", 4294967306.0), false,
                        "nearfit: FILE: manifest field \"k\" is 4294967306; it must be a whole number from 1 to 300"),
                new Case("k-above-rows.nfm", field("k", 301.0), false,
                        "nearfit: FILE: manifest field \"k\" is 301; it must be a whole number from 1 to 300"),
                new Case("whitening-nan.nfm", field("scaling.whitening[0]", null), true,
                        "nearfit: FILE: manifest field \"scaling.whitening[0]\" is missing (null); it must be a finite"
                                + " number"),
                new Case("entry-listed-1000-times.nfm", BadModelCorpusTest::listedManyTimes, false,
                        "nearfit: FILE: damaged manifest: entry input.0 is listed twice"),
                new Case("unused-huge-entry.nfm", BadModelCorpusTest::unusedHugeEntry, false, null),
                new Case("truncated.nfm", b -> Arrays.copyOf(b, b.length / 2), false,
                        "nearfit: FILE: is not a nearfit model file, or it is damaged or truncated (zip END header not"
                                + " found)"),
                new Case("empty-arrays.nfm", BadModelCorpusTest::emptyArrays, false,
                        "nearfit: FILE: the model holds no usable reference rows (its manifest says \"rows\": 0)"),
                new Case("no-usable-rows.nfm", BadModelCorpusTest::noResponses, false,
                        "nearfit: FILE: the model holds no usable reference rows (every stored row misses its response"
                                + " power_kw)"));
    }

    private static byte[] listedManyTimes(byte[] b) {
        return ModelEdits.withManifest(b, m -> {
            @SuppressWarnings("unchecked")
            List<Object> entries = (List<Object>) m.get("entries");
            for (int i = 0; i < 1000; i++) {
                entries.add(new LinkedHashMap<>((Map<?, ?>) entries.get(0)));
            }
        });
    }

    /** 64 MiB of deflated zeros listed as an array no model reads, with checksums it would fail. */
    private static byte[] unusedHugeEntry(byte[] b) {
        byte[] listed = ModelEdits.withManifest(b, m -> {
            Map<String, Object> junk = new LinkedHashMap<>();
            junk.put("name", "junk");
            junk.put("type", "f64");
            junk.put("count", (double) (8L << 20));
            junk.put("crc32", 1.0);
            junk.put("sha256", "0".repeat(64));
            @SuppressWarnings("unchecked")
            List<Object> entries = (List<Object>) m.get("entries");
            entries.add(junk);
        });
        return ModelEdits.withDeflatedZeros(listed, "data/junk.f64", 64L << 20);
    }

    private static byte[] emptyArrays(byte[] b) {
        byte[] out = b;
        for (String name : List.of("input.0", "response", "source_line")) {
            out = ModelEdits.withArrayBytes(out, name, new byte[0]);
        }
        return ModelEdits.withManifest(out, m -> {
            m.put("rows", 0L);
            for (Object o : (List<?>) m.get("entries")) {
                @SuppressWarnings("unchecked")
                Map<String, Object> e = (Map<String, Object>) o;
                e.put("count", 0L);
            }
        });
    }

    private static byte[] noResponses(byte[] b) {
        int n = ModelEdits.entries(b).get("data/response.f64").length / 8;
        ByteBuffer y = ByteBuffer.allocate(n * 8).order(ByteOrder.LITTLE_ENDIAN);
        for (int i = 0; i < n; i++) {
            y.putDouble(Double.NaN);
        }
        return ModelEdits.withArrayBytes(b, "response", y.array());
    }

    static List<org.junit.jupiter.params.provider.Arguments> runs() {
        List<org.junit.jupiter.params.provider.Arguments> runs = new ArrayList<>();
        for (String command : List.of("predict", "check")) {
            for (Case c : corpus()) {
                runs.add(org.junit.jupiter.params.provider.Arguments.of(command, c));
            }
        }
        return runs;
    }

    private static CliRun.Result run(String command, Path model) {
        return assertTimeoutPreemptively(BOUND, () -> command.equals("predict")
                ? CliRun.inProcess("predict", model.toString(), healthy.toString(), "--quiet")
                : CliRun.inProcess("check", model.toString(), weak.toString(), "--quiet"));
    }

    @ParameterizedTest(name = "{0} {1}")
    @MethodSource("runs")
    void predictAndCheckEndEachBadModelWithStatus2AndOneLineOrTheTrueOutput(String command, Case c)
            throws IOException {
        byte[] original = c.fromMahalanobis() ? mahalanobis : euclidean;
        Path file = dir.resolve(c.file());
        Files.write(file, c.make().apply(original));
        CliRun.Result r = run(command, file);
        assertFalse(r.err().contains("\tat ") || r.err().contains("Exception"), () -> "a stack trace: " + r.err());
        if (c.message() != null) {
            assertEquals(2, r.status(), r::toString);
            assertEquals(c.message().replace("FILE", file.toString()) + "\n", r.err());
        } else {
            Path plain = dir.resolve("plain-" + c.file());
            Files.write(plain, original);
            CliRun.Result truth = run(command, plain);
            assertEquals(truth.status(), r.status(), r::toString);
            // check's report names the model file and its digest and the time of the run: facts of the run, not results.
            assertEquals(withoutRunFacts(truth.out()), withoutRunFacts(r.out()));
            assertEquals(truth.err(), r.err());
        }
    }

    @Test
    void theTrueModelFailsTheWeakBatchThatAnEditedThresholdWouldPass() throws IOException {
        Path model = dir.resolve("true.nfm");
        Files.write(model, euclidean);
        assertEquals(1, run("check", model).status(), "the weak turbine fails the true model");
        Path edited = dir.resolve("edited.nfm");
        Files.write(edited, ModelEdits.withManifest(euclidean, m -> ModelEdits.set(m, "flags.threshold", 1e6)));
        // A deliberate editor who recomputes every digest gets through: integrity, not a signature.
        assertEquals(0, run("check", edited).status());
        Files.write(edited, ModelEdits.editManifestInPlace(euclidean, "\"threshold\":3.5", "\"threshold\":9.5", true));
        assertEquals(2, run("check", edited).status());
    }

    /** The output without check's "model:" and "run:" header lines, which name the file, its digest and the time. */
    static String withoutRunFacts(String out) {
        return out.lines().filter(l -> !l.startsWith("model: ") && !l.startsWith("run: "))
                .collect(java.util.stream.Collectors.joining("\n"));
    }
}
