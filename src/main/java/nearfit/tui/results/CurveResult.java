package nearfit.tui.results;

/**
 * The fitted curve along the display input. All arrays have the same length, one entry per point of the
 * {@link CurveRequest}; NaN where no estimate exists (no reference rows). The arrays are never changed
 * after construction.
 *
 * @param x          the display-input value of each point
 * @param fit        the estimate (a vote share from 0 to 1 for a category response)
 * @param bandLow    the band's lower edge, NaN when the band is off
 * @param bandHigh   the band's upper edge, NaN when the band is off
 * @param width      the window width: the scaled distance to the k-th neighbour
 * @param neighbours the neighbours used, more than k when rows tie with the k-th distance
 * @param compared   with a group compared, its rows' residuals against the other groups' fit; else {@code null}
 */
public record CurveResult(double[] x, double[] fit, double[] bandLow, double[] bandHigh, double[] width,
        int[] neighbours, ComparedResiduals compared) {
    /** A curve with no group compared. */
    public CurveResult(double[] x, double[] fit, double[] bandLow, double[] bandHigh, double[] width,
            int[] neighbours) {
        this(x, fit, bandLow, bandHigh, width, neighbours, null);
    }

    /** Checks that every array has one entry per point. */
    public CurveResult {
        int n = x.length;
        if (fit.length != n || bandLow.length != n || bandHigh.length != n || width.length != n
                || neighbours.length != n) {
            throw new IllegalArgumentException("curve arrays of unequal length");
        }
    }

    /** The number of points. */
    public int size() {
        return x.length;
    }

    /** The index of the point nearest to {@code value}; the points are evenly spaced and ascending. */
    public int nearest(double value) {
        int n = x.length;
        if (n == 0) {
            return -1;
        }
        double span = x[n - 1] - x[0];
        if (!(span > 0)) {
            return 0;
        }
        long i = Math.round((value - x[0]) / span * (n - 1));
        return (int) Math.max(0, Math.min(n - 1, i));
    }
}
