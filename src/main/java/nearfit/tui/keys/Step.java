package nearfit.tui.keys;

/** The outcome of one key press: the new state and what else to do. */
public record Step(ViewState state, Effect effect) {
    /** A step that only changes the state. */
    public static Step of(ViewState state) {
        return new Step(state, Effect.NONE);
    }
}
