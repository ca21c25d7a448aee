package nearfit.tui.bench;

import java.util.Locale;

import nearfit.plot.CanvasKind;
import nearfit.plot.CellGrid;
import nearfit.plot.PlotFrame;
import nearfit.plot.WidthStrip;
import nearfit.tui.results.Figures;

/**
 * The window-width strip with its scale label in the left margin, which ends one blank cell before the first
 * bar: a number as the plot package spells it, or, for a time display input, a duration.
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
        return WidthStrip.render(frame, width, xs, widths, 1, kind, (v, room) -> label(v, time, room));
    }

    /**
     * The label of the full bar height in at most {@code room} characters: fewer digits, then a tighter
     * spelling; empty when even the shortest does not fit, since a cut number would be a wrong one.
     */
    static String label(double value, boolean time, int room) {
        if (!time) {
            return WidthStrip.NUMBER.spell(value, room);
        }
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
        String[] tries = {d, d.replace(" ", ""), String.format(Locale.ROOT, "%.0f%s", value / units[u], names[u]),
            larger};
        for (String t : tries) {
            if (t.length() <= room) {
                return t;
            }
        }
        return "";
    }
}
