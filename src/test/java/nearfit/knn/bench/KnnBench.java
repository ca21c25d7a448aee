package nearfit.knn.bench;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.channels.FileChannel;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.Arrays;
import java.util.SplittableRandom;
import nearfit.knn.HeldOutBlocks;
import nearfit.knn.HeldOutScheme;
import nearfit.knn.KnnCostBreakdown;
import nearfit.knn.KnnCostBreakdown.Case;
import nearfit.knn.KnnModel;
import nearfit.knn.KnnSettings;
import nearfit.knn.NeighborIndex;
import nearfit.knn.NeighborTable;
import nearfit.knn.Progress;
import nearfit.knn.ReferenceData;
import nearfit.knn.Scaling;
import nearfit.knn.Tuning;
import nearfit.knn.TuningTable;

/**
 * The nearfit side of scripts/bench-knn. {@code generate DIR [N Q]} writes the seeded data as raw
 * little-endian doubles for every side; {@code run DIR REPS [N Q LOO_N]} times each case (after
 * warm-up) and prints "case median_seconds" lines, then the check figures every side prints
 * ({@code check_*}); {@code csv DIR ROWS FILE} writes the first ROWS rows as a CSV file for the
 * whole-process mode (shortest round-trip decimals, so every parser that rounds correctly reads the
 * same doubles); {@code cost DIR REPS LOO_N} prints where one thread's time goes in the all-k
 * leave-one-out pass ({@link KnnCostBreakdown}). Not a test: run by the script only.
 */
public final class KnnBench {
    static final int K = 10;
    static final int KMAX = 50;

    private KnnBench() {
    }

    public static void main(String[] args) throws Exception {
        Path dir = Path.of(args[1]);
        switch (args[0]) {
            case "generate" -> generate(dir, intArg(args, 2, 1_000_000), intArg(args, 3, 200_000));
            case "csv" -> csv(dir, Integer.parseInt(args[2]), Path.of(args[3]));
            case "cost" -> cost(dir, Integer.parseInt(args[2]), Integer.parseInt(args[3]));
            case "blocked" -> blocked(dir, Integer.parseInt(args[2]), Integer.parseInt(args[3]),
                    Integer.parseInt(args[4]), Integer.parseInt(args[5]));
            default -> run(dir, Integer.parseInt(args[2]), intArg(args, 3, 1_000_000), intArg(args, 4, 200_000),
                    intArg(args, 5, 200_000));
        }
    }

    private static int intArg(String[] args, int i, int fallback) {
        return args.length > i ? Integer.parseInt(args[i]) : fallback;
    }

    /** The first {@code rows} rows: three inputs and the response, as CSV with a header. */
    static void csv(Path dir, int rows, Path out) throws IOException {
        double[] x3 = read(dir.resolve("x3.bin"));
        double[] y = read(dir.resolve("y.bin"));
        StringBuilder b = new StringBuilder(rows * 80);
        b.append("wind_ms,air_density,yaw_deg,power_kw\n");
        for (int i = 0; i < rows; i++) {
            b.append(x3[3 * i]).append(',').append(x3[3 * i + 1]).append(',').append(x3[3 * i + 2]).append(',')
                    .append(y[i]).append('\n');
        }
        java.nio.file.Files.writeString(out, b);
    }

    /** A wind-site flavoured sample: wind speed, air density, yaw error; power with noise. */
    static void generate(Path dir, int rows, int queryCount) throws IOException {
        SplittableRandom r = new SplittableRandom(20261201);
        double[] x3 = new double[rows * 3];
        double[] y = new double[rows];
        for (int i = 0; i < rows; i++) {
            double ws = 12 * Math.pow(-Math.log(1 - r.nextDouble()), 1 / 2.0); // Weibull(k=2)
            double rho = 1.225 + 0.05 * gauss(r);
            double yaw = 8 * gauss(r);
            x3[3 * i] = ws;
            x3[3 * i + 1] = rho;
            x3[3 * i + 2] = yaw;
            double p = Math.min(3000, 0.5 * rho * 5000 * Math.pow(Math.min(ws, 13), 3) / 1000 * Math.cos(Math.toRadians(yaw)));
            y[i] = p + 40 * gauss(r);
        }
        double[] q3 = new double[queryCount * 3];
        for (int i = 0; i < queryCount; i++) {
            q3[3 * i] = 25 * r.nextDouble();
            q3[3 * i + 1] = 1.225 + 0.05 * gauss(r);
            q3[3 * i + 2] = 8 * gauss(r);
        }
        write(dir.resolve("x3.bin"), x3);
        write(dir.resolve("y.bin"), y);
        write(dir.resolve("q3.bin"), q3);
    }

    private static double gauss(SplittableRandom r) {
        return Math.sqrt(-2 * Math.log(1 - r.nextDouble())) * Math.cos(2 * Math.PI * r.nextDouble());
    }

    static void write(Path p, double[] v) throws IOException {
        ByteBuffer b = ByteBuffer.allocate(v.length * 8).order(ByteOrder.LITTLE_ENDIAN);
        b.asDoubleBuffer().put(v);
        try (FileChannel c = FileChannel.open(p, StandardOpenOption.CREATE, StandardOpenOption.WRITE, StandardOpenOption.TRUNCATE_EXISTING)) {
            c.write(b);
        }
    }

    static double[] read(Path p) throws IOException {
        try (FileChannel c = FileChannel.open(p)) {
            ByteBuffer b = ByteBuffer.allocate((int) c.size()).order(ByteOrder.LITTLE_ENDIAN);
            while (b.hasRemaining() && c.read(b) >= 0) {
                // read all
            }
            b.flip();
            double[] v = new double[b.remaining() / 8];
            b.asDoubleBuffer().get(v);
            return v;
        }
    }

    static double[][] columns(double[] packed, int d, int n) {
        double[][] c = new double[d][n];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < d; j++) {
                c[j][i] = packed[i * d + j];
            }
        }
        return c;
    }

    static void time(String name, int reps, Case c) throws Exception {
        double sink = c.run(); // warm-up
        sink += c.run();
        double[] t = new double[reps];
        for (int i = 0; i < reps; i++) {
            long t0 = System.nanoTime();
            sink += c.run();
            t[i] = (System.nanoTime() - t0) / 1e9;
        }
        Arrays.sort(t);
        System.out.printf("%s %.4f%n", name, t[reps / 2]);
        if (sink == 42.4242) {
            System.out.println("unlikely");
        }
    }

    static void run(Path dir, int reps, int rows, int queryCount, int looRows) throws Exception {
        double[] x3 = read(dir.resolve("x3.bin"));
        double[] y = read(dir.resolve("y.bin"));
        double[] q3 = read(dir.resolve("q3.bin"));
        double[][] c3 = columns(x3, 3, rows);
        double[][] c1 = {c3[0]};
        double[][] qc3 = columns(q3, 3, queryCount);
        double[][] qc1 = {qc3[0]};
        int threads = Runtime.getRuntime().availableProcessors();
        KnnSettings s = KnnSettings.defaults().withK(K).withScaling(Scaling.Z).withThreads(threads);
        String[] n1 = {"wind_speed"};
        String[] n3 = {"wind_speed", "air_density", "yaw_error"};

        KnnModel m1 = KnnModel.fit(ReferenceData.numeric(n1, c1, "power_kw", y, null), s);
        KnnModel m3 = KnnModel.fit(ReferenceData.numeric(n3, c3, "power_kw", y, null), s);
        time("fit_1d", reps, () -> KnnModel.fit(ReferenceData.numeric(n1, c1, "power_kw", y, null), s).index().size());
        time("fit_3d", reps, () -> KnnModel.fit(ReferenceData.numeric(n3, c3, "power_kw", y, null), s).index().size());
        double[] packed3 = packed(m3);
        time("index_3d", reps, () -> NeighborIndex.build(packed3, 3, s.metric(), threads).size());
        time("query_1d", reps, () -> queries(m1, qc1, threads));
        time("query_3d", reps, () -> queries(m3, qc3, threads));
        double[][] l3 = new double[3][];
        for (int j = 0; j < 3; j++) {
            l3[j] = Arrays.copyOf(c3[j], looRows);
        }
        KnnModel loo = KnnModel.fit(ReferenceData.numeric(n3, l3, "power_kw", Arrays.copyOf(y, looRows), null), s);
        time("loo_allk_3d", reps, () -> {
            TuningTable t = Tuning.leaveOneOut(loo, KMAX, looRows, 1, Progress.NONE);
            return t.rmse()[KMAX - 1];
        });
        TuningTable t = Tuning.leaveOneOut(loo, KMAX, looRows, 1, Progress.NONE);
        double[] rmse = t.rmse();
        int best = 0;
        for (int k = 1; k < KMAX; k++) {
            if (rmse[k] < rmse[best]) {
                best = k; // the first (smallest) k on an exact tie, as every side takes it
            }
        }
        System.out.printf("check_loo_rmse_k10 %.9f%n", rmse[9]);
        System.out.printf("check_best_k %d%n", best + 1);
        NeighborTable q = m3.neighborsAll(qc3, Progress.NONE);
        double kdist = 0;
        for (int i = 0; i < queryCount; i++) {
            kdist += q.distances()[i * K + K - 1];
        }
        System.out.printf("check_query_3d_kdist %.9f%n", kdist / queryCount);
    }

    /** The first {@code looRows} rows, fitted on one thread: build, searches, loads and the whole pass timed apart. */
    static void cost(Path dir, int reps, int looRows) throws Exception {
        double[] x3 = read(dir.resolve("x3.bin"));
        double[] y = read(dir.resolve("y.bin"));
        double[][] l3 = columns(x3, 3, looRows);
        KnnSettings s = KnnSettings.defaults().withK(K).withScaling(Scaling.Z).withThreads(1);
        KnnModel m = KnnModel.fit(ReferenceData.numeric(new String[] {"wind_speed", "air_density", "yaw_error"}, l3,
                "power_kw", Arrays.copyOf(y, looRows), null), s);
        KnnCostBreakdown.print(m, KMAX, reps, KnnBench::time);
    }

    /**
     * Blocked cross-validation against leave-one-out in the same process: the first {@code looRows} rows of
     * x3.bin, blocks of {@code block} consecutive rows (by row index, as the peers split them), every k up to
     * KMAX; prints both medians and the blocked check figures (RMSE at k = 10, best k).
     */
    static void blocked(Path dir, int reps, int rows, int looRows, int block) throws Exception {
        double[] x3 = read(dir.resolve("x3.bin"));
        double[] y = read(dir.resolve("y.bin"));
        double[][] c3 = columns(x3, 3, rows);
        double[][] l3 = new double[3][];
        for (int j = 0; j < 3; j++) {
            l3[j] = Arrays.copyOf(c3[j], looRows);
        }
        int threads = Runtime.getRuntime().availableProcessors();
        KnnSettings s = KnnSettings.defaults().withK(K).withScaling(Scaling.Z).withThreads(threads);
        KnnModel m = KnnModel.fit(ReferenceData.numeric(new String[] {"wind_speed", "air_density", "yaw_error"}, l3,
                "power_kw", Arrays.copyOf(y, looRows), null), s);
        int[] ids = m.data().rowIds();
        int[] g = new int[looRows];
        for (int i = 0; i < looRows; i++) {
            g[i] = ids[i] / block;
        }
        HeldOutBlocks blocks = HeldOutBlocks.of(new HeldOutScheme.ByGroup(), looRows, g, null);
        for (int round = 0; round < 2; round++) { // alternate the two cases so both see the same load
            time("loo_allk_3d", reps, () -> Tuning.leaveOneOut(m, KMAX, looRows, 1, Progress.NONE).rmse()[KMAX - 1]);
            time("blocked_allk_3d", reps,
                    () -> Tuning.heldOut(m, KMAX, blocks, looRows, 1, Progress.NONE).rmse()[KMAX - 1]);
        }
        TuningTable t = Tuning.heldOut(m, KMAX, blocks, looRows, 1, Progress.NONE);
        int best = 0;
        for (int k = 1; k < KMAX; k++) {
            if (t.rmse()[k] < t.rmse()[best]) {
                best = k;
            }
        }
        System.out.printf("check_blocked_rmse_k10 %.9f%n", t.rmse()[9]);
        System.out.printf("check_blocked_best_k %d%n", best + 1);
        System.out.printf("blocks %d%n", t.blocks());
    }

    /** The scaled coordinates of the model, packed (through the public transform). */
    static double[] packed(KnnModel m) {
        return m.transform().pack(m.data());
    }

    /** k = 10 neighbours (rows and distances) for every query, on all threads. */
    static double queries(KnnModel m, double[][] q, int threads) {
        NeighborTable t = m.neighborsAll(q, Progress.NONE);
        return t.distances()[t.distances().length - 1] + t.rowIds()[0];
    }
}
