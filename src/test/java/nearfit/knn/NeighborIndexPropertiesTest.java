package nearfit.knn;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import java.util.Random;
import net.jqwik.api.Example;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;

/** Every index returns exactly what the brute-force scan returns, ties included (property tests). */
class NeighborIndexPropertiesTest {

    /** Packed coordinates with values from a small set, so duplicates and tied distances abound. */
    static double[] coarseCoords(long seed, int n, int d) {
        Random r = new Random(seed);
        double[] c = new double[n * d];
        for (int i = 0; i < c.length; i++) {
            c[i] = r.nextInt(5) * 0.5;
        }
        return c;
    }

    private static void assertSameNeighbours(NeighborIndex index, NeighborIndex brute, double[] q, int k, int exclude) {
        NeighborList a = new NeighborList();
        NeighborList b = new NeighborList();
        assertSameNeighbours(index, a, brute, b, q, k, exclude);
    }

    /** Searches both indexes with their own (possibly reused) lists and compares the results. */
    private static void assertSameNeighbours(NeighborIndex index, NeighborList a, NeighborIndex brute, NeighborList b,
                                             double[] q, int k, int exclude) {
        index.search(q, k, exclude, a);
        brute.search(q, k, exclude, b);
        assertEquals(b.count(), a.count(), "count");
        assertArrayEquals(Arrays.copyOf(b.positions(), b.count()), Arrays.copyOf(a.positions(), a.count()), "positions");
        assertArrayEquals(Arrays.copyOf(b.keys(), b.count()), Arrays.copyOf(a.keys(), a.count()), "keys");
    }

    @Property(tries = 60)
    void kdTreeEqualsBruteForceWithTies(@ForAll long seed, @ForAll @IntRange(min = 2, max = 8) int d,
                                        @ForAll @IntRange(min = 1, max = 400) int n,
                                        @ForAll @IntRange(min = 1, max = 12) int k) {
        double[] c = coarseCoords(seed, n, d);
        Random r = new Random(seed + 1);
        for (Metric m : new Metric[] {Metric.EUCLIDEAN, Metric.MANHATTAN, Metric.CHEBYSHEV}) {
            KdTree tree = KdTree.build(c, d, m, 2);
            BruteForce brute = new BruteForce(c, d, m);
            for (int t = 0; t < 5; t++) {
                double[] q = new double[d];
                for (int j = 0; j < d; j++) {
                    q[j] = r.nextInt(7) * 0.5 - 0.5;
                }
                int exclude = t % 2 == 0 ? -1 : r.nextInt(n);
                int kk = Math.min(k, n - (exclude >= 0 ? 1 : 0));
                if (kk >= 1) {
                    assertSameNeighbours(tree, brute, q, kk, exclude);
                }
            }
        }
    }

    /**
     * One list reused over a walk of nearby queries, as batch queries and leave-one-out reuse it:
     * the tree's bound from the previous result must change nothing, ties and exclusions included.
     */
    @Property(tries = 25)
    void kdTreeReusingOneListOverNearbyQueriesEqualsBruteForce(@ForAll long seed,
                                                              @ForAll @IntRange(min = 2, max = 4) int d,
                                                              @ForAll @IntRange(min = 100, max = 3000) int n,
                                                              @ForAll @IntRange(min = 1, max = 60) int k) {
        double[] c = coarseCoords(seed, n, d);
        Random r = new Random(seed + 3);
        for (Metric m : new Metric[] {Metric.EUCLIDEAN, Metric.MANHATTAN, Metric.CHEBYSHEV}) {
            KdTree tree = KdTree.build(c, d, m, 2);
            BruteForce brute = new BruteForce(c, d, m);
            NeighborList a = new NeighborList();
            NeighborList b = new NeighborList();
            double[] q = new double[d];
            for (int t = 0; t < 40; t++) {
                int row = r.nextInt(n);
                boolean self = t % 3 != 0;
                for (int j = 0; j < d; j++) {
                    q[j] = self ? c[row * d + j] : q[j] + (r.nextInt(3) - 1) * 0.25;
                }
                int exclude = self ? row : -1;
                int kk = Math.min(t % 4 == 0 ? k / 2 + 1 : k, n - 1);
                assertSameNeighbours(tree, a, brute, b, q, kk, exclude);
            }
        }
    }

    /**
     * Trees large enough that the top levels split at a sampled median ({@link KdTree#EXACT_UP_TO}):
     * columns that are constant, on a decimal grid (steps of 0.1, not exact in binary, so distances
     * tie only within rounding) or coarse, over rows drawn from a small pool so whole points repeat.
     */
    @Property(tries = 25)
    void kdTreeWithSampledSplitsEqualsBruteForceOnDuplicatesConstantsAndGrids(
            @ForAll long seed, @ForAll @IntRange(min = 1, max = 5) int d,
            @ForAll @IntRange(min = 300, max = 6000) int n, @ForAll @IntRange(min = 1, max = 30) int k) {
        Random r = new Random(seed);
        int distinct = 1 + r.nextInt(Math.max(1, n / 4));
        double[] pool = new double[distinct * d];
        for (int j = 0; j < d; j++) {
            int kind = r.nextInt(3);
            for (int i = 0; i < distinct; i++) {
                pool[i * d + j] = kind == 0 ? 2.5 : kind == 1 ? r.nextInt(60) * 0.1 : r.nextInt(4);
            }
        }
        double[] c = new double[n * d];
        for (int i = 0; i < n; i++) {
            System.arraycopy(pool, r.nextInt(distinct) * d, c, i * d, d);
        }
        for (Metric m : new Metric[] {Metric.EUCLIDEAN, Metric.MANHATTAN, Metric.CHEBYSHEV}) {
            KdTree tree = KdTree.build(c, d, m, 2);
            BruteForce brute = new BruteForce(c, d, m);
            NeighborList a = new NeighborList();
            NeighborList b = new NeighborList();
            for (int t = 0; t < 12; t++) {
                int row = r.nextInt(n);
                double[] q = Arrays.copyOfRange(c, row * d, row * d + d);
                if (t % 3 == 0) {
                    q[r.nextInt(d)] += r.nextInt(5) * 0.1;
                }
                int exclude = t % 3 == 0 ? -1 : row;
                assertSameNeighbours(tree, a, brute, b, q, Math.min(k, n - 1), exclude);
            }
        }
    }

    /**
     * A root whose strided sample holds only the smallest value (every sampled row is 0, the others
     * distinct and larger): the sampled split would put 127 of 4096 rows on the left, so the build
     * falls back to the exact median and leaves stay near {@link KdTree#LEAF_SIZE} (without the
     * fallback the largest leaf holds 34). The answers equal brute force.
     */
    @Example
    void kdTreeFallsBackToTheExactMedianWhenTheSampleIsLopsided() {
        int n = 4096;
        int count = 127;
        double[] c = new double[n * 2];
        for (int i = 0; i < n; i++) {
            c[2 * i] = 1 + i;
        }
        for (int i = 0; i < count; i++) {
            c[2 * (int) ((2L * i + 1) * n / (2L * count))] = 0;
        }
        KdTree tree = KdTree.build(c, 2, Metric.EUCLIDEAN, 1);
        assertTrue(tree.largestLeaf() <= 24, "largest leaf " + tree.largestLeaf());
        BruteForce brute = new BruteForce(c, 2, Metric.EUCLIDEAN);
        for (int row = 0; row < n; row += 97) {
            assertSameNeighbours(tree, brute, Arrays.copyOfRange(c, 2 * row, 2 * row + 2), 20, row);
        }
    }

    @Property(tries = 60)
    void sortedIndexEqualsBruteForceWithTies(@ForAll long seed, @ForAll @IntRange(min = 2, max = 300) int n,
                                             @ForAll @IntRange(min = 1, max = 12) int k) {
        double[] c = coarseCoords(seed, n, 1);
        Arrays.sort(c);
        Random r = new Random(seed + 2);
        for (Metric m : new Metric[] {Metric.EUCLIDEAN, Metric.MANHATTAN, Metric.CHEBYSHEV}) {
            SortedIndex sorted = new SortedIndex(c, m);
            BruteForce brute = new BruteForce(c, 1, m);
            for (int t = 0; t < 6; t++) {
                double[] q = {r.nextInt(9) * 0.25 - 0.25};
                int exclude = t % 2 == 0 ? -1 : r.nextInt(n);
                int kk = Math.min(k, n - (exclude >= 0 ? 1 : 0));
                assertSameNeighbours(sorted, brute, q, kk, exclude);
            }
        }
    }

    @Property(tries = 30)
    void chosenIndexEqualsBruteForceForEveryMetricThroughTheModel(@ForAll long seed,
                                                                   @ForAll @IntRange(min = 1, max = 8) int d,
                                                                   @ForAll @IntRange(min = 70, max = 300) int n) {
        double[][] x = new double[d][n];
        Random r = new Random(seed);
        String[] names = new String[d];
        for (int j = 0; j < d; j++) {
            names[j] = "x" + j;
            for (int i = 0; i < n; i++) {
                x[j][i] = r.nextInt(6) + (j == 0 ? 0 : 0.001 * r.nextInt(3) * j); // independent enough for Mahalanobis
            }
        }
        double[] y = new double[n];
        for (int i = 0; i < n; i++) {
            y[i] = r.nextInt(4);
        }
        for (Metric m : Metric.values()) {
            KnnModel model = KnnModel.fit(ReferenceData.numeric(names, x, "y", y, null), KnnSettings.defaults().withK(5).withMetric(m));
            BruteForce brute = new BruteForce(model.coords(), d, m.base());
            for (int i = 0; i < 5; i++) {
                double[] q = Arrays.copyOfRange(model.coords(), i * d, i * d + d);
                assertSameNeighbours(model.index(), brute, q, 5, i);
            }
        }
    }
}
