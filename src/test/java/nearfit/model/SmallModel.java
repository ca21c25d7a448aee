package nearfit.model;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.SplittableRandom;

import nearfit.knn.Band;
import nearfit.knn.Estimates;
import nearfit.knn.FlagScale;
import nearfit.knn.Flags;
import nearfit.knn.KnnModel;
import nearfit.knn.KnnSettings;
import nearfit.knn.Metric;
import nearfit.knn.Progress;
import nearfit.knn.ReferenceData;
import nearfit.knn.Scaling;
import nearfit.knn.Weighting;

/**
 * A real small model file, fitted by the engine on 120 invented rows (wind speed, air temperature,
 * power) and saved by {@link ModelFile}, for the tests that damage models; and the query grid its
 * estimates are compared on.
 */
public final class SmallModel {
    /** Queries: input j of query i is {@code GRID[j][i]}. */
    static final double[][] GRID = grid();

    private SmallModel() {
    }

    /** The bytes of the model file fitted with this metric (Mahalanobis stores a whitening matrix). */
    public static byte[] bytes(Metric metric, Path dir) {
        KnnSettings settings = new KnnSettings(7, metric, Weighting.TRICUBE, Scaling.Z, Band.Q05_Q95, 3.5,
                FlagScale.GLOBAL_MAD, 1);
        KnnModel fitted = KnnModel.fit(reference(120), settings);
        ReferenceModel captured = ReferenceCapture.capture("test", new SourceInfo("site-log.csv", 10, null, null),
                fitted, Flags.leaveOneOut(fitted, Progress.NONE), null, -1, List.of(), null, List.of(),
                row -> -1, row -> row + 2L);
        Path file = dir.resolve("small-" + metric.name().toLowerCase(java.util.Locale.ROOT) + ".nfm");
        try {
            Files.deleteIfExists(file);
            ModelFile.write(captured, file, false, List.of());
            return Files.readAllBytes(file);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    /** Reads a model file and estimates at the grid, as predict does (rebuilt index, stored settings). */
    public static Estimates estimates(Path file) {
        RestoredModel restored = RestoredModel.of(ModelFile.read(file), 1);
        return restored.engine().estimateAll(GRID, Progress.NONE);
    }

    private static ReferenceData reference(int n) {
        SplittableRandom r = new SplittableRandom(15);
        double[] wind = new double[n];
        double[] temp = new double[n];
        double[] power = new double[n];
        for (int i = 0; i < n; i++) {
            wind[i] = 3 + 12 * r.nextDouble();
            temp[i] = -5 + 25 * r.nextDouble();
            power[i] = 2000 / (1 + Math.exp(-0.9 * (wind[i] - 8))) - 3 * temp[i] + 30 * (r.nextDouble() - 0.5);
        }
        return ReferenceData.numeric(new String[] {"wind_ms", "air_temp_c"}, new double[][] {wind, temp},
                "power_kw", power, null);
    }

    private static double[][] grid() {
        SplittableRandom r = new SplittableRandom(21);
        double[][] g = new double[2][40];
        for (int i = 0; i < 40; i++) {
            g[0][i] = 2 + 14 * r.nextDouble();
            g[1][i] = -8 + 30 * r.nextDouble();
        }
        return g;
    }
}
