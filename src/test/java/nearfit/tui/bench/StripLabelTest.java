package nearfit.tui.bench;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;

import org.junit.jupiter.api.Test;

import nearfit.plot.Axis;
import nearfit.plot.AxisKind;
import nearfit.plot.CanvasKind;
import nearfit.plot.CellGrid;
import nearfit.plot.PlotFrame;
import nearfit.tui.results.Figures;

class StripLabelTest {
    /** A plot area of 20 columns from grid column {@code col0}, x from 0 to 10. */
    private static PlotFrame frame(int col0) {
        return new PlotFrame(col0, 0, 20, 5, 2, 4, Axis.of(AxisKind.LINEAR, 0, 10, 5), Axis.of(AxisKind.LINEAR, 0, 1, 3));
    }

    private static CellGrid strip(int col0, double width, boolean time) {
        double[] xs = {0, 5, 10};
        double[] w = new double[3];
        Arrays.fill(w, width);
        return StripLabel.strip(frame(col0), col0 + 20, xs, w, time, CanvasKind.BRAILLE);
    }

    @Test
    void aLabelWiderThanTheMarginIsShortenedAndLeavesOneBlankBeforeTheBars() {
        // 0.0945 in three significant digits is six characters; a margin of six leaves room for five.
        CellGrid g = strip(6, 0.0945, false);
        String row = g.rowText(0);
        assertEquals(' ', row.charAt(5), row);
        assertEquals(0.0945, Double.parseDouble(row.substring(0, 5).strip()), 0.001, row);
        for (int c = 6; c < 26; c++) {
            assertEquals(0x2588, g.codePoint(c, 0), "a full bar at every column of a constant width: " + row);
        }
    }

    @Test
    void aLongNumberNeverRunsIntoTheBars() {
        CellGrid g = strip(6, 7_415_827, false);
        String row = g.rowText(0);
        assertEquals(' ', row.charAt(5), row);
        assertEquals(0x2588, g.codePoint(6, 0), row);
        assertTrue(row.substring(0, 5).strip().length() <= 5, row);
    }

    @Test
    void aTimeWidthIsADuration() {
        // 7 415 827 ms is 2.06 hours.
        String row = strip(8, 7_415_827, true).rowText(0);
        assertEquals("2.1 h", row.substring(0, 7).strip(), row);
        assertEquals(' ', row.charAt(7), row);
    }

    @Test
    void aNarrowMarginGetsATighterSpellingNeverACutOne() {
        assertEquals("2.4h", StripLabel.label(2.4 * 3_600_000, true, 4));
        assertEquals("2h", StripLabel.label(2.4 * 3_600_000, true, 3));
        assertEquals("26min", StripLabel.label(25.5 * 60_000, true, 5));
        assertEquals("0.4h", StripLabel.label(25.5 * 60_000, true, 4), "25.5 min in the next larger unit");
        assertEquals("7e6", StripLabel.label(7_415_827, false, 4));
        assertEquals("", StripLabel.label(7_415_827, false, 2), "no room: no label rather than a cut number");
    }

    @Test
    void durationsUseTheLargestUnitAtOrAboveOne() {
        assertEquals("45.0 s", Figures.duration(45_000));
        assertEquals("3.2 h", Figures.duration(3.2 * 3_600_000));
        assertEquals("2.1 d", Figures.duration(2.1 * 86_400_000));
        assertEquals("150 d", Figures.duration(150.0 * 86_400_000));
    }

    @Test
    void timesArePrintedAsUtcDateAndMinute() {
        // 2025-01-15T06:00:00Z is 1736920800000 ms after the epoch (ISO 8601, UTC).
        assertEquals("2025-01-15 06:00", Figures.time(1_736_920_800_000.0));
    }
}
