package nearfit.table;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.Arrays;
import java.util.SplittableRandom;

import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;
import org.junit.jupiter.api.Test;

/** Oracle: the same ranks read from the column sorted by {@link Arrays#sort(double[])} (Double.compare order). */
class RankSelectionTest {
    private static DecimalColumn column(double[] values) {
        DoubleChunks chunks = new DoubleChunks();
        long missing = 0;
        for (double v : values) {
            chunks.add(v);
            missing += Double.isNaN(v) ? 1 : 0;
        }
        return new DecimalColumn("x", chunks, missing, 0);
    }

    private static void assertSameAsSorting(double[] values) {
        double[] present = Arrays.stream(values).filter(v -> !Double.isNaN(v)).toArray();
        Arrays.sort(present);
        int n = present.length;
        if (n == 0) {
            return;
        }
        long[] ranks = {0, n - 1, n / 2, (n - 1) / 3, n / 100, (long) (0.99 * (n - 1)), n / 2, Math.min(n - 1, 1)};
        double[] got = RankSelection.select(column(values), n, ranks);
        for (int i = 0; i < ranks.length; i++) {
            assertEquals(Double.doubleToRawLongBits(present[(int) ranks[i]]), Double.doubleToRawLongBits(got[i]),
                    "rank " + ranks[i] + " of " + n);
        }
    }

    /** Value shapes that push buckets over the gather limit: one value, a narrow range, a few values, zeros. */
    @Property(tries = 60)
    void everyRankEqualsTheSortedColumns(@ForAll("seeds") long seed, @ForAll @IntRange(min = 1, max = 120_000) int n,
                                         @ForAll @IntRange(min = 0, max = 5) int shape) {
        SplittableRandom r = new SplittableRandom(seed);
        double[] v = new double[n];
        for (int i = 0; i < n; i++) {
            v[i] = switch (shape) {
                case 0 -> r.nextGaussian() * 1e3;
                case 1 -> 1000.0 + r.nextDouble() * 1e-9;        // one top-16-bit bucket, split again
                case 2 -> r.nextInt(5) * 0.5 - 1;                 // heavy ties
                case 3 -> r.nextBoolean() ? 0.0 : -0.0;          // signed zeros in Double.compare order
                case 4 -> r.nextInt(10) == 0 ? Double.NaN : r.nextDouble() - 0.5; // missing values
                default -> 2000.0;                                 // all one value
            };
        }
        assertSameAsSorting(v);
    }

    @net.jqwik.api.Provide
    net.jqwik.api.Arbitrary<Long> seeds() {
        return net.jqwik.api.Arbitraries.longs();
    }

    @Test
    void keysOrderValuesAsDoubleCompareAndRoundTrip() {
        double[] ordered = {Double.NEGATIVE_INFINITY, -1e308, -1.5, -Double.MIN_VALUE, -0.0, 0.0, Double.MIN_VALUE, 2.5,
            Double.MAX_VALUE, Double.POSITIVE_INFINITY};
        for (int i = 0; i + 1 < ordered.length; i++) {
            assertEquals(-1, Long.signum(Long.compareUnsigned(RankSelection.key(ordered[i]), RankSelection.key(ordered[i + 1]))),
                    ordered[i] + " before " + ordered[i + 1]);
        }
        for (double v : ordered) {
            assertEquals(Double.doubleToRawLongBits(v), Double.doubleToRawLongBits(RankSelection.value(RankSelection.key(v))));
        }
    }
}
