package nearfit.plot;

/**
 * What a tuning chart shows: the RMSE curve against k, a band of one standard error either side
 * with the one-SE line, and the two choices marked. Arrays are held, not copied.
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

    /** @return the standard error at a k of the table, or NaN if absent */
    public double seAt(double kValue) {
        for (int i = 0; i < k.length; i++) {
            if (k[i] == kValue) {
                return se[i];
            }
        }
        return Double.NaN;
    }

    /** @return the one-SE line: the best k's RMSE plus its standard error (NaN without one) */
    public double oneSeLine() {
        return rmseAt(bestK) + seAt(bestK);
    }

    /**
     * The y range: the RMSE curve's own {min, max} over finite values, never the error bars, so the
     * curve fills the plot whatever the standard errors; raised to the one-SE line when that lies
     * above the curve by at most a quarter of the curve's span (then it is drawn; farther up, the
     * band and the line are clipped at the top). {0, 1} when no RMSE is finite.
     */
    double[] yExtent() {
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;
        for (double r : rmse) {
            if (Double.isFinite(r)) {
                lo = Math.min(lo, r);
                hi = Math.max(hi, r);
            }
        }
        if (!(lo <= hi)) {
            return new double[] {0, 1};
        }
        double line = oneSeLine();
        if (line > hi && line - hi <= 0.25 * (hi - lo)) {
            hi = line;
        }
        return new double[] {lo, hi};
    }
}
