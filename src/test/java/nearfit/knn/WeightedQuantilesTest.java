package nearfit.knn;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.Arrays;
import java.util.Random;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;
import org.junit.jupiter.api.Test;

/** The selection median against the sort-based definition 7 (numpy.median's rule). */
class QuantilesTest {

    @Property(tries = 200)
    void selectionMedianEqualsTheSortedMedian(@ForAll long seed, @ForAll @IntRange(min = 1, max = 3000) int n,
                                              @ForAll @IntRange(min = 1, max = 50) int distinct) {
        Random r = new Random(seed);
        double[] a = new double[n];
        for (int i = 0; i < n; i++) {
            a[i] = r.nextInt(distinct) - distinct / 2.0 + (r.nextInt(4) == 0 ? r.nextGaussian() : 0);
        }
        double[] sorted = a.clone();
        Arrays.sort(sorted);
        assertEquals(WeightedQuantiles.sortedQuantile(sorted, n, 0.5), WeightedQuantiles.median(a.clone(), n));
    }

    @Test
    void evenCountTakesTheMidpointOfTheTwoMiddleValues() {
        // numpy.median([4, 1, 3, 2]) = 2.5 (from memory of numpy's definition: mean of the middle two)
        assertEquals(2.5, WeightedQuantiles.median(new double[] {4, 1, 3, 2}, 4));
        assertEquals(7.0, WeightedQuantiles.median(new double[] {7}, 1));
    }
}
