package nearfit.tui.paint;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

import nearfit.table.BadCell;
import nearfit.table.ColumnGaps;
import nearfit.table.LoadNotes;
import nearfit.table.RowSource;
import nearfit.table.LoadReport;
import nearfit.table.VisibleText;
import nearfit.tui.results.Figures;

/**
 * The load-report panel as text lines: what the loader read, its warnings about the file as a whole (say, it
 * grew while it was read), its ragged lines and each column's missing cells. Everything the file supplies
 * (its name, column names, cell texts) is made visible ({@link VisibleText}) before it reaches the screen.
 */
public final class LoadPanel {
    private LoadPanel() {
    }

    public static String title(LoadNotes notes) {
        int n = notes.count();
        return "load report: " + (n == 0 ? "no notes" : n + (n == 1 ? " note" : " notes")) + " (L or Esc closes)";
    }

    public static List<String> lines(LoadNotes notes) {
        LoadReport r = notes.report();
        List<String> out = new ArrayList<>();
        out.add(String.format(Locale.ROOT, "%s: %s data rows read, %s kept, %s dropped; delimiter %s, %s%s",
                VisibleText.of(r.source()), Figures.count(r.rowsRead()), Figures.count(r.rows()),
                Figures.count(r.droppedRows()), r.delimiterName(),
                r.headerPresent() ? "header row" : "no header row", r.decimalComma() ? ", decimal comma" : ""));
        for (String w : r.warnings()) {
            out.add("warning: " + VisibleText.of(w));
        }
        out.add(String.format(Locale.ROOT, "ragged lines: %s dropped (%s short, %s long; none of their cells is used)",
                Figures.count(r.raggedRows()), Figures.count(r.shortRows()), Figures.count(r.longRows())));
        for (BadCell c : r.raggedExamples()) {
            out.add("  line " + c.line() + ": " + VisibleText.of(c.text()));
        }
        if (r.raggedRows() > r.raggedExamples().size()) {
            out.add("  (the first " + r.raggedExamples().size() + " are listed)");
        }
        out.add("bad cells: " + Figures.count(r.badCells()) + " in all, read as missing");
        if (notes.columns().isEmpty()) {
            out.add("no column has blank or bad cells");
            return out;
        }
        out.add(String.format(Locale.ROOT, "%-16s %9s %9s  %s", "column", "blank", "bad",
                "first " + notes.source().heading() + "s"));
        for (ColumnGaps g : notes.columns()) {
            out.add(String.format(Locale.ROOT, "%-16s %9s %9s  %s", VisibleText.of(g.column()), Figures.count(g.blank()),
                    Figures.count(g.bad()), where(g, notes.source(), r.source())));
        }
        return out;
    }

    /** Where a column's gaps are: its first blank (or missing) lines, then its bad cells with their text. */
    private static String where(ColumnGaps g, RowSource source, String folder) {
        StringBuilder sb = new StringBuilder();
        if (!g.firstLines().isEmpty()) {
            sb.append(g.blankOnly() ? "blank at " : "missing at ").append(join(g.firstLines(), source, folder));
        }
        if (!g.badExamples().isEmpty()) {
            sb.append(sb.length() == 0 ? "" : "; ").append("bad at");
            for (int i = 0; i < g.badExamples().size(); i++) {
                BadCell b = g.badExamples().get(i);
                sb.append(i == 0 ? " " : ", ").append(RowOrigin.shown(source, b.line(), folder)).append(" \"").append(VisibleText.of(b.text())).append('"');
            }
        }
        return sb.toString();
    }

    private static String join(List<Long> lines, RowSource source, String folder) {
        StringBuilder sb = new StringBuilder();
        for (long l : lines) {
            sb.append(sb.length() == 0 ? "" : ", ").append(RowOrigin.shown(source, l, folder));
        }
        return sb.toString();
    }
}
