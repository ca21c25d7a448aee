package nearfit.tui;

import java.util.Locale;

import nearfit.plot.CanvasKind;
import nearfit.plot.CellGrid;
import nearfit.plot.NiceTicks;
import nearfit.plot.PlotFrame;
import nearfit.plot.Role;
import nearfit.plot.WidthStrip;

/**
 * The window-width strip with its scale label in the left margin: the plot package's bars, and a label that
 * always ends one blank cell before the first bar (the plot package writes its own label from the left edge,
 * so a label wider than the margin ran into the bars). A time display input has its width as a duration.
 */
final class StripLabel {
    private StripLabel() {
    }

    /**
     * @param frame  the frame of the scatter above
     * @param width  strip width in cells
     * @param xs     display input at each curve point, ascending
     * @param widths window width at each point, in display-input units (milliseconds for time)
     * @param time   whether the display input is a time
     * @param kind   glyph set
     */
    static CellGrid strip(PlotFrame frame, int width, double[] xs, double[] widths, boolean time, CanvasKind kind) {
        // The bars are drawn with the frame moved right by a margin wide enough for the plot package's own
        // label, which is then left out when the bars are copied back into place.
        int margin = 32;
        PlotFrame moved = new PlotFrame(frame.col0() + margin, frame.row0(), frame.cols(), frame.rows(),
                frame.dotsX(), frame.dotsY(), frame.x(), frame.y());
        CellGrid bars = WidthStrip.render(moved, width + margin, xs, widths, 1, kind);
        CellGrid.Builder g = CellGrid.builder(width, 1);
        for (int c = frame.col0(); c < width; c++) {
            g.set(c, 0, bars.codePoint(c + margin, 0), bars.role(c + margin, 0));
        }
        int room = frame.col0() - 1;
        double top = largestAtColumns(frame, xs, widths);
        if (room > 0 && top > 0) {
            String label = label(top, time, room);
            g.text(room - label.length(), 0, label, Role.TICK_LABEL);
        }
        return g.build();
    }

    /**
     * The label of the full bar height in at most {@code room} characters: fewer digits, then a tighter
     * spelling; empty when even the shortest does not fit, since a cut number would be a wrong one.
     */
    static String label(double value, boolean time, int room) {
        String[] tries;
        if (time) {
            String d = Figures.duration(value);
            // Then rounded to a whole number of the same unit, then the next larger unit: 25.5 min, 26min, 0.4h.
            double[] units = {1000, 60_000, 3_600_000, 86_400_000};
            String[] names = {"s", "min", "h", "d"};
            int u = 0;
            while (u + 1 < units.length && !d.endsWith(" " + names[u])) {
                u++;
            }
            String larger = u + 1 < units.length
                    ? String.format(Locale.ROOT, "%.1f%s", value / units[u + 1], names[u + 1]) : "";
            tries = new String[] {d, d.replace(" ", ""),
                String.format(Locale.ROOT, "%.0f%s", value / units[u], names[u]), larger};
        } else {
            String sci = String.format(Locale.ROOT, "%.0e", value).replaceFirst("e([+-])0*(\\d)", "e$1$2")
                    .replace("e+", "e");
            tries = new String[] {NiceTicks.label(value, Math.max(0, 2 - (int) Math.floor(Math.log10(value)))),
                String.format(Locale.ROOT, "%.2g", value), String.format(Locale.ROOT, "%.1g", value), sci};
        }
        for (String t : tries) {
            if (t.length() <= room) {
                return t;
            }
        }
        return "";
    }

    /**
     * The largest width at the plot's column centres, which is what the strip scales its bars to: linear
     * interpolation between curve points, as the bars use. One pass, since both xs and the centres ascend.
     */
    static double largestAtColumns(PlotFrame frame, double[] xs, double[] widths) {
        double max = 0;
        int i = 0;
        for (int c = 0; c < frame.cols(); c++) {
            double x = frame.xAtColumn(frame.col0() + c);
            while (i + 1 < xs.length && xs[i + 1] < x) {
                i++;
            }
            if (i + 1 >= xs.length || !(x >= xs[i] && x <= xs[i + 1])) {
                continue;
            }
            double span = xs[i + 1] - xs[i];
            double w = span > 0 ? widths[i] + (x - xs[i]) / span * (widths[i + 1] - widths[i]) : widths[i];
            if (w > max) {
                max = w;
            }
        }
        return max;
    }
}
