package nearfit.tui.paint;

import nearfit.tui.keys.KeyTable;
import nearfit.tui.keys.PlotMode;
import nearfit.tui.keys.ViewState;
import nearfit.tui.results.Cells;
import nearfit.tui.results.ColumnInfo;
import nearfit.tui.results.ColumnKind;
import nearfit.tui.results.CurveRequest;
import nearfit.tui.results.CurveResult;
import nearfit.tui.results.Figures;
import nearfit.tui.results.FlaggedRows;
import nearfit.tui.results.FrameInput;
import nearfit.tui.results.Ink;
import nearfit.tui.results.PlotCells;
import nearfit.tui.results.Results;

/**
 * Draws one frame from the state, the latest results, the table's facts and the drawings made for them
 * before the frame. Everything numeric shown comes from the results; this class only lays text and cells
 * out, asks the core for nothing and starts no job.
 */
public final class ScreenPainter {
    private ScreenPainter() {
    }

    public static void paint(Pen pen, ScreenRegions layout, ViewState s, Results r, FrameInput in, Drawings drawings) {
        if (!layout.fits() || in.request() == null) {
            pen.clear();
        } else {
            // The plot and strip write every cell of their rows, so only the text rows are blanked first:
            // that halves the cells handed to the terminal library per frame.
            pen.clearRows(0, layout.plotTop());
            pen.clearRows(layout.plotTop() + layout.plotHeight(), layout.stripRow());
            pen.clearRows(layout.stripRow() + 1, layout.height());
        }
        if (!layout.fits()) {
            tooSmall(pen, layout);
            return;
        }
        header(pen, layout, s, r, in);
        if (in.request() != null && drawings.plot() != null) {
            PlotCells drawn = drawings.plot();
            pen.cells(drawn.plot(), 0, layout.plotTop());
            pen.cells(drawn.strip(), 0, layout.stripRow());
            stripCaption(pen, layout, s, r, in, drawn);
        } else {
            pen.text(2, layout.plotTop() + layout.plotHeight() / 2, "no rows to plot: change the row condition (/)",
                    Ink.WARNING);
        }
        boolean warn = s.message().isEmpty() ? !r.failure().isEmpty() : s.warning();
        pen.text(0, layout.statusRow(), status(s, r, in, layout.width(), pen.look().ascii()),
                warn ? Ink.WARNING : Ink.TEXT);
        pen.text(0, layout.keyRow(), KeyTable.keyBar(layout.width()), Ink.LABEL);
        Panels.paint(pen, layout, s, r, in, drawings);
    }

    /**
     * Says what the strip under the plot shows and in which unit, on the left of the axis-name row above it
     * (which holds only the axis name, on the right): the strip's own margin has room for the number alone.
     */
    private static void stripCaption(Pen pen, ScreenRegions layout, ViewState s, Results r, FrameInput in, PlotCells drawn) {
        if (r.curve() == null || s.mode() == PlotMode.RESIDUALS_OVER_TIME || drawn.strip().width() == 0) {
            return;
        }
        boolean time = kindOf(in, s.displayInput()) == ColumnKind.TIME;
        String unit = time ? "as a duration" : "in " + nearfit.table.VisibleText.of(s.displayInput()) + " units";
        String caption = (pen.look().ascii() ? "v" : "▼") + " window width (distance to the k-th neighbour), " + unit;
        int row = layout.plotTop() + layout.plotHeight() - 1;
        // Only over blank cells: the axis name sits at the right end of this row.
        int free = 0;
        Cells plot = drawn.plot();
        int last = plot.height() - 1;
        while (free < plot.width() && plot.codePoint(free, last) == ' ') {
            free++;
        }
        String[] tries = {caption, (pen.look().ascii() ? "v" : "▼") + " window width, " + unit,
            (pen.look().ascii() ? "v" : "▼") + " width, " + unit};
        for (String t : tries) {
            if (t.length() + 2 <= free) {
                pen.text(0, row, t, Ink.LABEL);
                return;
            }
        }
    }

    private static void tooSmall(Pen pen, ScreenRegions layout) {
        String text = "nearfit needs a window of at least " + ScreenRegions.MIN_WIDTH + "x" + ScreenRegions.MIN_HEIGHT
                + "; this one is " + layout.width() + "x" + layout.height() + ". Enlarge it, or press q to quit.";
        java.util.List<String> lines = wrap(text, layout.width());
        int top = Math.max(0, (layout.height() - lines.size()) / 2);
        for (int i = 0; i < lines.size(); i++) {
            pen.text(0, top + i, lines.get(i), Ink.WARNING);
        }
    }

    /** Words in lines of at most {@code width} characters; a word longer than that is split. */
    static java.util.List<String> wrap(String text, int width) {
        java.util.List<String> lines = new java.util.ArrayList<>();
        StringBuilder line = new StringBuilder();
        for (String word : text.split(" ")) {
            while (word.length() > width && width > 0) {
                if (line.length() > 0) {
                    lines.add(line.toString());
                    line.setLength(0);
                }
                lines.add(word.substring(0, width));
                word = word.substring(width);
            }
            if (line.length() > 0 && line.length() + 1 + word.length() > width) {
                lines.add(line.toString());
                line.setLength(0);
            }
            line.append(line.length() > 0 ? " " : "").append(word);
        }
        if (line.length() > 0) {
            lines.add(line.toString());
        }
        return lines;
    }

    private static void header(Pen pen, ScreenRegions layout, ViewState s, Results r, FrameInput in) {
        boolean ascii = pen.look().ascii();
        pen.text(0, 0, Header.first(s, r, in, layout.width(), ascii), Ink.TITLE);
        pen.text(0, 1, Header.second(s, in, layout.width(), ascii), Ink.TEXT);
    }

    /** The header's tuning part, full and with the held-out scheme in shorter words. */
    static String[] tuningSpellings(Results r) {
        String full = "  |  " + tuningState(r);
        if (!Double.isNaN(r.tuningProgress()) || r.tuning() == null) {
            return new String[] {full};
        }
        return new String[] {full, "  |  best k " + r.tuning().bestK() + ", one-SE k " + r.tuning().oneSeK() + ", "
                + r.tuning().scheme().shortWords()};
    }

    static String tuningState(Results r) {
        if (!Double.isNaN(r.tuningProgress())) {
            return "tuning " + Math.round(100 * r.tuningProgress()) + " %";
        }
        if (r.tuning() != null) {
            return "best k " + r.tuning().bestK() + ", one-SE k " + r.tuning().oneSeK() + " (" + r.tuning().scheme().words() + ")";
        }
        return "tuning not run";
    }

    /** The leave-one-out RMSE at k: from the flags when the core gives it, else from the tuning table. */
    static double looRmse(ViewState s, Results r) {
        if (r.flags() != null && !Double.isNaN(r.flags().looRmse())) {
            return r.flags().looRmse();
        }
        if (r.tuning() != null) {
            return r.tuning().at(s.k());
        }
        return Double.NaN;
    }

    /** The kind of a column of the table, or {@code null} for a name it does not have. */
    static ColumnKind kindOf(FrameInput in, String column) {
        for (ColumnInfo c : in.columns()) {
            if (c.name().equals(column)) {
                return c.kind();
            }
        }
        return null;
    }

    static String label(java.util.List<String> labels, int code) {
        return code >= 0 && code < labels.size() ? labels.get(code) : "#" + code;
    }

    /**
     * The status line at {@code width} columns: a message or failure, or the figures at the crosshair. When the
     * figures do not fit, whole fields give way by importance (neighbour count, window width, band, then the
     * longer spellings), never digits.
     */
    static String status(ViewState s, Results r, FrameInput in, int width, boolean ascii) {
        if (!s.message().isEmpty()) {
            return Figures.fit(nearfit.table.VisibleText.of(s.message()), width, ascii);
        }
        if (!r.failure().isEmpty()) {
            return Figures.fit(nearfit.table.VisibleText.of(r.failure()), width, ascii);
        }
        HeaderLine line = new HeaderLine();
        int n = -1;
        int w = -1;
        int band = -1;
        int at = -1;
        CurveResult c = r.curve();
        CurveRequest q = in.request();
        String name = nearfit.table.VisibleText.of(s.displayInput());
        if (c != null && q != null && c.size() > 0) {
            double x = q.from() + s.crosshair() * (q.to() - q.from());
            int i = c.nearest(x);
            boolean time = kindOf(in, s.displayInput()) == ColumnKind.TIME;
            String xs = time ? Figures.time(c.x()[i]) : Figures.value(c.x()[i]);
            at = line.part(name + " " + xs + ": fit " + Figures.value(c.fit()[i]), xs + ": fit " + Figures.value(c.fit()[i]));
            double lo = c.bandLow()[i];
            double hi = c.bandHigh()[i];
            if (!Double.isNaN(lo)) {
                band = line.part("  band " + Figures.value(lo) + " to " + Figures.value(hi), "");
                // A mean can lie outside a quantile band where the neighbours' responses are skewed.
                if (c.fit()[i] < lo || c.fit()[i] > hi) {
                    line.part("  fit outside band");
                }
            }
            // The window width is in display-input units: milliseconds for a time input.
            w = line.part("  width " + (time ? Figures.duration(c.width()[i]) : Figures.value(c.width()[i])), "");
            n = line.part("  n " + c.neighbours()[i], "");
        } else {
            line.part("fitting ...");
        }
        String rmse = Figures.value(looRmse(s, r));
        int loo = line.part("  |  LOO RMSE " + rmse, "  |  RMSE " + rmse);
        FlaggedRows f = r.flags();
        int flagged = -1;
        if (f != null && f.examined() == 0) {
            flagged = line.part("  |  no flags for a category response", "  |  no flags");
        } else if (f != null) {
            String count = "  |  flagged " + Figures.count(f.shownFlagged());
            flagged = line.part(count + " (" + Figures.percent(f.share()) + ")", count);
            if (!Double.isNaN(r.flagsProgress())) {
                line.part(" updating " + Math.round(100 * r.flagsProgress()) + " %", " upd " + Math.round(100 * r.flagsProgress()) + " %");
            }
        } else {
            line.part("  |  leave-one-out " + (Double.isNaN(r.flagsProgress()) ? "waiting"
                    : Math.round(100 * r.flagsProgress()) + " %"));
        }
        for (int part : new int[] {n, flagged, w, band, loo, at}) {
            if (part >= 0) {
                line.thenShorten(part);
            }
        }
        return line.fit(width, ascii);
    }
}
