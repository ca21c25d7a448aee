package nearfit.table.bench;

import java.util.Arrays;

import nearfit.table.CsvLoader;
import nearfit.table.LoadOptions;
import nearfit.table.Table;

/**
 * The nearfit side of scripts/bench-load: loads one file {@code warmup + reps} times and prints the
 * median seconds of the timed repetitions, the row count, the threads used and the median process CPU
 * seconds per load (all threads, GC included; steadier than wall time on a busy machine).
 *
 * <p>Usage: {@code LoadBench FILE [REPS [WARMUP [THREADS]]]}.
 */
public final class LoadBench {
    private LoadBench() {
    }

    private static double median(double[] v) {
        Arrays.sort(v);
        int n = v.length;
        return n % 2 == 1 ? v[n / 2] : (v[n / 2 - 1] + v[n / 2]) / 2;
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
        double[] cpu = new double[reps];
        com.sun.management.OperatingSystemMXBean os = (com.sun.management.OperatingSystemMXBean)
                java.lang.management.ManagementFactory.getOperatingSystemMXBean();
        int rows = 0;
        for (int i = -warmup; i < reps; i++) {
            long c0 = os.getProcessCpuTime();
            long t0 = System.nanoTime();
            Table t = CsvLoader.load(file, options);
            long t1 = System.nanoTime();
            long c1 = os.getProcessCpuTime();
            rows = t.rowCount();
            if (i >= 0) {
                secs[i] = (t1 - t0) / 1e9;
                cpu[i] = (c1 - c0) / 1e9;
            }
        }
        System.out.printf("median_s=%.4f rows=%d threads=%d reps=%d cpu_s=%.4f%n", median(secs), rows,
                options.threads(), reps, median(cpu));
    }
}
