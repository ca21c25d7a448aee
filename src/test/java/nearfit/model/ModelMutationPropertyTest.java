package nearfit.model;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;

import nearfit.knn.Metric;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.lifecycle.AfterContainer;

/**
 * Random byte edits and random field edits of a real small model's manifest and arrays (see
 * {@link ModelMutations}): each ends in one line naming the file, or in a correct result, within a
 * bound enforced by the test. scripts/fuzz-models runs the same trials for longer and counts them.
 */
class ModelMutationPropertyTest {
    private static final Path DIR = tempDir();
    private static final ModelMutations EUCLIDEAN = new ModelMutations(SmallModel.bytes(Metric.EUCLIDEAN, DIR), DIR);
    private static final ModelMutations MAHALANOBIS = new ModelMutations(SmallModel.bytes(Metric.MAHALANOBIS, DIR), DIR);

    private static Path tempDir() {
        try {
            return Files.createTempDirectory("nearfit-mutations");
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    @AfterContainer
    static void removeTheFiles() throws IOException {
        try (var files = Files.list(DIR)) {
            for (Path p : (Iterable<Path>) files::iterator) {
                Files.deleteIfExists(p);
            }
        }
        Files.deleteIfExists(DIR);
    }

    @Property(tries = 300)
    void aMutatedEuclideanModelIsRefusedInOneLineOrGivesACorrectResult(@ForAll long seed) {
        EUCLIDEAN.run(seed);
    }

    @Property(tries = 150)
    void aMutatedMahalanobisModelIsRefusedInOneLineOrGivesACorrectResult(@ForAll long seed) {
        MAHALANOBIS.run(seed);
    }
}
