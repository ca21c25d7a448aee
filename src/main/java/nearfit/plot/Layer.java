package nearfit.plot;

/**
 * The layers of a {@link Canvas}, bottom to top. Where layers share a cell the top one's
 * role wins (except that the highlighted group's points rise above the band and the curve); how
 * their dots merge is described on {@link Canvas}.
 */
public enum Layer {
    /** Data points; counted per cell for density. */
    POINTS,
    /** The band's shading, merged with the points below. */
    BAND,
    /** The band's edges, opaque like the curve. */
    BAND_EDGE,
    /** The fitted curve. */
    CURVE,
    /** Flagged rows. */
    FLAG,
    /** The crosshair. */
    CROSSHAIR,
    /** One marked row (chosen in a table), drawn over everything so it is found at once. */
    MARK
}
