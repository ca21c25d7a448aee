package nearfit.knn;

import java.util.Arrays;

/**
 * Sorts a long array on several threads: equal slices sorted at once by the JDK's sort, then
 * merged pairwise. The JDK's own parallel sort runs on one thread when the common pool has a
 * parallelism of 1, which it has on a two-core machine. The result is the sorted array, so it does
 * not depend on the thread count.
 */
final class ParallelSort {
    /** Below this many values one thread sorts: a thread costs more than it saves. */
    private static final int MIN_PARALLEL = 1 << 16;

    private ParallelSort() {
    }

    /** Sorts {@code a} ascending (signed order) on up to {@code threads} threads. */
    static void sort(long[] a, int threads) {
        int n = a.length;
        int slices = Math.max(1, Math.min(Integer.highestOneBit(Math.max(1, threads)), n / MIN_PARALLEL));
        if (slices == 1) {
            Arrays.sort(a);
            return;
        }
        int[] bound = new int[slices + 1];
        for (int s = 0; s <= slices; s++) {
            bound[s] = (int) ((long) n * s / slices);
        }
        Thread[] pool = new Thread[slices - 1];
        for (int s = 1; s < slices; s++) {
            int from = bound[s];
            int to = bound[s + 1];
            pool[s - 1] = new Thread(() -> Arrays.sort(a, from, to), "nearfit-sort-" + s);
            pool[s - 1].start();
        }
        Arrays.sort(a, 0, bound[1]);
        join(pool);
        long[] buffer = new long[n];
        long[] src = a;
        long[] dst = buffer;
        for (int width = 1; width < slices; width *= 2) {
            for (int s = 0; s < slices; s += 2 * width) {
                int lo = bound[s];
                int mid = bound[Math.min(s + width, slices)];
                int hi = bound[Math.min(s + 2 * width, slices)];
                merge(src, lo, mid, hi, dst);
            }
            long[] t = src;
            src = dst;
            dst = t;
        }
        if (src != a) {
            System.arraycopy(src, 0, a, 0, n);
        }
    }

    private static void merge(long[] src, int lo, int mid, int hi, long[] dst) {
        int i = lo;
        int j = mid;
        int o = lo;
        while (i < mid && j < hi) {
            dst[o++] = src[i] <= src[j] ? src[i++] : src[j++];
        }
        System.arraycopy(src, i, dst, o, mid - i);
        System.arraycopy(src, j, dst, o + mid - i, hi - j);
    }

    private static void join(Thread[] pool) {
        for (Thread t : pool) {
            boolean interrupted = false;
            while (true) {
                try {
                    t.join();
                    break;
                } catch (InterruptedException e) {
                    interrupted = true; // the slice must finish before the array is read
                }
            }
            if (interrupted) {
                Thread.currentThread().interrupt();
            }
        }
    }
}
