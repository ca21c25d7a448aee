package nearfit.knn;

import java.util.Arrays;
import java.util.SplittableRandom;
import nearfit.table.NearfitException;

/**
 * Choosing k: leave-one-out (full or sampled) and k-fold cross-validation for every k from 1 to
 * kmax in one neighbour pass per evaluated row. Each row's kmax neighbours (its own position
 * excluded; duplicates of it still count) give the fits at every k through prefix sums under the
 * tie rule, exactly the fits {@link Searcher} computes with that row left out, under the settings'
 * {@link EstimateKind}: the mean from prefix sums in O(1) per k, the median from the neighbours
 * sorted by response once per row ({@link LocalEstimator#medians}; class responses vote either way). Partial sums are
 * kept per fixed chunk of rows and added in chunk order, so the table does not depend on the
 * thread count, and the canonical row order makes it independent of row order.
 */
public final class Tuning {
    /** Above this many reference rows, {@link #leaveOneOut(KnnModel, int, Progress)} samples. */
    public static final int SAMPLE_ABOVE = 200_000;
    /** The default sample size for large references. */
    public static final int DEFAULT_SAMPLE = 100_000;
    /** The default seed for sampling and folds. */
    public static final long DEFAULT_SEED = 1;

    private static final int SUMS = 4; // per k: sum e^2, sum e^4, sum |e|, sum miss

    private Tuning() {
    }

    /** Leave-one-out over all rows, or over {@link #DEFAULT_SAMPLE} seeded rows above {@link #SAMPLE_ABOVE}. */
    public static TuningTable leaveOneOut(KnnModel model, int kmax, Progress progress) {
        int n = model.data().size();
        int m = n > SAMPLE_ABOVE ? DEFAULT_SAMPLE : n;
        return leaveOneOut(model, kmax, m, DEFAULT_SEED, progress);
    }

    /**
     * Leave-one-out evaluated on m rows chosen with the seed (all rows when m &gt;= n); the
     * neighbours are still searched among all rows.
     */
    public static TuningTable leaveOneOut(KnnModel model, int kmax, int m, long seed, Progress progress) {
        int n = model.data().size();
        checkKmax(kmax, n - 1);
        int[] rows = m >= n ? allRows(n) : sample(n, m, seed);
        String method = m >= n ? "leave-one-out" : "sampled leave-one-out";
        double[] sums = evaluate(model, model.index(), model.coords(), rows, null, kmax, progress, true);
        return table(method, model.data(), rows, sums, kmax);
    }

    /** K-fold cross-validation with seeded folds; the scaling stays the one fitted on all rows. */
    public static TuningTable kFold(KnnModel model, int kmax, int folds, long seed, Progress progress) {
        int n = model.data().size();
        if (folds < 2 || folds > n) {
            throw new NearfitException("folds must be between 2 and the " + n + " rows, got " + folds);
        }
        int[] fold = new int[n];
        int[] order = sample(n, n, seed);
        for (int i = 0; i < n; i++) {
            fold[order[i]] = i % folds;
        }
        int d = model.data().dimensions();
        double[] total = new double[kmax * SUMS];
        for (int f = 0; f < folds; f++) {
            int[] train = positionsWhere(fold, f, false);
            int[] test = positionsWhere(fold, f, true);
            checkKmax(kmax, train.length);
            double[] coords = new double[train.length * d];
            for (int i = 0; i < train.length; i++) {
                System.arraycopy(model.coords(), train[i] * d, coords, i * d, d);
            }
            NeighborIndex index = NeighborIndex.build(coords, d, model.settings().metric(), model.settings().threads());
            double[] sums = evaluate(model, index, coords, test, train, kmax, progress, false);
            for (int i = 0; i < total.length; i++) {
                total[i] += sums[i];
            }
        }
        return table("k-fold", model.data(), allRows(n), total, kmax);
    }

    private static void checkKmax(int kmax, int usable) {
        if (kmax < 1 || kmax > usable) {
            throw new NearfitException("the largest k to try must be between 1 and " + usable
                    + " (the rows usable as neighbours), got " + kmax);
        }
    }

    static int[] allRows(int n) {
        int[] r = new int[n];
        for (int i = 0; i < n; i++) {
            r[i] = i;
        }
        return r;
    }

    /** m distinct positions out of n, ascending (partial Fisher-Yates with a seeded generator). */
    static int[] sample(int n, int m, long seed) {
        int[] p = allRows(n);
        SplittableRandom rnd = new SplittableRandom(seed);
        for (int i = 0; i < m; i++) {
            int j = i + rnd.nextInt(n - i);
            int t = p[i];
            p[i] = p[j];
            p[j] = t;
        }
        int[] s = Arrays.copyOf(p, m);
        if (m < n) {
            Arrays.sort(s);
        }
        return s;
    }

    private static int[] positionsWhere(int[] fold, int f, boolean in) {
        int c = 0;
        for (int v : fold) {
            c += (v == f) == in ? 1 : 0;
        }
        int[] r = new int[c];
        c = 0;
        for (int i = 0; i < fold.length; i++) {
            if ((fold[i] == f) == in) {
                r[c++] = i;
            }
        }
        return r;
    }

    /**
     * Sums over the evaluated rows, per k. {@code map} maps index positions to reference positions
     * (null: the same); {@code exclude} leaves each row's own position out.
     */
    private static double[] evaluate(KnnModel model, NeighborIndex index, double[] coords, int[] rows, int[] map,
                                     int kmax, Progress progress, boolean exclude) {
        int d = model.data().dimensions();
        int chunks = Workers.chunks(rows.length);
        int[] order = spatialOrder(model.coords(), d, rows);
        double[][] partial = new double[chunks][];
        TiedRuns runs = tiedRunsFor(model, index, map);
        Workers.run(rows.length, model.settings().threads(), () -> new RowPass(model, index, map, kmax, runs), (pass, c, from, to) -> {
            double[] sums = new double[kmax * SUMS];
            double[] q = new double[d];
            for (int r = from; r < to; r++) {
                int pos = rows[order[r]];
                System.arraycopy(model.coords(), pos * d, q, 0, d);
                pass.run(q, exclude ? pos : -1, pos, sums);
            }
            partial[c] = sums;
        }, progress);
        double[] total = new double[kmax * SUMS];
        for (double[] p : partial) {
            for (int i = 0; i < total.length; i++) {
                total[i] += p[i];
            }
        }
        return total;
    }

    /** The long tied runs of the searched index: the model's own, or those of a fold's index. */
    private static TiedRuns tiedRunsFor(KnnModel model, NeighborIndex index, int[] map) {
        if (map == null) {
            return model.tiedRuns();
        }
        if (index instanceof SortedIndex sorted && !model.data().isCategory()) {
            return TiedRuns.of(sorted.coordinates(), RowPass.gather(model.data().response(), map), sorted.metric());
        }
        return null;
    }

    /**
     * The order to evaluate rows in: Morton order of their coordinates, so consecutive rows search
     * the same part of the index while it is in cache. It depends only on the (canonical) data, so
     * the chunk sums, and the table, stay independent of row order and thread count. With one
     * input the rows, ascending positions of ascending coordinates, are in that order already.
     */
    static int[] spatialOrder(double[] coords, int d, int[] rows) {
        if (d == 1) {
            return allRows(rows.length);
        }
        double[] q = new double[rows.length * d];
        for (int i = 0; i < rows.length; i++) {
            System.arraycopy(coords, rows[i] * d, q, i * d, d);
        }
        return QueryOrder.of(q, d, rows.length);
    }

    private static TuningTable table(String method, ReferenceData data, int[] rows, double[] s, int kmax) {
        int m = rows.length;
        double[] rmse = new double[kmax];
        double[] rmseSe = new double[kmax];
        double[] mae = new double[kmax];
        double[] maeSe = new double[kmax];
        double[] press = new double[kmax];
        double[] r2 = new double[kmax];
        double[] err = new double[kmax];
        double[] errSe = new double[kmax];
        boolean category = data.isCategory();
        double tss = category ? Double.NaN : tss(data.response(), rows);
        for (int k = 0; k < kmax; k++) {
            double s2 = s[k * SUMS];
            double s4 = s[k * SUMS + 1];
            double sa = s[k * SUMS + 2];
            double miss = s[k * SUMS + 3];
            if (category) {
                double p = miss / m;
                err[k] = p;
                errSe[k] = seOfMean(miss, miss, m);
                rmse[k] = rmseSe[k] = mae[k] = maeSe[k] = press[k] = r2[k] = Double.NaN;
            } else {
                double mse = s2 / m;
                rmse[k] = Math.sqrt(mse);
                double seMse = seOfMean(s2, s4, m);
                rmseSe[k] = rmse[k] > 0 ? seMse / (2 * rmse[k]) : 0;
                mae[k] = sa / m;
                maeSe[k] = seOfMean(sa, s2, m);
                press[k] = s2;
                r2[k] = 1 - s2 / tss;
                err[k] = errSe[k] = Double.NaN;
            }
        }
        double[] crit = category ? err : rmse;
        double[] se = category ? errSe : rmseSe;
        int best = 0;
        for (int k = 1; k < kmax; k++) {
            if (crit[k] < crit[best]) {
                best = k;
            }
        }
        int oneSe = best;
        for (int k = kmax - 1; k > best; k--) {
            if (crit[k] <= crit[best] + se[best]) {
                oneSe = k;
                break;
            }
        }
        return new TuningTable(method, m, data.size(), rmse, rmseSe, mae, maeSe, press, r2, err, errSe, best + 1, oneSe + 1);
    }

    /** SE of the mean of a quantity from its sum and sum of squares over n values (sample SD). */
    private static double seOfMean(double sum, double sumSq, int n) {
        if (n < 2) {
            return Double.NaN;
        }
        double mean = sum / n;
        double var = Math.max(0, (sumSq - n * mean * mean) / (n - 1));
        return Math.sqrt(var / n);
    }

    private static double tss(double[] y, int[] rows) {
        double s = 0;
        for (int r : rows) {
            s += y[r];
        }
        double mean = s / rows.length;
        double t = 0;
        for (int r : rows) {
            t += (y[r] - mean) * (y[r] - mean);
        }
        return t;
    }

    /** One thread's state for the all-k pass over rows. */
    private static final class RowPass {
        final NeighborIndex index;
        final int[] map;
        final int kmax;
        final Weighting weighting;
        final boolean median;
        final double[] fits;
        final double[] y;
        final int[] classes;
        final double[] indexValues;
        final NeighborList list = new NeighborList();
        final LocalEstimator est;
        final double[] shares;
        final double[] nearest;
        final TiedRuns runs;

        RowPass(KnnModel model, NeighborIndex index, int[] map, int kmax, TiedRuns runs) {
            this.runs = runs;
            this.index = index;
            this.map = map;
            this.kmax = kmax;
            this.weighting = model.settings().weighting();
            this.median = model.settings().estimate() == EstimateKind.MEDIAN;
            this.fits = new double[kmax];
            this.est = new LocalEstimator(model.settings().metric());
            ReferenceData data = model.data();
            this.y = data.response();
            this.classes = data.classes();
            int c = Math.max(1, data.classCount());
            this.shares = new double[c];
            this.nearest = new double[c];
            double[] v = y != null ? y : model.classValues();
            this.indexValues = map == null ? v : gather(v, map);
        }

        static double[] gather(double[] v, int[] map) {
            double[] g = new double[map.length];
            for (int i = 0; i < map.length; i++) {
                g[i] = v[map[i]];
            }
            return g;
        }

        void run(double[] q, int exclude, int pos, double[] sums) {
            int run = runs == null ? -1 : runs.runFor(q[0], kmax, exclude);
            if (run >= 0) {
                // the run holds every counted neighbour for each k up to kmax: one fit for all k
                double e = y[pos] - (median ? runs.quantile(run, exclude, 0.5) : runs.mean(run, exclude));
                double e2 = e * e;
                for (int o = 0; o < kmax * SUMS; o += SUMS) {
                    sums[o] += e2;
                    sums[o + 1] += e2 * e2;
                    sums[o + 2] += Math.abs(e);
                }
                return;
            }
            boolean tricube = weighting == Weighting.TRICUBE;
            int available = index.size() - (exclude >= 0 ? 1 : 0);
            int want = tricube ? Math.min(kmax + 1, available) : kmax;
            index.search(q, want, exclude, list);
            int c = list.count();
            if (tricube && c < available && list.key(c - 1) <= index.metric().tieHigh(list.key(kmax - 1))) {
                index.search(q, c + 1, exclude, list);
            }
            est.load(list, indexValues);
            double truth = y != null ? y[pos] : classes[pos];
            if (median && classes == null) {
                est.medians(weighting, kmax, fits);
            }
            for (int k = 1; k <= kmax; k++) {
                int o = (k - 1) * SUMS;
                if (!median || classes != null) {
                    est.prepare(weighting, k); // the medians were weighted inside medians()
                }
                if (classes != null) {
                    int winner = est.vote(k, shares, nearest);
                    sums[o + 3] += winner == (int) truth ? 0 : 1;
                } else {
                    double e = truth - (median ? fits[k - 1] : est.fit(k));
                    double e2 = e * e;
                    sums[o] += e2;
                    sums[o + 1] += e2 * e2;
                    sums[o + 2] += Math.abs(e);
                }
            }
        }
    }
}
