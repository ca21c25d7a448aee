package nearfit.knn;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.Arrays;
import java.util.Random;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;

/**
 * The sorted index on heavily tied inputs (long runs of one value, as a sensor's rounding makes)
 * returns exactly what the brute-force scan returns, in the same (key, position) order, with the
 * excluded row anywhere in or next to a run.
 */
class SortedIndexTiesTest {

    @Property(tries = 80)
    void longTiedRunsMatchBruteForceWithEveryExclusion(@ForAll long seed,
                                                       @ForAll @IntRange(min = 2, max = 400) int n,
                                                       @ForAll @IntRange(min = 1, max = 40) int k) {
        Random r = new Random(seed);
        double[] c = new double[n];
        for (int i = 0; i < n; i++) {
            c[i] = r.nextInt(3) * 0.01; // three values, 0.01 apart: runs of ~n/3 rows
        }
        Arrays.sort(c);
        for (Metric m : new Metric[] {Metric.EUCLIDEAN, Metric.MANHATTAN}) {
            SortedIndex sorted = new SortedIndex(c, m);
            BruteForce brute = new BruteForce(c, 1, m);
            NeighborList a = new NeighborList();
            NeighborList b = new NeighborList();
            for (int t = 0; t < 8; t++) {
                double[] q = {t < 6 ? c[r.nextInt(n)] : 0.005 * (t - 6) + 0.005}; // on a run, or midway
                int exclude = t % 2 == 0 ? -1 : edgeOfRun(c, r.nextInt(n), r.nextBoolean());
                int kk = Math.min(k, n - (exclude >= 0 ? 1 : 0));
                sorted.search(q, kk, exclude, a);
                brute.search(q, kk, exclude, b);
                assertEquals(b.count(), a.count(), "count");
                assertArrayEquals(Arrays.copyOf(b.positions(), b.count()), Arrays.copyOf(a.positions(), a.count()));
                assertArrayEquals(Arrays.copyOf(b.keys(), b.count()), Arrays.copyOf(a.keys(), a.count()));
            }
        }
    }

    /** The first or last position of the run holding position i (the block walk's edge cases). */
    private static int edgeOfRun(double[] c, int i, boolean first) {
        int p = i;
        if (first) {
            while (p > 0 && c[p - 1] == c[i]) {
                p--;
            }
        } else {
            while (p < c.length - 1 && c[p + 1] == c[i]) {
                p++;
            }
        }
        return p;
    }
}
