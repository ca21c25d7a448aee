package nearfit.tui;

/** The band drawn around the curve, cycled by the {@code b} key. */
public enum BandKind {
    /** The neighbours' 10 % and 90 % quantiles. */
    QUANTILE_10_90("q10-q90"),
    /** The neighbours' 5 % and 95 % quantiles. */
    QUANTILE_05_95("q05-q95"),
    /** Fit plus or minus two standard deviations of the neighbours' responses. */
    TWO_SD("±2 SD"),
    /** No band. */
    OFF("off");

    private final String label;

    BandKind(String label) {
        this.label = label;
    }

    /** The name shown in the header. */
    public String label() {
        return label;
    }
}
