package nearfit.tui.keys;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;

class KLadderTest {
    @Test
    void plusWalksTheProjectsLadder() {
        // The ladder as the issue lists it: 1 2 3 5 7 10 15 20 30 50 70 100 150 200 300 500 700 1000 ...
        int[] expected = {1, 2, 3, 5, 7, 10, 15, 20, 30, 50, 70, 100, 150, 200, 300, 500, 700, 1000, 1500};
        int k = 1;
        for (int i = 1; i < expected.length; i++) {
            k = KLadder.up(k, 1_000_000);
            assertEquals(expected[i], k);
        }
    }

    @Test
    void aKBetweenStepsMovesToTheNeighbouringStep() {
        assertEquals(30, KLadder.up(25, 1000));
        assertEquals(20, KLadder.down(25));
        assertEquals(1, KLadder.down(1));
    }

    @Test
    void upStopsAtTheLargestUsableK() {
        assertEquals(40, KLadder.up(30, 40));
    }

    @Property(tries = 300)
    void upThenDownNeverLeavesTheLadderOrder(@ForAll @IntRange(min = 1, max = 5_000_000) int k) {
        int up = KLadder.up(k, Integer.MAX_VALUE);
        int down = KLadder.down(k);
        assertTrue(up > k, "up from " + k);
        assertTrue(down < k || k == 1, "down from " + k);
        assertTrue(KLadder.down(up) >= k || KLadder.down(up) >= down, "down from up stays at or above k's step");
    }
}
