package nearfit.tui;

import java.util.ArrayList;
import java.util.List;

/** Draws the open panel over the plot: help, a column picker, tuning, flagged rows, export, a prompt. */
final class Panels {
    private Panels() {
    }

    static void paint(Pen pen, Layout layout, ViewState s, Results r, FrameInput in, Sketches sketches) {
        switch (s.overlay()) {
            case HELP -> list(pen, layout, "keys (Esc closes)", helpLines(), s.cursor(), false);
            case PICKER -> list(pen, layout, "choose the " + s.ask().title() + " (Enter, Esc)",
                    pickerLines(s, in), s.cursor(), true);
            case TUNING -> tuning(pen, layout, s, r, sketches);
            case FLAGS -> list(pen, layout, flagTitle(r), FlagTable.lines(s, r, in), s.cursor() + 1, true);
            case LOAD -> list(pen, layout, LoadPanel.title(in.notes()), LoadPanel.lines(in.notes()), s.cursor(), false);
            case EXPORT -> list(pen, layout, "export (1-4 or Enter, Esc)", exportLines(), s.cursor(), true);
            case PROMPT -> prompt(pen, layout, s);
            case CONFIRM -> prompt(pen, layout, s.typed() + " exists. Replace it? y replaces, any other key keeps it");
            case NONE -> {
            }
        }
    }

    static List<String> helpLines() {
        List<String> out = new ArrayList<>();
        for (KeyBinding k : KeyBinding.values()) {
            out.add(Figures.pad(k.key(), 7) + k.meaning());
        }
        return out;
    }

    private static List<String> pickerLines(ViewState s, FrameInput in) {
        List<String> out = new ArrayList<>();
        for (String name : Pickers.options(s.ask(), s, in.columns())) {
            String mark = s.ask() == Ask.INPUTS ? (s.inputs().contains(name) ? "[x] " : "[ ] ") : "";
            out.add(mark + name + (name.equals(current(s)) ? "  (now)" : ""));
        }
        return out;
    }

    /** The current choice of what the open picker asks for: only that line is marked "(now)". */
    private static String current(ViewState s) {
        return switch (s.ask()) {
            case DISPLAY_INPUT -> s.displayInput();
            case RESPONSE -> s.response();
            case GROUP -> s.groupColumn() == null ? Pickers.NO_GROUP : s.groupColumn();
            case HELD_INPUT -> s.heldInput();
            default -> null;
        };
    }

    private static List<String> exportLines() {
        List<String> out = new ArrayList<>();
        ExportKind[] kinds = ExportKind.values();
        for (int i = 0; i < kinds.length; i++) {
            out.add((i + 1) + "  " + kinds[i].title());
        }
        return out;
    }

    private static String flagTitle(Results r) {
        if (r.flags() == null) {
            return "flagged rows: leave-one-out "
                    + (Double.isNaN(r.flagsProgress()) ? "waiting" : Math.round(100 * r.flagsProgress()) + " %");
        }
        String updating = Double.isNaN(r.flagsProgress()) ? ""
                : " (updating " + Math.round(100 * r.flagsProgress()) + " %)";
        return "flagged rows" + updating + ": " + Figures.count(r.flags().result().flaggedCount()) + " with |z| > "
                + Figures.value(r.flags().result().threshold()) + ", largest first (Enter jumps, Esc)";
    }

    /**
     * A boxed list over the plot, scrolled so the cursor line is visible. When {@code selectable} the cursor
     * line is drawn reversed. Line 0 of a table may be its heading, in which case the cursor starts at 1.
     */
    static void list(Pen pen, Layout layout, String title, List<String> lines, int cursor, boolean selectable) {
        int col = 2;
        int w = layout.width() - 4;
        int row = layout.plotTop();
        int h = layout.plotHeight();
        pen.box(col, row, w, h, title);
        int visible = h - 2;
        int first = Math.max(0, Math.min(cursor - visible / 2, lines.size() - visible));
        for (int i = 0; i < visible && first + i < lines.size(); i++) {
            int line = first + i;
            String text = Figures.pad(" " + lines.get(line), w - 2);
            pen.text(col + 1, row + 1 + i, text, selectable && line == cursor ? Ink.SELECTED : Ink.TEXT);
        }
        if (lines.isEmpty()) {
            pen.text(col + 2, row + 1, "(nothing to show yet)", Ink.LABEL);
        }
    }

    private static void tuning(Pen pen, Layout layout, ViewState s, Results r, Sketches sketches) {
        int row = layout.plotTop();
        int h = layout.plotHeight();
        int w = layout.width() - 4;
        nearfit.knn.TuningTable t = r.tuning();
        String title = t == null ? "tuning: " + ScreenPainter.tuningState(r)
                : "tuning: RMSE against log k (Enter adopts, * lowest, 1 one-SE, Esc)";
        pen.box(2, row, w, h, title);
        if (t == null) {
            return;
        }
        int tableWidth = 30;
        int chartWidth = w - 2 - tableWidth - 1;
        pen.cells(sketches.chart(t, s.k(), chartWidth, h - 2, pen.look().ascii()), 3, row + 1);
        List<String> lines = new ArrayList<>();
        lines.add("   k        RMSE        SE");
        double[] value = TuningCriterion.values(t);
        double[] se = TuningCriterion.se(t);
        for (int k = 1; k <= t.kmax(); k++) {
            String mark = k == t.bestK() ? "*" : k == t.oneSeK() ? "1" : " ";
            lines.add(String.format(java.util.Locale.ROOT, "%s%5d  %10s  %8s%s", mark, k,
                    Figures.value(value[k - 1]), Figures.value(se[k - 1]), k == s.k() ? " <" : ""));
        }
        int visible = h - 2;
        int cursorLine = s.cursor() + 1;
        int first = Math.max(0, Math.min(cursorLine - visible / 2, lines.size() - visible));
        int col = 3 + chartWidth + 1;
        for (int i = 0; i < visible && first + i < lines.size(); i++) {
            int line = first + i;
            pen.text(col, row + 1 + i, Figures.pad(lines.get(line), tableWidth),
                    line == cursorLine ? Ink.SELECTED : line == 0 ? Ink.LABEL : Ink.TEXT);
        }
    }

    private static void prompt(Pen pen, Layout layout, ViewState s) {
        String hint = switch (s.ask()) {
            case CONDITION -> "  (column op value [and ...]; Enter applies, empty clears)";
            case FILE -> "  (Enter writes, Esc cancels)";
            default -> "  (Enter, Esc)";
        };
        prompt(pen, layout, s.ask().title() + ": " + s.typed() + "_" + hint);
    }

    private static void prompt(Pen pen, Layout layout, String text) {
        int row = layout.plotTop() + layout.plotHeight() - 3;
        pen.box(2, row, layout.width() - 4, 3, "");
        pen.text(4, row + 1, Figures.fit(text, layout.width() - 8, pen.look().ascii()), Ink.TEXT);
    }
}
