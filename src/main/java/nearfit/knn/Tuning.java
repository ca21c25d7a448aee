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
        double[] sums = evaluate(model, model.index(), model.coords(), rows, null, kmax, progress, true, null, null, null);
        return table(method, model.data(), rows, sums, kmax, new HeldOutScheme.LeaveOneOut(), null);
    }

    /** K-fold cross-validation with seeded folds; the scaling stays the one fitted on all rows. */
    public static TuningTable kFold(KnnModel model, int kmax, int folds, long seed, Progress progress) {
        int n = model.data().size();
        HeldOutBlocks blocks = HeldOutBlocks.of(new HeldOutScheme.Folds(Math.max(2, folds), seed), n, null, null);
        if (folds < 2) {
            throw new NearfitException("folds must be between 2 and the " + n + " rows, got " + folds);
        }
        return heldOut(model, kmax, blocks, n, seed, progress);
    }

    /**
     * Cross-validation under a held-out scheme for every k from 1 to kmax: each evaluated row is
     * predicted from the reference rows outside its own block only, one neighbour search per row
     * with the tie rule as everywhere. Scaling and whitening stay those fitted on all rows.
     * Leave-one-out goes to {@link #leaveOneOut(KnnModel, int, int, long, Progress)}. With at most
     * {@link #FEW_BLOCKS} blocks one index is built per block on the other blocks' rows; with more,
     * the model's index is searched for more neighbours than kmax until kmax rows outside the block
     * (and every row tied with the kmax-th of them) are known, which is exact: all rows at keys up to
     * the searched k-th key are in the list, and the kmax-th outside key is at most that.
     *
     * @param sample rows evaluated (all when &gt;= n; neighbours still from all rows outside the block);
     *               negative: all rows up to {@link #SAMPLE_ABOVE}, else {@link #DEFAULT_SAMPLE}
     * @param seed   the sample's seed
     */
    public static TuningTable heldOut(KnnModel model, int kmax, HeldOutBlocks blocks, int sample, long seed,
                                      Progress progress) {
        int n = model.data().size();
        if (blocks.rows() != n) {
            throw new IllegalArgumentException("blocks for " + blocks.rows() + " rows, model of " + n);
        }
        int m = sample < 0 ? (n > SAMPLE_ABOVE ? DEFAULT_SAMPLE : n) : sample;
        HeldOutScheme scheme = blocks.scheme();
        if (scheme instanceof HeldOutScheme.LeaveOneOut) {
            return leaveOneOut(model, kmax, m, seed, progress);
        }
        checkKmax(kmax, n - blocks.largest());
        int[] rows = m >= n ? allRows(n) : sample(n, m, seed);
        BlockSums bs = new BlockSums(blocks, kmax);
        double[] total;
        if (blocks.count() <= FEW_BLOCKS) {
            total = perBlockIndexes(model, kmax, blocks, rows, bs, null, progress);
        } else {
            total = evaluate(model, model.index(), model.coords(), rows, null, kmax, progress, false, blocks, bs, null);
        }
        String method = scheme.describe() + (m < n ? " on " + m + " sampled rows" : "");
        return table(method, model.data(), rows, total, kmax, scheme, bs);
    }

    /**
     * Every reference row's residual at the model's k under the scheme (response minus the fit from
     * rows outside the row's block): the basis of the reference residual scale. NaN for a category.
     */
    public static double[] heldOutResiduals(KnnModel model, HeldOutBlocks blocks, Progress progress) {
        int n = model.data().size();
        int k = model.settings().k();
        double[] res = new double[n];
        if (model.data().isCategory()) {
            java.util.Arrays.fill(res, Double.NaN);
            return res;
        }
        boolean loo = blocks.scheme() instanceof HeldOutScheme.LeaveOneOut;
        checkKmax(k, n - (loo ? 1 : blocks.largest()));
        int[] rows = allRows(n);
        if (loo) {
            evaluate(model, model.index(), model.coords(), rows, null, k, progress, true, null, null, res);
        } else if (blocks.count() <= FEW_BLOCKS) {
            perBlockIndexes(model, k, blocks, rows, null, res, progress);
        } else {
            evaluate(model, model.index(), model.coords(), rows, null, k, progress, false, blocks, null, res);
        }
        return res;
    }

    /**
     * The reference residual scale for z under the scheme: the median and 1.4826 MAD (Iglewicz &amp; Hoaglin
     * 1993) of {@link #heldOutResiduals} at the model's k, as {@link Flags} takes them from leave-one-out's.
     */
    public static ZBasis.ReferenceResiduals residualScale(KnnModel model, HeldOutBlocks blocks, Progress progress) {
        return residualScale(heldOutResiduals(model, blocks, progress));
    }

    /** The median and 1.4826 MAD (Iglewicz &amp; Hoaglin 1993) of held-out residuals, as {@link Flags} takes them. */
    public static ZBasis.ReferenceResiduals residualScale(double[] res) {
        int n = res.length;
        double median = Flags.medianOf(res, n);
        return new ZBasis.ReferenceResiduals(median, Flags.madOf(res, median, n));
    }

    /** Up to this many blocks, one index per block on the other rows; above, a filtered search of the model's index. */
    static final int FEW_BLOCKS = 32;

    /** Evaluates block by block, each on an index of the other blocks' rows; returns the summed sums. */
    private static double[] perBlockIndexes(KnnModel model, int kmax, HeldOutBlocks blocks, int[] rows,
                                            BlockSums bs, double[] residuals, Progress progress) {
        int d = model.data().dimensions();
        int n = model.data().size();
        double[] total = new double[kmax * SUMS];
        int[] blockOf = blocks.blockOf();
        for (int b = 0; b < blocks.count(); b++) {
            int[] test = rowsIn(rows, blockOf, b);
            if (test.length == 0) {
                continue;
            }
            int[] train = positionsWhere(blockOf, b, false);
            double[] coords = new double[train.length * d];
            for (int i = 0; i < train.length; i++) {
                System.arraycopy(model.coords(), train[i] * d, coords, i * d, d);
            }
            NeighborIndex index = train.length == n ? model.index()
                    : NeighborIndex.build(coords, d, model.settings().metric(), model.settings().threads());
            double[] sums = evaluate(model, index, coords, test, train, kmax, progress, false, null, bs, residuals);
            for (int i = 0; i < total.length; i++) {
                total[i] += sums[i];
            }
        }
        return total;
    }

    /** The rows (ascending) of block b among the given rows. */
    private static int[] rowsIn(int[] rows, int[] blockOf, int b) {
        int c = 0;
        for (int r : rows) {
            c += blockOf[r] == b ? 1 : 0;
        }
        int[] out = new int[c];
        c = 0;
        for (int r : rows) {
            if (blockOf[r] == b) {
                out[c++] = r;
            }
        }
        return out;
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
     * (null: the same); {@code exclude} leaves each row's own position out; {@code filter} (or null)
     * leaves the rows of each row's own block out of a search of the model's own index; {@code bs}
     * (or null) collects per-block sums; {@code residuals} (or null) receives each row's residual at
     * k = kmax, by reference position.
     */
    private static double[] evaluate(KnnModel model, NeighborIndex index, double[] coords, int[] rows, int[] map,
                                     int kmax, Progress progress, boolean exclude, HeldOutBlocks filter,
                                     BlockSums bs, double[] residuals) {
        int d = model.data().dimensions();
        int chunks = Workers.chunks(rows.length);
        int[] order = spatialOrder(model.coords(), d, rows);
        double[][] partial = new double[chunks][];
        TiedRuns runs = filter == null ? tiedRunsFor(model, index, map) : null;
        int[] blockOf = bs == null ? null : bs.blocks.blockOf();
        BlockSums.Sequence seq = bs == null ? null : bs.sequence();
        Workers.run(rows.length, model.settings().threads(), () -> new RowPass(model, index, map, kmax, runs, filter),
                (pass, c, from, to) -> {
            double[] sums = new double[kmax * SUMS];
            double[] q = new double[d];
            double[] one = bs == null ? sums : new double[kmax * SUMS];
            double[] perRow = bs == null ? null : new double[(to - from) * kmax * SUMS];
            int[] rowBlock = bs == null ? null : new int[to - from];
            for (int r = from; r < to; r++) {
                int pos = rows[order[r]];
                System.arraycopy(model.coords(), pos * d, q, 0, d);
                if (bs != null) {
                    java.util.Arrays.fill(one, 0);
                }
                pass.run(q, exclude ? pos : -1, pos, one);
                if (bs != null) {
                    for (int i = 0; i < one.length; i++) {
                        sums[i] += one[i];
                    }
                    System.arraycopy(one, 0, perRow, (r - from) * one.length, one.length);
                    rowBlock[r - from] = blockOf[pos];
                }
                if (residuals != null) {
                    residuals[pos] = pass.lastResidual;
                }
            }
            partial[c] = sums;
            if (seq != null) {
                seq.offer(c, rowBlock, perRow);
            }
        }, progress);
        double[] total = new double[kmax * SUMS];
        for (double[] p : partial) {
            for (int i = 0; i < total.length; i++) {
                total[i] += p[i];
            }
        }
        return total;
    }

    /**
     * Per-block sums of e^2, |e| and misses for every k, added in (chunk, row) order whatever thread
     * finished a chunk first, so they do not depend on the thread count.
     */
    static final class BlockSums {
        final HeldOutBlocks blocks;
        final int kmax;
        final double[] sums; // [block][k][SUMS]
        final long[] rows;

        BlockSums(HeldOutBlocks blocks, int kmax) {
            this.blocks = blocks;
            this.kmax = kmax;
            this.sums = new double[blocks.count() * kmax * SUMS];
            this.rows = new long[blocks.count()];
        }

        Sequence sequence() {
            return new Sequence();
        }

        /** One evaluation's chunks, merged in chunk order. */
        final class Sequence {
            private final java.util.Map<Integer, Object[]> pending = new java.util.HashMap<>();
            private int next;

            synchronized void offer(int chunk, int[] rowBlock, double[] perRow) {
                pending.put(chunk, new Object[] {rowBlock, perRow});
                Object[] ready;
                while ((ready = pending.remove(next)) != null) {
                    merge((int[]) ready[0], (double[]) ready[1]);
                    next++;
                }
            }

            private void merge(int[] rowBlock, double[] perRow) {
                int w = kmax * SUMS;
                for (int r = 0; r < rowBlock.length; r++) {
                    int b = rowBlock[r];
                    rows[b]++;
                    int o = b * w;
                    int p = r * w;
                    for (int i = 0; i < w; i++) {
                        sums[o + i] += perRow[p + i];
                    }
                }
            }
        }

        /** The blocked SE of the mean of quantity {@code q} (0: e^2, 2: |e|, 3: miss) at k index ki. */
        double se(int ki, int q, double mean, long total) {
            int w = kmax * SUMS;
            double acc = 0;
            int used = 0;
            for (int b = 0; b < rows.length; b++) {
                if (rows[b] > 0) {
                    double dev = sums[b * w + ki * SUMS + q] - rows[b] * mean;
                    acc += dev * dev;
                    used++;
                }
            }
            return used < 2 ? Double.NaN : Math.sqrt(used / (used - 1.0) * acc) / total;
        }

        /**
         * The blocked SE of the mean difference of quantity {@code q} between k indexes {@code ki} and {@code kj}
         * over the same blocks: the same formula as {@link #se} applied to each block's difference of sums. Blocks
         * that are hard for every k (a curtailed or iced day) add to both and cancel, so this SE is the spread of
         * the difference itself.
         */
        double pairedSe(int ki, int kj, int q, double meanDiff, long total) {
            int w = kmax * SUMS;
            double acc = 0;
            int used = 0;
            for (int b = 0; b < rows.length; b++) {
                if (rows[b] > 0) {
                    double diff = sums[b * w + ki * SUMS + q] - sums[b * w + kj * SUMS + q];
                    double dev = diff - rows[b] * meanDiff;
                    acc += dev * dev;
                    used++;
                }
            }
            return used < 2 ? Double.NaN : Math.sqrt(used / (used - 1.0) * acc) / total;
        }

        int used() {
            int used = 0;
            for (long r : rows) {
                used += r > 0 ? 1 : 0;
            }
            return used;
        }
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

    private static TuningTable table(String method, ReferenceData data, int[] rows, double[] s, int kmax,
                                     HeldOutScheme scheme, BlockSums bs) {
        boolean overBlocks = bs != null && scheme.seOverBlocks();
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
                errSe[k] = overBlocks ? bs.se(k, 3, p, m) : seOfMean(miss, miss, m);
                rmse[k] = rmseSe[k] = mae[k] = maeSe[k] = press[k] = r2[k] = Double.NaN;
            } else {
                double mse = s2 / m;
                rmse[k] = Math.sqrt(mse);
                double seMse = overBlocks ? bs.se(k, 0, mse, m) : seOfMean(s2, s4, m);
                rmseSe[k] = rmse[k] > 0 ? seMse / (2 * rmse[k]) : 0;
                mae[k] = sa / m;
                maeSe[k] = overBlocks ? bs.se(k, 2, mae[k], m) : seOfMean(sa, s2, m);
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
            if (overBlocks ? withinPairedSe(bs, s, k, best, category, m) : crit[k] <= crit[best] + se[best]) {
                oneSe = k;
                break;
            }
        }
        int blocks = bs == null ? m : bs.used();
        return new TuningTable(method, m, data.size(), rmse, rmseSe, mae, maeSe, press, r2, err, errSe, best + 1,
                oneSe + 1, scheme, blocks, overBlocks);
    }

    /**
     * The one-SE rule over blocks: k is as good as the best when its mean squared error (error rate) exceeds the
     * best's by at most one SE of that difference, taken over the same blocks ({@link BlockSums#pairedSe}). Why not
     * the best's own SE, as under leave-one-out: over blocks that SE carries the day-to-day spread that every k
     * shares (on the demo log about thirteen times the row-wise SE), and the rule then accepts every k tried.
     * Comparing each k with the best on the same blocks removes the shared part (the paired comparison of
     * cross-validated models, as in Nadeau &amp; Bengio 2003, Machine Learning 52: 239-281, cited from memory).
     */
    private static boolean withinPairedSe(BlockSums bs, double[] s, int k, int best, boolean category, int m) {
        int q = category ? 3 : 0;
        double diff = (s[k * SUMS + q] - s[best * SUMS + q]) / m;
        double se = bs.pairedSe(k, best, q, diff, m);
        return diff <= (Double.isNaN(se) ? 0 : se);
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
        /** The blocks whose own rows a search skips, or null. */
        final HeldOutBlocks filter;
        final int[] blockSize;
        final NeighborList wide;
        /** Rows of the own block met by the last filtered search: the next search asks for that many more. */
        int extra;
        /** The residual at k = kmax of the last row run (numeric responses). */
        double lastResidual = Double.NaN;

        RowPass(KnnModel model, NeighborIndex index, int[] map, int kmax, TiedRuns runs, HeldOutBlocks filter) {
            this.runs = runs;
            this.filter = filter;
            this.wide = filter == null ? null : new NeighborList();
            this.blockSize = filter == null ? null : sizes(filter);
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

        private static int[] sizes(HeldOutBlocks b) {
            int[] size = new int[b.count()];
            for (int v : b.blockOf()) {
                size[v]++;
            }
            return size;
        }

        /**
         * The neighbours of q for k among the rows outside block {@code block} of the model's own
         * index, by the tie rule over those rows: searches for k plus a guess of the own block's rows
         * among them, widening until k outside rows are found (or every row was searched), then offers
         * the outside rows in (key, position) order to {@code out}.
         */
        void searchOutside(double[] q, int k, int block, NeighborList out) {
            int n = index.size();
            int want = Math.min(n, k + extra);
            int[] blockOf = filter.blockOf();
            int outside;
            int c;
            while (true) {
                index.search(q, want, -1, wide);
                c = wide.count();
                outside = 0;
                for (int i = 0; i < c; i++) {
                    outside += blockOf[wide.position(i)] != block ? 1 : 0;
                }
                if (outside >= k || want >= n) {
                    break;
                }
                want = (int) Math.min(n, Math.max(2L * want, (long) k + 2L * (c - outside)));
            }
            extra = Math.min(blockSize[block], c - outside + 2);
            out.reset(k, index.metric());
            for (int i = 0; i < c; i++) {
                int p = wide.position(i);
                if (blockOf[p] != block) {
                    out.offer(wide.key(i), p);
                }
            }
            out.finish();
        }

        private void search(double[] q, int k, int exclude, int pos) {
            if (filter == null) {
                index.search(q, k, exclude, list);
            } else {
                searchOutside(q, k, filter.blockOf()[pos], list);
            }
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
                lastResidual = e;
                for (int o = 0; o < kmax * SUMS; o += SUMS) {
                    sums[o] += e2;
                    sums[o + 1] += e2 * e2;
                    sums[o + 2] += Math.abs(e);
                }
                return;
            }
            boolean tricube = weighting == Weighting.TRICUBE;
            int available = index.size() - (exclude >= 0 ? 1 : 0)
                    - (filter != null ? blockSize[filter.blockOf()[pos]] : 0);
            int want = tricube ? Math.min(kmax + 1, available) : kmax;
            search(q, want, exclude, pos);
            int c = list.count();
            if (tricube && c < available && list.key(c - 1) <= index.metric().tieHigh(list.key(kmax - 1))) {
                search(q, c + 1, exclude, pos);
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
                    lastResidual = e;
                    sums[o] += e2;
                    sums[o + 1] += e2 * e2;
                    sums[o + 2] += Math.abs(e);
                }
            }
        }
    }
}
