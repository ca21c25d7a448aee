package nearfit.tui.keys;

/** Something a key press asks the explorer to do beyond changing the state. */
public sealed interface Effect {
    /** Nothing more to do. */
    record None() implements Effect {
    }

    /** Apply a typed row condition once the core has checked it. */
    record ApplyCondition(String condition) implements Effect {
    }

    /** Write an export; {@code force} replaces an existing file. */
    record Export(ExportKind kind, String file, boolean force) implements Effect {
    }

    /** End at once as an interrupt does (Ctrl-C), exit status 130. */
    record Interrupt() implements Effect {
    }

    /** The shared instance of {@link None}. */
    Effect NONE = new None();
}
