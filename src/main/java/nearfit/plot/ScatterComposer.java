package nearfit.plot;

/**
 * Composes a {@link Scene} into a text chart: points binned straight into a canvas's dots, then
 * band, curve, flags and crosshair, with axes, ticks and labels around.
 *
 * <p>Cost: one pass over the points with no allocation per point, plus one pass over each
 * line's vertices; auto ranges add one pass to find the extent. Frames that change only the
 * curve, band, flags or crosshair skip the pass over the points: bin them once with
 * {@link #points} and compose each frame over that {@link PointLayer}, which gives the same cells
 * as {@link #compose(Scene, int, int, CanvasKind)}.
 */
public final class ScatterComposer {
    private ScatterComposer() {
    }

    /**
     * @param scene  what to draw
     * @param width  grid width in cells
     * @param height grid height in cells
     * @param kind   braille or ASCII glyphs
     * @return the chart and its frame
     * @throws IllegalArgumentException when the size leaves no room for a plot
     */
    public static ComposedPlot compose(Scene scene, int width, int height, CanvasKind kind) {
        PlotFrame f = frame(scene, width, height, kind);
        Canvas canvas = kind.newCanvas(f.cols(), f.rows());
        draw(scene, f, canvas);
        return finish(scene, f, canvas, width, height, kind);
    }

    /**
     * Bins a scene's points once for charts of width × height cells.
     *
     * @throws IllegalArgumentException when the size leaves no room for a plot
     */
    public static PointLayer points(Scene scene, int width, int height, CanvasKind kind) {
        return new PointLayer(scene, frame(scene, width, height, kind), width, height, kind);
    }

    /**
     * Composes a scene over points binned earlier: the same cells as {@link #compose(Scene, int, int,
     * CanvasKind)} at the points' size and kind, without a pass over the points.
     *
     * @throws IllegalArgumentException when {@code points} does not {@link PointLayer#fits fit} the scene
     *     (other points, colouring or axis ranges): bin them again
     */
    public static ComposedPlot compose(Scene scene, PointLayer points) {
        PlotFrame f = frame(scene, points.width(), points.height(), points.kind());
        if (!points.fits(scene, f)) {
            throw new IllegalArgumentException("the binned points do not fit this scene");
        }
        Canvas canvas = points.kind().newCanvas(f.cols(), f.rows());
        points.copyInto(canvas);
        drawOverPoints(scene, f, canvas);
        return finish(scene, f, canvas, points.width(), points.height(), points.kind());
    }

    static PlotFrame frame(Scene scene, int width, int height, CanvasKind kind) {
        boolean header = !scene.title().isEmpty() || !scene.yName().isEmpty();
        return PlotFrame.layout(width, height, header, !scene.xName().isEmpty(), kind,
                rows -> yAxis(scene, rows), cols -> xAxis(scene, cols));
    }

    private static ComposedPlot finish(Scene scene, PlotFrame f, Canvas canvas, int width, int height, CanvasKind kind) {
        CellGrid.Builder g = CellGrid.builder(width, height);
        canvas.writeTo(g, f.col0(), f.row0());
        AxesPainter.paint(g, f, kind, scene.yName(), scene.title(), scene.xName());
        return new ComposedPlot(g.build(), f);
    }

    /** Draws every layer of a scene into a canvas laid out by a frame of the same size. */
    public static void draw(Scene scene, PlotFrame f, Canvas canvas) {
        binPoints(scene, f, canvas);
        drawOverPoints(scene, f, canvas);
    }

    /** Draws band, curve, flags, crosshair and a marked row, the layers over the points. */
    private static void drawOverPoints(Scene scene, PlotFrame f, Canvas canvas) {
        if (scene.band() != null) {
            drawBand(scene.band(), f, canvas);
        }
        if (scene.curve() != null) {
            polyline(scene.curve().xs(), scene.curve().ys(), f, canvas, Layer.CURVE, false);
        }
        if (scene.flags() != null) {
            double[] fx = scene.flags().x();
            double[] fy = scene.flags().y();
            for (int i = 0; i < fx.length; i++) {
                int dx = f.dotColumn(fx[i]);
                int dy = f.dotRow(fy[i]);
                if (dx >= 0 && dy >= 0) {
                    canvas.mark(Layer.FLAG, dx, dy);
                }
            }
        }
        int cx = f.dotColumn(scene.crosshairX());
        if (cx >= 0) {
            canvas.line(Layer.CROSSHAIR, cx, 0, cx, canvas.dotHeight() - 1, false);
        }
        if (scene.marked() != null) {
            for (int i = 0; i < scene.marked().x().length; i++) {
                int dx = f.dotColumn(scene.marked().x()[i]);
                int dy = f.dotRow(scene.marked().y()[i]);
                if (dx >= 0 && dy >= 0) {
                    canvas.mark(Layer.MARK, dx, dy);
                }
            }
        }
    }

    static Axis xAxis(Scene s, int cols) {
        int ticks = Math.max(2, cols / 12);
        if (s.xRange() != null) {
            return Axis.of(s.xKind(), s.xRange().min(), widened(s.xRange()), ticks);
        }
        double[] e = s.xExtent();
        return Axis.fit(s.xKind(), e[0], e[1], 0.5 / cols, ticks);
    }

    static Axis yAxis(Scene s, int rows) {
        int ticks = Math.max(2, rows / 3);
        if (s.yRange() != null) {
            return Axis.of(AxisKind.LINEAR, s.yRange().min(), widened(s.yRange()), ticks);
        }
        double[] e = s.yExtent();
        return Axis.fit(AxisKind.LINEAR, e[0], e[1], 0.5 / rows, ticks);
    }

    /** A given zero-width range gets a tiny width so the axis is defined. */
    private static double widened(Scene.Range r) {
        return r.max() > r.min() ? r.max() : NiceTicks.widen(r.min())[1];
    }

    /** The hot loop: one dot per finite point inside the ranges. */
    static void binPoints(Scene s, PlotFrame f, Canvas canvas) {
        double[] x = s.x();
        double[] y = s.y();
        int w = f.dotWidth();
        int h = f.dotHeight();
        double x0 = f.x().min();
        double sx = w / (f.x().max() - x0);
        double y0 = f.y().min();
        double sy = h / (f.y().max() - y0);
        int[] codes = null;
        int code = 0;
        boolean classes = false;
        if (s.colouring() instanceof Scene.PointColouring.Highlight hl) {
            codes = hl.codes();
            code = hl.code();
        } else if (s.colouring() instanceof Scene.PointColouring.Classes cl) {
            codes = cl.codes();
            classes = true;
        }
        for (int i = 0; i < x.length; i++) {
            double u = (x[i] - x0) * sx;
            double v = (y[i] - y0) * sy;
            if (!(u >= 0 && u <= w && v >= 0 && v <= h)) {
                continue; // NaN fails too
            }
            int dx = Math.min((int) u, w - 1);
            int dy = h - 1 - Math.min((int) v, h - 1);
            if (codes == null) {
                canvas.addPoint(dx, dy);
            } else if (classes) {
                canvas.addClassPoint(dx, dy, codes[i]);
            } else if (codes[i] == code) {
                canvas.addHighlightPoint(dx, dy);
            } else {
                canvas.addPoint(dx, dy);
            }
        }
    }

    private static void polyline(double[] xs, double[] ys, PlotFrame f, Canvas canvas, Layer layer, boolean dashed) {
        for (int i = 1; i < xs.length; i++) {
            double ax = f.lineX(xs[i - 1]);
            double ay = f.lineY(ys[i - 1]);
            double bx = f.lineX(xs[i]);
            double by = f.lineY(ys[i]);
            if (Double.isFinite(ax + ay + bx + by)) {
                canvas.line(layer, ax, ay, bx, by, dashed);
            }
        }
        if (xs.length == 1 && Double.isFinite(f.lineX(xs[0]) + f.lineY(ys[0]))) {
            canvas.mark(layer, f.dotColumn(xs[0]), f.dotRow(ys[0]));
        }
    }

    private static void drawBand(Scene.Band b, PlotFrame f, Canvas canvas) {
        if (b.style() == Scene.BandStyle.SHADED) {
            shade(b, f, canvas);
        }
        polyline(b.xs(), b.lo(), f, canvas, Layer.BAND_EDGE, true);
        polyline(b.xs(), b.hi(), f, canvas, Layer.BAND_EDGE, true);
    }

    /** Shades each dot column between successive band vertices, interpolating both edges linearly. */
    private static void shade(Scene.Band b, PlotFrame f, Canvas canvas) {
        double[] xs = b.xs();
        for (int i = 1; i < xs.length; i++) {
            double ax = f.lineX(xs[i - 1]);
            double bx = f.lineX(xs[i]);
            double alo = f.lineY(b.lo()[i - 1]);
            double ahi = f.lineY(b.hi()[i - 1]);
            double blo = f.lineY(b.lo()[i]);
            double bhi = f.lineY(b.hi()[i]);
            if (!Double.isFinite(ax + bx + alo + ahi + blo + bhi) || !(bx > ax)) {
                continue;
            }
            int from = Math.max(0, (int) Math.ceil(ax));
            int to = Math.min(canvas.dotWidth() - 1, (int) Math.floor(bx));
            for (int d = from; d <= to; d++) {
                double t = (d - ax) / (bx - ax);
                int lo = (int) Math.round(alo + t * (blo - alo));
                int hi = (int) Math.round(ahi + t * (bhi - ahi));
                canvas.shadeColumn(Layer.BAND, d, lo, hi);
            }
        }
    }
}
