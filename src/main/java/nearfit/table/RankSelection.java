package nearfit.table;

import java.util.Arrays;

/**
 * Exact order statistics of a numeric column in linear time, without sorting and without copying the
 * column: a most-significant-digit radix selection on the values' sortable 64-bit keys, 16 bits a pass.
 *
 * <p>The first pass counts the keys' top 16 bits, so each wanted rank lies in one bucket. A bucket of at most
 * {@link #GATHER_LIMIT} values is gathered in one more pass and sorted; a larger one is split on the next 16
 * bits in a later pass; a bucket on all 64 bits is a single value. Any column takes at most five passes, and a
 * column of spread-out values two. The order is that of {@link Double#compare} (so -0.0 before 0.0), the
 * order a full sort gives, so every statistic equals what it is in the sorted column.
 */
final class RankSelection {
    /** A bucket of at most this many values is gathered and sorted rather than split again. */
    static final int GATHER_LIMIT = 1 << 15;
    private static final int DIGIT = 16;
    private static final int BUCKETS = 1 << DIGIT;

    private RankSelection() {
    }

    /**
     * Where one wanted rank stands. Invariant: the rank is the {@code within}-th smallest of the {@code size}
     * values whose top {@code bits} key bits equal {@code prefix}.
     */
    private static final class Pending {
        long prefix;
        int bits;
        long within;
        long size;
        double value = Double.NaN;
        boolean resolved;

        boolean holds(long key) {
            return bits == 0 || (key >>> (64 - bits)) == prefix;
        }

        boolean sameBucket(Pending o) {
            return bits == o.bits && prefix == o.prefix;
        }
    }

    /** The key whose unsigned order is {@link Double#compare}'s order of the values (NaN excluded). */
    static long key(double v) {
        long bits = Double.doubleToRawLongBits(v);
        return bits ^ ((bits >> 63) | Long.MIN_VALUE);
    }

    /** The value of a key; inverse of {@link #key}. */
    static double value(long key) {
        return Double.longBitsToDouble(key < 0 ? key ^ Long.MIN_VALUE : ~key);
    }

    /**
     * The values at the given ranks (0-based positions in ascending order) among the present (not NaN) values
     * of {@code column}, of which there are {@code n}.
     *
     * @param ranks ranks in [0, n), in any order, repeats allowed
     */
    static double[] select(NumericColumn column, long n, long[] ranks) {
        Pending[] pending = new Pending[ranks.length];
        for (int i = 0; i < ranks.length; i++) {
            Pending p = new Pending();
            p.within = ranks[i];
            p.size = n;
            pending[i] = p;
        }
        Pending[] split;
        while ((split = leaders(pending, true)).length > 0) {
            countAndNarrow(column, pending, split);
        }
        gather(column, pending, leaders(pending, false));
        double[] out = new double[ranks.length];
        for (int i = 0; i < ranks.length; i++) {
            out[i] = pending[i].value;
        }
        return out;
    }

    /** One unresolved rank per distinct bucket, among those to split (over the limit) or to gather. */
    private static Pending[] leaders(Pending[] pending, boolean toSplit) {
        Pending[] out = new Pending[pending.length];
        int n = 0;
        for (Pending p : pending) {
            if (p.resolved || (p.size > GATHER_LIMIT) != toSplit) {
                continue;
            }
            boolean seen = false;
            for (int i = 0; i < n && !seen; i++) {
                seen = out[i].sameBucket(p);
            }
            if (!seen) {
                out[n++] = p;
            }
        }
        return Arrays.copyOf(out, n);
    }

    /** One pass counting the next digit inside each leader's bucket, then every rank in them moves down a digit. */
    private static void countAndNarrow(NumericColumn column, Pending[] pending, Pending[] leaders) {
        int g = leaders.length;
        long[][] counts = new long[g][BUCKETS];
        for (int row = 0, rows = column.size(); row < rows; row++) {
            double v = column.asDouble(row);
            if (v != v) {
                continue;
            }
            long k = key(v);
            for (int i = 0; i < g; i++) {
                Pending l = leaders[i];
                if (l.holds(k)) {
                    counts[i][(int) ((k >>> (64 - l.bits - DIGIT)) & (BUCKETS - 1))]++;
                }
            }
        }
        for (Pending p : pending) {
            for (int i = 0; i < g; i++) {
                if (!p.resolved && p.sameBucket(leaders[i]) && p != leaders[i]) {
                    narrow(p, counts[i]);
                }
            }
        }
        for (int i = 0; i < g; i++) {
            narrow(leaders[i], counts[i]); // last: the others compare their bucket with the leader's old one
        }
    }

    private static void narrow(Pending p, long[] counts) {
        int bucket = 0;
        while (p.within >= counts[bucket]) {
            p.within -= counts[bucket++];
        }
        p.prefix = p.bits == 0 ? bucket : (p.prefix << DIGIT) | bucket;
        p.bits += DIGIT;
        p.size = counts[bucket];
        if (p.bits == 64) { // one key: the value is known
            p.value = value(p.prefix);
            p.resolved = true;
        }
    }

    /** One pass gathering each leader's bucket (at most the limit each); sorts it and reads off every rank. */
    private static void gather(NumericColumn column, Pending[] pending, Pending[] leaders) {
        int g = leaders.length;
        if (g == 0) {
            return;
        }
        double[][] held = new double[g][];
        int[] filled = new int[g];
        for (int i = 0; i < g; i++) {
            held[i] = new double[(int) leaders[i].size];
        }
        for (int row = 0, rows = column.size(); row < rows; row++) {
            double v = column.asDouble(row);
            if (v != v) {
                continue;
            }
            long k = key(v);
            for (int i = 0; i < g; i++) {
                if (leaders[i].holds(k)) {
                    held[i][filled[i]++] = v;
                }
            }
        }
        for (int i = 0; i < g; i++) {
            Arrays.sort(held[i]);
            for (Pending p : pending) {
                if (!p.resolved && p.sameBucket(leaders[i])) {
                    p.value = held[i][(int) p.within];
                    p.resolved = true;
                }
            }
        }
    }
}
