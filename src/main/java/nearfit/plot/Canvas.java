package nearfit.plot;

import java.util.Arrays;

/**
 * A drawing surface of cells subdivided into dots, with one dot mask per {@link Layer} and a
 * point count per cell, turned into cells of a {@link CellGrid} by {@link #writeTo}.
 *
 * <p>Dot coordinates: x from 0 at the left to {@link #dotWidth()} − 1, y from 0 at the top to
 * {@link #dotHeight()} − 1. Dots outside are ignored, so callers need not clip.
 *
 * <p>Merging, bottom to top (points, band shading, band edges, curve, flags, crosshair); the
 * top layer present in a cell gives its role:
 * <ul>
 *   <li>points and band shading merge (union), so shading does not hide the data under it;
 *   <li>band edges and the curve are opaque: a cell they cross shows only their own dots, so
 *       the lines stay legible through dense points;
 *   <li>a flag cell shows the subclass's flag glyph, hiding what is below;
 *   <li>crosshair dots merge with the glyph below when that glyph is made of dots;
 *   <li>a cell holding a point of the highlighted group shows its points above the band and the
 *       curve (a group's flat run along the curve must not hide under it); flags, the crosshair
 *       and a marked row stay above it;
 *   <li>a marked row's cell shows the subclass's mark glyph, hiding everything below.
 * </ul>
 * Points are coloured by density: level 1 + floor((L − 1) · ln(count) / ln(max count)) with
 * L = {@link Role#DENSITY_LEVELS}, a log scale so that a single stray row and a cell holding
 * thousands are both visible; a cell holding any point of the highlighted group takes
 * {@link Role#HIGHLIGHT}, and with category codes the code with most points in the cell
 * gives the {@link Role#ofClass class role}.
 *
 * <p>Not thread-safe; one canvas per frame.
 */
public abstract sealed class Canvas permits BrailleCanvas, AsciiCanvas {
    private final int cols;
    private final int rows;
    private final int dotsX;
    private final int dotsY;
    // log2 of dotsX and dotsY (both powers of two), so the per-point path shifts instead of dividing.
    private final int shiftX;
    private final int shiftY;
    // bits[sy * dotsX + sx]: the mask bit of each dot in a cell, a table so no virtual call per point.
    private final int[] bits;
    private final byte[][] masks;
    private final int[] counts;
    private int[] highlightCounts;
    private int[] classCounts;

    Canvas(int cols, int rows, int dotsX, int dotsY) {
        if (cols < 1 || rows < 1) {
            throw new IllegalArgumentException("canvas of " + cols + "x" + rows + " cells");
        }
        this.cols = cols;
        this.rows = rows;
        this.dotsX = dotsX;
        this.dotsY = dotsY;
        if (Integer.bitCount(dotsX) != 1 || Integer.bitCount(dotsY) != 1) {
            throw new IllegalArgumentException("dots per cell must be powers of two");
        }
        this.shiftX = Integer.numberOfTrailingZeros(dotsX);
        this.shiftY = Integer.numberOfTrailingZeros(dotsY);
        this.bits = new int[dotsX * dotsY];
        for (int sy = 0; sy < dotsY; sy++) {
            for (int sx = 0; sx < dotsX; sx++) {
                bits[sy * dotsX + sx] = dotBit(sx, sy);
            }
        }
        this.masks = new byte[Layer.values().length][cols * rows];
        this.counts = new int[cols * rows];
    }

    /** @return width in cells */
    public final int columns() {
        return cols;
    }

    /** @return height in cells */
    public final int rows() {
        return rows;
    }

    /** @return width in dots */
    public final int dotWidth() {
        return cols * dotsX;
    }

    /** @return height in dots */
    public final int dotHeight() {
        return rows * dotsY;
    }

    /** @return dots per cell across */
    public final int dotsPerColumn() {
        return dotsX;
    }

    /** @return dots per cell down */
    public final int dotsPerRow() {
        return dotsY;
    }

    /** The mask bit of a dot within its cell; sx in [0, dotsX), sy in [0, dotsY). */
    abstract int dotBit(int sx, int sy);

    /** The glyph of a cell whose top layer is {@code top}; {@code dots} is the merged mask. */
    abstract int glyph(int col, int row, Layer top, int dots, Role role);

    /** Counts one data point at a dot and sets the dot. */
    public final void addPoint(int dx, int dy) {
        int cell = cellOf(dx, dy);
        if (cell >= 0) {
            counts[cell]++;
            masks[0][cell] |= (byte) bits[((dy & (dotsY - 1)) << shiftX) + (dx & (dotsX - 1))];
        }
    }

    /** Counts one point of the highlighted group. */
    public final void addHighlightPoint(int dx, int dy) {
        int cell = cellOf(dx, dy);
        if (cell >= 0) {
            if (highlightCounts == null) {
                highlightCounts = new int[counts.length];
            }
            highlightCounts[cell]++;
            addPoint(dx, dy);
        }
    }

    /** Counts one point with a non-negative category code (taken modulo {@link Role#CLASS_COUNT}). */
    public final void addClassPoint(int dx, int dy, int code) {
        int cell = cellOf(dx, dy);
        if (cell >= 0) {
            if (classCounts == null) {
                classCounts = new int[counts.length * Role.CLASS_COUNT];
            }
            classCounts[cell * Role.CLASS_COUNT + Math.floorMod(code, Role.CLASS_COUNT)]++;
            addPoint(dx, dy);
        }
    }

    /** Sets one dot of a layer other than points. */
    public final void mark(Layer layer, int dx, int dy) {
        int cell = cellOf(dx, dy);
        if (cell >= 0) {
            masks[layer.ordinal()][cell] |= (byte) bits[((dy & (dotsY - 1)) << shiftX) + (dx & (dotsX - 1))];
        }
    }

    /** @return the number of points counted in a cell */
    public final int count(int col, int row) {
        return counts[row * cols + col];
    }

    /** @return whether a layer has the dot set */
    public final boolean isSet(Layer layer, int dx, int dy) {
        int cell = cellOf(dx, dy);
        return cell >= 0 && (masks[layer.ordinal()][cell] & bits[((dy & (dotsY - 1)) << shiftX) + (dx & (dotsX - 1))]) != 0;
    }

    /** @return whether a layer has any dot in a cell */
    public final boolean hasAny(Layer layer, int col, int row) {
        return col >= 0 && col < cols && row >= 0 && row < rows && masks[layer.ordinal()][row * cols + col] != 0;
    }

    /**
     * Draws a straight segment between two points given in dot units (fractions allowed), clipped
     * to the canvas first (Liang and Barsky, 1984) so that far-off ends cost nothing, then walked
     * dot by dot with Bresenham's algorithm (Bresenham, IBM Systems Journal 4(1), 1965).
     *
     * @param dashed whether to leave every third and fourth dot of the walk unset; ignored on a
     *     canvas of one dot per cell, where gaps would be whole characters
     */
    public final void line(Layer layer, double x0, double y0, double x1, double y1, boolean dashed) {
        double[] c = {x0, y0, x1, y1};
        if (!clip(c, dotWidth() - 0.5, dotHeight() - 0.5)) {
            return;
        }
        // Dot i spans [i - 0.5, i + 0.5); halves go left in x (round) and up in y (ceil(y - 0.5)),
        // matching how single points are binned, and ends are clamped after clipping.
        int ax = clamp((int) Math.round(c[0]), dotWidth());
        int ay = clamp((int) Math.ceil(c[1] - 0.5), dotHeight());
        int bx = clamp((int) Math.round(c[2]), dotWidth());
        int by = clamp((int) Math.ceil(c[3] - 0.5), dotHeight());
        int sx = ax < bx ? 1 : -1;
        int sy = ay < by ? 1 : -1;
        int ddx = Math.abs(bx - ax);
        int ddy = -Math.abs(by - ay);
        int err = ddx + ddy;
        for (int step = 0; ; step++) {
            if (!dashed || dotsX == 1 || (step & 2) == 0) {
                mark(layer, ax, ay);
            }
            if (ax == bx && ay == by) {
                return;
            }
            int e2 = 2 * err;
            if (e2 >= ddy) {
                err += ddy;
                ax += sx;
            }
            if (e2 <= ddx) {
                err += ddx;
                ay += sy;
            }
        }
    }

    private static int clamp(int v, int size) {
        return Math.max(0, Math.min(size - 1, v));
    }

    /** Liang-Barsky clipping of c = {x0, y0, x1, y1} to [-0.5, maxX] x [-0.5, maxY]; false if outside. */
    private static boolean clip(double[] c, double maxX, double maxY) {
        double dx = c[2] - c[0];
        double dy = c[3] - c[1];
        double[] p = {-dx, dx, -dy, dy};
        double[] q = {c[0] + 0.5, maxX - c[0], c[1] + 0.5, maxY - c[1]};
        double t0 = 0;
        double t1 = 1;
        for (int i = 0; i < 4; i++) {
            if (p[i] == 0) {
                if (q[i] < 0) {
                    return false;
                }
            } else {
                double t = q[i] / p[i];
                if (p[i] < 0) {
                    t0 = Math.max(t0, t);
                } else {
                    t1 = Math.min(t1, t);
                }
            }
        }
        if (t0 > t1 || Double.isNaN(t0 + t1)) {
            return false;
        }
        double x0 = c[0];
        double y0 = c[1];
        c[0] = x0 + t0 * dx;
        c[1] = y0 + t0 * dy;
        c[2] = x0 + t1 * dx;
        c[3] = y0 + t1 * dy;
        return true;
    }

    /**
     * Shades a dot column between two rows (inclusive, either order) with a sparse checker so
     * that a shaded band reads as texture, not as solid points, when colour is off.
     */
    public final void shadeColumn(Layer layer, int dx, int dyA, int dyB) {
        int top = Math.max(0, Math.min(dyA, dyB));
        int bottom = Math.min(dotHeight() - 1, Math.max(dyA, dyB));
        for (int dy = top; dy <= bottom; dy++) {
            // One dot per cell (ASCII): shade every cell; the glyph itself marks the shading.
            if (dotsX == 1 || (((dx + dy) & 1) == 0 && (dy & 1) == 0)) {
                mark(layer, dx, dy);
            }
        }
    }

    /** Writes every cell into a grid builder with the canvas's top-left cell at (col0, row0). */
    public final void writeTo(CellGrid.Builder grid, int col0, int row0) {
        int max = 0;
        for (int n : counts) {
            max = Math.max(max, n);
        }
        double logMax = Math.log(max);
        for (int r = 0; r < rows; r++) {
            for (int c = 0; c < cols; c++) {
                writeCell(grid, col0, row0, c, r, logMax);
            }
        }
    }

    private void writeCell(CellGrid.Builder grid, int col0, int row0, int c, int r, double logMax) {
        int cell = r * cols + c;
        Layer top = topLayer(cell);
        if (top == null) {
            return;
        }
        if ((top == Layer.BAND || top == Layer.BAND_EDGE || top == Layer.CURVE) && highlightCounts != null
                && highlightCounts[cell] > 0) {
            top = Layer.POINTS;
        }
        int dots = switch (top) {
            case POINTS, BAND -> (masks[0][cell] | masks[1][cell]) & 0xFF;
            case BAND_EDGE, CURVE, FLAG, MARK -> masks[top.ordinal()][cell] & 0xFF;
            case CROSSHAIR -> mergedUnderCrosshair(cell);
        };
        Role role = switch (top) {
            case POINTS -> pointsRole(cell, logMax);
            case BAND, BAND_EDGE -> Role.BAND;
            case CURVE -> Role.CURVE;
            case FLAG -> Role.FLAG;
            case CROSSHAIR -> Role.CROSSHAIR;
            case MARK -> Role.MARKER;
        };
        grid.set(col0 + c, row0 + r, glyph(c, r, top, dots, role), role);
    }

    private int mergedUnderCrosshair(int cell) {
        int curve = masks[Layer.CURVE.ordinal()][cell];
        int edge = masks[Layer.BAND_EDGE.ordinal()][cell];
        int below = curve != 0 ? curve : edge != 0 ? edge : masks[0][cell] | masks[1][cell];
        return (below | masks[Layer.CROSSHAIR.ordinal()][cell]) & 0xFF;
    }

    /** @return the top layer with a dot in the cell, or null when the cell is empty */
    final Layer topLayer(int cell) {
        for (int l = masks.length - 1; l >= 0; l--) {
            if (masks[l][cell] != 0) {
                return Layer.values()[l];
            }
        }
        return null;
    }

    /** @return whether the flag layer has a dot in the cell; used by glyphs under the crosshair */
    final boolean flagged(int col, int row) {
        return masks[Layer.FLAG.ordinal()][row * cols + col] != 0;
    }

    private Role pointsRole(int cell, double logMax) {
        if (highlightCounts != null && highlightCounts[cell] > 0) {
            return Role.HIGHLIGHT;
        }
        if (classCounts != null) {
            return Role.ofClass(majorityClass(cell));
        }
        return Role.points(densityLevel(counts[cell], logMax));
    }

    /** Density level 1..L of a count on a log scale up to the largest count (see class doc). */
    static int densityLevel(int count, double logMax) {
        if (count <= 1 || logMax <= 0) {
            return 1;
        }
        // 1e-9 so that exact powers (count = max^(j/(L-1))) reach their level despite rounding.
        int level = 1 + (int) ((Role.DENSITY_LEVELS - 1) * Math.log(count) / logMax + 1e-9);
        return Math.min(level, Role.DENSITY_LEVELS);
    }

    /** @return the class code with most points in a cell; ties to the lower code */
    final int majorityClass(int cell) {
        int best = 0;
        int base = cell * Role.CLASS_COUNT;
        for (int k = 1; k < Role.CLASS_COUNT; k++) {
            if (classCounts[base + k] > classCounts[base + best]) {
                best = k;
            }
        }
        return best;
    }

    final boolean hasClasses() {
        return classCounts != null;
    }

    /**
     * Replaces this canvas's points (dot mask, counts, highlighted and class counts) with a copy of
     * another's of the same size and kind; the other layers are left as they are.
     */
    final void copyPointsFrom(Canvas other) {
        if (other.cols != cols || other.rows != rows || other.dotsX != dotsX || other.dotsY != dotsY) {
            throw new IllegalArgumentException("points of a " + other.cols + "x" + other.rows + " canvas into a "
                    + cols + "x" + rows + " one");
        }
        System.arraycopy(other.masks[0], 0, masks[0], 0, counts.length);
        System.arraycopy(other.counts, 0, counts, 0, counts.length);
        highlightCounts = other.highlightCounts == null ? null : other.highlightCounts.clone();
        classCounts = other.classCounts == null ? null : other.classCounts.clone();
    }

    /** Clears every layer and count, for reuse across frames of the same size. */
    public final void clear() {
        for (byte[] m : masks) {
            Arrays.fill(m, (byte) 0);
        }
        Arrays.fill(counts, 0);
        highlightCounts = null;
        classCounts = null;
    }

    /** Cell index of a dot, or -1 outside. */
    private int cellOf(int dx, int dy) {
        if (dx < 0 || dy < 0 || dx >= cols * dotsX || dy >= rows * dotsY) {
            return -1;
        }
        return (dy >> shiftY) * cols + (dx >> shiftX);
    }
}
