package nearfit.knn;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;

import java.util.Arrays;
import java.util.SplittableRandom;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;

/** The sliced sort and merge gives what one {@link Arrays#sort(long[])} gives, for any thread count. */
class ParallelSortTest {

    @Property(tries = 30)
    void equalsTheSequentialSort(@ForAll long seed, @ForAll @IntRange(min = 0, max = 400_000) int n,
                                 @ForAll @IntRange(min = 1, max = 7) int threads,
                                 @ForAll @IntRange(min = 1, max = 1000) int distinct) {
        SplittableRandom r = new SplittableRandom(seed);
        long[] a = new long[n];
        for (int i = 0; i < n; i++) {
            a[i] = r.nextInt(distinct) * (r.nextBoolean() ? Long.MAX_VALUE / distinct : -3L);
        }
        long[] expected = a.clone();
        Arrays.sort(expected);
        ParallelSort.sort(a, threads);
        assertArrayEquals(expected, a);
    }
}
