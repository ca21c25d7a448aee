package nearfit.tui.keys;

/** The panel drawn over the plot, if any; {@code Esc} closes it. */
public enum Overlay {
    NONE, HELP, PICKER, TUNING, FLAGS, LOAD, EXPORT, PROMPT, CONFIRM
}
