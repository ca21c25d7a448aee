package nearfit.tui;

/**
 * Draws one frame from the state, the latest results and the table's facts. Everything numeric shown comes
 * from the results; this class only lays text out.
 */
final class ScreenPainter {
    private static final String KEYS = "? help  q quit  +/- k  t tuning  F flagged  f marks  x/y/i columns  "
            + "g group  / condition  e export  arrows crosshair";
    /** The keys line with the load report, for windows wide enough to show it whole. */
    private static final String KEYS_WIDE = KEYS.replace("e export", "e export  L load");

    private ScreenPainter() {
    }

    static void paint(Pen pen, Layout layout, ViewState s, Results r, FrameInput in, Sketches sketches) {
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
        if (in.request() != null) {
            PlotScene scene = scene(s, r, in, pen.look());
            PlotCells drawn = sketches.plot(scene, layout.width(), layout.plotHeight());
            pen.cells(drawn.plot(), 0, layout.plotTop());
            pen.cells(drawn.strip(), 0, layout.stripRow());
        } else {
            pen.text(2, layout.plotTop() + layout.plotHeight() / 2, "no rows to plot: change the row condition (/)",
                    Ink.WARNING);
        }
        pen.text(0, layout.statusRow(), Figures.fit(status(s, r, in), layout.width(), pen.look().ascii()),
                s.message().isEmpty() && r.failure().isEmpty() ? Ink.TEXT : Ink.WARNING);
        String keys = KEYS_WIDE.length() <= layout.width() ? KEYS_WIDE : KEYS;
        pen.text(0, layout.keyRow(), Figures.fit(keys, layout.width(), pen.look().ascii()), Ink.LABEL);
        Panels.paint(pen, layout, s, r, in, sketches);
    }

    /** The scene handed to the plot package. */
    static PlotScene scene(ViewState s, Results r, FrameInput in, Look look) {
        CurveRequest q = in.request();
        double x = q.from() + s.crosshair() * (q.to() - q.from());
        CurveResult curve = r.curve() != null && r.curve().size() == q.steps() ? r.curve() : null;
        return new PlotScene(s.model(), q, curve, r.flags(), s.mode(), s.flagMarks(), x, s.heldQuantile(), s.nearHeldOnly(),
                s.markedRow(), look.ascii());
    }

    private static void tooSmall(Pen pen, Layout layout) {
        String text = "nearfit needs a window of at least " + Layout.MIN_WIDTH + "x" + Layout.MIN_HEIGHT
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

    private static void header(Pen pen, Layout layout, ViewState s, Results r, FrameInput in) {
        boolean ascii = pen.look().ascii();
        pen.text(0, 0, Header.first(s, r, in, layout.width(), ascii), Ink.TITLE);
        pen.text(0, 1, Header.second(s, in, layout.width(), ascii), Ink.TEXT);
    }

    static String tuningState(Results r) {
        if (!Double.isNaN(r.tuningProgress())) {
            return "tuning " + Math.round(100 * r.tuningProgress()) + " %";
        }
        if (r.tuning() != null) {
            return "best k " + r.tuning().bestK() + ", one-SE k " + r.tuning().oneSeK();
        }
        return "tuning not run";
    }

    /** The leave-one-out RMSE at k: from the flags when the core gives it, else from the tuning table. */
    static double looRmse(ViewState s, Results r) {
        if (r.flags() != null && !Double.isNaN(r.flags().looRmse())) {
            return r.flags().looRmse();
        }
        if (r.tuning() != null) {
            return TuningCriterion.at(r.tuning(), s.k());
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

    static String status(ViewState s, Results r, FrameInput in) {
        if (!s.message().isEmpty()) {
            return s.message();
        }
        if (!r.failure().isEmpty()) {
            return r.failure();
        }
        StringBuilder sb = new StringBuilder();
        CurveResult c = r.curve();
        CurveRequest q = in.request();
        if (c != null && q != null && c.size() > 0) {
            double x = q.from() + s.crosshair() * (q.to() - q.from());
            int i = c.nearest(x);
            boolean time = kindOf(in, s.displayInput()) == ColumnKind.TIME;
            sb.append(s.displayInput()).append(' ').append(time ? Figures.time(c.x()[i]) : Figures.value(c.x()[i]))
                    .append(": fit ").append(Figures.value(c.fit()[i]));
            if (!Double.isNaN(c.bandLow()[i])) {
                sb.append("  band ").append(Figures.value(c.bandLow()[i])).append(" to ")
                        .append(Figures.value(c.bandHigh()[i]));
            }
            // The window width is in display-input units: milliseconds for a time input.
            sb.append("  width ").append(time ? Figures.duration(c.width()[i]) : Figures.value(c.width()[i]))
                    .append("  n ").append(c.neighbours()[i]);
        } else {
            sb.append("fitting ...");
        }
        sb.append("  |  LOO RMSE ").append(Figures.value(looRmse(s, r)));
        FlaggedRows f = r.flags();
        if (f != null && f.examined() == 0) {
            sb.append("  |  no flags for a category response");
        } else if (f != null) {
            sb.append("  |  flagged ").append(Figures.count(f.result().flaggedCount())).append(" (")
                    .append(Figures.percent(f.share())).append(')');
            if (!Double.isNaN(r.flagsProgress())) {
                sb.append(" updating ").append(Math.round(100 * r.flagsProgress())).append(" %");
            }
        } else {
            sb.append("  |  leave-one-out ").append(Double.isNaN(r.flagsProgress()) ? "waiting"
                    : Math.round(100 * r.flagsProgress()) + " %");
        }
        return sb.toString();
    }
}
