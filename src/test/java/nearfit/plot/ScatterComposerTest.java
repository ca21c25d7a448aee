package nearfit.plot;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

class ScatterComposerTest {

    private static final double NAN = Double.NaN;

    private static ComposedPlot braille(Scene s) {
        return ScatterComposer.compose(s, 60, 20, CanvasKind.BRAILLE);
    }

    @Test
    void aPointAtTheMinimumLandsInTheBottomLeftPlotCell() {
        Scene s = Scene.builder(new double[] {2, 8, 5}, new double[] {10, 30, 20}).build();
        ComposedPlot p = braille(s);
        PlotFrame f = p.frame();
        int col = f.col0();
        int row = f.row0() + f.rows() - 1;
        assertTrue(p.grid().role(col, row).densityLevel() > 0, "points role at bottom-left, got " + p.grid().role(col, row));
        assertTrue(p.grid().codePoint(col, row) > BrailleCanvas.BLANK_PATTERN);
        assertEquals(col, f.columnOf(2));
        assertEquals(row, f.rowOf(10));
    }

    @Test
    void aPointAtTheMaximumLandsInTheTopRightPlotCell() {
        Scene s = Scene.builder(new double[] {2, 8}, new double[] {10, 30}).build();
        ComposedPlot p = ScatterComposer.compose(s, 60, 20, CanvasKind.ASCII);
        PlotFrame f = p.frame();
        assertEquals('.', p.grid().codePoint(f.col0() + f.cols() - 1, f.row0()));
    }

    @Test
    void aCurveYEqualsXLightsTheDiagonal() {
        double[] none = {};
        Scene s = Scene.builder(none, none).curve(new double[] {0, 1}, new double[] {0, 1})
                .xRange(0, 1).yRange(0, 1).build();
        ComposedPlot p = ScatterComposer.compose(s, 44, 24, CanvasKind.ASCII);
        PlotFrame f = p.frame();
        int lit = 0;
        for (int c = 0; c < f.cols(); c++) {
            // y = x: the cell row expected for this column's centre, within one row for the walk's rounding
            double x = f.xAtColumn(f.col0() + c);
            int expected = f.rowOf(x);
            boolean near = false;
            for (int r = Math.max(f.row0(), expected - 1); r <= Math.min(f.row0() + f.rows() - 1, expected + 1); r++) {
                near |= p.grid().role(f.col0() + c, r) == Role.CURVE;
            }
            lit += near ? 1 : 0;
        }
        assertEquals(f.cols(), lit, "every column has the curve next to the diagonal");
        assertEquals(Role.CURVE, p.grid().role(f.col0(), f.row0() + f.rows() - 1));
        assertEquals(Role.CURVE, p.grid().role(f.col0() + f.cols() - 1, f.row0()));
    }

    @Test
    void densityLevelsIncreaseWithCounts() {
        // 1 point at x = 0, 30 at x = 5, 1000 at x = 10, all at y = 0
        int n = 1 + 30 + 1000;
        double[] x = new double[n];
        double[] y = new double[n];
        for (int i = 1; i < n; i++) {
            x[i] = i <= 30 ? 5 : 10;
        }
        Scene s = Scene.builder(x, y).xRange(0, 10).yRange(-1, 1).build();
        ComposedPlot p = braille(s);
        PlotFrame f = p.frame();
        int row = f.rowOf(0);
        int low = p.grid().role(f.columnOf(0), row).densityLevel();
        int mid = p.grid().role(f.columnOf(5), row).densityLevel();
        int high = p.grid().role(f.columnOf(10), row).densityLevel();
        assertEquals(1, low);
        // log scale: 1 + floor(4 ln 30 / ln 1000) = 1 + floor(1.97) = 2
        assertEquals(2, mid);
        assertEquals(Role.DENSITY_LEVELS, high);
    }

    @Test
    void nanValuesAreSkipped() {
        Scene s = Scene.builder(new double[] {NAN, 1, 2, NAN}, new double[] {5, NAN, 3, NAN}).xRange(0, 4).yRange(0, 6).build();
        ComposedPlot p = braille(s);
        int points = 0;
        for (int l = 1; l <= Role.DENSITY_LEVELS; l++) {
            points += p.grid().count(Role.points(l));
        }
        assertEquals(1, points);
    }

    @Test
    void aNanInTheCurveBreaksTheLine() {
        double[] none = {};
        Scene s = Scene.builder(none, none).curve(new double[] {0, 1, 2, 3}, new double[] {1, 1, NAN, 1})
                .xRange(0, 3).yRange(0, 2).build();
        ComposedPlot p = ScatterComposer.compose(s, 40, 12, CanvasKind.ASCII);
        PlotFrame f = p.frame();
        int row = f.rowOf(1);
        assertEquals(Role.CURVE, p.grid().role(f.columnOf(0.5), row));
        assertEquals(Role.BLANK, p.grid().role(f.columnOf(2), row));
    }

    @Test
    void aZeroWidthRangeDoesNotDivideByZero() {
        Scene s = Scene.builder(new double[] {3, 3, 3}, new double[] {7, 7, 7}).build();
        ComposedPlot p = braille(s);
        PlotFrame f = p.frame();
        assertTrue(f.x().max() > f.x().min() && f.y().max() > f.y().min());
        int col = f.columnOf(3);
        int row = f.rowOf(7);
        assertTrue(col >= f.col0() && row >= f.row0());
        assertEquals(Role.points(Role.DENSITY_LEVELS), p.grid().role(col, row), "three points in one cell, the most");
    }

    @Test
    void theHighlightedGroupTakesItsOwnRole() {
        Scene s = Scene.builder(new double[] {0, 10}, new double[] {0, 10}).highlight(new int[] {1, 2}, 2).build();
        ComposedPlot p = braille(s);
        PlotFrame f = p.frame();
        assertEquals(Role.HIGHLIGHT, p.grid().role(f.columnOf(10), f.rowOf(10)));
        assertEquals(Role.POINTS_1, p.grid().role(f.columnOf(0), f.rowOf(0)));
    }

    @Test
    void highlightedPointsDrawAboveTheBandAndTheCurve() {
        // A flat run of the highlighted group along the curve (a stuck sensor) must not hide under it; the
        // other group's points under the curve stay under it.
        double[] x = {0, 2, 4, 6, 8, 10, 3};
        double[] y = {5, 5, 5, 5, 5, 5, 5};
        Scene s = Scene.builder(x, y).highlight(new int[] {1, 1, 1, 1, 1, 1, 2}, 1).xRange(0, 10).yRange(0, 10)
                .curve(new double[] {0, 10}, new double[] {5, 5})
                .band(new double[] {0, 10}, new double[] {5, 5}, new double[] {5, 5}, Scene.BandStyle.LINES).build();
        ComposedPlot p = braille(s);
        PlotFrame f = p.frame();
        for (double at : new double[] {0, 4, 8}) {
            assertEquals(Role.HIGHLIGHT, p.grid().role(f.columnOf(at), f.rowOf(5)), "at " + at);
        }
        Scene other = Scene.builder(x, y).highlight(new int[] {2, 2, 2, 2, 2, 2, 2}, 1).xRange(0, 10).yRange(0, 10)
                .curve(new double[] {0, 10}, new double[] {5, 5}).build();
        ComposedPlot q = braille(other);
        assertEquals(Role.CURVE, q.grid().role(q.frame().columnOf(4), q.frame().rowOf(5)));
    }

    @Test
    void aMarkedRowHasItsOwnGlyphAboveEverything() {
        Scene s = Scene.builder(new double[] {0, 10}, new double[] {0, 10}).flags(new double[] {10}, new double[] {10})
                .marked(10, 10).build();
        ComposedPlot b = braille(s);
        assertEquals(BrailleCanvas.MARK_GLYPH, b.grid().codePoint(b.frame().columnOf(10), b.frame().rowOf(10)));
        assertEquals(Role.MARKER, b.grid().role(b.frame().columnOf(10), b.frame().rowOf(10)));
        ComposedPlot a = ScatterComposer.compose(s, 40, 12, CanvasKind.ASCII);
        assertEquals('*', a.grid().codePoint(a.frame().columnOf(10), a.frame().rowOf(10)));
    }

    @Test
    void classesColourByTheMostFrequentCodeInTheCell() {
        Scene s = Scene.builder(new double[] {0, 0, 0, 10}, new double[] {0, 0, 0, 10}).classes(new int[] {3, 3, 1, 9}).build();
        ComposedPlot p = ScatterComposer.compose(s, 40, 12, CanvasKind.ASCII);
        PlotFrame f = p.frame();
        assertEquals(Role.CLASS_3, p.grid().role(f.columnOf(0), f.rowOf(0)));
        assertEquals(Role.CLASS_1, p.grid().role(f.columnOf(10), f.rowOf(10))); // 9 mod 8
        assertEquals('d', p.grid().codePoint(f.columnOf(0), f.rowOf(0)));
    }

    @Test
    void flagsAndCrosshairHaveTheirOwnGlyphsWithoutColour() {
        Scene s = Scene.builder(new double[] {0, 10}, new double[] {0, 10})
                .flags(new double[] {10}, new double[] {10}).crosshair(5).build();
        ComposedPlot p = ScatterComposer.compose(s, 40, 12, CanvasKind.ASCII);
        PlotFrame f = p.frame();
        assertEquals('x', p.grid().codePoint(f.columnOf(10), f.rowOf(10)));
        int cross = f.columnOf(5);
        for (int r = f.row0(); r < f.row0() + f.rows(); r++) {
            assertEquals(Role.CROSSHAIR, p.grid().role(cross, r));
            assertEquals('!', p.grid().codePoint(cross, r));
        }
    }

    @Test
    void aShadedBandFillsBetweenItsEdges() {
        double[] none = {};
        Scene s = Scene.builder(none, none).band(new double[] {0, 10}, new double[] {2, 2}, new double[] {8, 8}, Scene.BandStyle.SHADED)
                .xRange(0, 10).yRange(0, 10).build();
        ComposedPlot p = ScatterComposer.compose(s, 40, 23, CanvasKind.ASCII);
        PlotFrame f = p.frame();
        int c = f.columnOf(5);
        assertEquals('=', p.grid().codePoint(c, f.rowOf(2)));
        assertEquals('=', p.grid().codePoint(c, f.rowOf(8)));
        assertEquals('~', p.grid().codePoint(c, f.rowOf(5)));
        assertEquals(Role.BLANK, p.grid().role(c, f.rowOf(9.5)));
    }

    @Test
    void xAtColumnInvertsColumnOf() {
        Scene s = Scene.builder(new double[] {0, 100}, new double[] {0, 1}).build();
        PlotFrame f = braille(s).frame();
        for (int c = f.col0(); c < f.col0() + f.cols(); c++) {
            assertEquals(c, f.columnOf(f.xAtColumn(c)));
        }
        assertTrue(Double.isNaN(f.xAtColumn(f.col0() - 1)));
        assertEquals(-1, f.columnOf(1e9));
    }

    @Test
    void tickLabelsAndNamesAreWritten() {
        Scene s = Scene.builder(new double[] {0, 25}, new double[] {0, 2000}).labels("T05", "wind_ms", "power_kw").build();
        String text = TextRenderer.plain(braille(s).grid());
        assertTrue(text.contains("power_kw") && text.contains("T05") && text.contains("wind_ms"));
        assertTrue(text.contains("1000") && text.contains("20"), text);
        assertFalse(text.contains("0.30000000000000004"));
    }
}
