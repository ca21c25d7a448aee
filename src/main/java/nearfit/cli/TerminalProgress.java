package nearfit.cli;

import java.io.PrintWriter;
import java.util.Locale;

import nearfit.knn.Progress;

/**
 * Shows the progress of a long step on standard error, rewriting one line at most twice a second;
 * silent under {@code --quiet} or when standard error is not a terminal (so logs stay clean).
 */
final class TerminalProgress implements Progress {
    private static final long INTERVAL_NANOS = 500_000_000L;
    private final PrintWriter err;
    private final String step;
    private final boolean shown;
    private long lastNanos = System.nanoTime();
    private boolean printed;

    private TerminalProgress(PrintWriter err, String step, boolean shown) {
        this.err = err;
        this.step = step;
        this.shown = shown;
    }

    /** Progress for {@code step} (e.g. "tuning"), shown only on a terminal and without --quiet. */
    static TerminalProgress of(PrintWriter err, String step, boolean quiet) {
        return new TerminalProgress(err, step, !quiet && System.console() != null);
    }

    @Override
    public synchronized void report(long done, long total) {
        long now = System.nanoTime();
        if (!shown || total <= 0 || now - lastNanos < INTERVAL_NANOS) {
            return;
        }
        lastNanos = now;
        printed = true;
        err.printf(Locale.ROOT, "\rnearfit: %s %3d %%", step, (int) (100 * done / total));
        err.flush();
    }

    /** Clears the progress line, if one was printed. */
    synchronized void done() {
        if (printed) {
            err.print("\r\033[K");
            err.flush();
            printed = false;
        }
    }
}
