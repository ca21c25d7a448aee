package nearfit.knn;

/**
 * A k-d tree (Bentley 1975; k-nearest search after Friedman, Bentley &amp; Finkel 1977) over packed
 * coordinates. The tree is implicit and balanced: node i has children 2i+1 and 2i+2, every leaf
 * sits at depth {@code depth} and holds at most {@link #LEAF_SIZE} rows. Each node splits its rows
 * at the median of its widest coordinate (selection on an int permutation) and stores its bounding
 * box, which gives an exact lower bound on the key for every metric. The coordinates are moved into tree
 * order while building, so both the build and a leaf scan read memory in sequence.
 */
public final class KdTree implements NeighborIndex {
    /** Rows per leaf at most. */
    static final int LEAF_SIZE = 16;

    private final int d;
    private final int n;
    private final Metric base;
    private final int depth;
    private final int[] start;
    private final int[] end;
    /** Per node, per dimension: min then max, interleaved so a node's box fills adjacent memory. */
    private final double[] box;
    private final double[] treeCoords;
    private final int[] treePos;

    private KdTree(int d, int n, Metric base, int depth, int[] start, int[] end, double[] box,
                   double[] treeCoords, int[] treePos) {
        this.d = d;
        this.n = n;
        this.base = base;
        this.depth = depth;
        this.start = start;
        this.end = end;
        this.box = box;
        this.treeCoords = treeCoords;
        this.treePos = treePos;
    }

    /** Builds a tree over packed coordinates (n*d), splitting the top levels over threads. */
    public static KdTree build(double[] coords, int d, Metric base, int threads) {
        int n = coords.length / d;
        int depth = 0;
        while ((n + (1 << depth) - 1) >> depth > LEAF_SIZE) {
            depth++;
        }
        int nodes = (1 << (depth + 1)) - 1;
        Builder b = new Builder(coords.clone(), d, depth, n, nodes);
        b.build(0, 0, n, 0, Math.max(1, threads));
        double[] box = new double[nodes * 2 * d];
        for (int i = 0; i < nodes * d; i++) {
            box[2 * i] = b.lo[i];
            box[2 * i + 1] = b.hi[i];
        }
        return new KdTree(d, n, base.base(), depth, b.start, b.end, box, b.rows, b.pos);
    }

    /**
     * The build state. Rows are moved physically (d doubles and a position per swap) rather than
     * through an index permutation, so every pass over a node reads memory in sequence; each
     * node's slots and row range are written by exactly one thread.
     */
    private static final class Builder {
        final double[] rows;
        final int[] pos;
        final int d;
        final int depth;
        final int[] start;
        final int[] end;
        final double[] lo;
        final double[] hi;

        Builder(double[] rows, int d, int depth, int n, int nodes) {
            this.rows = rows;
            this.d = d;
            this.depth = depth;
            this.pos = new int[n];
            for (int i = 0; i < n; i++) {
                pos[i] = i;
            }
            this.start = new int[nodes];
            this.end = new int[nodes];
            this.lo = new double[nodes * d];
            this.hi = new double[nodes * d];
        }

        void build(int node, int from, int to, int level, int threads) {
            start[node] = from;
            end[node] = to;
            box(node, from, to);
            if (level == depth) {
                return;
            }
            int dim = widest(node);
            int mid = (from + to) >>> 1;
            select(from, to, mid, dim);
            if (threads > 1 && to - from > 50_000) {
                int half = threads / 2;
                Thread t = new Thread(() -> build(2 * node + 1, from, mid, level + 1, half));
                t.start();
                build(2 * node + 2, mid, to, level + 1, threads - half);
                join(t);
            } else {
                build(2 * node + 1, from, mid, level + 1, 1);
                build(2 * node + 2, mid, to, level + 1, 1);
            }
        }

        private static void join(Thread t) {
            try {
                t.join();
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                throw new CancelledException();
            }
        }

        private void box(int node, int from, int to) {
            int o = node * d;
            for (int j = 0; j < d; j++) {
                lo[o + j] = Double.POSITIVE_INFINITY;
                hi[o + j] = Double.NEGATIVE_INFINITY;
            }
            for (int i = from; i < to; i++) {
                int p = i * d;
                for (int j = 0; j < d; j++) {
                    double v = rows[p + j];
                    if (v < lo[o + j]) {
                        lo[o + j] = v;
                    }
                    if (v > hi[o + j]) {
                        hi[o + j] = v;
                    }
                }
            }
        }

        private int widest(int node) {
            int best = 0;
            double w = -1;
            for (int j = 0; j < d; j++) {
                double s = hi[node * d + j] - lo[node * d + j];
                if (s > w) {
                    w = s;
                    best = j;
                }
            }
            return best;
        }

        /**
         * Hoare-partition quickselect (Wirth's FIND): stops on equal keys from both sides, so runs
         * of equal values still split evenly and cost linear time; swaps only misplaced rows.
         */
        private void select(int from, int to, int kth, int dim) {
            int l = from;
            int r = to - 1;
            while (l < r) {
                double a = rows[l * d + dim];
                double b = rows[((l + r) >>> 1) * d + dim];
                double c = rows[r * d + dim];
                double pivot = Math.max(Math.min(a, b), Math.min(Math.max(a, b), c));
                int i = l;
                int j = r;
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
                if (j < kth) {
                    l = i;
                }
                if (kth < i) {
                    r = j;
                }
            }
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
        out.reset(k);
        visit(0, 0, query, exclude, out);
        out.finish();
    }

    private void visit(int node, int level, double[] q, int exclude, NeighborList out) {
        if (level == depth) {
            scanLeaf(node, q, exclude, out);
            return;
        }
        int left = 2 * node + 1;
        int right = left + 1;
        double bl = boxKey(left, q);
        double br = boxKey(right, q);
        int first = bl <= br ? left : right;
        int second = bl <= br ? right : left;
        double bSecond = Math.max(bl, br);
        if (Math.min(bl, br) <= out.bound()) {
            visit(first, level + 1, q, exclude, out);
        }
        if (bSecond <= out.bound()) {
            visit(second, level + 1, q, exclude, out);
        }
    }

    /** The box bound; Euclidean written out branch-free (the same values as {@link Metric#boxKey}). */
    private double boxKey(int node, double[] q) {
        if (base != Metric.EUCLIDEAN) {
            return Metric.boxKey(base, box, node * 2 * d, q, d);
        }
        int o = node * 2 * d;
        double s = 0;
        for (int j = 0; j < d; j++) {
            double g = Math.max(0.0, Math.max(box[o + 2 * j] - q[j], q[j] - box[o + 2 * j + 1]));
            s += g * g;
        }
        return s;
    }

    private void scanLeaf(int node, double[] q, int exclude, NeighborList out) {
        int to = end[node];
        if (base == Metric.EUCLIDEAN) {
            for (int i = start[node]; i < to; i++) {
                int o = i * d;
                double key = 0;
                for (int j = 0; j < d; j++) {
                    double t = treeCoords[o + j] - q[j];
                    key += t * t;
                }
                if (key <= out.bound() && treePos[i] != exclude) {
                    out.offer(key, treePos[i]);
                }
            }
            return;
        }
        for (int i = start[node]; i < to; i++) {
            double key = Metric.key(base, treeCoords, i, q, d);
            if (key <= out.bound() && treePos[i] != exclude) {
                out.offer(key, treePos[i]);
            }
        }
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
