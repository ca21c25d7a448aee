package nearfit.tui;

import nearfit.knn.Band;
import nearfit.knn.EstimateKind;
import nearfit.knn.Metric;
import nearfit.knn.Scaling;
import nearfit.knn.Weighting;

/**
 * The names the explorer shows for the knn package's choices. The switches have no default, so a new
 * choice in knn fails to compile here until it has a name; the keys cycle through the knn enums themselves.
 */
final class ChoiceNames {
    private ChoiceNames() {
    }

    static String of(Metric m) {
        return switch (m) {
            case EUCLIDEAN -> "Euclidean";
            case MANHATTAN -> "Manhattan";
            case CHEBYSHEV -> "Chebyshev";
            case MAHALANOBIS -> "Mahalanobis";
        };
    }

    static String of(Weighting w) {
        return switch (w) {
            case UNIFORM -> "equal";
            case INVERSE -> "1/distance";
            case TRICUBE -> "tricube";
        };
    }

    static String of(Scaling s) {
        return switch (s) {
            case Z -> "z-score";
            case ROBUST -> "median/MAD";
            case RANGE -> "min-max";
            case NONE -> "none";
        };
    }

    /** The command line's words, {@code --estimate mean|median}. */
    static String of(EstimateKind e) {
        return switch (e) {
            case MEAN -> "mean";
            case MEDIAN -> "median";
        };
    }

    static String of(Band b) {
        return switch (b) {
            case Q10_Q90 -> "q10-q90";
            case Q05_Q95 -> "q05-q95";
            case SD2 -> "±2 SD";
            case NONE -> "off";
        };
    }
}
