package nearfit.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;

import java.util.Arrays;
import java.util.Comparator;

import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;
import net.jqwik.api.constraints.Size;

class WorstRowsTest {
    /** The kept rows are the first rows of a stable sort by descending score. */
    @Property(tries = 200)
    void keepsTheLargestScoresLikeAStableSort(@ForAll @Size(max = 60) double[] scores,
                                              @ForAll @IntRange(min = 0, max = 8) int capacity) {
        WorstRows<Integer> w = new WorstRows<>(capacity);
        for (int i = 0; i < scores.length; i++) {
            w.offer(i, Math.abs(scores[i]));
        }
        Integer[] order = new Integer[scores.length];
        for (int i = 0; i < order.length; i++) {
            order[i] = i;
        }
        Arrays.sort(order, Comparator.comparingDouble((Integer i) -> -Math.abs(scores[i])));
        int[] expected = new int[Math.min(capacity, scores.length)];
        for (int i = 0; i < expected.length; i++) {
            expected[i] = order[i];
        }
        assertArrayEquals(expected, w.largestFirst().stream().mapToInt(Integer::intValue).toArray());
    }
}
