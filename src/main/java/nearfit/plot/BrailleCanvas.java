package nearfit.plot;

/**
 * A {@link Canvas} of Unicode Braille Patterns: 2 × 4 dots per cell.
 *
 * <p>Code points follow the Unicode Standard, Braille Patterns block U+2800–U+28FF: dot n is bit
 * n − 1 above U+2800, dots 1, 2, 3 down the left column, 4, 5, 6 down the right, 7 and 8 the
 * bottom row left and right.
 *
 * <p>Shapes that stay distinct without colour: points are single dots; the band's edges are
 * dashed and its shading a sparse checker; the curve is a solid line that clears the points in
 * the cells it crosses; a flagged cell shows {@code ×} (U+00D7) instead of dots; the crosshair
 * is a full dot column merged with what is below; a marked row's cell shows {@code ◆}.
 */
public final class BrailleCanvas extends Canvas {
    /** The empty pattern, U+2800. */
    public static final int BLANK_PATTERN = 0x2800;
    /** The glyph of a flagged cell. */
    public static final int FLAG_GLYPH = 0x00D7;
    /** The glyph of a marked row's cell, U+25C6 BLACK DIAMOND. */
    public static final int MARK_GLYPH = 0x25C6;

    // BIT[sy][sx]: the Unicode dot number n gives bit n - 1 (dots 1-3 left, 4-6 right, 7-8 bottom).
    private static final int[][] BIT = {{0x01, 0x08}, {0x02, 0x10}, {0x04, 0x20}, {0x40, 0x80}};

    /**
     * @param cols width in cells, at least 1
     * @param rows height in cells, at least 1
     */
    public BrailleCanvas(int cols, int rows) {
        super(cols, rows, 2, 4);
    }

    /**
     * @param dotNumbers Braille dot numbers 1 to 8 as the Unicode Standard numbers them
     * @return the code point of the pattern with exactly those dots raised
     */
    public static int codePointOfDots(int... dotNumbers) {
        int bits = 0;
        for (int n : dotNumbers) {
            if (n < 1 || n > 8) {
                throw new IllegalArgumentException("braille dot " + n + " outside 1..8");
            }
            bits |= 1 << (n - 1);
        }
        return BLANK_PATTERN + bits;
    }

    /**
     * @param sx column within the cell, 0 (left) or 1 (right)
     * @param sy row within the cell, 0 (top) to 3 (bottom)
     * @return the Unicode dot number, 1 to 8
     */
    public static int dotNumber(int sx, int sy) {
        return Integer.numberOfTrailingZeros(BIT[sy][sx]) + 1;
    }

    @Override
    int dotBit(int sx, int sy) {
        return BIT[sy][sx];
    }

    @Override
    int glyph(int col, int row, Layer top, int dots, Role role) {
        if (top == Layer.MARK) {
            return MARK_GLYPH;
        }
        if (top == Layer.FLAG || (top == Layer.CROSSHAIR && flagged(col, row))) {
            return FLAG_GLYPH;
        }
        return BLANK_PATTERN + dots;
    }
}
