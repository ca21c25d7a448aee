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
    void theStandardErrorBandUsesTheBandRoleUnderTheCurve() {
        CellGrid g = TuningChart.compose(SCENE, 70, 20, CanvasKind.ASCII);
        assertTrue(g.count(Role.BAND) >= SCENE.k().length, "band cells");
        assertTrue(g.count(Role.CURVE) > 0);
    }

    /** The demo log's shape: RMSE differences between k of a few units, standard errors of hundreds. */
    private static TuningScene withSe(double se) {
        double[] k = {1, 2, 3, 5, 8, 13, 20, 30, 50};
        double[] rmse = {97, 91, 88.5, 87, 86.4, 86.6, 87.2, 88, 89.5};
        double[] s = new double[k.length];
        java.util.Arrays.fill(s, se);
        return new TuningScene(k, rmse, s, 8, 50, "");
    }

    private static java.util.Set<Integer> cellsOf(CellGrid g, Role role) {
        java.util.Set<Integer> cells = new java.util.HashSet<>();
        for (int r = 0; r < g.height(); r++) {
            for (int c = 0; c < g.width(); c++) {
                if (g.role(c, r) == role) {
                    cells.add(r * g.width() + c);
                }
            }
        }
        return cells;
    }

    private static int rowsHolding(CellGrid g, Role role) {
        int rows = 0;
        for (int r = 0; r < g.height(); r++) {
            for (int c = 0; c < g.width(); c++) {
                if (g.role(c, r) == role) {
                    rows++;
                    break;
                }
            }
        }
        return rows;
    }

    @Test
    void theCurveKeepsItsCellsWhateverTheStandardErrors() {
        for (CanvasKind kind : CanvasKind.values()) {
            CellGrid none = TuningChart.compose(withSe(0), 60, 20, kind);
            CellGrid huge = TuningChart.compose(withSe(1e6), 60, 20, kind);
            java.util.Set<Integer> curve = cellsOf(none, Role.CURVE);
            assertTrue(curve.size() > 20, kind + ": " + curve.size() + " curve cells");
            assertEquals(curve, cellsOf(huge, Role.CURVE), kind + ": SE of 1e6 moved or hid the curve\n"
                    + TextRenderer.plain(huge));
        }
    }

    @Test
    void withHugeStandardErrorsTheCurveStillSpansThePlotAndTheMarksSitApart() {
        CellGrid g = TuningChart.compose(withSe(400), 60, 20, CanvasKind.ASCII);
        // 20 rows: the header, 16 plot rows, the axis, tick labels, the k label; the curve (86.4 to 97) spans them
        assertTrue(rowsHolding(g, Role.CURVE) >= 10, TextRenderer.plain(g));
        int bestRow = -1;
        int oneSeRow = -1;
        for (int r = 0; r < g.height(); r++) {
            for (int c = 0; c < g.width(); c++) {
                if (g.role(c, r) == Role.MARKER) {
                    bestRow = g.codePoint(c, r) == '*' ? r : bestRow;
                    oneSeRow = g.codePoint(c, r) == 'o' ? r : oneSeRow;
                }
            }
        }
        assertTrue(bestRow > oneSeRow && oneSeRow > 0, "best at row " + bestRow + ", one-SE at row " + oneSeRow);
    }

    @Test
    void aBandWiderThanThePlotIsClippedToThePlotArea() {
        CellGrid g = TuningChart.compose(withSe(1e6), 60, 20, CanvasKind.ASCII);
        int top = -1;
        int bottom = -1;
        for (int r = 0; r < g.height(); r++) {
            if (g.rowText(r).indexOf('~') >= 0) {
                top = top < 0 ? r : top;
                bottom = r;
            }
        }
        // 20 rows: the header, plot rows 1 to 16, the axis, tick labels and the k label; the band fills the
        // plot's rows and nothing beyond
        assertEquals(1, top, TextRenderer.plain(g));
        assertEquals(16, bottom, TextRenderer.plain(g));
    }

    @Test
    void theOneSeLineIsDrawnWhereItFallsInsideTheCurvesRange() {
        // best 86.4 + SE 2 = 88.4: inside the curve's range 86.4..97
        CellGrid g = TuningChart.compose(withSe(2), 60, 20, CanvasKind.ASCII);
        int longest = 0;
        for (int r = 1; r <= 16; r++) {
            String row = g.rowText(r);
            longest = Math.max(longest, (int) row.chars().filter(ch -> ch == '=').count());
        }
        assertTrue(longest >= 20, "a row of the one-SE line\n" + TextRenderer.plain(g));
        CellGrid far = TuningChart.compose(withSe(1e6), 60, 20, CanvasKind.ASCII);
        assertTrue(TextRenderer.plain(far).indexOf('=') < 0, "a line far above the curve is clipped away");
    }
}
