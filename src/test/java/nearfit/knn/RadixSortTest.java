package nearfit.knn;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;

import java.util.Arrays;
import java.util.SplittableRandom;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;

/** The 32-bit radix order against a stable comparison sort by unsigned key. */
class RadixSortTest {

    @Property(tries = 60)
    void order32IsTheStableUnsignedOrderAndSortsTheKeysAlong(@ForAll long seed,
                                                             @ForAll @IntRange(min = 0, max = 50_000) int n,
                                                             @ForAll @IntRange(min = 1, max = 5000) int distinct) {
        SplittableRandom r = new SplittableRandom(seed);
        int[] key = new int[n];
        int[] values = new int[distinct];
        for (int v = 0; v < distinct; v++) {
            values[v] = r.nextInt(); // negative ints are large unsigned keys
        }
        for (int i = 0; i < n; i++) {
            key[i] = values[r.nextInt(distinct)];
        }
        Integer[] expected = new Integer[n];
        for (int i = 0; i < n; i++) {
            expected[i] = i;
        }
        int[] original = key.clone();
        Arrays.sort(expected, (a, b) -> Integer.compareUnsigned(original[a], original[b])); // stable
        int[] order = RadixSort.order32(key);
        int[] want = new int[n];
        int[] sortedKeys = new int[n];
        for (int i = 0; i < n; i++) {
            want[i] = expected[i];
            sortedKeys[i] = original[expected[i]];
        }
        assertArrayEquals(want, order);
        assertArrayEquals(sortedKeys, key);
    }
}
