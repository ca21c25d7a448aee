package nearfit.plot;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.awt.image.BufferedImage;
import java.nio.file.Files;
import java.nio.file.Path;
import javax.imageio.ImageIO;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class PngRendererTest {
    private static final double[] NONE = {};

    @TempDir
    Path dir;

    private BufferedImage roundTrip(Scene s, int w, int h) throws Exception {
        Path file = dir.resolve("plot.png");
        PngRenderer.write(s, w, h, file);
        assertTrue(Files.size(file) > 0);
        return ImageIO.read(file.toFile());
    }

    private static boolean near(int rgb, int want, int tol) {
        return Math.abs(((rgb >> 16) & 0xFF) - ((want >> 16) & 0xFF)) <= tol
                && Math.abs(((rgb >> 8) & 0xFF) - ((want >> 8) & 0xFF)) <= tol
                && Math.abs((rgb & 0xFF) - (want & 0xFF)) <= tol;
    }

    /** Mean row of curve-coloured pixels in a column, or NaN if none. */
    private static double curveRow(BufferedImage img, int col, int curve) {
        double sum = 0;
        int n = 0;
        for (int r = 0; r < img.getHeight(); r++) {
            if (near(img.getRGB(col, r), curve, 12)) {
                sum += r;
                n++;
            }
        }
        return n == 0 ? Double.NaN : sum / n;
    }

    @Test
    void thePictureHasTheAskedSize() throws Exception {
        BufferedImage img = roundTrip(Scene.builder(new double[] {1, 2}, new double[] {3, 4}).build(), 640, 400);
        assertEquals(640, img.getWidth());
        assertEquals(400, img.getHeight());
    }

    @Test
    void curveColouredPixelsFollowTheCurvesPath() throws Exception {
        Scene s = Scene.builder(NONE, NONE).curve(new double[] {0, 10}, new double[] {0, 10})
                .xRange(0, 10).yRange(0, 10).labels("", "x", "y").build();
        BufferedImage img = roundTrip(s, 500, 400);
        int curve = Palette.paper().rgb(Role.CURVE) & 0xFFFFFF;
        int[] cols = {120, 200, 280, 360, 440};
        double[] rows = new double[cols.length];
        for (int i = 0; i < cols.length; i++) {
            rows[i] = curveRow(img, cols[i], curve);
            assertTrue(Double.isFinite(rows[i]), "curve colour in column " + cols[i]);
        }
        // y = x rises steadily: equal column steps give equal row steps upwards
        double step = (rows[cols.length - 1] - rows[0]) / (cols.length - 1);
        assertTrue(step < -10, "rising, step " + step);
        for (int i = 0; i < cols.length; i++) {
            assertEquals(rows[0] + i * step, rows[i], 3.0, "column " + cols[i] + " on a straight line");
        }
    }

    @Test
    void aShadedBandTintsThePixelsBetweenItsEdges() throws Exception {
        Scene s = Scene.builder(NONE, NONE).band(new double[] {0, 10}, new double[] {2, 2}, new double[] {8, 8}, Scene.BandStyle.SHADED)
                .xRange(0, 10).yRange(0, 10).build();
        BufferedImage img = roundTrip(s, 400, 400);
        Palette p = Palette.paper();
        int tint = blend(p.background(), p.rgb(Role.BAND), 0.22);
        int col = 250;
        int first = -1;
        int last = -1;
        for (int r = 0; r < img.getHeight(); r++) {
            if (near(img.getRGB(col, r), tint, 6)) {
                first = first < 0 ? r : first;
                last = r;
            }
        }
        assertTrue(first > 0, "tinted pixels present");
        // lo..hi is 60 % of the y range; the plot is most of the picture's height
        double share = (last - first + 1) / 400.0;
        assertTrue(share > 0.4 && share < 0.6, "band share of height " + share);
        assertTrue(near(img.getRGB(col, first - 8), p.background(), 2), "background above the band");
        assertTrue(near(img.getRGB(col, last + 8), p.background(), 2), "background below the band");
    }

    @Test
    void densePointsAreDarkerThanSparseOnes() throws Exception {
        int n = 5001;
        double[] x = new double[n];
        double[] y = new double[n];
        for (int i = 1; i < n; i++) {
            x[i] = 10;
            y[i] = 10;
        }
        BufferedImage img = PngRenderer.render(Scene.builder(x, y).build(), 300, 200);
        int darkest = 255 * 3;
        int sparsest = 0;
        Palette p = Palette.paper();
        int one = p.rgb(Role.POINTS_1);
        int top = p.rgb(Role.POINTS_5);
        boolean sawOne = false;
        boolean sawTop = false;
        for (int r = 0; r < img.getHeight(); r++) {
            for (int c = 0; c < img.getWidth(); c++) {
                int rgb = img.getRGB(c, r) & 0xFFFFFF;
                sawOne |= rgb == one;
                sawTop |= rgb == top;
            }
        }
        assertTrue(sawOne && sawTop, "one sparse and one dense mark");
        assertTrue(luma(top) < luma(one));
    }

    private static int luma(int rgb) {
        return ((rgb >> 16) & 0xFF) * 3 + ((rgb >> 8) & 0xFF) * 6 + (rgb & 0xFF);
    }

    private static int blend(int bg, int fg, double a) {
        int r = (int) Math.round(((bg >> 16) & 0xFF) * (1 - a) + ((fg >> 16) & 0xFF) * a);
        int g = (int) Math.round(((bg >> 8) & 0xFF) * (1 - a) + ((fg >> 8) & 0xFF) * a);
        int b = (int) Math.round((bg & 0xFF) * (1 - a) + (fg & 0xFF) * a);
        return (r << 16) | (g << 8) | b;
    }
}
