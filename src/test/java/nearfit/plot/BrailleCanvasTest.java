package nearfit.plot;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/** Source for the code points: the Unicode Standard, Braille Patterns block U+2800–U+28FF (dot n is bit n − 1). */
class BrailleCanvasTest {

    private static CellGrid gridOf(Canvas canvas) {
        CellGrid.Builder g = CellGrid.builder(canvas.columns(), canvas.rows());
        canvas.writeTo(g, 0, 0);
        return g.build();
    }

    @Test
    void allEightDotsAreU28FF() {
        assertEquals(0x28FF, BrailleCanvas.codePointOfDots(1, 2, 3, 4, 5, 6, 7, 8));
    }

    @Test
    void dotOneAloneIsU2801() {
        assertEquals(0x2801, BrailleCanvas.codePointOfDots(1));
    }

    @Test
    void dotsOneTwoThreeSevenAreU2847() {
        assertEquals(0x2847, BrailleCanvas.codePointOfDots(1, 2, 3, 7));
    }

    @Test
    void dotEightAloneIsU2880() {
        assertEquals(0x2880, BrailleCanvas.codePointOfDots(8));
    }

    @Test
    void dotsRunDownTheLeftColumnThenTheRightThenTheBottomRow() {
        // Unicode Standard dot layout: 1 4 / 2 5 / 3 6 / 7 8.
        int[][] expected = {{1, 4}, {2, 5}, {3, 6}, {7, 8}};
        for (int sy = 0; sy < 4; sy++) {
            for (int sx = 0; sx < 2; sx++) {
                assertEquals(expected[sy][sx], BrailleCanvas.dotNumber(sx, sy), "dot at (" + sx + ", " + sy + ")");
            }
        }
    }

    @Test
    void aPixelLightsTheDotAtItsPlaceInItsCell() {
        BrailleCanvas canvas = new BrailleCanvas(3, 2);
        canvas.addPoint(3, 6); // x 3: right column of cell 1; y 6: third row of cell 1 -> dot 6
        CellGrid grid = gridOf(canvas);
        assertEquals(BrailleCanvas.codePointOfDots(6), grid.codePoint(1, 1));
        assertEquals(' ', grid.codePoint(0, 0));
        assertEquals(1, canvas.count(1, 1));
    }

    @Test
    void theBottomRightDotOfTheLastCellIsDotEight() {
        BrailleCanvas canvas = new BrailleCanvas(2, 2);
        canvas.addPoint(canvas.dotWidth() - 1, canvas.dotHeight() - 1);
        CellGrid.Builder g = CellGrid.builder(2, 2);
        canvas.writeTo(g, 0, 0);
        assertEquals(0x2880, g.build().codePoint(1, 1));
    }

    @Test
    void dotsOutsideTheCanvasAreIgnored() {
        BrailleCanvas canvas = new BrailleCanvas(2, 2);
        canvas.addPoint(-1, 0);
        canvas.addPoint(4, 0);
        canvas.addPoint(0, 8);
        canvas.mark(Layer.CURVE, 99, 99);
        CellGrid.Builder g = CellGrid.builder(2, 2);
        canvas.writeTo(g, 0, 0);
        assertEquals(0, g.build().count(Role.BLANK) - 4);
    }

    @Test
    void aLineWalksEveryDotBetweenItsEnds() {
        BrailleCanvas canvas = new BrailleCanvas(4, 2);
        canvas.line(Layer.CURVE, 0, 0, 7, 7, false);
        for (int i = 0; i < 8; i++) {
            assertTrue(canvas.isSet(Layer.CURVE, i, i), "diagonal dot " + i);
        }
        assertFalse(canvas.isSet(Layer.CURVE, 7, 0));
    }

    @Test
    void aLineFarOutsideIsClippedToTheCanvas() {
        BrailleCanvas canvas = new BrailleCanvas(4, 2);
        canvas.line(Layer.CURVE, -1e9, 3, 1e9, 3, false);
        for (int x = 0; x < 8; x++) {
            assertTrue(canvas.isSet(Layer.CURVE, x, 3));
        }
    }

    @Test
    void theCurveHidesPointsInItsCellsAndWinsTheRole() {
        BrailleCanvas canvas = new BrailleCanvas(1, 1);
        canvas.addPoint(1, 3);
        canvas.mark(Layer.CURVE, 0, 0);
        CellGrid grid = gridOf(canvas);
        assertEquals(Role.CURVE, grid.role(0, 0));
        assertEquals(BrailleCanvas.codePointOfDots(1), grid.codePoint(0, 0));
    }

    @Test
    void bandDotsMergeWithPointsAndWinTheRole() {
        BrailleCanvas canvas = new BrailleCanvas(1, 1);
        canvas.addPoint(1, 3);
        canvas.mark(Layer.BAND, 0, 0);
        CellGrid grid = gridOf(canvas);
        assertEquals(Role.BAND, grid.role(0, 0));
        assertEquals(BrailleCanvas.codePointOfDots(1, 8), grid.codePoint(0, 0));
    }

    @Test
    void aFlaggedCellShowsTheFlagGlyph() {
        BrailleCanvas canvas = new BrailleCanvas(1, 1);
        canvas.mark(Layer.CURVE, 0, 0);
        canvas.mark(Layer.FLAG, 1, 1);
        CellGrid grid = gridOf(canvas);
        assertEquals(BrailleCanvas.FLAG_GLYPH, grid.codePoint(0, 0));
        assertEquals(Role.FLAG, grid.role(0, 0));
    }

    @Test
    void densityLevelsGrowWithTheLogOfTheCount() {
        double logMax = Math.log(10_000);
        // level = 1 + floor(4 ln(n) / ln(10000)): 1 -> 1, 10 -> 2, 100 -> 3, 1000 -> 4, 10000 -> 5
        assertEquals(1, Canvas.densityLevel(1, logMax));
        assertEquals(2, Canvas.densityLevel(10, logMax));
        assertEquals(3, Canvas.densityLevel(100, logMax));
        assertEquals(4, Canvas.densityLevel(1000, logMax));
        assertEquals(5, Canvas.densityLevel(10_000, logMax));
    }
}
