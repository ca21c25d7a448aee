package nearfit.tui;

/** The distance between scaled inputs, cycled by the {@code m} key. */
public enum Metric {
    /** Square root of the summed squared differences. */
    EUCLIDEAN("Euclidean"),
    /** Summed absolute differences. */
    MANHATTAN("Manhattan"),
    /** Largest absolute difference. */
    CHEBYSHEV("Chebyshev"),
    /** Euclidean after whitening by the inputs' covariance. */
    MAHALANOBIS("Mahalanobis");

    private final String label;

    Metric(String label) {
        this.label = label;
    }

    /** The name shown in the header. */
    public String label() {
        return label;
    }
}
