package nearfit.model;

import java.util.Locale;

import nearfit.knn.Band;
import nearfit.knn.EstimateKind;
import nearfit.knn.FlagScale;
import nearfit.knn.KnnSettings;
import nearfit.knn.Metric;
import nearfit.knn.Scaling;
import nearfit.knn.Weighting;

/**
 * Maps the words of {@link ModelSettings} to the engine's {@link KnnSettings} and back: z scale
 * {@code local} is {@link FlagScale#LOCAL_SD}, {@code reference} is {@link FlagScale#GLOBAL_MAD}.
 */
public final class EngineSettings {
    private EngineSettings() {
    }

    /** The engine settings for the given words and thread count. */
    public static KnnSettings of(ModelSettings s, int threads) {
        return new KnnSettings(s.k(), Metric.valueOf(upper(s.metric())), Weighting.valueOf(upper(s.weights())),
                Scaling.valueOf(upper(s.scaling())), Band.valueOf(upper(s.band())),
                EstimateKind.valueOf(upper(s.estimate())), s.flagThreshold(),
                "local".equals(s.zScale()) ? FlagScale.LOCAL_SD : FlagScale.GLOBAL_MAD, threads);
    }

    /** The words for engine settings. */
    public static ModelSettings words(KnnSettings s) {
        return new ModelSettings(lower(s.metric()), lower(s.weighting()), lower(s.scaling()), s.k(),
                lower(s.band()), s.flagThreshold(), s.flagScale() == FlagScale.GLOBAL_MAD ? "reference" : "local",
                lower(s.estimate()));
    }

    static String upper(String word) {
        return word.toUpperCase(Locale.ROOT).replace('-', '_');
    }

    private static String lower(Enum<?> e) {
        return e.name().toLowerCase(Locale.ROOT).replace('_', '-');
    }
}
