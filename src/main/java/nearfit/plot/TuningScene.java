package nearfit.plot;

/**
 * What a tuning chart shows: leave-one-out RMSE against k with one standard error either side,
 * and the two choices marked. Arrays are held, not copied.
 *
 * @param k      candidate k values, positive, ascending
 * @param rmse   leave-one-out RMSE at each k
 * @param se     its standard error at each k (NaN for none)
 * @param bestK  the k with the smallest RMSE
 * @param oneSeK the one-SE k: the largest k within one standard error of the best
 * @param title  chart title, may be empty
 */
public record TuningScene(double[] k, double[] rmse, double[] se, double bestK, double oneSeK, String title) {
    /** Checks lengths and that k is positive. */
    public TuningScene {
        if (k.length != rmse.length || k.length != se.length) {
            throw new IllegalArgumentException("tuning arrays of lengths " + k.length + ", " + rmse.length + ", " + se.length);
        }
        if (k.length == 0) {
            throw new IllegalArgumentException("a tuning chart needs at least one k");
        }
        for (double v : k) {
            if (!(v > 0)) {
                throw new IllegalArgumentException("k must be positive, got " + v);
            }
        }
    }

    /** @return the RMSE at a k of the table, or NaN if absent */
    public double rmseAt(double kValue) {
        for (int i = 0; i < k.length; i++) {
            if (k[i] == kValue) {
                return rmse[i];
            }
        }
        return Double.NaN;
    }

    /** @return {min, max} of rmse ± se over finite values */
    double[] yExtent() {
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;
        for (int i = 0; i < k.length; i++) {
            double s = Double.isFinite(se[i]) ? se[i] : 0;
            lo = Math.min(lo, rmse[i] - s);
            hi = Math.max(hi, rmse[i] + s);
        }
        return lo <= hi ? new double[] {lo, hi} : new double[] {0, 1};
    }
}
