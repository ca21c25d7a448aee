package nearfit.model;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import java.nio.file.Path;
import java.util.List;
import java.util.SplittableRandom;

import nearfit.knn.Band;
import nearfit.knn.Estimates;
import nearfit.knn.FlagResult;
import nearfit.knn.FlagScale;
import nearfit.knn.Flags;
import nearfit.knn.KnnModel;
import nearfit.knn.KnnSettings;
import nearfit.knn.Metric;
import nearfit.knn.Progress;
import nearfit.knn.ReferenceData;
import nearfit.knn.Scaling;
import nearfit.knn.Weighting;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;
import org.junit.jupiter.api.io.TempDir;

class RestoredModelTest {
    @TempDir
    Path dir;

    /** Two inputs (wind speed, air temperature) and power with noise; row ids 100.. to test the mapping. */
    private static ReferenceData reference(int n) {
        SplittableRandom r = new SplittableRandom(5);
        double[] wind = new double[n];
        double[] temp = new double[n];
        double[] power = new double[n];
        int[] ids = new int[n];
        for (int i = 0; i < n; i++) {
            wind[i] = 3 + 12 * r.nextDouble();
            temp[i] = -5 + 25 * r.nextDouble();
            power[i] = 2000 / (1 + Math.exp(-0.9 * (wind[i] - 8))) - 3 * temp[i] + 30 * (r.nextDouble() - 0.5);
            ids[i] = 100 + i;
        }
        return ReferenceData.numeric(new String[] {"wind_ms", "air_temp_c"}, new double[][] {wind, temp},
                "power_kw", power, ids);
    }

    @ParameterizedTest
    @EnumSource(Metric.class)
    void aSavedAndLoadedModelEstimatesExactlyAsTheFittedOne(Metric metric) {
        KnnSettings settings = new KnnSettings(12, metric, Weighting.TRICUBE, Scaling.ROBUST, Band.Q05_Q95, 3.5,
                FlagScale.GLOBAL_MAD, 2);
        KnnModel fitted = KnnModel.fit(reference(600), settings);
        FlagResult loo = Flags.leaveOneOut(fitted, Progress.NONE);
        ReferenceModel captured = ReferenceCapture.capture("test", new SourceInfo("site-log.csv", 10, null, null),
                fitted, loo, null, -1, List.of(), null, List.of(), row -> -1, row -> row + 2L);
        Path file = dir.resolve("ref.nfm");
        ModelFile.write(captured, file, false, List.of());
        RestoredModel restored = RestoredModel.of(ModelFile.read(file), 2);

        double[][] grid = new double[2][200];
        SplittableRandom r = new SplittableRandom(9);
        for (int i = 0; i < 200; i++) {
            grid[0][i] = 2 + 14 * r.nextDouble();
            grid[1][i] = -8 + 30 * r.nextDouble();
        }
        Estimates a = fitted.estimateAll(grid, Progress.NONE);
        Estimates b = restored.engine().estimateAll(grid, Progress.NONE);
        assertArrayEquals(a.fit(), b.fit());
        assertArrayEquals(a.bandLow(), b.bandLow());
        assertArrayEquals(a.bandHigh(), b.bandHigh());
        assertEquals(loo.mad(), restored.stored().residualScale().scale());
        assertEquals(settings.metric(), restored.engine().settings().metric());
    }

    @ParameterizedTest
    @EnumSource(Metric.class)
    void theStoredLinesFollowTheEnginesRowIds(Metric metric) {
        KnnModel fitted = KnnModel.fit(reference(50), KnnSettings.defaults().withK(3).withMetric(metric));
        ReferenceModel captured = ReferenceCapture.capture("test", new SourceInfo("s.csv", 1, null, null),
                fitted, null, null, -1, List.of(), null, List.of(), row -> -1, row -> row * 10L);
        int[] ids = fitted.data().rowIds();
        for (int i = 0; i < ids.length; i++) {
            assertEquals(ids[i] * 10L, captured.rows().sourceLines()[i]);
            assertEquals(fitted.data().input(0)[i], captured.rows().inputs()[0][i]);
        }
    }
}
