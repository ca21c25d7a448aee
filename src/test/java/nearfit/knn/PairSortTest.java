package nearfit.knn;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;

import java.util.Arrays;
import java.util.Random;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;

/** The pair sort yields the lexicographic (a, b) order, whether or not a arrives ascending. */
class PairSortTest {

    /** Reference order: sort index pairs with a comparator (independent of PairSort's code). */
    private static double[][] lexicographic(double[] a, double[] b) {
        Integer[] idx = new Integer[a.length];
        for (int i = 0; i < idx.length; i++) {
            idx[i] = i;
        }
        Arrays.sort(idx, (i, j) -> a[i] != a[j] ? Double.compare(a[i], a[j]) : Double.compare(b[i], b[j]));
        double[][] out = new double[2][a.length];
        for (int i = 0; i < idx.length; i++) {
            out[0][i] = a[idx[i]];
            out[1][i] = b[idx[i]];
        }
        return out;
    }

    @Property(tries = 200)
    void sortsPairsLexicographicallyWithManyTies(@ForAll long seed, @ForAll @IntRange(min = 0, max = 400) int n,
                                                 @ForAll boolean keysArriveAscending) {
        Random r = new Random(seed);
        double[] a = new double[n];
        double[] b = new double[n];
        for (int i = 0; i < n; i++) {
            a[i] = r.nextInt(4) * 0.5; // few keys: long runs of equal a, as with rounded sensor values
            b[i] = r.nextInt(7) - 3.0;
        }
        if (keysArriveAscending) {
            Arrays.sort(a);
        }
        double[][] expected = lexicographic(a, b);
        PairSort.sort(a, b, 0, n);
        assertArrayEquals(expected[0], a);
        assertArrayEquals(expected[1], b);
    }
}
