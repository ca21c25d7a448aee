package nearfit.tui.session;

/**
 * SIGTERM handled by the explorer itself: the screen is stopped first, then the JVM exits with
 * 143 (128 + 15). With only a shutdown hook, the terminal library's own hook could leave the
 * alternate screen first, and a frame drawn in that moment landed on the user's shell (seen under
 * load in TmuxViewTest); here nothing can draw between the signal and the stop. Uses
 * {@code sun.misc.Signal} (module jdk.unsupported); where it is missing, the shutdown hook alone
 * restores the terminal, as before.
 */
@SuppressWarnings("removal")
final class TermSignal {
    /** The exit status after SIGTERM, as shells report it. */
    static final int EXIT_TERMINATED = 143;

    private final Object previous;

    private TermSignal(Object previous) {
        this.previous = previous;
    }

    /** Installs the handler; {@code stop} must be safe to call from any thread and twice. */
    static TermSignal install(Runnable stop) {
        try {
            sun.misc.SignalHandler handler = signal -> {
                stop.run();
                System.exit(EXIT_TERMINATED);
            };
            return new TermSignal(sun.misc.Signal.handle(new sun.misc.Signal("TERM"), handler));
        } catch (IllegalArgumentException | LinkageError e) {
            return new TermSignal(null); // no such signal here, or no jdk.unsupported: the hook remains
        }
    }

    /** Puts back the handler that was there before. */
    void restore() {
        if (previous instanceof sun.misc.SignalHandler h) {
            try {
                sun.misc.Signal.handle(new sun.misc.Signal("TERM"), h);
            } catch (IllegalArgumentException e) {
                // as in install
            }
        }
    }
}
