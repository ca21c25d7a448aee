package nearfit.knn;

/**
 * Estimates at many points, one slot per point (see {@link Estimate} for the meaning and units).
 * The arrays are owned by this value; callers must not change them.
 */
public record Estimates(double[] fit, double[] bandLow, double[] bandHigh, double[] localSd,
                        double[] windowWidth, int[] neighbourCount) {

    /** Empty arrays for n points. */
    static Estimates ofSize(int n) {
        return new Estimates(new double[n], new double[n], new double[n], new double[n], new double[n], new int[n]);
    }

    /** Number of points. */
    public int size() {
        return fit.length;
    }

    /** The estimate at point i as a record. */
    public Estimate at(int i) {
        return new Estimate(fit[i], bandLow[i], bandHigh[i], localSd[i], windowWidth[i], neighbourCount[i]);
    }
}
