package nearfit.plot;

/**
 * A scene's data points binned once into the cells of a canvas (the dot mask and the point count of each
 * cell, plus the highlighted group's or the classes' counts), so that frames which change only the curve,
 * band, flags or crosshair copy it instead of binning every point again.
 *
 * <p>Invariant: the binned canvas is {@link #cols()} × {@link #rows()} cells of {@link #kind()} and holds
 * exactly the points {@code x[i], y[i]} of the scene it was made from, mapped through the x range
 * [{@code xMin}, {@code xMax}] and the y range [{@code yMin}, {@code yMax}]. It is never changed after
 * construction; {@link ScatterComposer#compose(Scene, PointLayer)} copies it into a fresh canvas.
 *
 * <p>The scene's arrays are held, not copied, and compared by identity in {@link #fits}: a caller that
 * changes the points builds new arrays (as the explorer does), so the identity names the data.
 */
public final class PointLayer {
    private final double[] x;
    private final double[] y;
    private final Scene.PointColouring colouring;
    private final CanvasKind kind;
    private final int width;
    private final int height;
    private final double xMin;
    private final double xMax;
    private final double yMin;
    private final double yMax;
    private final Canvas binned;

    PointLayer(Scene scene, PlotFrame f, int width, int height, CanvasKind kind) {
        this.width = width;
        this.height = height;
        this.x = scene.x();
        this.y = scene.y();
        this.colouring = scene.colouring();
        this.kind = kind;
        this.xMin = f.x().min();
        this.xMax = f.x().max();
        this.yMin = f.y().min();
        this.yMax = f.y().max();
        this.binned = kind.newCanvas(f.cols(), f.rows());
        ScatterComposer.binPoints(scene, f, binned);
    }

    /** @return the glyph kind the points were binned for */
    public CanvasKind kind() {
        return kind;
    }

    /** @return the width in cells of the charts these points are for */
    public int width() {
        return width;
    }

    /** @return the height in cells of the charts these points are for */
    public int height() {
        return height;
    }

    /** @return the plot width in cells */
    public int cols() {
        return binned.columns();
    }

    /** @return the plot height in cells */
    public int rows() {
        return binned.rows();
    }

    /** @return the points counted in a plot cell (0, 0 = top left of the plot area) */
    public int count(int col, int row) {
        return binned.count(col, row);
    }

    /**
     * Whether this layer holds the points of {@code scene} as a chart of this size and kind lays them
     * out: the same point and colouring arrays and the same axis ranges (which a scene without explicit
     * ranges takes from its curve, band and flags too). When false, bin them again.
     */
    public boolean fits(Scene scene) {
        try {
            return fits(scene, ScatterComposer.frame(scene, width, height, kind));
        } catch (IllegalArgumentException tooSmall) {
            return false;
        }
    }

    boolean fits(Scene scene, PlotFrame f) {
        return scene.x() == x && scene.y() == y && sameColouring(scene.colouring())
                && f.cols() == binned.columns() && f.rows() == binned.rows()
                && f.x().min() == xMin && f.x().max() == xMax && f.y().min() == yMin && f.y().max() == yMax;
    }

    private boolean sameColouring(Scene.PointColouring c) {
        if (c instanceof Scene.PointColouring.Highlight h && colouring instanceof Scene.PointColouring.Highlight o) {
            return h.codes() == o.codes() && h.code() == o.code();
        }
        if (c instanceof Scene.PointColouring.Classes h && colouring instanceof Scene.PointColouring.Classes o) {
            return h.codes() == o.codes();
        }
        return c instanceof Scene.PointColouring.Plain && colouring instanceof Scene.PointColouring.Plain;
    }

    /** Copies the binned points into a canvas of the same size and kind that holds nothing yet. */
    void copyInto(Canvas canvas) {
        canvas.copyPointsFrom(binned);
    }
}
