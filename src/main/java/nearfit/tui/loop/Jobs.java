package nearfit.tui.loop;

import java.util.concurrent.BlockingQueue;
import java.util.concurrent.CancellationException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.TimeUnit;
import java.util.function.BiFunction;
import java.util.function.Function;

import nearfit.tui.bench.JobControl;
import nearfit.tui.bench.JobReport;
import nearfit.tui.results.Results;

/**
 * The explorer's background work: one executor with two lanes, at most one live job per kind, each job
 * tagged with the generation of the state that asked for it. The curve has a lane of its own, so a k change
 * never waits behind leave-one-out work; flags and tuning share the other lane, one after the other (each
 * job itself runs on all cores, so they would only compete if run side by side). While a curve is being
 * computed, leave-one-out work waits at its next cancellation check (the knn package checks before each
 * chunk of rows), so a k change gets the cores at once and its frame is not slowed by tuning. Starting a job cancels the older one of its kind, and a result
 * whose generation is no longer the latest of its kind is dropped by {@link #isCurrent}.
 *
 * <p>Finished jobs post an {@link Event.JobDone} to the explorer's event queue; progress posts {@link Event#TICK} at most
 * once per percentage point. {@link #start}, {@link #isCurrent} and {@link #progress} are called from the
 * explorer's thread only.
 */
final class Jobs implements AutoCloseable {
    /** The kinds of job; each has its own latest generation. */
    enum Kind { CURVE, TUNING, FLAGS }

    /**
     * Longest a leave-one-out worker waits for one curve; a curve takes well under a second, so this only
     * guards against a curve that never ends.
     */
    private static final long MAX_PAUSE_MILLIS = 2_000;

    private final Object curveGate = new Object();
    /** Curve jobs running now; guarded by {@link #curveGate}. */
    private int curvesRunning;
    private final ExecutorService curveLane;
    private final ExecutorService longLane;
    private final BlockingQueue<Event> events;
    private final long[] latest = new long[Kind.values().length];
    private final Control[] running = new Control[Kind.values().length];
    private int outstanding;
    private final int[] outstandingOf = new int[Kind.values().length];

    Jobs(BlockingQueue<Event> events) {
        this.events = events;
        this.curveLane = Executors.newSingleThreadExecutor(r -> daemon(r, "nearfit-curve"));
        this.longLane = Executors.newSingleThreadExecutor(r -> daemon(r, "nearfit-leave-one-out"));
    }

    private static Thread daemon(Runnable r, String name) {
        Thread t = new Thread(r, name);
        t.setDaemon(true);
        return t;
    }

    /**
     * Cancels the running job of this kind and starts {@code work} for generation {@code generation}; its value
     * goes into the results through {@code into}, on the explorer's thread.
     */
    <T> void start(Kind kind, long generation, Function<JobControl, T> work, BiFunction<Results, T, Results> into) {
        Control old = running[kind.ordinal()];
        if (old != null) {
            old.cancel();
        }
        Control c = new Control(kind != Kind.CURVE);
        running[kind.ordinal()] = c;
        latest[kind.ordinal()] = generation;
        synchronized (this) {
            outstanding++;
            outstandingOf[kind.ordinal()]++;
        }
        (kind == Kind.CURVE ? curveLane : longLane).execute(() -> run(kind, generation, c, work, into));
    }

    private <T> void run(Kind kind, long generation, Control c, Function<JobControl, T> work,
            BiFunction<Results, T, Results> into) {
        if (kind == Kind.CURVE) {
            curveStarted();
        }
        try {
            if (!c.cancelRequested()) {
                T value = work.apply(c);
                if (!c.cancelRequested()) {
                    events.add(new Event.JobDone(kind, generation, r -> into.apply(r, value), null));
                }
            }
        } catch (CancellationException e) {
            // A newer setting asked for this work again; nothing to report.
        } catch (RuntimeException | Error e) {
            events.add(new Event.JobDone(kind, generation, null, e));
        } finally {
            if (kind == Kind.CURVE) {
                curveEnded();
            }
            c.finished = true;
            synchronized (this) {
                outstanding--;
                outstandingOf[kind.ordinal()]--;
                notifyAll();
            }
        }
    }

    private void curveStarted() {
        synchronized (curveGate) {
            curvesRunning++;
        }
    }

    private void curveEnded() {
        synchronized (curveGate) {
            curvesRunning--;
            curveGate.notifyAll();
        }
    }

    /** Waits while a curve job runs, at most {@link #MAX_PAUSE_MILLIS}, or until {@code c} is cancelled. */
    private void yieldToCurve(Control c) {
        long end = System.currentTimeMillis() + MAX_PAUSE_MILLIS;
        synchronized (curveGate) {
            long left;
            while (curvesRunning > 0 && !c.cancelRequested() && (left = end - System.currentTimeMillis()) > 0) {
                try {
                    curveGate.wait(left);
                } catch (InterruptedException e) {
                    Thread.currentThread().interrupt();
                    return;
                }
            }
        }
    }

    /** Whether a finished job is the latest of its kind. */
    boolean isCurrent(Event.JobDone d) {
        return d.generation() == latest[d.kind().ordinal()];
    }

    /** Progress of the running job of a kind, NaN when none is running. */
    double progress(Kind kind) {
        Control c = running[kind.ordinal()];
        return c == null || c.finished ? Double.NaN : c.fraction();
    }

    /** Waits until no job is running or queued; for tests and benchmarks. */
    synchronized void awaitIdle(long timeoutMillis) throws InterruptedException {
        long end = System.currentTimeMillis() + timeoutMillis;
        while (outstanding > 0) {
            long left = end - System.currentTimeMillis();
            if (left <= 0) {
                throw new IllegalStateException("background work still running after " + timeoutMillis + " ms");
            }
            wait(left);
        }
    }

    /** Cancels the running job of a kind, if any; its result, if it still comes, is dropped. */
    void cancel(Kind kind) {
        Control c = running[kind.ordinal()];
        if (c != null) {
            c.cancel();
        }
        running[kind.ordinal()] = null;
        latest[kind.ordinal()] = -1; // generations start at 1, so no job is current
    }

    /** Whether any job is running or queued. */
    synchronized boolean busy() {
        return outstanding > 0;
    }

    /** Waits until no job of one kind is running or queued; for benchmarks. */
    synchronized void awaitIdle(Kind kind, long timeoutMillis) throws InterruptedException {
        long end = System.currentTimeMillis() + timeoutMillis;
        while (outstandingOf[kind.ordinal()] > 0) {
            long left = end - System.currentTimeMillis();
            if (left <= 0) {
                throw new IllegalStateException(kind + " work still running after " + timeoutMillis + " ms");
            }
            wait(left);
        }
    }

    @Override
    public void close() {
        for (Control c : running) {
            if (c != null) {
                c.cancel();
            }
        }
        curveLane.shutdownNow();
        longLane.shutdownNow();
        try {
            curveLane.awaitTermination(2, TimeUnit.SECONDS);
            longLane.awaitTermination(2, TimeUnit.SECONDS);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        }
    }

    /** A job's flags that also post an {@link Event#TICK} when its progress passes a percentage point. */
    private final class Control extends JobReport {
        volatile boolean finished;
        private final boolean yields;
        private int lastPercent = -1;

        Control(boolean yields) {
            this.yields = yields;
        }

        /** For leave-one-out work, called by the engine's workers between chunks: first gives way to a curve. */
        @Override
        public boolean cancelled() {
            if (yields && !cancelRequested()) {
                yieldToCurve(this);
            }
            return cancelRequested();
        }

        @Override
        public void progress(double f) {
            super.progress(f);
            int percent = (int) (100 * f);
            if (percent != lastPercent) {
                lastPercent = percent;
                events.offer(Event.TICK);
            }
        }
    }
}
