package nearfit.plot;

/**
 * A {@link Canvas} of one ASCII character per cell, for {@code --ascii} or terminals without
 * UTF-8.
 *
 * <p>Glyphs: points by density level 1..5 as {@code . : + o @}; the highlighted group
 * {@code #}; category codes as letters {@code a}..{@code h}; band edges {@code =} and band
 * shading {@code ~}; the curve {@code - / \ |} following its local slope; flags {@code x}; the
 * crosshair {@code !}; a marked row {@code *}. None is used by two layers, so the picture reads without colour.
 */
public final class AsciiCanvas extends Canvas {
    private static final String DENSITY_RAMP = ".:+o@";

    /**
     * @param cols width in cells, at least 1
     * @param rows height in cells, at least 1
     */
    public AsciiCanvas(int cols, int rows) {
        super(cols, rows, 1, 1);
    }

    /** @return the glyph of points at a density level, 1 to {@link Role#DENSITY_LEVELS} */
    public static char densityGlyph(int level) {
        return DENSITY_RAMP.charAt(level - 1);
    }

    @Override
    int dotBit(int sx, int sy) {
        return 1;
    }

    @Override
    int glyph(int col, int row, Layer top, int dots, Role role) {
        return switch (top) {
            case POINTS -> pointsGlyph(role);
            case BAND -> '~';
            case BAND_EDGE -> '=';
            case CURVE -> curveGlyph(col, row);
            case FLAG -> 'x';
            case CROSSHAIR -> flagged(col, row) ? 'x' : '!';
            case MARK -> '*';
        };
    }

    private static char pointsGlyph(Role role) {
        if (role == Role.HIGHLIGHT) {
            return '#';
        }
        int level = role.densityLevel();
        return level > 0 ? densityGlyph(level) : (char) ('a' + role.ordinal() - Role.CLASS_0.ordinal());
    }

    /** Picks a stroke from the curve cells around this one (left, right, above, below). */
    private char curveGlyph(int c, int r) {
        boolean horizontal = hasAny(Layer.CURVE, c - 1, r) || hasAny(Layer.CURVE, c + 1, r);
        boolean rising = hasAny(Layer.CURVE, c + 1, r - 1) || hasAny(Layer.CURVE, c - 1, r + 1);
        boolean falling = hasAny(Layer.CURVE, c + 1, r + 1) || hasAny(Layer.CURVE, c - 1, r - 1);
        boolean vertical = hasAny(Layer.CURVE, c, r - 1) || hasAny(Layer.CURVE, c, r + 1);
        if (vertical && !horizontal) {
            return '|';
        }
        if (rising && !falling && !horizontal) {
            return '/';
        }
        if (falling && !rising && !horizontal) {
            return '\\';
        }
        return '-';
    }
}
