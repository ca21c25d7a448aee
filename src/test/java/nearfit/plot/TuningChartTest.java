package nearfit.plot;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

class TuningChartTest {
    private static final TuningScene SCENE = new TuningScene(
            new double[] {1, 2, 5, 10, 20, 50, 100},
            new double[] {90, 70, 60, 55, 57, 65, 80},
            new double[] {6, 5, 4, 3, 3, 4, 5},
            10, 20, "T02");

    @Test
    void theBestAndOneSeKAreMarkedAtTheirPlaces() {
        CellGrid g = TuningChart.compose(SCENE, 70, 20, CanvasKind.BRAILLE);
        int best = -1;
        int oneSe = -1;
        for (int r = 0; r < g.height(); r++) {
            for (int c = 0; c < g.width(); c++) {
                if (g.role(c, r) == Role.MARKER) {
                    if (g.codePoint(c, r) == '●') {
                        best = c;
                    } else if (g.codePoint(c, r) == '○') {
                        oneSe = c;
                    }
                }
            }
        }
        assertTrue(best > 0 && oneSe > best, "best at " + best + ", one-SE at " + oneSe);
        String text = TextRenderer.plain(g);
        assertTrue(text.contains("best k 10") && text.contains("one-SE k 20"), text);
    }

    @Test
    void aNarrowChartShortensItsAxisNameRatherThanCutTheOneSeK() {
        // 43 cells: the chart's width in the tuning panel of an 80-column window (it showed "one-SE k" alone).
        TuningScene s = new TuningScene(new double[] {1, 10, 36, 100, 200}, new double[] {90, 87, 86.4, 86.8, 87.1},
                new double[] {1, 1, 1, 1, 1}, 36, 200, "");
        String first = TextRenderer.plain(TuningChart.compose(s, 43, 18, CanvasKind.BRAILLE)).lines().findFirst()
                .orElseThrow();
        assertTrue(first.contains("best k 36") && first.contains("one-SE k 200"), first);
    }

    @Test
    void theKAxisIsLogarithmic() {
        CellGrid g = TuningChart.compose(SCENE, 70, 20, CanvasKind.ASCII);
        String axisLabels = g.rowText(g.height() - 2);
        int c1 = axisLabels.indexOf(" 1 ") + 1;
        int c10 = axisLabels.indexOf("10");
        int c100 = axisLabels.indexOf("100");
        assertTrue(c1 > 0 && c10 > c1 && c100 > c10, axisLabels);
        // equal decades take equal widths, within a cell of label centring
        assertEquals(c10 - c1, c100 + 1 - c10, 2, axisLabels);
    }

    @Test
    void errorBarsUseTheBandRole() {
        CellGrid g = TuningChart.compose(SCENE, 70, 20, CanvasKind.ASCII);
        assertTrue(g.count(Role.BAND) >= SCENE.k().length, "one bar per k at least");
        assertTrue(g.count(Role.CURVE) > 0);
    }
}
