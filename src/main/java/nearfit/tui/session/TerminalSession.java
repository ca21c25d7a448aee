package nearfit.tui.session;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.concurrent.CancellationException;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.TimeoutException;

import com.googlecode.lanterna.input.KeyStroke;
import com.googlecode.lanterna.input.KeyType;
import com.googlecode.lanterna.screen.Screen;
import com.googlecode.lanterna.screen.TerminalScreen;
import com.googlecode.lanterna.terminal.DefaultTerminalFactory;
import com.googlecode.lanterna.terminal.Terminal;
import com.googlecode.lanterna.terminal.ansi.UnixLikeTerminal;

import nearfit.table.NearfitException;
import nearfit.tui.bench.JobReport;
import nearfit.tui.bench.Workbench;
import nearfit.tui.keys.ViewState;
import nearfit.tui.loop.Explorer;
import nearfit.tui.paint.Look;
import nearfit.tui.paint.Pen;
import nearfit.tui.paint.ScreenRegions;
import nearfit.tui.results.Figures;
import nearfit.tui.results.Ink;

/**
 * One explorer session on a terminal: opens the screen, shows load progress, runs the {@link Explorer}, and
 * always gives the terminal back as it was, on quit, on an error (whose one-line message is printed after
 * the restore), on Ctrl-C (read as a key in raw mode, exit status 130) and on SIGTERM or SIGINT (a shutdown
 * hook stops the screen; the JVM then exits with 143 or 130).
 */
public final class TerminalSession {
    /** Exit status for a usage or input error, as the command line uses. */
    public static final int EXIT_USAGE = 2;

    private final TerminalScreen screen;
    private final Look look;
    private boolean stopped;

    private TerminalSession(TerminalScreen screen, Look look) {
        this.screen = screen;
        this.look = look;
    }

    /** The real terminal on standard input and output, with Ctrl-C delivered as a key. */
    public static TerminalScreen systemScreen() throws IOException {
        Terminal t = new DefaultTerminalFactory(System.out, System.in, StandardCharsets.UTF_8)
                .setForceTextTerminal(true)
                .setUnixTerminalCtrlCBehaviour(UnixLikeTerminal.CtrlCBehaviour.TRAP)
                .createTerminal();
        return new TerminalScreen(t);
    }

    /**
     * Runs a session and returns its exit status: 0 after {@code q}, 130 after Ctrl-C, 2 after an error.
     *
     * @param screen    a screen not yet started
     * @param file      the file to open
     * @param shownName the file as the user named it
     * @param opener    the loader
     * @param start     the command line's first view
     * @param look      ASCII or not, colour or not
     * @param err       where the error line goes, after the terminal is restored
     */
    public static int run(TerminalScreen screen, Path file, String shownName, WorkbenchOpener opener,
            StartSettings start, Look look, PrintWriter err) {
        TerminalSession session = new TerminalSession(screen, look);
        Thread hook = new Thread(session::stop, "nearfit-restore-terminal");
        Runtime.getRuntime().addShutdownHook(hook);
        TermSignal term = TermSignal.install(session::stop);
        String failure = null;
        int status;
        try {
            screen.startScreen();
            screen.setCursorPosition(null);
            Workbench wb = session.load(file, shownName, opener);
            if (wb == null) {
                status = Explorer.EXIT_INTERRUPTED;
            } else {
                ViewState first = start.initialState(wb.columns(), wb.rowsUsed(""));
                try (Explorer explorer = new Explorer(screen, wb, first, look)) {
                    explorer.stopDrawingWhen(session::isStopped);
                    status = explorer.run();
                }
            }
        } catch (NearfitException e) {
            failure = "nearfit: " + e.getMessage();
            status = EXIT_USAGE;
        } catch (IOException | RuntimeException e) {
            failure = "nearfit: " + Explorer.oneLine(e);
            status = EXIT_USAGE;
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            status = Explorer.EXIT_INTERRUPTED;
        } finally {
            term.restore();
            session.stop();
            try {
                Runtime.getRuntime().removeShutdownHook(hook);
            } catch (IllegalStateException e) {
                // The JVM is already shutting down; the hook has run or will run, and stop() is idempotent.
            }
        }
        if (failure != null) {
            err.println(failure);
            err.flush();
        }
        return status;
    }

    /** Whether the screen has been stopped; read under the screen's lock. */
    boolean isStopped() {
        return stopped;
    }

    /** Stops the screen and restores the terminal's settings; safe to call twice and from the shutdown hook. */
    void stop() {
        synchronized (screen) {
            if (stopped) {
                return;
            }
            stopped = true;
            // No input drain: stopScreen() first polls the input, and under SIGTERM that can fail (the
            // terminal library's own shutdown hook may restore the tty at the same moment), which skipped
            // leaving the alternate screen and left the last frame on the user's shell.
            try {
                screen.stopScreen(false);
            } catch (IOException | RuntimeException e) {
                leavePrivateMode();
            }
        }
        try {
            screen.getTerminal().close();
        } catch (IOException | RuntimeException e) {
            // As above.
        }
    }

    private void leavePrivateMode() {
        try {
            screen.getTerminal().exitPrivateMode();
        } catch (IOException | RuntimeException e) {
            // Nothing more can be done for a terminal that is gone.
        }
    }

    /** Loads on a background thread while drawing progress; q or Ctrl-C cancels (returns {@code null}). */
    private Workbench load(Path file, String shownName, WorkbenchOpener opener) throws IOException,
            InterruptedException {
        JobReport progress = new JobReport();
        CompletableFuture<Workbench> task = CompletableFuture.supplyAsync(() -> opener.open(file, shownName, progress));
        while (true) {
            drawLoading(shownName, progress.fraction(), progress.rowsRead());
            try {
                return task.get(100, TimeUnit.MILLISECONDS);
            } catch (TimeoutException e) {
                KeyStroke k = screen.pollInput();
                if (k != null && (k.getKeyType() == KeyType.EOF || (k.getKeyType() == KeyType.Character
                        && (k.getCharacter() == 'q' || (k.isCtrlDown() && k.getCharacter() == 'c'))))) {
                    progress.cancel();
                    return null;
                }
            } catch (ExecutionException e) {
                Throwable cause = e.getCause();
                if (cause instanceof CancellationException) {
                    return null;
                }
                if (cause instanceof RuntimeException re) {
                    throw re;
                }
                throw new IllegalStateException(cause);
            }
        }
    }

    private void drawLoading(String shownName, double fraction, long rows) throws IOException {
        screen.doResizeIfNecessary();
        ScreenRegions layout = new ScreenRegions(screen.getTerminalSize().getColumns(), screen.getTerminalSize().getRows());
        Pen pen = new Pen(screen.newTextGraphics(), look, layout.width(), layout.height(),
                new it.unimi.dsi.fastutil.ints.Int2ObjectOpenHashMap<>());
        pen.clear();
        // A gzip file's decompressed size is unknown until the end, so its progress is the rows read.
        String done = fraction > 0 ? Math.round(100 * fraction) + " %" : Figures.count(rows) + " rows";
        pen.text(0, 0, Figures.fit("nearfit  loading " + shownName + "  " + done, layout.width(), look.ascii()),
                Ink.TITLE);
        pen.text(0, layout.height() - 1, "q cancels", Ink.LABEL);
        screen.refresh(Screen.RefreshType.DELTA);
    }
}
