package nearfit.plot;

/**
 * What a cell of a {@link CellGrid} shows, so that a face can choose its colour.
 *
 * <p>Roles carry meaning, not colours: the explorer maps them to terminal colours, the text
 * renderer to ANSI escape codes through a {@link Palette}, or to nothing at all. Glyphs alone
 * must still tell the layers apart when colour is off (see {@link BrailleCanvas} and
 * {@link AsciiCanvas} for the shapes each layer uses).
 */
public enum Role {
    /** An empty cell. */
    BLANK,
    /** Axis lines and tick marks. */
    AXIS,
    /** Numbers or dates beside ticks. */
    TICK_LABEL,
    /** Axis names and legends. */
    LABEL,
    /** The chart's title. */
    TITLE,
    /** Points, density level 1 (fewest points per cell, log scale). */
    POINTS_1,
    /** Points, density level 2. */
    POINTS_2,
    /** Points, density level 3. */
    POINTS_3,
    /** Points, density level 4. */
    POINTS_4,
    /** Points, density level 5 (most points per cell). */
    POINTS_5,
    /** Points of the highlighted group. */
    HIGHLIGHT,
    /** Points whose category code is 0 modulo {@link #CLASS_COUNT}. */
    CLASS_0,
    /** Category code 1 modulo {@link #CLASS_COUNT}. */
    CLASS_1,
    /** Category code 2 modulo {@link #CLASS_COUNT}. */
    CLASS_2,
    /** Category code 3 modulo {@link #CLASS_COUNT}. */
    CLASS_3,
    /** Category code 4 modulo {@link #CLASS_COUNT}. */
    CLASS_4,
    /** Category code 5 modulo {@link #CLASS_COUNT}. */
    CLASS_5,
    /** Category code 6 modulo {@link #CLASS_COUNT}. */
    CLASS_6,
    /** Category code 7 modulo {@link #CLASS_COUNT}. */
    CLASS_7,
    /** The band around the curve (its edges, its shading or a tuning chart's error bars). */
    BAND,
    /** The fitted curve. */
    CURVE,
    /** Flagged rows. */
    FLAG,
    /** The crosshair. */
    CROSSHAIR,
    /** Marked choices, such as the best k and the one-SE k of a tuning chart. */
    MARKER,
    /** The window-width strip under the plot. */
    WIDTH;

    /** Number of density levels, {@link #POINTS_1} to {@link #POINTS_5}. */
    public static final int DENSITY_LEVELS = 5;
    /** Number of category colours; codes beyond wrap around. */
    public static final int CLASS_COUNT = 8;

    private static final Role[] VALUES = values();

    /**
     * @param level a density level, 1 to {@link #DENSITY_LEVELS}
     * @return the points role for that level
     */
    public static Role points(int level) {
        if (level < 1 || level > DENSITY_LEVELS) {
            throw new IllegalArgumentException("density level " + level + " outside 1.." + DENSITY_LEVELS);
        }
        return VALUES[POINTS_1.ordinal() + level - 1];
    }

    /**
     * @param code a non-negative category code
     * @return its colour role, codes taken modulo {@link #CLASS_COUNT}
     */
    public static Role ofClass(int code) {
        return VALUES[CLASS_0.ordinal() + Math.floorMod(code, CLASS_COUNT)];
    }

    /** @return the density level of a points role, or 0 for any other role */
    public int densityLevel() {
        int d = ordinal() - POINTS_1.ordinal();
        return d >= 0 && d < DENSITY_LEVELS ? d + 1 : 0;
    }

    static Role ofOrdinal(int ordinal) {
        return VALUES[ordinal];
    }
}
