package nearfit.tui;

/** How inputs are scaled before distances are taken, cycled by the {@code s} key. */
public enum Scaling {
    /** Subtract the mean, divide by the standard deviation. */
    STANDARD("z-score"),
    /** Map the minimum to 0 and the maximum to 1. */
    RANGE("min-max"),
    /** Subtract the median, divide by the interquartile range. */
    ROBUST("median/IQR"),
    /** Inputs as they are. */
    NONE("none");

    private final String label;

    Scaling(String label) {
        this.label = label;
    }

    /** The name shown in the header. */
    public String label() {
        return label;
    }
}
