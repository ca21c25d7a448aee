package nearfit.tui.paint;

import java.util.ArrayList;
import java.util.List;

import nearfit.tui.keys.Ask;
import nearfit.tui.keys.ExportKind;
import nearfit.tui.keys.KeyTable;
import nearfit.tui.keys.Pickers;
import nearfit.tui.keys.Prompts;
import nearfit.tui.keys.ViewState;
import nearfit.tui.results.Cells;
import nearfit.tui.results.Figures;
import nearfit.tui.results.FrameInput;
import nearfit.tui.results.Ink;
import nearfit.tui.results.Results;
import nearfit.tui.results.HeldOutChoice;
import nearfit.tui.results.TuningFigures;

/** Draws the open panel over the plot: help, a column picker, tuning, flagged rows, export, a prompt. */
final class Panels {
    private Panels() {
    }

    static void paint(Pen pen, ScreenRegions layout, ViewState s, Results r, FrameInput in, Drawings drawn) {
        switch (s.overlay()) {
            case HELP -> list(pen, layout, "keys (Esc closes)", KeyTable.helpLines(), s.cursor(), false, KeyTable.KEY_COLUMN);
            case PICKER -> fitted(pen, layout, "choose the " + s.ask().title() + " (Enter, Esc)", pickerLines(s, in),
                    s.cursor());
            case TUNING -> tuning(pen, layout, s, r, drawn.tuningChart());
            case FLAGS -> list(pen, layout, flagTitle(r), FlagTable.lines(s, r, in, layout.width() - 7), s.cursor() + 1,
                    true, 0);
            case LOAD -> list(pen, layout, LoadPanel.title(in.notes()), LoadPanel.lines(in.notes()), s.cursor(), false, 2);
            case EXPORT -> fitted(pen, layout, "export (1-4 or Enter, Esc)", exportLines(), s.cursor());
            case PROMPT -> prompt(pen, layout, s);
            case CONFIRM -> prompt(pen, layout, s.typed() + " exists. Replace it? y replaces, any other key keeps it");
            case NONE -> {
            }
        }
    }

    private static List<String> pickerLines(ViewState s, FrameInput in) {
        List<String> out = new ArrayList<>();
        for (String name : Pickers.options(s.ask(), s, in.columns())) {
            String mark = s.ask() == Ask.INPUTS ? (s.inputs().contains(name) ? "[x] " : "[ ] ") : "";
            // Only the current choice is marked "(now)"; names come from the file, made visible.
            out.add(mark + nearfit.table.VisibleText.of(name) + (name.equals(Pickers.current(s)) ? "  (now)" : ""));
        }
        return out;
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
        return "flagged rows" + updating + ": " + Figures.count(r.flags().shownFlagged()) + " with |z| > "
                + Figures.value(r.flags().result().threshold()) + ", largest first (Enter marks, Esc)";
    }

    /** A picker or menu: a boxed list only as tall as its lines (up to the plot's height). */
    private static void fitted(Pen pen, ScreenRegions layout, String title, List<String> lines, int cursor) {
        int h = Math.min(layout.plotHeight(), Math.max(3, lines.size() + 2));
        box(pen, layout, layout.plotTop(), h, title, lines, cursor, true, 0);
    }

    /**
     * A boxed list over the plot. A selectable list scrolls so the cursor line is visible and draws it reversed
     * (line 0 of a table may be its heading, in which case the cursor starts at 1); any other list scrolls
     * with the cursor as its first line, and its lines too long for the box wrap, continued {@code indent}
     * columns in. When the lines do not all fit, the bottom edge says which are shown and which way more lie.
     */
    static void list(Pen pen, ScreenRegions layout, String title, List<String> lines, int cursor, boolean selectable,
            int indent) {
        int inner = layout.width() - 4 - 3;
        box(pen, layout, layout.plotTop(), layout.plotHeight(), title, selectable ? lines : wrapped(lines, inner, indent),
                cursor, selectable, indent);
    }

    private static void box(Pen pen, ScreenRegions layout, int row, int h, String title, List<String> lines, int cursor,
            boolean selectable, int indent) {
        int col = 2;
        int w = layout.width() - 4;
        pen.box(col, row, w, h, title);
        int visible = h - 2;
        int last = Math.max(0, lines.size() - visible);
        int first = selectable ? Math.max(0, Math.min(cursor - visible / 2, last)) : Math.max(0, Math.min(cursor, last));
        for (int i = 0; i < visible && first + i < lines.size(); i++) {
            int line = first + i;
            String text = Figures.pad(" " + lines.get(line), w - 2);
            pen.text(col + 1, row + 1 + i, text, selectable && line == cursor ? Ink.SELECTED : Ink.TEXT);
        }
        if (lines.isEmpty()) {
            pen.text(col + 2, row + 1, "(nothing to show yet)", Ink.LABEL);
        }
        if (lines.size() > visible) {
            boolean ascii = pen.look().ascii();
            int shownTo = Math.min(lines.size(), first + visible);
            String more = (first > 0 ? (ascii ? "^" : "↑") : "") + (shownTo < lines.size() ? (ascii ? "v" : "↓") : "");
            String where = " lines " + (first + 1) + "-" + shownTo + " of " + lines.size() + " " + more
                    + (selectable ? "" : ", arrows or PgUp/PgDn") + " ";
            if (where.length() <= w - 4) {
                pen.text(col + w - 2 - where.length(), row + h - 1, where, Ink.TITLE);
            }
        }
    }

    /** Lines cut at word boundaries to {@code width}; a continuation starts {@code indent} columns in. */
    static List<String> wrapped(List<String> lines, int width, int indent) {
        List<String> out = new ArrayList<>();
        for (String line : lines) {
            if (line.length() <= width) {
                out.add(line);
                continue;
            }
            List<String> parts = ScreenPainter.wrap(line, width);
            out.add(parts.get(0));
            // The rest is rewrapped at the narrower width left after the indent.
            String rest = String.join(" ", parts.subList(1, parts.size()));
            for (String p : ScreenPainter.wrap(rest, Math.max(10, width - indent))) {
                out.add(" ".repeat(indent) + p);
            }
        }
        return out;
    }

    /**
     * Why the table is leave-one-out's when another scheme was chosen: the workbench falls back when one group (or
     * day) holds every reference row, since nothing outside it is left to predict a row from.
     */
    static String fellBack(ViewState s, TuningFigures t) {
        HeldOutChoice chosen = s.heldOut();
        if (t.scheme() != HeldOutChoice.LEAVE_ONE_OUT || chosen == HeldOutChoice.LEAVE_ONE_OUT
                || chosen == HeldOutChoice.GROUP && s.groupColumn() == null) {
            return "";
        }
        return " (" + chosen.shortWords() + " does not apply: one " + (chosen == HeldOutChoice.GROUP ? "group" : "day")
                + " holds every reference row)";
    }

    private static void tuning(Pen pen, ScreenRegions layout, ViewState s, Results r, Cells chart) {
        int row = layout.plotTop();
        int h = layout.plotHeight();
        int w = layout.width() - 4;
        TuningFigures t = r.tuning();
        String title = t == null ? "tuning: " + ScreenPainter.tuningState(r)
                : "tuning, " + t.scheme().words() + fellBack(s, t) + ": " + rmseSource(t)
                        + " RMSE against log k (Enter adopts, * lowest, 1 one-SE, H scheme, Esc)";
        pen.box(2, row, w, h, title);
        if (t == null) {
            return;
        }
        int tableWidth = ScreenRegions.TUNING_TABLE_WIDTH;
        int chartWidth = layout.tuningChartWidth();
        if (chart != null) {
            pen.cells(chart, 3, row + 1);
        }
        List<String> lines = new ArrayList<>();
        // The lowest and the one-SE k stay in view above the scrolling table, whatever the window's height.
        double[] v = t.values();
        String[] fixed = {
            String.format(java.util.Locale.ROOT, "* lowest %4d  %10s", t.bestK(), Figures.value(v[t.bestK() - 1])),
            String.format(java.util.Locale.ROOT, "1 one-SE %4d  %10s", t.oneSeK(), Figures.value(v[t.oneSeK() - 1])),
            t.sampled() ? "RMSE on " + Figures.count(t.evaluatedRows()) + " sampled rows" : "RMSE on every row"};
        lines.add("   k        RMSE        SE");
        double[] value = t.values();
        double[] se = t.se();
        for (int k = 1; k <= t.kmax(); k++) {
            String mark = k == t.bestK() ? "*" : k == t.oneSeK() ? "1" : " ";
            lines.add(String.format(java.util.Locale.ROOT, "%s%5d  %10s  %8s%s", mark, k,
                    Figures.value(value[k - 1]), Figures.value(se[k - 1]), k == s.k() ? " <" : ""));
        }
        int col = 3 + chartWidth + 1;
        for (int i = 0; i < fixed.length; i++) {
            pen.text(col, row + 1 + i, Figures.pad(fixed[i], tableWidth), Ink.LABEL);
        }
        int top = row + 1 + fixed.length;
        int visible = h - 2 - fixed.length;
        int cursorLine = s.cursor() + 1;
        int first = Math.max(0, Math.min(cursorLine - visible / 2, lines.size() - visible));
        for (int i = 0; i < visible && first + i < lines.size(); i++) {
            int line = first + i;
            pen.text(col, top + i, Figures.pad(lines.get(line), tableWidth),
                    line == cursorLine ? Ink.SELECTED : line == 0 ? Ink.LABEL : Ink.TEXT);
        }
    }

    /** Where the panel's RMSE comes from, said beside it: a sample's differs from the status line's. */
    private static String rmseSource(TuningFigures t) {
        return t.sampled() ? "sampled (" + Figures.count(t.evaluatedRows()) + " of " + Figures.count(t.referenceRows())
                + " rows)" : "held-out";
    }

    private static void prompt(Pen pen, ScreenRegions layout, ViewState s) {
        String hint = switch (s.ask()) {
            case CONDITION -> "  (column op value [and ...]; Enter applies, empty clears)";
            case FILE -> "  (Enter writes, Esc cancels)";
            default -> "  (Enter, Esc)";
        };
        String lead = s.ask().title() + ": ";
        int caret = Prompts.caret(s);
        int room = layout.width() - 8;
        // Long text scrolls so the caret stays in view.
        int shift = Math.max(0, lead.length() + caret + 1 - room);
        String text = lead + s.typed() + " " + hint;
        prompt(pen, layout, text.substring(Math.min(shift, text.length())));
        int at = lead.length() + caret - shift;
        if (at >= 0 && at < room) {
            String under = caret < s.typed().length() ? String.valueOf(s.typed().charAt(caret)) : " ";
            pen.text(4 + at, layout.plotTop() + layout.plotHeight() - 2, under, Ink.SELECTED);
        }
    }

    private static void prompt(Pen pen, ScreenRegions layout, String text) {
        int row = layout.plotTop() + layout.plotHeight() - 3;
        pen.box(2, row, layout.width() - 4, 3, "");
        pen.text(4, row + 1, Figures.fit(text, layout.width() - 8, pen.look().ascii()), Ink.TEXT);
    }
}
