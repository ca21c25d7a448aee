package nearfit.tui;

/** The panel drawn over the plot, if any; {@code Esc} closes it. */
public enum Overlay {
    NONE, HELP, PICKER, TUNING, FLAGS, EXPORT, PROMPT, CONFIRM
}
