package nearfit.plot;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.FontMetrics;
import java.awt.Graphics2D;
import java.awt.RenderingHints;
import java.awt.geom.Path2D;
import java.awt.image.BufferedImage;
import java.awt.image.DataBufferInt;
import java.io.IOException;
import java.nio.file.Path;
import javax.imageio.ImageIO;

/**
 * Renders a {@link Scene} as a picture with Java2D, headless (no display needed; the JVM runs
 * with {@code java.awt.headless=true}, which this class sets if unset). The same layers as the
 * text chart: points as 2 × 2 marks shaded by log density, the band as a translucent polygon or
 * dashed edges, the curve as a polyline, flags as crosses, the crosshair dashed; colours from
 * {@link Palette#paper()}.
 */
public final class PngRenderer {
    /** Pixels per text cell used to size ticks and margins like the text chart's. */
    private static final int CELL_W = 8;
    private static final int CELL_H = 16;
    private static final int MARK = 2;
    private static final float BAND_ALPHA = 0.22f;

    private PngRenderer() {
    }

    /**
     * @param width  picture width in pixels, at least 120
     * @param height picture height in pixels, at least 90
     * @return the picture
     */
    public static BufferedImage render(Scene s, int width, int height) {
        if (width < 120 || height < 90) {
            throw new IllegalArgumentException("a picture of " + width + "x" + height + " pixels is too small");
        }
        if (System.getProperty("java.awt.headless") == null) {
            System.setProperty("java.awt.headless", "true");
        }
        Palette pal = Palette.paper();
        BufferedImage img = new BufferedImage(width, height, BufferedImage.TYPE_INT_RGB);
        Graphics2D g = img.createGraphics();
        try {
            g.setColor(new Color(pal.background()));
            g.fillRect(0, 0, width, height);
            g.setRenderingHint(RenderingHints.KEY_ANTIALIASING, RenderingHints.VALUE_ANTIALIAS_ON);
            g.setRenderingHint(RenderingHints.KEY_TEXT_ANTIALIASING, RenderingHints.VALUE_TEXT_ANTIALIAS_ON);
            g.setFont(new Font(Font.SANS_SERIF, Font.PLAIN, 12));
            Area a = layout(s, width, height, g.getFontMetrics());
            points(s, a, img, pal);
            band(s, a, g, pal);
            if (s.curve() != null) {
                g.setColor(new Color(pal.rgb(Role.CURVE)));
                g.setStroke(new BasicStroke(2.2f, BasicStroke.CAP_ROUND, BasicStroke.JOIN_ROUND));
                g.draw(polyline(s.curve().xs(), s.curve().ys(), a));
            }
            flagsAndCrosshair(s, a, g, pal);
            axes(s, a, g, pal, width);
        } finally {
            g.dispose();
        }
        return img;
    }

    /**
     * Renders and writes a PNG file.
     *
     * @throws IOException when the file cannot be written
     */
    public static void write(Scene s, int width, int height, Path file) throws IOException {
        if (!ImageIO.write(render(s, width, height), "png", file.toFile())) {
            throw new IOException("no PNG writer available");
        }
    }

    /** The plot rectangle in pixels and its axes. */
    private record Area(int left, int top, int w, int h, Axis x, Axis y) {
        double px(double v) {
            return left + x.fraction(v) * w;
        }

        double py(double v) {
            return top + h - y.fraction(v) * h;
        }
    }

    private static Area layout(Scene s, int width, int height, FontMetrics fm) {
        int top = fm.getHeight() * (s.title().isEmpty() && s.yName().isEmpty() ? 1 : 2);
        int bottom = fm.getHeight() * (s.xName().isEmpty() ? 2 : 3);
        int h = height - top - bottom;
        Axis y = ScatterComposer.yAxis(s, Math.max(2, h / CELL_H));
        int labelW = 0;
        for (String l : y.ticks().labels()) {
            labelW = Math.max(labelW, fm.stringWidth(l));
        }
        int left = labelW + 12;
        int w = width - left - fm.charWidth('0') * 3;
        Axis x = ScatterComposer.xAxis(s, Math.max(2, w / CELL_W));
        return new Area(left, top, w, h, x, y);
    }

    /** Bins points into pixels (one pass, no allocation per point), then paints marks by log density. */
    private static void points(Scene s, Area a, BufferedImage img, Palette pal) {
        int[] counts = new int[a.w() * a.h()];
        byte[] special = new byte[counts.length]; // 0 plain, 1 highlight, 2 + class code mod 8
        int[] codes = null;
        int code = 0;
        boolean classes = s.colouring() instanceof Scene.PointColouring.Classes;
        if (s.colouring() instanceof Scene.PointColouring.Highlight hl) {
            codes = hl.codes();
            code = hl.code();
        } else if (s.colouring() instanceof Scene.PointColouring.Classes cl) {
            codes = cl.codes();
        }
        double sx = a.w() / (a.x().max() - a.x().min());
        double sy = a.h() / (a.y().max() - a.y().min());
        double[] x = s.x();
        double[] y = s.y();
        int max = 0;
        for (int i = 0; i < x.length; i++) {
            double u = (x[i] - a.x().min()) * sx;
            double v = (y[i] - a.y().min()) * sy;
            if (!(u >= 0 && u < a.w() && v >= 0 && v < a.h())) {
                continue;
            }
            int p = (a.h() - 1 - (int) v) * a.w() + (int) u;
            max = Math.max(max, ++counts[p]);
            if (codes != null) {
                if (classes) {
                    special[p] = (byte) (2 + Math.floorMod(codes[i], Role.CLASS_COUNT));
                } else if (codes[i] == code) {
                    special[p] = 1;
                }
            }
        }
        paintMarks(a, img, pal, counts, special, max);
    }

    private static void paintMarks(Area a, BufferedImage img, Palette pal, int[] counts, byte[] special, int max) {
        int[] raster = ((DataBufferInt) img.getRaster().getDataBuffer()).getData();
        int width = img.getWidth();
        double logMax = Math.log(max);
        for (int p = 0; p < counts.length; p++) {
            if (counts[p] == 0) {
                continue;
            }
            int rgb = special[p] == 1 ? pal.rgb(Role.HIGHLIGHT)
                    : special[p] >= 2 ? pal.rgb(Role.ofClass(special[p] - 2))
                    : pal.rgb(Role.points(Canvas.densityLevel(counts[p], logMax)));
            int px = a.left() + p % a.w();
            int py = a.top() + p / a.w();
            for (int dy = 0; dy < MARK && py + dy < img.getHeight(); dy++) {
                for (int dx = 0; dx < MARK && px + dx < width; dx++) {
                    raster[(py + dy) * width + px + dx] = rgb;
                }
            }
        }
    }

    private static void band(Scene s, Area a, Graphics2D g, Palette pal) {
        Scene.Band b = s.band();
        if (b == null) {
            return;
        }
        Color c = new Color(pal.rgb(Role.BAND));
        if (b.style() == Scene.BandStyle.SHADED) {
            g.setColor(new Color(c.getRed(), c.getGreen(), c.getBlue(), Math.round(BAND_ALPHA * 255)));
            g.fill(bandPolygon(b, a));
        }
        g.setColor(c);
        g.setStroke(new BasicStroke(1.2f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_ROUND, 1f, new float[] {5f, 3f}, 0f));
        g.draw(polyline(b.xs(), b.lo(), a));
        g.draw(polyline(b.xs(), b.hi(), a));
    }

    /** One closed polygon per NaN-free run: along hi forwards, back along lo. */
    private static Path2D bandPolygon(Scene.Band b, Area a) {
        Path2D path = new Path2D.Double();
        int n = b.xs().length;
        int start = 0;
        while (start < n) {
            int end = start;
            while (end < n && Double.isFinite(b.xs()[end] + b.lo()[end] + b.hi()[end])) {
                end++;
            }
            if (end - start >= 2) {
                path.moveTo(a.px(b.xs()[start]), a.py(b.hi()[start]));
                for (int i = start + 1; i < end; i++) {
                    path.lineTo(a.px(b.xs()[i]), a.py(b.hi()[i]));
                }
                for (int i = end - 1; i >= start; i--) {
                    path.lineTo(a.px(b.xs()[i]), a.py(b.lo()[i]));
                }
                path.closePath();
            }
            start = end + 1;
        }
        return path;
    }

    /** A polyline in pixels; NaN breaks it. Java2D clips to the picture. */
    private static Path2D polyline(double[] xs, double[] ys, Area a) {
        Path2D path = new Path2D.Double();
        boolean pen = false;
        for (int i = 0; i < xs.length; i++) {
            double px = a.px(xs[i]);
            double py = a.py(ys[i]);
            if (!Double.isFinite(px + py)) {
                pen = false;
            } else if (pen) {
                path.lineTo(px, py);
            } else {
                path.moveTo(px, py);
                pen = true;
            }
        }
        return path;
    }

    private static void flagsAndCrosshair(Scene s, Area a, Graphics2D g, Palette pal) {
        g.setClip(a.left(), a.top(), a.w(), a.h());
        if (s.flags() != null) {
            g.setColor(new Color(pal.rgb(Role.FLAG)));
            g.setStroke(new BasicStroke(1.6f));
            Path2D crosses = new Path2D.Double();
            for (int i = 0; i < s.flags().x().length; i++) {
                double px = a.px(s.flags().x()[i]);
                double py = a.py(s.flags().y()[i]);
                if (Double.isFinite(px + py)) {
                    crosses.moveTo(px - 4, py - 4);
                    crosses.lineTo(px + 4, py + 4);
                    crosses.moveTo(px - 4, py + 4);
                    crosses.lineTo(px + 4, py - 4);
                }
            }
            g.draw(crosses);
        }
        if (Double.isFinite(s.crosshairX())) {
            double px = a.px(s.crosshairX());
            g.setColor(new Color(pal.rgb(Role.CROSSHAIR)));
            g.setStroke(new BasicStroke(1f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER, 1f, new float[] {2f, 3f}, 0f));
            g.draw(new java.awt.geom.Line2D.Double(px, a.top(), px, a.top() + a.h()));
        }
        g.setClip(null);
    }

    private static void axes(Scene s, Area a, Graphics2D g, Palette pal, int width) {
        FontMetrics fm = g.getFontMetrics();
        int bottom = a.top() + a.h();
        g.setColor(new Color(pal.rgb(Role.AXIS)));
        g.setStroke(new BasicStroke(1f));
        g.drawLine(a.left(), a.top(), a.left(), bottom);
        g.drawLine(a.left(), bottom, a.left() + a.w(), bottom);
        Ticks yt = a.y().ticks();
        for (int i = 0; i < yt.size(); i++) {
            int py = (int) Math.round(a.py(yt.values()[i]));
            g.drawLine(a.left() - 4, py, a.left(), py);
            String l = yt.labels()[i];
            g.drawString(l, a.left() - 6 - fm.stringWidth(l), py + fm.getAscent() / 2 - 1);
        }
        Ticks xt = a.x().ticks();
        int freeFrom = 0;
        for (int i = 0; i < xt.size(); i++) {
            int px = (int) Math.round(a.px(xt.values()[i]));
            g.drawLine(px, bottom, px, bottom + 4);
            String l = xt.labels()[i];
            int start = Math.min(Math.max(px - fm.stringWidth(l) / 2, 0), width - fm.stringWidth(l));
            if (start >= freeFrom) {
                g.drawString(l, start, bottom + 6 + fm.getAscent());
                freeFrom = start + fm.stringWidth(l) + fm.charWidth(' ');
            }
        }
        g.setColor(new Color(pal.rgb(Role.LABEL)));
        g.drawString(s.yName(), 4, fm.getHeight());
        g.drawString(s.xName(), width - 4 - fm.stringWidth(s.xName()), bottom + 6 + fm.getHeight() + fm.getAscent());
        g.setColor(new Color(pal.rgb(Role.TITLE)));
        g.setFont(g.getFont().deriveFont(Font.BOLD));
        g.drawString(s.title(), (width - g.getFontMetrics().stringWidth(s.title())) / 2, fm.getHeight());
    }
}
