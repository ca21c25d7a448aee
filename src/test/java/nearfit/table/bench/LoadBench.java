package nearfit.table.bench;

import java.util.Arrays;

import nearfit.table.CsvLoader;
import nearfit.table.LoadOptions;
import nearfit.table.Table;

/**
 * The nearfit side of scripts/bench-load: loads one file {@code warmup + reps} times and prints the
 * median seconds of the timed repetitions, the row count and the threads used.
 *
 * <p>Usage: {@code LoadBench FILE [REPS [WARMUP [THREADS]]]}.
 */
public final class LoadBench {
    private LoadBench() {
    }

    public static void main(String[] args) {
        String file = args[0];
        int reps = args.length > 1 ? Integer.parseInt(args[1]) : 5;
        int warmup = args.length > 2 ? Integer.parseInt(args[2]) : 2;
        LoadOptions.Builder b = LoadOptions.builder();
        if (args.length > 3) {
            b.threads(Integer.parseInt(args[3]));
        }
        LoadOptions options = b.build();
        double[] secs = new double[reps];
        int rows = 0;
        for (int i = -warmup; i < reps; i++) {
            long t0 = System.nanoTime();
            Table t = CsvLoader.load(file, options);
            long t1 = System.nanoTime();
            rows = t.rowCount();
            if (i >= 0) {
                secs[i] = (t1 - t0) / 1e9;
            }
        }
        Arrays.sort(secs);
        double median = reps % 2 == 1 ? secs[reps / 2] : (secs[reps / 2 - 1] + secs[reps / 2]) / 2;
        System.out.printf("median_s=%.4f rows=%d threads=%d reps=%d%n", median, rows, options.threads(), reps);
    }
}
