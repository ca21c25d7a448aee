package nearfit.knn;

/**
 * A k-d tree (Bentley 1975; k-nearest search after Friedman, Bentley &amp; Finkel 1977) over packed
 * coordinates. The tree is implicit: node i has children 2i+1 and 2i+2 and every leaf sits at depth
 * {@code depth}, chosen so that exact median splits would leave at most {@link #LEAF_SIZE} rows a leaf.
 * Each node splits its rows on its cell's widest side: rows left of the split have a coordinate
 * {@code <= splitValue}, rows right {@code >=} (the one invariant the search relies on). Nodes of up
 * to {@link #EXACT_UP_TO} rows split at the exact median (selection); larger ones at the median of an
 * evenly strided sample, with one partition pass (see {@link Builder#build}), so a leaf holds
 * {@link #LEAF_SIZE} rows on average but may hold somewhat more or fewer. The coordinates are moved
 * into tree order while building, so the rows of a leaf are contiguous and a leaf scan is a linear sweep.
 *
 * <p>The search keeps, per dimension, the gap between the query and the current cell (Arya &amp;
 * Mount 1993, incremental distance): entering the far child changes one gap, so a node costs O(1)
 * plus a d-term sum. The bound is summed from the gaps in dimension order with the operations of
 * {@link Metric#key}, and each gap is at most the matching coordinate difference of every row in the
 * cell, so by monotone rounding it never exceeds the key of a row inside: pruning is exact, ties
 * included. The bound a cell is compared with is the largest key that ties the current k-th
 * ({@link NeighborList#bound()}, {@link Metric#tieHigh}), so a row that ties it only within the
 * rounding tolerance is not pruned either.
 */
public final class KdTree implements NeighborIndex {
    /** Rows per leaf with exact median splits at every level (the depth is chosen for it). */
    static final int LEAF_SIZE = 16;
    /** Nodes of at most this many rows split at the exact median; larger ones at a sampled median. */
    static final int EXACT_UP_TO = 256;

    private final int d;
    private final int n;
    private final Metric base;
    private final int depth;
    /** The node index of the first leaf: leaf node i holds rows leafStart[i - firstLeaf] until leafStart[i - firstLeaf + 1]. */
    private final int firstLeaf;
    private final int[] leafStart;
    private final int[] splitDim;
    private final double[] splitValue;
    private final double[] rootLo;
    private final double[] rootHi;
    private final double[] treeCoords;
    private final int[] treePos;

    private KdTree(int d, int n, Metric base, int depth, Builder b) {
        this.d = d;
        this.n = n;
        this.base = base;
        this.depth = depth;
        this.firstLeaf = (1 << depth) - 1;
        this.leafStart = b.leafStart;
        this.splitDim = b.splitDim;
        this.splitValue = b.splitValue;
        this.rootLo = b.rootLo;
        this.rootHi = b.rootHi;
        this.treeCoords = b.rows;
        this.treePos = b.pos;
    }

    /** Builds a tree over packed coordinates (n*d), splitting the top levels over threads. */
    public static KdTree build(double[] coords, int d, Metric base, int threads) {
        int n = coords.length / d;
        int depth = 0;
        while ((n + (1 << depth) - 1) >> depth > LEAF_SIZE) {
            depth++;
        }
        Builder b = new Builder(coords.clone(), d, depth, n);
        double[] lo = b.rootLo.clone();
        double[] hi = b.rootHi.clone();
        b.build(0, 0, n, 0, lo, hi, Math.max(1, threads));
        b.leafStart[1 << depth] = n;
        return new KdTree(d, n, base.base(), depth, b);
    }

    /**
     * The build state. Rows are moved physically (d doubles and a position per swap) rather than
     * through an index permutation, so every pass over a node reads memory in sequence; each
     * node's slots and row range are written by exactly one thread. The split dimension is the
     * widest side of the node's cell (the root's bounding box cut by the ancestors' splits), which
     * needs no pass over the rows; it affects speed only, never results.
     */
    private static final class Builder {
        final double[] rows;
        final int[] pos;
        final int d;
        final int depth;
        final int[] leafStart;
        final int[] splitDim;
        final double[] splitValue;
        final double[] rootLo;
        final double[] rootHi;

        Builder(double[] rows, int d, int depth, int n) {
            this.rows = rows;
            this.d = d;
            this.depth = depth;
            this.pos = new int[n];
            for (int i = 0; i < n; i++) {
                pos[i] = i;
            }
            int internal = (1 << depth) - 1;
            this.leafStart = new int[(1 << depth) + 1];
            this.splitDim = new int[Math.max(1, internal)];
            this.splitValue = new double[Math.max(1, internal)];
            this.rootLo = new double[d];
            this.rootHi = new double[d];
            java.util.Arrays.fill(rootLo, Double.POSITIVE_INFINITY);
            java.util.Arrays.fill(rootHi, Double.NEGATIVE_INFINITY);
            for (int i = 0; i < n; i++) {
                for (int j = 0; j < d; j++) {
                    double v = rows[i * d + j];
                    rootLo[j] = Math.min(rootLo[j], v);
                    rootHi[j] = Math.max(rootHi[j], v);
                }
            }
        }

        /**
         * Builds node's subtree over rows [from, to) in the cell [lo, hi] (arrays owned by this call).
         * Above {@link #EXACT_UP_TO} rows the split value is a sample's median and one partition pass
         * puts the rows on their sides (about one read of the node, where a quickselect needs about
         * three); if that leaves the split more than 1/8 of the node away from the middle (a sample
         * that misses a lopsided distribution), the exact median is selected instead. So each side of
         * a sampled split holds at most 5/8 of its node, and a leaf under L sampled levels at most
         * {@code LEAF_SIZE (5/4)^L} rows; the depth is fixed, so the tree never grows deeper.
         */
        void build(int node, int from, int to, int level, double[] lo, double[] hi, int threads) {
            if (level == depth) {
                leafStart[node - ((1 << depth) - 1)] = from;
                return;
            }
            int dim = 0;
            for (int j = 1; j < d; j++) {
                if (hi[j] - lo[j] > hi[dim] - lo[dim]) {
                    dim = j;
                }
            }
            int split = splitRows(node, from, to, dim, lo[dim]);
            double s = splitValue[node];
            splitDim[node] = dim;
            double[] leftHi = hi.clone();
            leftHi[dim] = s;
            double[] rightLo = lo.clone();
            rightLo[dim] = s;
            if (threads > 1 && to - from > 50_000) {
                int half = threads / 2;
                Thread t = new Thread(() -> build(2 * node + 1, from, split, level + 1, lo, leftHi, half));
                t.start();
                build(2 * node + 2, split, to, level + 1, rightLo, hi, threads - half);
                join(t);
            } else {
                build(2 * node + 1, from, split, level + 1, lo, leftHi, 1);
                build(2 * node + 2, split, to, level + 1, rightLo, hi, 1);
            }
        }

        /** Splits rows [from, to) on dim, sets the node's split value, returns where the right side starts. */
        private int splitRows(int node, int from, int to, int dim, double cellLo) {
            int mid = (from + to) >>> 1;
            if (to - from <= EXACT_UP_TO) {
                splitValue[node] = mid < to ? select(from, to, mid, dim) : cellLo;
                return mid;
            }
            double s = sampledMedian(from, to, dim);
            int split = partition(from, to, dim, s);
            if (Math.abs(split - mid) > (to - from) >>> 3) {
                s = select(from, to, mid, dim); // an unrepresentative sample: see build
                split = mid;
            }
            splitValue[node] = s;
            return split;
        }

        private static void join(Thread t) {
            try {
                t.join();
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                throw new CancelledException();
            }
        }

        /**
         * The median of an evenly strided sample of the rows [from, to) along dim: 127 rows, up to
         * 1023 for nodes above 64k rows (one in 64), so the split's rank is off by about
         * 1 / (2 sqrt(sample)) of the node (4.4 % at 127, 1.6 % at 1023). The positions depend only
         * on the range, never on threads or a seed, so the tree is the same on every run.
         */
        private double sampledMedian(int from, int to, int dim) {
            int size = to - from;
            int count = Math.min(1023, Math.max(127, size >>> 6)) | 1;
            double[] sample = new double[count];
            for (int i = 0; i < count; i++) {
                int row = from + (int) ((2L * i + 1) * size / (2L * count));
                sample[i] = rows[row * d + dim];
            }
            return WeightedQuantiles.select(sample, 0, count - 1, count >>> 1);
        }

        /**
         * One Hoare pass over [from, to) around {@code pivot}, a value some row of the range holds
         * (so the scans stop inside it). Returns p with rows [from, p) {@code <= pivot} and [p, to)
         * {@code >= pivot}: the split invariant. The scans stop on rows equal to the pivot from both
         * sides, so a run of equal values (a constant column, a coarse decimal grid) is dealt out
         * evenly and cannot put every row on one side.
         */
        private int partition(int from, int to, int dim, double pivot) {
            int i = from;
            int j = to - 1;
            while (i <= j) {
                while (rows[i * d + dim] < pivot) {
                    i++;
                }
                while (rows[j * d + dim] > pivot) {
                    j--;
                }
                if (i <= j) {
                    swap(i++, j--);
                }
            }
            return i;
        }

        /**
         * Hoare-partition quickselect (Wirth's FIND): stops on equal keys from both sides, so runs
         * of equal values still split evenly and cost linear time; swaps only misplaced rows.
         * Afterwards rows before kth are {@code <=} and rows from kth on {@code >=} the returned value.
         */
        private double select(int from, int to, int kth, int dim) {
            int l = from;
            int r = to - 1;
            while (l < r) {
                double a = rows[l * d + dim];
                double b = rows[((l + r) >>> 1) * d + dim];
                double c = rows[r * d + dim];
                double pivot = Math.max(Math.min(a, b), Math.min(Math.max(a, b), c));
                int i = partition(l, r + 1, dim, pivot);
                // rows [l, i) are <= pivot, [i, r] >= pivot; a row i - 1 equal to the pivot is in its
                // sorted place, so the left part can end before it
                int j = rows[(i - 1) * d + dim] == pivot ? i - 2 : i - 1;
                if (j < kth) {
                    l = i;
                }
                if (kth < i) {
                    r = j;
                }
            }
            return rows[kth * d + dim];
        }

        private void swap(int i, int j) {
            int a = i * d;
            int b = j * d;
            for (int k = 0; k < d; k++) {
                double t = rows[a + k];
                rows[a + k] = rows[b + k];
                rows[b + k] = t;
            }
            int t = pos[i];
            pos[i] = pos[j];
            pos[j] = t;
        }
    }

    @Override
    public void search(double[] query, int k, int exclude, NeighborList out) {
        out.reset(k, base);
        double[] gap = out.gaps(d);
        for (int j = 0; j < d; j++) {
            double q = query[j];
            gap[j] = q < rootLo[j] ? rootLo[j] - q : q > rootHi[j] ? q - rootHi[j] : 0.0;
        }
        out.limit(capFromPrevious(query, k, exclude, out));
        visit(0, 0, query, gap, exclude, out);
        out.finish(this, treePos);
    }

    /**
     * An upper bound on the k-th key from the previous search's result (consecutive queries of a
     * batch are close, so this prunes from the first node on): the largest key among k of its rows
     * other than the excluded row; +infinity when there are fewer. The row the previous search
     * excluded counts too: in leave-one-out that is the previous query's own row, and the current
     * row is usually among the previous k, so without it one row would be missing. Changes the
     * work, not the result.
     */
    private double capFromPrevious(double[] q, int k, int exclude, NeighborList out) {
        int[] slots = out.previousSlots(this);
        if (slots == null) {
            return Double.POSITIVE_INFINITY;
        }
        int m = out.previousCount();
        double cap = 0;
        int used = 0;
        for (int i = 0; i < m && used < k; i++) {
            int slot = slots[i];
            if (treePos[slot] != exclude) {
                cap = Math.max(cap, Metric.key(base, treeCoords, slot, q, d));
                used++;
            }
        }
        int previousExcluded = out.previousExcludedSlot();
        if (used < k && previousExcluded >= 0 && treePos[previousExcluded] != exclude) {
            cap = Math.max(cap, Metric.key(base, treeCoords, previousExcluded, q, d));
            used++;
        }
        return used == k ? cap : Double.POSITIVE_INFINITY;
    }

    private void visit(int node, int level, double[] q, double[] gap, int exclude, NeighborList out) {
        if (level == depth) {
            scanLeaf(node - firstLeaf, q, exclude, out);
            return;
        }
        int dim = splitDim[node];
        double diff = q[dim] - splitValue[node];
        int left = 2 * node + 1;
        visit(diff <= 0 ? left : left + 1, level + 1, q, gap, exclude, out);
        double old = gap[dim];
        double g = diff <= 0 ? splitValue[node] - q[dim] : diff;
        gap[dim] = g;
        if (cellKey(gap) <= out.bound()) {
            visit(diff <= 0 ? left + 1 : left, level + 1, q, gap, exclude, out);
        }
        gap[dim] = old;
    }
    /** The bound on the key of any row in the cell with these gaps; see the class comment. */
    private double cellKey(double[] gap) {
        double s = 0;
        if (base == Metric.EUCLIDEAN) {
            for (int j = 0; j < d; j++) {
                s += gap[j] * gap[j];
            }
        } else if (base == Metric.MANHATTAN) {
            for (int j = 0; j < d; j++) {
                s += gap[j];
            }
        } else {
            for (int j = 0; j < d; j++) {
                s = Math.max(s, gap[j]);
            }
        }
        return s;
    }

    private void scanLeaf(int leaf, double[] q, int exclude, NeighborList out) {
        int from = leafStart[leaf];
        int to = leafStart[leaf + 1];
        if (base != Metric.EUCLIDEAN) {
            for (int i = from; i < to; i++) {
                double key = Metric.key(base, treeCoords, i, q, d);
                if (key <= out.bound()) {
                    offerUnlessExcluded(key, i, exclude, out);
                }
            }
        } else if (d == 3) {
            scanLeaf3(from, to, q, exclude, out);
        } else if (d == 2) {
            scanLeaf2(from, to, q, exclude, out);
        } else {
            for (int i = from; i < to; i++) {
                int o = i * d;
                double key = 0;
                for (int j = 0; j < d; j++) {
                    double t = treeCoords[o + j] - q[j];
                    key += t * t;
                }
                if (key <= out.bound()) {
                    offerUnlessExcluded(key, i, exclude, out);
                }
            }
        }
    }

    /** Offers slot i unless it holds the excluded row, whose slot is noted for the next search's cap instead. */
    private double offerUnlessExcluded(double key, int i, int exclude, NeighborList out) {
        if (treePos[i] != exclude) {
            return out.offer(key, i);
        }
        out.noteExcludedSlot(i);
        return out.bound();
    }

    /** Euclidean in three inputs: the general loop's operations in its order, unrolled. */
    private void scanLeaf3(int from, int to, double[] q, int exclude, NeighborList out) {
        double q0 = q[0];
        double q1 = q[1];
        double q2 = q[2];
        double[] c = treeCoords;
        double bound = out.bound();
        for (int i = from; i < to; i++) {
            int o = 3 * i;
            double t0 = c[o] - q0;
            double t1 = c[o + 1] - q1;
            double t2 = c[o + 2] - q2;
            double key = t0 * t0 + t1 * t1 + t2 * t2;
            if (key <= bound) {
                bound = offerUnlessExcluded(key, i, exclude, out);
            }
        }
    }

    /** Euclidean in two inputs, as {@link #scanLeaf3}. */
    private void scanLeaf2(int from, int to, double[] q, int exclude, NeighborList out) {
        double q0 = q[0];
        double q1 = q[1];
        double[] c = treeCoords;
        double bound = out.bound();
        for (int i = from; i < to; i++) {
            int o = 2 * i;
            double t0 = c[o] - q0;
            double t1 = c[o + 1] - q1;
            double key = t0 * t0 + t1 * t1;
            if (key <= bound) {
                bound = offerUnlessExcluded(key, i, exclude, out);
            }
        }
    }

    /** The most rows any leaf holds (for tests of the split guard). */
    int largestLeaf() {
        int most = 0;
        for (int i = 0; i + 1 < leafStart.length; i++) {
            most = Math.max(most, leafStart[i + 1] - leafStart[i]);
        }
        return most;
    }

    @Override
    public int size() {
        return n;
    }

    @Override
    public int dimensions() {
        return d;
    }

    @Override
    public Metric metric() {
        return base;
    }
}
