package nearfit.plot;

/**
 * One axis: its kind, the data range it shows and its ticks. Invariant: min &lt; max, both
 * finite (and positive for {@link AxisKind#LOG}); ticks lie within [min, max].
 *
 * @param kind  how values map to position
 * @param min   the value at the low end (left or bottom edge)
 * @param max   the value at the high end
 * @param ticks ticks within the range
 */
public record Axis(AxisKind kind, double min, double max, Ticks ticks) {
    /** Checks the invariant. */
    public Axis {
        if (!(min < max) || Double.isInfinite(min) || Double.isInfinite(max) || (kind == AxisKind.LOG && !(min > 0))) {
            throw new IllegalArgumentException(kind + " axis range " + min + ".." + max);
        }
    }

    /**
     * An axis over [lo, hi] widened by {@code pad} of the span on each side, with about
     * {@code tickCount} ticks; a zero-width range is first widened by {@link NiceTicks#widen}
     * (for a log axis: a factor of 2 either side).
     *
     * @param pad fraction of the span added at each end, such as 0.5 / cells so the extreme
     *     points sit half a cell inside the edges
     */
    public static Axis fit(AxisKind kind, double lo, double hi, double pad, int tickCount) {
        if (kind == AxisKind.LOG) {
            double a = Math.log10(lo);
            double b = Math.log10(hi);
            if (a == b) {
                a -= Math.log10(2);
                b += Math.log10(2);
            }
            double p = (b - a) * pad;
            return of(kind, Math.pow(10, a - p), Math.pow(10, b + p), tickCount);
        }
        if (lo == hi) {
            double[] w = NiceTicks.widen(lo);
            lo = w[0];
            hi = w[1];
        }
        double p = (hi - lo) * pad;
        return of(kind, lo - p, hi + p, tickCount);
    }

    /** An axis over exactly [min, max] (a zoom) with about {@code tickCount} ticks. */
    public static Axis of(AxisKind kind, double min, double max, int tickCount) {
        Ticks t = switch (kind) {
            case LINEAR -> NiceTicks.loose(min, max, tickCount).ticks().within(min, max);
            case LOG -> LogTicks.within(min, max);
            case TIME -> TimeTicks.within(min, max, tickCount);
        };
        return new Axis(kind, min, max, t);
    }

    /** @return the position of a value, 0 at min and 1 at max (outside for values outside) */
    public double fraction(double value) {
        if (kind == AxisKind.LOG) {
            return Math.log(value / min) / Math.log(max / min);
        }
        return (value - min) / (max - min);
    }

    /** @return the value at a position, the inverse of {@link #fraction} */
    public double valueAt(double fraction) {
        if (kind == AxisKind.LOG) {
            return min * Math.pow(max / min, fraction);
        }
        return min + fraction * (max - min);
    }

    /** @return the longest tick label's length in code points */
    public int widestLabel() {
        int w = 0;
        for (String s : ticks.labels()) {
            w = Math.max(w, s.codePointCount(0, s.length()));
        }
        return w;
    }
}
