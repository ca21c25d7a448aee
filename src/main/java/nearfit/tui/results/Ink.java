package nearfit.tui.results;

/**
 * What a screen cell shows, so that the explorer can choose its colour. The names match the plot
 * package's roles one for one, which keeps the adapter a lookup by name.
 */
public enum Ink {
    BLANK, AXIS, TICK_LABEL, LABEL, TITLE,
    POINTS_1, POINTS_2, POINTS_3, POINTS_4, POINTS_5,
    HIGHLIGHT,
    CLASS_0, CLASS_1, CLASS_2, CLASS_3, CLASS_4, CLASS_5, CLASS_6, CLASS_7,
    BAND, CURVE, FLAG, CROSSHAIR, MARKER, WIDTH,
    /** Explorer chrome: header and status text. */
    TEXT,
    /** Explorer chrome: a highlighted line in a table or menu. */
    SELECTED,
    /** Explorer chrome: an error or a warning. */
    WARNING
}
