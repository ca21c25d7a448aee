package nearfit.knn;

/** The band drawn around the fit: the neighbours' spread. */
public enum Band implements ChoiceWord {
    /** Weighted 10% and 90% quantiles of the neighbours' responses. */
    Q10_Q90(0.10, 0.90),
    /** Weighted 5% and 95% quantiles. */
    Q05_Q95(0.05, 0.95),
    /** The fit plus and minus two weighted SDs (the neighbours' spread about their weighted mean). */
    SD2(Double.NaN, Double.NaN),
    /** No band; low and high are NaN. */
    NONE(Double.NaN, Double.NaN);

    private final double low;
    private final double high;

    Band(double low, double high) {
        this.low = low;
        this.high = high;
    }

    /** The lower probability for a quantile band, NaN otherwise. */
    public double lowProbability() {
        return low;
    }

    /** The upper probability for a quantile band, NaN otherwise. */
    public double highProbability() {
        return high;
    }

    /** Whether the band is made of two quantiles. */
    public boolean isQuantile() {
        return !Double.isNaN(low);
    }
}
