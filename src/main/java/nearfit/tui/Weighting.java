package nearfit.tui;

/** How the k neighbours are weighted in an estimate, cycled by the {@code w} key. */
public enum Weighting {
    /** Every neighbour counts the same. */
    EQUAL("equal"),
    /** One over distance. */
    INVERSE("1/distance"),
    /** Tricube of distance over window width (Cleveland 1979). */
    TRICUBE("tricube");

    private final String label;

    Weighting(String label) {
        this.label = label;
    }

    /** The name shown in the header. */
    public String label() {
        return label;
    }
}
