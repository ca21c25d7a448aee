package nearfit.tui.keys;

import nearfit.knn.Band;
import nearfit.knn.EstimateKind;
import nearfit.knn.Metric;
import nearfit.knn.Scaling;
import nearfit.knn.Weighting;

/**
 * The names the explorer shows for the knn package's choices: the batch commands' option values
 * ({@code --metric}, {@code --weights}, {@code --scale}, {@code --band}), so what the header says can be typed. The switches have no default, so a new
 * choice in knn fails to compile here until it has a name; the keys cycle through the knn enums themselves.
 */
public final class ChoiceNames {
    private ChoiceNames() {
    }

    public static String of(Metric m) {
        return switch (m) {
            case EUCLIDEAN -> "euclidean";
            case MANHATTAN -> "manhattan";
            case CHEBYSHEV -> "chebyshev";
            case MAHALANOBIS -> "mahalanobis";
        };
    }

    public static String of(Weighting w) {
        return switch (w) {
            case UNIFORM -> "uniform";
            case INVERSE -> "inverse";
            case TRICUBE -> "tricube";
        };
    }

    public static String of(Scaling s) {
        return switch (s) {
            case Z -> "z";
            case ROBUST -> "robust";
            case RANGE -> "range";
            case NONE -> "none";
        };
    }

    /** The command line's words, {@code --estimate mean|median}. */
    public static String of(EstimateKind e) {
        return switch (e) {
            case MEAN -> "mean";
            case MEDIAN -> "median";
        };
    }

    public static String of(Band b) {
        return switch (b) {
            case Q10_Q90 -> "q10-q90";
            case Q05_Q95 -> "q05-q95";
            case SD2 -> "sd2";
            case NONE -> "none";
        };
    }
}
