package nearfit.tui;

/** How inputs are scaled before distances are taken, cycled by the {@code s} key. */
public enum Scaling {
    /** Subtract the mean, divide by the standard deviation. */
    STANDARD("z-score"),
    /** Subtract the median, divide by 1.4826 times the median absolute deviation. */
    ROBUST("median/MAD"),
    /** Map the minimum to 0 and the maximum to 1. */
    RANGE("min-max"),
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
