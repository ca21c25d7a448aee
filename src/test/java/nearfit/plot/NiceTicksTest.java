package nearfit.plot;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.DoubleRange;
import net.jqwik.api.constraints.IntRange;
import net.jqwik.api.constraints.Scale;
import org.junit.jupiter.api.Test;

/**
 * Worked examples computed by hand from the nice-numbers method of Heckbert, "Nice Numbers for
 * Graph Labels", Graphics Gems (1990), as remembered: range = nicenum(max − min, false),
 * d = nicenum(range / (nticks − 1), true), graphmin = floor(min / d)·d, graphmax = ceil(max / d)·d,
 * nfrac = max(−floor(log10 d), 0).
 */
class NiceTicksTest {

    @Test
    void nicenumRoundsToOneTwoFiveOrTen() {
        // round: f < 1.5 -> 1, < 3 -> 2, < 7 -> 5, else 10
        assertEquals(100, NiceTicks.niceNumber(125, true));
        assertEquals(0.2, NiceTicks.niceNumber(0.25, true));
        assertEquals(50, NiceTicks.niceNumber(69, true));
        assertEquals(1000, NiceTicks.niceNumber(700, true));
        // ceiling: f <= 1 -> 1, <= 2 -> 2, <= 5 -> 5, else 10
        assertEquals(500, NiceTicks.niceNumber(438, false));
        assertEquals(1, NiceTicks.niceNumber(1, false));
        assertEquals(10, NiceTicks.niceNumber(5.1, false));
    }

    @Test
    void zeroToOneWithFiveTicksStepsByTwoTenths() {
        // range = nicenum(1) = 1; d = nicenum(0.25, round) = 0.2; 0 .. 1; nfrac = 1
        NiceTicks t = NiceTicks.loose(0, 1, 5);
        assertEquals(0.2, t.step());
        assertArrayEquals(new double[] {0, 0.2, 0.4, 0.6, 0.8, 1.0}, t.ticks().values());
        assertArrayEquals(new String[] {"0", "0.2", "0.4", "0.6", "0.8", "1.0"}, t.ticks().labels());
        assertEquals(1, t.fractionDigits());
    }

    @Test
    void from105To543StepsByAHundred() {
        // range = nicenum(438) = 500; d = nicenum(125, round) = 100; graphmin 100, graphmax 600; nfrac 0
        NiceTicks t = NiceTicks.loose(105, 543, 5);
        assertEquals(100, t.graphMin());
        assertEquals(600, t.graphMax());
        assertArrayEquals(new String[] {"100", "200", "300", "400", "500", "600"}, t.ticks().labels());
        assertEquals(0, t.fractionDigits());
    }

    @Test
    void aNegativeRangeEndsAtZeroWithoutMinusZero() {
        // -3.7..-0.2: range = nicenum(3.5) = 5; d = nicenum(1.25, round) = 1; floor(-3.7) = -4, ceil(-0.2) = -0
        NiceTicks t = NiceTicks.loose(-3.7, -0.2, 5);
        assertArrayEquals(new String[] {"-4", "-3", "-2", "-1", "0"}, t.ticks().labels());
    }

    @Test
    void aRangeAcrossZeroStepsByFive() {
        // -12..17: range = nicenum(29) = 50; d = nicenum(12.5, round) = 10; -20 .. 20
        NiceTicks t = NiceTicks.loose(-12, 17, 5);
        assertArrayEquals(new double[] {-20, -10, 0, 10, 20}, t.ticks().values());
    }

    @Test
    void aTinyRangeGetsTinyStepsAndCompactLabels() {
        // 0..1e-6: range = 1e-6; d = nicenum(2.5e-7, round) = 2e-7; 0 .. 1e-6 in 6 ticks; nfrac = 7
        NiceTicks t = NiceTicks.loose(0, 1e-6, 5);
        assertEquals(2e-7, t.step());
        assertEquals(6, t.size());
        assertEquals(1e-6, t.graphMax());
        assertEquals(7, t.fractionDigits());
        assertArrayEquals(new String[] {"0", "2e-7", "4e-7", "6e-7", "8e-7", "1e-6"}, t.ticks().labels());
    }

    @Test
    void tickValuesAreTheNearestDoublesToTheirDecimals() {
        NiceTicks t = NiceTicks.loose(0, 1, 11); // d = nicenum(0.1, round) = 0.1
        assertEquals(0.3, t.value(3));
        assertEquals("0.3", t.ticks().labels()[3]);
        assertEquals(0.7, t.value(7));
    }

    @Test
    void aZeroWidthRangeIsWidenedInsteadOfDividingByZero() {
        NiceTicks t = NiceTicks.loose(50, 50, 5); // widened to 45..55: range 10, d = nicenum(2.5) = 2
        assertEquals(2, t.step());
        assertEquals(44, t.graphMin());
        assertEquals(56, t.graphMax());
        NiceTicks zero = NiceTicks.loose(0, 0, 5); // -1..1: range 2, d = nicenum(0.5) = 0.5
        assertEquals(0.5, zero.step());
    }

    @Test
    void largeNumbersAreLabelledWithoutFractionDigits() {
        NiceTicks t = NiceTicks.loose(1200, 4800, 5); // range 5000, d = 1000
        assertArrayEquals(new String[] {"1000", "2000", "3000", "4000", "5000"}, t.ticks().labels());
        assertEquals("1.5e9", NiceTicks.label(1.5e9, 0));
    }

    @Property(tries = 300)
    void ticksEncloseTheRangeAtOneTwoOrFiveStep(@ForAll @DoubleRange(min = -1e6, max = 1e6) @Scale(4) double a,
                                                @ForAll @DoubleRange(min = 1e-3, max = 1e6) @Scale(4) double span,
                                                @ForAll @IntRange(min = 2, max = 12) int count) {
        NiceTicks t = NiceTicks.loose(a, a + span, count);
        double tol = 1e-6 * t.step(); // the ends snap to a tick within rounding error, by design
        assertTrue(t.graphMin() <= a + tol && t.graphMax() >= a + span - tol, "ticks " + t.graphMin() + ".." + t.graphMax() + " enclose the data");
        double m = t.step() / Math.pow(10, Math.floor(Math.log10(t.step()) + 1e-12));
        assertTrue(Math.abs(m - 1) < 1e-9 || Math.abs(m - 2) < 1e-9 || Math.abs(m - 5) < 1e-9, "mantissa " + m);
        assertTrue(t.size() <= 2 * count + 3, "about count ticks, got " + t.size());
    }
}
