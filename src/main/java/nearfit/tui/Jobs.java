package nearfit.tui;

import java.util.concurrent.BlockingQueue;
import java.util.concurrent.CancellationException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.TimeUnit;
import java.util.function.Function;

/**
 * The explorer's background work: one executor, at most one live job per kind, each job tagged with the
 * generation of the state that asked for it. Starting a job cancels the older one of its kind, and a result
 * whose generation is no longer the latest of its kind is dropped by {@link #isCurrent}.
 *
 * <p>Finished jobs post a {@link Done} to the explorer's event queue; progress posts {@link #TICK} at most
 * once per percentage point. {@link #start}, {@link #isCurrent} and {@link #progress} are called from the
 * explorer's thread only.
 */
final class Jobs implements AutoCloseable {
    /** The kinds of job; each has its own latest generation. */
    enum Kind { CURVE, TUNING, FLAGS }

    /** A finished job: its value, or the failure that ended it. */
    record Done(Kind kind, long generation, Object value, Throwable failure) {
    }

    /** Posted when a running job's progress moved on, so the header can be redrawn. */
    static final Object TICK = new Object();

    private final ExecutorService pool;
    private final BlockingQueue<Object> events;
    private final long[] latest = new long[Kind.values().length];
    private final Control[] running = new Control[Kind.values().length];
    private int outstanding;

    /** @param threads worker threads: one per kind keeps a k change from waiting behind a long tuning run */
    Jobs(BlockingQueue<Object> events, int threads) {
        this.events = events;
        this.pool = Executors.newFixedThreadPool(threads, r -> {
            Thread t = new Thread(r, "nearfit-job");
            t.setDaemon(true);
            return t;
        });
    }

    /** Cancels the running job of this kind and starts {@code work} for generation {@code generation}. */
    <T> void start(Kind kind, long generation, Function<JobControl, T> work) {
        Control old = running[kind.ordinal()];
        if (old != null) {
            old.cancelled = true;
        }
        Control c = new Control();
        running[kind.ordinal()] = c;
        latest[kind.ordinal()] = generation;
        synchronized (this) {
            outstanding++;
        }
        pool.execute(() -> run(kind, generation, c, work));
    }

    private <T> void run(Kind kind, long generation, Control c, Function<JobControl, T> work) {
        try {
            if (!c.cancelled) {
                T value = work.apply(c);
                if (!c.cancelled) {
                    events.add(new Done(kind, generation, value, null));
                }
            }
        } catch (CancellationException e) {
            // A newer setting asked for this work again; nothing to report.
        } catch (RuntimeException | Error e) {
            events.add(new Done(kind, generation, null, e));
        } finally {
            c.finished = true;
            synchronized (this) {
                outstanding--;
                notifyAll();
            }
        }
    }

    /** Whether a finished job is the latest of its kind. */
    boolean isCurrent(Done d) {
        return d.generation() == latest[d.kind().ordinal()];
    }

    /** Progress of the running job of a kind, NaN when none is running. */
    double progress(Kind kind) {
        Control c = running[kind.ordinal()];
        return c == null || c.finished ? Double.NaN : c.fraction;
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

    @Override
    public void close() {
        for (Control c : running) {
            if (c != null) {
                c.cancelled = true;
            }
        }
        pool.shutdownNow();
        try {
            pool.awaitTermination(2, TimeUnit.SECONDS);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        }
    }

    private final class Control implements JobControl {
        volatile boolean cancelled;
        volatile boolean finished;
        volatile double fraction;
        private int lastPercent = -1;

        @Override
        public boolean cancelled() {
            return cancelled;
        }

        @Override
        public void progress(double f) {
            fraction = f;
            int percent = (int) (100 * f);
            if (percent != lastPercent) {
                lastPercent = percent;
                events.offer(TICK);
            }
        }
    }
}
