package nearfit.plot;

/**
 * Ticks for a base-10 logarithmic axis, such as k on a tuning chart: 1, 2, 5 times each power of
 * ten when the range spans at most {@value #MAX_DECADES_FOR_125} decades, powers of ten alone
 * beyond (common practice for log axes).
 */
public final class LogTicks {
    /** Widest span, in decades, that still gets the 2 and 5 ticks. */
    public static final int MAX_DECADES_FOR_125 = 3;
    private static final int[] MANTISSAS = {1, 2, 5};

    private LogTicks() {
    }

    /**
     * @param min lower end, positive and finite
     * @param max upper end, at least min
     * @return the ticks within [min, max]; for a range inside one step, its two ends' nearest
     *     ticks outside are not added, so the result may hold a single tick or none
     */
    public static Ticks within(double min, double max) {
        if (!(min > 0) || !(max >= min) || Double.isInfinite(max)) {
            throw new IllegalArgumentException("log axis range " + min + ".." + max);
        }
        int lo = (int) Math.floor(Math.log10(min));
        int hi = (int) Math.ceil(Math.log10(max));
        boolean all = hi - lo <= MAX_DECADES_FOR_125;
        int capacity = (hi - lo + 1) * MANTISSAS.length;
        double[] vs = new double[capacity];
        String[] ls = new String[capacity];
        int n = 0;
        for (int e = lo; e <= hi; e++) {
            for (int m : MANTISSAS) {
                if (m != 1 && !all) {
                    continue;
                }
                double v = e >= 0 ? m * Math.pow(10, e) : m / Math.pow(10, -e);
                if (v >= min * (1 - 1e-12) && v <= max * (1 + 1e-12)) {
                    vs[n] = v;
                    ls[n++] = NiceTicks.label(v, Math.max(-e, 0));
                }
            }
        }
        return new Ticks(java.util.Arrays.copyOf(vs, n), java.util.Arrays.copyOf(ls, n));
    }
}
