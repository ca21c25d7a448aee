package nearfit.knn;

import java.util.concurrent.atomic.AtomicInteger;
import java.util.concurrent.atomic.AtomicLong;
import java.util.concurrent.atomic.AtomicReference;
import java.util.function.Supplier;

/**
 * Runs a loop over rows {@code [0, n)} in fixed chunks on a given number of threads. Chunk
 * boundaries depend only on n and the chunk size, never on the thread count, and each chunk writes
 * only its own slots, so results are identical whatever the thread count. Checks cancellation
 * before every chunk.
 */
final class Workers {
    /** Rows per chunk: the unit of work, of progress and of cancellation. */
    static final int CHUNK = 1024;

    /** The work on one chunk, with the thread's own scratch. */
    interface Body<S> {
        void run(S scratch, int chunk, int from, int to);
    }

    private Workers() {
    }

    static int chunks(int n) {
        return (n + CHUNK - 1) / CHUNK;
    }

    static <S> void run(int n, int threads, Supplier<S> scratch, Body<S> body, Progress progress) {
        int chunks = chunks(n);
        AtomicInteger next = new AtomicInteger();
        AtomicLong done = new AtomicLong();
        AtomicReference<Throwable> failure = new AtomicReference<>();
        Runnable worker = () -> {
            S s = scratch.get();
            int c;
            while (failure.get() == null && (c = next.getAndIncrement()) < chunks) {
                if (progress.isCancelled()) {
                    failure.compareAndSet(null, new CancelledException());
                    return;
                }
                int from = c * CHUNK;
                int to = Math.min(n, from + CHUNK);
                try {
                    body.run(s, c, from, to);
                } catch (RuntimeException | Error e) {
                    failure.compareAndSet(null, e);
                    return;
                }
                progress.report(done.addAndGet(to - from), n);
            }
        };
        int t = Math.max(1, Math.min(threads, chunks));
        Thread[] pool = new Thread[t - 1];
        for (int i = 0; i < pool.length; i++) {
            pool[i] = new Thread(worker, "nearfit-knn-" + i);
            pool[i].setDaemon(true);
            pool[i].start();
        }
        worker.run();
        for (Thread th : pool) {
            try {
                th.join();
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                failure.compareAndSet(null, new CancelledException());
            }
        }
        Throwable f = failure.get();
        if (f instanceof RuntimeException) {
            throw (RuntimeException) f;
        }
        if (f instanceof Error) {
            throw (Error) f;
        }
    }
}
