package nearfit.tui.loop;

import java.io.IOException;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.concurrent.BlockingQueue;
import java.util.concurrent.LinkedBlockingQueue;
import java.util.concurrent.TimeUnit;

import com.googlecode.lanterna.TerminalSize;
import com.googlecode.lanterna.input.KeyStroke;
import com.googlecode.lanterna.screen.Screen;
import com.googlecode.lanterna.screen.TerminalScreen;

import nearfit.table.NearfitException;
import nearfit.tui.bench.TuningCriterion;
import nearfit.tui.bench.Workbench;
import nearfit.tui.export.Exporter;
import nearfit.tui.keys.Effect;
import nearfit.tui.keys.FitKey;
import nearfit.tui.results.HeldOutChoice;
import nearfit.tui.keys.KeyContext;
import nearfit.tui.keys.KeyPress;
import nearfit.tui.keys.Step;
import nearfit.tui.keys.ViewState;
import nearfit.tui.paint.Drawings;
import nearfit.tui.paint.LoadPanel;
import nearfit.tui.paint.Look;
import nearfit.tui.paint.Pen;
import nearfit.tui.paint.ScreenPainter;
import nearfit.tui.paint.ScreenRegions;
import nearfit.tui.results.ColumnInfo;
import nearfit.tui.results.ColumnKind;
import nearfit.tui.results.CurveRequest;
import nearfit.tui.results.Figures;
import nearfit.tui.results.FrameInput;
import nearfit.tui.results.Results;

/**
 * The explorer's event loop: holds the current {@link ViewState} and the latest {@link Results}, turns key
 * presses into new states, asks the {@link Workbench} for what a state needs on background {@link Jobs}, and
 * has each frame painted from the state and the results. Keys, finished jobs and ticks arrive as
 * {@link Event}s on one queue.
 *
 * <p>All fields are used from one thread, the one that calls {@link #run} (or, in tests, {@link #press} and
 * {@link #settle}); background jobs only post events to the queue.
 */
public final class Explorer implements AutoCloseable {
    /** Exit status after Ctrl-C, as a shell reports a process ended by SIGINT. */
    public static final int EXIT_INTERRUPTED = 130;
    /** How long a frame waits for a curve just asked for: below what a key press feels like (common practice). */
    private static final long FRESH_CURVE_NANOS = 40_000_000L;
    /** How long after a resize frames are sent whole: a few frames of the 250 ms loop. */
    private static final long RESIZE_SETTLE_NANOS = 600_000_000L;

    private final TerminalScreen screen;
    private final Workbench workbench;
    private final Look look;
    private final BlockingQueue<Event> events = new LinkedBlockingQueue<>();
    private final Jobs jobs = new Jobs(events);
    private final Sketches sketches;
    private final Exporter exporter;
    private final DataExtent extent;
    private final it.unimi.dsi.fastutil.ints.Int2ObjectOpenHashMap<com.googlecode.lanterna.TextCharacter> characters =
            new it.unimi.dsi.fastutil.ints.Int2ObjectOpenHashMap<>();
    private ViewState state;
    private Results results;
    private ScreenRegions layout;
    private long generation;
    private CurveKey curveKey;
    /** The settings of the latest tuning job, with k 1: tuning does not depend on k. */
    private TuningKey tuningKey;
    private FlagsKey flagsKey;
    /**
     * The curve key whose job last finished. New tuning or flags wait until the current curve is in, so the
     * curve has the cores: at start, and after a k change (which makes the flags stale).
     */
    private CurveKey curveDoneKey;
    private boolean submitAfterFrame;
    /** The kind of job whose failure the results show, or {@code null}: it goes when that job runs again. */
    private Jobs.Kind failedKind;
    private long curveAskedAt;
    private java.util.function.BooleanSupplier screenStopped = () -> false;
    /** Frames are sent whole until this {@link System#nanoTime} after a resize. */
    private long completeUntil = System.nanoTime();
    private int exitStatus;
    private long framesDrawn;

    /**
     * @param screen    a started screen
     * @param workbench the loaded table and the core behind it
     * @param initial   the first state
     * @param look      ASCII or not, colour or not
     */
    public Explorer(TerminalScreen screen, Workbench workbench, ViewState initial, Look look) {
        this.screen = screen;
        this.workbench = workbench;
        this.look = look;
        this.sketches = new Sketches(workbench);
        this.exporter = new Exporter(workbench);
        this.extent = new DataExtent(workbench);
        this.state = initial;
        this.results = Results.none(workbench.rowsUsed(initial.condition()));
        this.layout = layoutOf(screen.getTerminalSize());
    }

    /**
     * Tells the explorer when the screen has been stopped (by a shutdown hook on SIGTERM, say): no frame is sent
     * after that, so nothing is drawn over the restored terminal. The check and the stop both hold the screen's
     * lock.
     */
    public void stopDrawingWhen(java.util.function.BooleanSupplier stopped) {
        this.screenStopped = stopped;
    }

    /** The current state. */
    public ViewState state() {
        return state;
    }

    /** The latest results. */
    public Results results() {
        return results;
    }

    /** Frames drawn so far. */
    public long framesDrawn() {
        return framesDrawn;
    }

    /**
     * Draws the first frame (the points, as soon as the table is in) and then starts the curve; tuning and
     * flags start once the first curve is in.
     */
    public void start() throws IOException {
        draw();
        submit();
    }

    /** Handles one key: the next state, its effect, the jobs it needs and a frame (with a quick curve, if any). */
    public void press(KeyStroke key) throws IOException {
        Step step = KeyPress.next(state, key, context());
        state = step.state();
        perform(step.effect());
        submit();
        awaitFreshCurve();
        draw();
    }

    /** Waits until the background work of the current state is done, applies its results and draws. */
    public void settle() throws IOException, InterruptedException {
        // A finished curve starts tuning and flags, so wait again until draining starts nothing new. Jobs that
        // end between the frame and the check leave their results queued, so the queue must be empty too (a
        // scripted job can finish that fast; a test once saw no flags after settling).
        do {
            jobs.awaitIdle(120_000);
            drainEvents();
            draw();
        } while (jobs.busy() || !events.isEmpty());
    }

    /** Waits until the curve of the current state is in and drawn, leaving tuning and flags running. */
    public void settleCurve() throws IOException, InterruptedException {
        jobs.awaitIdle(Jobs.Kind.CURVE, 120_000);
        if (drainEvents() || submitAfterFrame) {
            draw();
        }
    }

    /** Waits until one kind of background work is done ("curve", "tuning" or "flags"), then draws. */
    public void settle(String kind) throws IOException, InterruptedException {
        // Tuning and flags are started by the first curve, so that comes first.
        jobs.awaitIdle(Jobs.Kind.CURVE, 600_000);
        drainEvents();
        draw();
        jobs.awaitIdle(Jobs.Kind.valueOf(kind.toUpperCase(java.util.Locale.ROOT)), 600_000);
        drainEvents();
        draw();
    }

    /**
     * Runs until quit: keys come from a reader thread, results and progress from the jobs, all through one
     * queue, so a key is handled as soon as it arrives whatever the jobs are doing.
     *
     * @return 0 after {@code q}, {@link #EXIT_INTERRUPTED} after Ctrl-C
     */
    public int run() throws IOException, InterruptedException {
        KeyReader.start(screen, events);
        screen.getTerminal().addResizeListener((t, size) -> events.offer(Event.TICK));
        start();
        while (!state.quit()) {
            Event e = events.poll(250, TimeUnit.MILLISECONDS);
            while (e != null && !state.quit()) {
                handle(e);
                e = events.poll();
            }
            awaitFreshCurve();
            if (!state.quit()) {
                draw();
            }
        }
        return exitStatus;
    }

    private void handle(Event e) throws IOException {
        if (e instanceof Event.Key key) {
            Step step = KeyPress.next(state, key.stroke(), context());
            state = step.state();
            perform(step.effect());
            submit();
        } else if (e instanceof Event.JobDone d) {
            apply(d);
            if (d.kind() == Jobs.Kind.CURVE && jobs.isCurrent(d)) {
                // Tuning and flags are started after the frame that shows this curve (see draw).
                curveDoneKey = curveKey;
                submitAfterFrame = true;
            }
        }
    }

    /** Handles every queued event; returns whether there was any. */
    private boolean drainEvents() throws IOException {
        boolean any = false;
        Event e;
        while ((e = events.poll()) != null) {
            handle(e);
            any = true;
        }
        return any;
    }

    /**
     * Waits a little for a curve that has just been asked for, handling whatever arrives meanwhile, so that a
     * k change usually draws one frame, with the new curve, instead of one without and one with it.
     */
    private void awaitFreshCurve() throws IOException {
        long end = curveAskedAt + FRESH_CURVE_NANOS;
        long left;
        while (curveKey != null && !curveKey.equals(curveDoneKey) && !state.quit()
                && (left = end - System.nanoTime()) > 0) {
            Event e;
            try {
                e = events.poll(left, TimeUnit.NANOSECONDS);
            } catch (InterruptedException stop) {
                Thread.currentThread().interrupt();
                return;
            }
            if (e != null) {
                handle(e);
            }
        }
    }

    private void apply(Event.JobDone d) {
        if (!jobs.isCurrent(d)) {
            return;
        }
        if (d.failure() != null) {
            results = results.withFailure(oneLine(d.failure()));
            failedKind = d.kind();
            return;
        }
        results = d.update().apply(results);
    }

    public static String oneLine(Throwable t) {
        if (t instanceof NearfitException) {
            return t.getMessage();
        }
        String m = t.getMessage();
        return "internal error: " + t.getClass().getSimpleName() + (m == null ? "" : ": " + m.lines().findFirst().orElse(""));
    }

    private void perform(Effect effect) {
        if (effect instanceof Effect.Interrupt) {
            exitStatus = EXIT_INTERRUPTED;
            state = state.edit().quit(true).build();
        } else if (effect instanceof Effect.ApplyCondition c) {
            try {
                int rows = workbench.rowsUsed(c.condition());
                state = state.edit().condition(c.condition()).zoom(Double.NaN, Double.NaN).markedRow(-1)
                        .message(c.condition().isEmpty() ? "all rows" : Figures.count(rows) + " rows match").build();
                results = results.withRowsUsed(rows).withFailure("");
                failedKind = null;
            } catch (NearfitException e) {
                state = state.edit().warning(e.getMessage()).build();
            }
        } else if (effect instanceof Effect.Export x) {
            state = exporter.export(x, state, results, frameInput());
        }
    }

    /** Starts whatever job the state needs that is not already running or done for the same settings. */
    private void submit() {
        if (results.rowsUsed() == 0) {
            return;
        }
        FitKey model = state.model();
        CurveRequest request = request();
        CurveKey ck = new CurveKey(model, request);
        if (request != null && !ck.equals(curveKey)) {
            curveKey = ck;
            generation++;
            results = results.withCurve(results.curve(), 0);
            curveAskedAt = System.nanoTime();
            forgetFailureOf(Jobs.Kind.CURVE);
            jobs.start(Jobs.Kind.CURVE, generation, c -> workbench.curve(model, request, c),
                    (r, curve) -> r.withCurve(curve, Double.NaN));
        }
        // The flagged rows listed are those the row condition shows, which may be fewer than the reference's.
        String shown = state.condition();
        FlagsKey fk = new FlagsKey(model, state.groupColumn(), shown);
        if (request != null && !ck.equals(curveDoneKey)) {
            // Stale flags would only slow the curve down; they start again once it is in.
            if (!fk.equals(flagsKey)) {
                jobs.cancel(Jobs.Kind.FLAGS);
            }
            return;
        }
        // Flags first: they are drawn on the plot, tuning only in its panel and the header; both share a lane.
        if (!fk.equals(flagsKey)) {
            flagsKey = fk;
            generation++;
            // The previous flags stay on screen, marked as updating, until the new ones arrive: a k change
            // then redraws without recomposing the plot.
            results = results.withFlags(results.flags(), 0);
            String group = state.groupColumn();
            forgetFailureOf(Jobs.Kind.FLAGS);
            jobs.start(Jobs.Kind.FLAGS, generation, c -> workbench.flags(model, group, shown, c),
                    (r, flags) -> r.withFlags(flags, Double.NaN));
        }
        HeldOutChoice choice = state.tuningChoice(workbench.timeColumn() != null);
        String byGroup = choice == HeldOutChoice.GROUP ? state.groupColumn() : null;
        TuningKey tk = new TuningKey(model.withK(1), choice, byGroup);
        if (!tk.equals(tuningKey)) {
            tuningKey = tk;
            generation++;
            results = results.withTuning(null, 0);
            forgetFailureOf(Jobs.Kind.TUNING);
            // The figures are taken from the core's table in the job, so the frame only reads them.
            jobs.start(Jobs.Kind.TUNING, generation, c -> TuningCriterion.figures(workbench.tune(model, choice, byGroup, c)),
                    (r, tuning) -> r.withTuning(tuning, Double.NaN));
        }
    }

    /** A failure is shown until the job that failed runs again, for settings the user has since changed. */
    private void forgetFailureOf(Jobs.Kind kind) {
        if (failedKind == kind) {
            results = results.withFailure("");
            failedKind = null;
        }
    }

    /** The curve request of the current state and screen size, or {@code null} without rows. */
    public CurveRequest request() {
        double from = state.wholeRange() ? quantile(state.displayInput(), 0) : state.zoomFrom();
        double to = state.wholeRange() ? quantile(state.displayInput(), 1) : state.zoomTo();
        if (Double.isNaN(from) || Double.isNaN(to)) {
            return null;
        }
        if (!(to > from)) {
            to = from + 1;
        }
        int responseClass = kindOf(state.response()) == ColumnKind.CATEGORY ? state.responseClass() : -1;
        return new CurveRequest(state.displayInput(), heldValues(), from, to, layout.curveSteps(),
                state.groupColumn(), state.group(), state.compare(), responseClass);
    }

    private Map<String, Double> heldValues() {
        Map<String, Double> held = new HashMap<>();
        for (Map.Entry<String, Double> e : state.heldQuantile().entrySet()) {
            held.put(e.getKey(), quantile(e.getKey(), e.getValue()));
        }
        return held;
    }

    /** A quantile from the core, asked once per column, condition and level. */
    private double quantile(String column, double q) {
        return extent.quantile(column, state.condition(), q);
    }

    private ColumnKind kindOf(String column) {
        for (ColumnInfo c : workbench.columns()) {
            if (c.name().equals(column)) {
                return c.kind();
            }
        }
        return null;
    }

    private KeyContext context() {
        int groups = state.groupColumn() == null ? 0 : workbench.labels(state.groupColumn()).size();
        int classes = kindOf(state.response()) == ColumnKind.CATEGORY ? workbench.labels(state.response()).size() : 0;
        return new KeyContext(workbench.columns(), results, quantile(state.displayInput(), 0),
                quantile(state.displayInput(), 1), groups, classes, workbench.timeColumn() != null,
                LoadPanel.lines(workbench.loadNotes()).size());
    }

    FrameInput frameInput() {
        List<String> groups = state.groupColumn() == null ? List.of() : workbench.labels(state.groupColumn());
        List<String> classes = kindOf(state.response()) == ColumnKind.CATEGORY
                ? workbench.labels(state.response()) : List.of();
        return new FrameInput(workbench.source(), workbench.totalRows(), workbench.columns(), heldValues(),
                results.rowsUsed() == 0 ? null : request(), groups, classes, Double.NaN, workbench.loadNotes());
    }

    /**
     * Draws a frame: first takes in a new terminal size (which may ask for a new curve) and the jobs' progress,
     * then makes the frame's drawings and has the painter lay out the state, the results and the drawings.
     */
    public void draw() throws IOException {
        TerminalSize resized = screen.doResizeIfNecessary();
        long now = System.nanoTime();
        if (resized != null) {
            layout = layoutOf(resized);
            completeUntil = now + RESIZE_SETTLE_NANOS;
            submit();
        }
        results = new Results(results.curve(), jobs.progress(Jobs.Kind.CURVE), results.tuning(),
                jobs.progress(Jobs.Kind.TUNING), results.flags(), jobs.progress(Jobs.Kind.FLAGS),
                results.rowsUsed(), results.failure());
        FrameInput in = frameInput();
        Drawings drawings = sketches.of(layout, state, results, in, look.ascii());
        Pen pen = new Pen(screen.newTextGraphics(), look, layout.width(), layout.height(), characters);
        ScreenPainter.paint(pen, layout, state, results, in, drawings);
        screen.setCursorPosition(null);
        // After a resize the terminal may reflow or clear its cells, even after the first frame at the new size
        // (a multiplexer over SSH may apply its reflow late), so frames are sent whole for a short while;
        // otherwise only the cells that changed.
        synchronized (screen) {
            if (screenStopped.getAsBoolean()) {
                return;
            }
            screen.refresh(now - completeUntil < 0 ? Screen.RefreshType.COMPLETE : Screen.RefreshType.DELTA);
        }
        framesDrawn++;
        if (submitAfterFrame) {
            submitAfterFrame = false;
            submit();
        }
    }

    /** What a curve job depends on: the model settings and where the curve is evaluated. */
    /** What a tuning job depends on: the settings with k 1, the held-out choice and its group column. */
    private record TuningKey(FitKey anyK, HeldOutChoice choice, String groupColumn) {
    }

    private record CurveKey(FitKey model, CurveRequest request) {
    }

    /** What a flags job depends on: the model settings, the group column labelling the rows and the rows shown. */
    private record FlagsKey(FitKey model, String groupColumn, String shownCondition) {
    }

    private static ScreenRegions layoutOf(TerminalSize size) {
        return new ScreenRegions(size.getColumns(), size.getRows());
    }

    @Override
    public void close() {
        jobs.close();
    }

    @Override
    public String toString() {
        return "Explorer[" + Objects.toString(state) + "]";
    }
}
