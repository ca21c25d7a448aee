package nearfit.plot;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Random;

import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;
import org.junit.jupiter.api.Test;

class PointLayerTest {

    /** Points, curve, band, flags and crosshair drawn from one seed; colouring 0 plain, 1 highlight, 2 classes. */
    private static Scene scene(double[] x, double[] y, int[] codes, int colouring, long seed, boolean ranges) {
        Random r = new Random(seed);
        int m = 2 + r.nextInt(40);
        double[] cx = new double[m];
        double[] cy = new double[m];
        double[] lo = new double[m];
        double[] hi = new double[m];
        for (int i = 0; i < m; i++) {
            cx[i] = 10.0 * i / (m - 1);
            cy[i] = r.nextDouble() * 100;
            lo[i] = cy[i] - r.nextDouble() * 20;
            hi[i] = cy[i] + r.nextDouble() * 20;
        }
        int nf = r.nextInt(20);
        double[] fx = new double[nf];
        double[] fy = new double[nf];
        for (int i = 0; i < nf; i++) {
            fx[i] = r.nextDouble() * 10;
            fy[i] = r.nextDouble() * 100;
        }
        Scene.Builder b = Scene.builder(x, y).labels("", "wind_ms", "power_kw").curve(cx, cy)
                .band(cx, lo, hi, r.nextBoolean() ? Scene.BandStyle.SHADED : Scene.BandStyle.LINES)
                .flags(fx, fy).crosshair(r.nextDouble() * 10);
        if (ranges) {
            b.xRange(0, 10).yRange(-20, 120);
        }
        if (colouring == 1) {
            b.highlight(codes, 2);
        } else if (colouring == 2) {
            b.classes(codes);
        }
        return b.build();
    }

    private static double[][] points(int n, long seed) {
        Random r = new Random(seed);
        double[] x = new double[n];
        double[] y = new double[n];
        int[] c = new int[n];
        for (int i = 0; i < n; i++) {
            x[i] = r.nextDouble() * 10;
            // a power-curve-like cloud with some rows outside the shown range and a few NaN
            y[i] = i % 97 == 0 ? Double.NaN : 100 / (1 + Math.exp(5 - x[i])) + r.nextGaussian() * 8;
            c[i] = r.nextInt(5);
        }
        double[] codes = new double[n];
        for (int i = 0; i < n; i++) {
            codes[i] = c[i];
        }
        return new double[][] {x, y, codes};
    }

    private static int[] codes(double[] v) {
        int[] c = new int[v.length];
        for (int i = 0; i < v.length; i++) {
            c[i] = (int) v[i];
        }
        return c;
    }

    /** Same cells and roles, same plot area and axis ranges (ticks hold arrays, so frames are compared by field). */
    private static void assertSameChart(ComposedPlot full, ComposedPlot cached) {
        assertEquals(full.grid(), cached.grid());
        PlotFrame a = full.frame();
        PlotFrame b = cached.frame();
        assertEquals(java.util.List.of(a.col0(), a.row0(), a.cols(), a.rows(), a.x().min(), a.x().max(), a.y().min(), a.y().max()),
                java.util.List.of(b.col0(), b.row0(), b.cols(), b.rows(), b.x().min(), b.x().max(), b.y().min(), b.y().max()));
    }

    @Property(tries = 60)
    void composingOverBinnedPointsGivesTheCellsOfAFullCompose(@ForAll @IntRange(min = 0, max = 3000) int n,
            @ForAll @IntRange(min = 0, max = 2) int colouring, @ForAll long seed, @ForAll boolean ascii,
            @ForAll @IntRange(min = 30, max = 130) int width, @ForAll @IntRange(min = 8, max = 45) int height) {
        double[][] p = points(n, seed);
        int[] codes = codes(p[2]);
        CanvasKind kind = ascii ? CanvasKind.ASCII : CanvasKind.BRAILLE;
        Scene first = scene(p[0], p[1], codes, colouring, seed, true);
        PointLayer layer = ScatterComposer.points(first, width, height, kind);
        // Several frames over the same layer: each must equal its own full compose, so composing one frame
        // must leave the layer as it was.
        for (long frame = 0; frame < 3; frame++) {
            Scene s = scene(p[0], p[1], codes, colouring, seed + 31 * frame, true);
            assertTrue(layer.fits(s));
            assertSameChart(ScatterComposer.compose(s, width, height, kind), ScatterComposer.compose(s, layer));
        }
    }

    @Test
    void aLayerWithoutRangesFitsOnlyWhileTheAxesStayTheSame() {
        double[][] p = points(500, 7);
        int[] codes = codes(p[2]);
        Scene a = scene(p[0], p[1], codes, 0, 7, false);
        PointLayer layer = ScatterComposer.points(a, 100, 30, CanvasKind.BRAILLE);
        assertTrue(layer.fits(a));
        assertSameChart(ScatterComposer.compose(a, 100, 30, CanvasKind.BRAILLE), ScatterComposer.compose(a, layer));
        // A curve far above the data widens the y axis, so the points land on other dots.
        Scene high = Scene.builder(p[0], p[1]).labels("", "wind_ms", "power_kw")
                .curve(new double[] {0, 10}, new double[] {0, 1e4}).build();
        assertFalse(layer.fits(high));
        assertThrows(IllegalArgumentException.class, () -> ScatterComposer.compose(high, layer));
    }

    @Test
    void otherPointsOrColouringDoNotFit() {
        double[][] p = points(200, 3);
        int[] codes = codes(p[2]);
        Scene plain = scene(p[0], p[1], codes, 0, 3, true);
        PointLayer layer = ScatterComposer.points(plain, 80, 24, CanvasKind.BRAILLE);
        assertFalse(layer.fits(scene(p[0].clone(), p[1], codes, 0, 3, true)), "a copy of x is other data");
        assertFalse(layer.fits(scene(p[0], p[1], codes, 1, 3, true)), "highlighting changes the roles");
        Scene zoomed = Scene.builder(p[0], p[1]).labels("", "wind_ms", "power_kw").xRange(2, 5).yRange(-20, 120).build();
        assertFalse(layer.fits(zoomed));
        PointLayer highlighted = ScatterComposer.points(scene(p[0], p[1], codes, 1, 3, true), 80, 24, CanvasKind.BRAILLE);
        Scene otherGroup = Scene.builder(p[0], p[1]).labels("", "wind_ms", "power_kw").xRange(0, 10).yRange(-20, 120)
                .highlight(codes, 3).build();
        assertFalse(highlighted.fits(otherGroup), "another highlighted group");
    }

    @Test
    void theLayerCountsEveryShownPointOnce() {
        // 4 rows in the shown range, one outside it, one NaN: the cell counts add up to 4
        double[] x = {1, 1, 9, 5, 50, Double.NaN};
        double[] y = {1, 1, 9, 5, 5, 5};
        Scene s = Scene.builder(x, y).xRange(0, 10).yRange(0, 10).build();
        PointLayer layer = ScatterComposer.points(s, 40, 12, CanvasKind.ASCII);
        int total = 0;
        int most = 0;
        for (int r = 0; r < layer.rows(); r++) {
            for (int c = 0; c < layer.cols(); c++) {
                total += layer.count(c, r);
                most = Math.max(most, layer.count(c, r));
            }
        }
        assertEquals(4, total);
        assertEquals(2, most);
        assertNotEquals(0, layer.cols());
    }
}
