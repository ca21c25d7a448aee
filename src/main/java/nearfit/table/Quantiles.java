package nearfit.table;

/**
 * Sample quantiles by Hyndman and Fan (1996), "Sample quantiles in statistical packages", The American
 * Statistician 50(4), definition 7: the default of R's quantile() and numpy.percentile ('linear').
 */
public final class Quantiles {
    private Quantiles() {
    }

    /**
     * The p-quantile of {@code sorted[0..n)}, which must be sorted ascending and free of NaN:
     * with h = (n - 1) p, the value x[floor h] + (h - floor h) (x[floor h + 1] - x[floor h]).
     *
     * @param p in [0, 1]
     * @return NaN when n is 0
     */
    public static double type7(double[] sorted, int n, double p) {
        if (n == 0) {
            return Double.NaN;
        }
        double h = (n - 1) * p;
        int lo = (int) Math.floor(h);
        if (lo >= n - 1) {
            return sorted[n - 1];
        }
        return between(sorted[lo], sorted[lo + 1], h - lo);
    }

    /**
     * The point {@code frac} of the way from {@code a} to {@code b}, as numpy's lerp computes it: from the
     * nearer end, so a tie (a == b) gives exactly a and frac = 1 gives exactly b.
     */
    static double between(double a, double b, double frac) {
        return frac >= 0.5 ? b - (b - a) * (1 - frac) : a + (b - a) * frac;
    }
}
