package nearfit.plot;

import java.util.Objects;

/**
 * Everything one scatter plot shows, as a value that both faces take ({@link ScatterComposer}
 * for text, {@link PngRenderer} for pictures), so they cannot diverge.
 *
 * <p>Arrays are held, not copied, since they may hold millions of rows: callers must not change
 * them while a frame is being drawn. NaN marks a missing value anywhere (points are skipped,
 * lines broken).
 *
 * @param title      chart title, may be empty
 * @param xName      name of the display input, may be empty
 * @param yName      name of the response, may be empty
 * @param xKind      {@link AxisKind#LINEAR} or {@link AxisKind#TIME}
 * @param x          display input of each row
 * @param y          response of each row, same length as x
 * @param colouring  how points are coloured
 * @param xRange     the shown x range (a zoom), or null to fit the data
 * @param yRange     the shown y range, or null to fit the data
 * @param curve      the fitted curve, or null
 * @param band       the band around the curve, or null
 * @param flags      flagged rows' positions, or null
 * @param crosshairX the crosshair's x, or NaN for none
 * @param marked     one marked row's position (one x and one y), or null
 */
public record Scene(String title, String xName, String yName, AxisKind xKind, double[] x, double[] y,
                    PointColouring colouring, Range xRange, Range yRange, Curve curve, Band band, Marks flags,
                    double crosshairX, Marks marked) {

    /** Checks lengths and kinds. */
    public Scene {
        Objects.requireNonNull(title, "title");
        Objects.requireNonNull(xName, "xName");
        Objects.requireNonNull(yName, "yName");
        Objects.requireNonNull(colouring, "colouring");
        if (xKind == AxisKind.LOG) {
            throw new IllegalArgumentException("a scatter's x axis is linear or time");
        }
        if (x.length != y.length) {
            throw new IllegalArgumentException(x.length + " x values but " + y.length + " y values");
        }
        if (colouring instanceof PointColouring.Highlight h && h.codes().length != x.length
                || colouring instanceof PointColouring.Classes c && c.codes().length != x.length) {
            throw new IllegalArgumentException("one group code per row needed");
        }
    }

    /** @return a builder for the points x[i], y[i] */
    public static Builder builder(double[] x, double[] y) {
        return new Builder(x, y);
    }

    /** A shown range; min &lt;= max, both finite. */
    public record Range(double min, double max) {
        /** Checks the invariant. */
        public Range {
            if (!(min <= max) || Double.isInfinite(min) || Double.isInfinite(max)) {
                throw new IllegalArgumentException("range " + min + ".." + max);
            }
        }
    }

    /** A polyline in data units; successive points joined, NaN breaks the line. */
    public record Curve(double[] xs, double[] ys) {
        /** Checks lengths. */
        public Curve {
            if (xs.length != ys.length) {
                throw new IllegalArgumentException(xs.length + " curve x values but " + ys.length + " y values");
            }
        }
    }

    /** How a band is drawn. */
    public enum BandStyle {
        /** Its two edges as dashed lines. */
        LINES,
        /** The region between its edges shaded, edges dashed. */
        SHADED
    }

    /** The band's lower and upper edge at each xs, ascending xs; NaN breaks it. */
    public record Band(double[] xs, double[] lo, double[] hi, BandStyle style) {
        /** Checks lengths. */
        public Band {
            Objects.requireNonNull(style, "style");
            if (xs.length != lo.length || xs.length != hi.length) {
                throw new IllegalArgumentException("band arrays of lengths " + xs.length + ", " + lo.length + ", " + hi.length);
            }
        }
    }

    /** Marked positions, such as flagged rows. */
    public record Marks(double[] x, double[] y) {
        /** Checks lengths. */
        public Marks {
            if (x.length != y.length) {
                throw new IllegalArgumentException(x.length + " mark x values but " + y.length + " y values");
            }
        }
    }

    /** How points are coloured: plainly by density, one group over the others, or by class. */
    public sealed interface PointColouring {
        /** Density only. */
        record Plain() implements PointColouring {
        }

        /** Rows whose code equals {@code code} drawn as {@link Role#HIGHLIGHT} over the others. */
        record Highlight(int[] codes, int code) implements PointColouring {
        }

        /** Each row by its category code (a class of the response), {@link Role#ofClass}. */
        record Classes(int[] codes) implements PointColouring {
        }
    }

    /** @return {min, max} of the finite x values of points, curve, band and flags; {0, 1} if none */
    public double[] xExtent() {
        double[] e = {Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY};
        extend(e, x);
        if (curve != null) {
            extend(e, curve.xs());
        }
        if (band != null) {
            extend(e, band.xs());
        }
        if (flags != null) {
            extend(e, flags.x());
        }
        return finished(e);
    }

    /** @return {min, max} of the finite y values of points, curve, band and flags; {0, 1} if none */
    public double[] yExtent() {
        double[] e = {Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY};
        extend(e, y);
        if (curve != null) {
            extend(e, curve.ys());
        }
        if (band != null) {
            extend(e, band.lo());
            extend(e, band.hi());
        }
        if (flags != null) {
            extend(e, flags.y());
        }
        return finished(e);
    }

    private static void extend(double[] e, double[] v) {
        double lo = e[0];
        double hi = e[1];
        for (double d : v) {
            if (d < lo) {
                lo = d;
            }
            if (d > hi) {
                hi = d;
            }
        }
        e[0] = lo;
        e[1] = hi;
    }

    private static double[] finished(double[] e) {
        return e[0] <= e[1] ? e : new double[] {0, 1};
    }

    /** Builds a {@link Scene}; everything but the points is optional. */
    public static final class Builder {
        private final double[] x;
        private final double[] y;
        private String title = "";
        private String xName = "";
        private String yName = "";
        private AxisKind xKind = AxisKind.LINEAR;
        private PointColouring colouring = new PointColouring.Plain();
        private Range xRange;
        private Range yRange;
        private Curve curve;
        private Band band;
        private Marks flags;
        private double crosshairX = Double.NaN;
        private Marks marked;

        private Builder(double[] x, double[] y) {
            this.x = Objects.requireNonNull(x, "x");
            this.y = Objects.requireNonNull(y, "y");
        }

        /** Sets title and axis names. */
        public Builder labels(String title, String xName, String yName) {
            this.title = title;
            this.xName = xName;
            this.yName = yName;
            return this;
        }

        /** Makes x a time axis (epoch milliseconds). */
        public Builder timeAxis() {
            this.xKind = AxisKind.TIME;
            return this;
        }

        /** Highlights rows with {@code codes[i] == code}. */
        public Builder highlight(int[] codes, int code) {
            this.colouring = new PointColouring.Highlight(codes, code);
            return this;
        }

        /** Colours rows by class code. */
        public Builder classes(int[] codes) {
            this.colouring = new PointColouring.Classes(codes);
            return this;
        }

        /** Shows exactly [min, max] of x (a zoom). */
        public Builder xRange(double min, double max) {
            this.xRange = new Range(min, max);
            return this;
        }

        /** Shows exactly [min, max] of y. */
        public Builder yRange(double min, double max) {
            this.yRange = new Range(min, max);
            return this;
        }

        /** Sets the fitted curve. */
        public Builder curve(double[] xs, double[] ys) {
            this.curve = new Curve(xs, ys);
            return this;
        }

        /** Sets the band. */
        public Builder band(double[] xs, double[] lo, double[] hi, BandStyle style) {
            this.band = new Band(xs, lo, hi, style);
            return this;
        }

        /** Sets the flagged rows' positions. */
        public Builder flags(double[] fx, double[] fy) {
            this.flags = new Marks(fx, fy);
            return this;
        }

        /** Sets the crosshair's x. */
        public Builder crosshair(double x) {
            this.crosshairX = x;
            return this;
        }

        /** Marks one row's position, drawn over every other layer. */
        public Builder marked(double mx, double my) {
            this.marked = new Marks(new double[] {mx}, new double[] {my});
            return this;
        }

        /** @return the scene */
        public Scene build() {
            return new Scene(title, xName, yName, xKind, x, y, colouring, xRange, yRange, curve, band, flags, crosshairX, marked);
        }
    }
}
