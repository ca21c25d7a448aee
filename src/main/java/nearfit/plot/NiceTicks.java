package nearfit.plot;

import java.math.BigDecimal;

/**
 * Linear axis ticks by the nice-numbers method of Heckbert, "Nice Numbers for Graph Labels",
 * Graphics Gems (1990): steps of 1, 2 or 5 times a power of ten, loose labelling (the first and
 * last ticks enclose the data) and nfrac = max(−floor(log10 d), 0) fractional digits.
 *
 * <p>Two guards the published pseudo-code leaves to the reader: tick values are computed as an
 * integer times the step's mantissa, scaled by an exact power of ten, so they are the doubles
 * nearest the decimal values (0.3, not 0.30000000000000004); and a zero-width range is widened
 * (see {@link #widen}) instead of dividing by zero.
 */
public final class NiceTicks {
    // Slack, in steps, when deciding floor/ceil of min/d and max/d, so 1e-6/2e-7 = 5.000000000000001
    // counts as 5; the relative part covers the rounding error of a large quotient.
    private static final double SLACK = 1e-9;
    private static final double RELATIVE_SLACK = 1e-14;

    private final double step;
    private final int mantissa;
    private final int exponent;
    private final long first;
    private final long last;

    private NiceTicks(int mantissa, int exponent, long first, long last) {
        this.mantissa = mantissa;
        this.exponent = exponent;
        this.step = scale(mantissa, exponent);
        this.first = first;
        this.last = last;
    }

    /**
     * Heckbert's nicenum: a nice number near x.
     *
     * @param x     a positive finite number
     * @param round true to round to the nearest nice number, false to take the ceiling
     * @return 1, 2, 5 or 10 times a power of ten
     */
    public static double niceNumber(double x, boolean round) {
        int exp = (int) Math.floor(Math.log10(x));
        return scale(niceMantissa(x / Math.pow(10, exp), round), exp);
    }

    private static int niceMantissa(double f, boolean round) {
        if (round) {
            return f < 1.5 ? 1 : f < 3 ? 2 : f < 7 ? 5 : 10;
        }
        return f <= 1 ? 1 : f <= 2 ? 2 : f <= 5 ? 5 : 10;
    }

    /**
     * Loose labelling of [min, max] with about {@code count} ticks.
     *
     * @param min   lower end, finite
     * @param max   upper end, finite, at least min
     * @param count the wished number of ticks, at least 2
     * @return the ticks; the first is at most min and the last at least max
     */
    public static NiceTicks loose(double min, double max, int count) {
        if (!(min <= max) || Double.isInfinite(min) || Double.isInfinite(max)) {
            throw new IllegalArgumentException("axis range " + min + ".." + max);
        }
        if (min == max) {
            double[] w = widen(min);
            min = w[0];
            max = w[1];
        }
        double range = niceNumber(max - min, false);
        double d = range / (Math.max(count, 2) - 1);
        int exp = (int) Math.floor(Math.log10(d));
        int mant = niceMantissa(d / Math.pow(10, exp), true);
        if (mant == 10) {
            mant = 1;
            exp++;
        }
        double unit = scale(mant, exp);
        long first = floorWithSlack(min / unit);
        long last = ceilWithSlack(max / unit);
        return new NiceTicks(mant, exp, first, last);
    }

    /**
     * The range used for a zero-width one: x ± 10 % of |x|, or −1..1 around zero (common practice).
     *
     * @return {lower, upper}
     */
    public static double[] widen(double x) {
        if (x == 0) {
            return new double[] {-1, 1};
        }
        double h = Math.abs(x) * 0.1;
        return new double[] {x - h, x + h};
    }

    private static long floorWithSlack(double q) {
        double r = Math.rint(q);
        return Math.abs(q - r) <= SLACK + RELATIVE_SLACK * Math.abs(q) ? (long) r : (long) Math.floor(q);
    }

    private static long ceilWithSlack(double q) {
        double r = Math.rint(q);
        return Math.abs(q - r) <= SLACK + RELATIVE_SLACK * Math.abs(q) ? (long) r : (long) Math.ceil(q);
    }

    /** m · 10^e computed with one exact multiply or divide, so the result is the nearest double. */
    private static double scale(long m, int e) {
        return e >= 0 ? m * Math.pow(10, e) : m / Math.pow(10, -e);
    }

    /** @return the tick spacing d */
    public double step() {
        return step;
    }

    /** @return Heckbert's graphmin, the first tick */
    public double graphMin() {
        return value(0);
    }

    /** @return Heckbert's graphmax, the last tick */
    public double graphMax() {
        return value(size() - 1);
    }

    /** @return nfrac = max(−floor(log10 d), 0), the fractional digits the labels need */
    public int fractionDigits() {
        return Math.max(-exponent, 0);
    }

    /** @return the number of ticks */
    public int size() {
        return (int) (last - first + 1);
    }

    /** @return the i-th tick value, 0-based */
    public double value(int i) {
        double v = scale((first + i) * mantissa, exponent);
        return v == 0 ? 0.0 : v; // no -0 label
    }

    /** @return the ticks with compact labels (see {@link #label}) */
    public Ticks ticks() {
        int n = size();
        double[] vs = new double[n];
        String[] ls = new String[n];
        for (int i = 0; i < n; i++) {
            vs[i] = value(i);
            ls[i] = label(vs[i], fractionDigits());
        }
        return new Ticks(vs, ls);
    }

    /**
     * A compact tick label: fixed notation with {@code digits} fractional digits, or
     * scientific notation (such as {@code 2e-7}, {@code 1.5e9}) when fixed notation would take
     * more than 7 characters and scientific is shorter, which happens for tiny or huge numbers.
     */
    public static String label(double value, int digits) {
        if (value == 0) {
            return "0";
        }
        BigDecimal exact = new BigDecimal(value).setScale(digits, java.math.RoundingMode.HALF_EVEN);
        String fixed = exact.toPlainString();
        BigDecimal shortest = new BigDecimal(Double.toString(value)).stripTrailingZeros();
        String sci = scientific(shortest);
        return fixed.length() > 7 && sci.length() < fixed.length() ? sci : fixed;
    }

    private static String scientific(BigDecimal v) {
        int exp = v.precision() - v.scale() - 1;
        BigDecimal m = v.movePointLeft(exp).stripTrailingZeros();
        return m.toPlainString() + "e" + exp;
    }
}
