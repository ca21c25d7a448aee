package nearfit.plot;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

class WidthStripTest {

    @Test
    void barsFollowTheWidthAlongTheColumnsOfThePlot() {
        Scene s = Scene.builder(new double[] {0, 10}, new double[] {0, 1}).xRange(0, 10).build();
        ComposedPlot p = ScatterComposer.compose(s, 50, 12, CanvasKind.BRAILLE);
        PlotFrame f = p.frame();
        // width grows linearly from 1 at x = 0 to 4 at x = 10
        CellGrid strip = WidthStrip.render(f, 50, new double[] {0, 10}, new double[] {1, 4}, 2, CanvasKind.BRAILLE);
        int left = height(strip, f.col0());
        int right = height(strip, f.col0() + f.cols() - 1);
        assertTrue(left < right, left + " < " + right);
        assertEquals(16, right, 1); // the largest width fills both rows (16 eighths)
        assertEquals(Role.BLANK, strip.role(f.col0() - 2, 1), "nothing left of the plot but the label");
        // the label is the largest width sampled, at the last column's centre: 1 + 0.3 x
        double largest = 1 + 0.3 * f.xAtColumn(f.col0() + f.cols() - 1);
        // in the margin (col0 - 1 cells), ending one blank cell before the bars: here one digit fits
        String label = strip.rowText(0).substring(0, f.col0() - 1).strip();
        assertEquals(largest, Double.parseDouble(label), 0.5, strip.rowText(0));
        assertEquals(Role.BLANK, strip.role(f.col0() - 1, 0), "a blank cell between the label and the bars");
    }

    private static int height(CellGrid strip, int col) {
        int eighths = 0;
        for (int r = 0; r < strip.height(); r++) {
            int cp = strip.codePoint(col, r);
            if (cp >= 0x2581 && cp <= 0x2588) {
                eighths += cp - 0x2580;
            }
        }
        return eighths;
    }

    @Test
    void interpolationIsLinearAndNanOutside() {
        double[] xs = {0, 1, 3};
        double[] ys = {0, 10, 30};
        assertEquals(20, WidthStrip.interpolate(xs, ys, 2), 1e-12);
        assertTrue(Double.isNaN(WidthStrip.interpolate(xs, ys, 3.5)));
        assertTrue(Double.isNaN(WidthStrip.interpolate(xs, ys, Double.NaN)));
    }
}
