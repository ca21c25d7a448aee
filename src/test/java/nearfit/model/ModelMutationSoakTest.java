package nearfit.model;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Map;
import java.util.SplittableRandom;
import java.util.TreeMap;

import nearfit.knn.Metric;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The model mutations of {@link ModelMutationPropertyTest} run many times (system property
 * {@code fuzz.tries}, 50000 by default, about four minutes), alternating the Euclidean and the
 * Mahalanobis model; every trial must end as {@link ModelMutations} requires, and the count of each
 * ending (refusals by the kind of their message) is written to target/soak/model-mutations.md and
 * standard output. Tagged "soak": scripts/fuzz-models or scripts/soak runs it.
 */
@Tag("soak")
class ModelMutationSoakTest {
    private static final int TRIES = Integer.getInteger("fuzz.tries", 50_000);
    private static final int SHOWN_KINDS = 25;
    private static final long SEED = Long.getLong("fuzz.seed", 20261202L);

    @TempDir
    Path dir;

    @Test
    void everyMutationOfAModelEndsInOneLineOrACorrectResult() throws IOException {
        ModelMutations[] models = {new ModelMutations(SmallModel.bytes(Metric.EUCLIDEAN, dir), dir),
            new ModelMutations(SmallModel.bytes(Metric.MAHALANOBIS, dir), dir)};
        Map<String, Integer> endings = new TreeMap<>();
        Map<String, Integer> refusals = new TreeMap<>();
        SplittableRandom seeds = new SplittableRandom(SEED);
        long start = System.nanoTime();
        for (int i = 0; i < TRIES; i++) {
            ModelMutations.Trial t = models[i % 2].run(seeds.nextLong());
            String kind = t.edit().startsWith("bytes") || t.edit().startsWith("cut") ? "byte edit"
                    : t.edit().startsWith("manifest text") ? "manifest text edit"
                    : t.edit().contains(" byte ") ? "array edit" : "field edit";
            endings.merge(kind + ": " + t.ending().name().toLowerCase(java.util.Locale.ROOT).replace('_', ' '), 1,
                    Integer::sum);
            if (t.ending() == ModelMutations.Ending.REFUSED) {
                refusals.merge(kindOf(t.detail()), 1, Integer::sum);
            }
        }
        double seconds = (System.nanoTime() - start) / 1e9;
        StringBuilder report = new StringBuilder();
        report.append(String.format("model mutations: %d tried in %.0f s (seed %d), every one ended in one line naming"
                + " the file or a correct result within %d s%n", TRIES, seconds, SEED,
                ModelMutations.BOUND.toSeconds()));
        endings.forEach((k, v) -> report.append(String.format("  %6d  %s%n", v, k)));
        report.append(String.format("refusals: %d kinds of message; the %d most frequent:%n", refusals.size(),
                Math.min(SHOWN_KINDS, refusals.size())));
        refusals.entrySet().stream().sorted((a, b) -> b.getValue() - a.getValue()).limit(SHOWN_KINDS)
                .forEach(e -> report.append(String.format("  %6d  %s%n", e.getValue(), e.getKey())));
        Path out = Path.of("target", "soak");
        Files.createDirectories(out);
        Files.writeString(out.resolve("model-mutations.md"), report.toString());
        System.out.print(report);
    }

    /** A refusal's kind: its text up to the first ';' or '(', numbers as #. */
    private static String kindOf(String detail) {
        String s = detail.replaceAll("\\d+(\\.\\d+)?(E-?\\d+)?", "#");
        int cut = s.length();
        for (char c : new char[] {';', '('}) {
            int at = s.indexOf(c);
            if (at > 0) {
                cut = Math.min(cut, at);
            }
        }
        return s.substring(0, Math.min(cut, 100)).strip();
    }
}
