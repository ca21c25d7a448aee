package nearfit.tui.paint;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

import nearfit.table.RowSource;
import nearfit.table.VisibleText;
import nearfit.tui.keys.ViewState;
import nearfit.tui.results.Figures;
import nearfit.tui.results.FlaggedRow;
import nearfit.tui.results.FrameInput;
import nearfit.tui.results.Results;

/**
 * The flagged-rows table as text lines: a heading, then one line per flagged row in the results' order.
 *
 * <p>Columns run from the most to the least important: z (the sort key), the fit and the residual, then the
 * group, time, the row's origin (CSV line or Parquet row), response and the inputs. When the width is short, whole columns are left out from
 * the least important end; a number is never cut. Group labels and column names come from the file and are
 * made visible ({@link VisibleText}).
 */
final class FlagTable {
    /** One column: its heading and its cell for each row, aligned to the widest of them ({@code width}). */
    private record Column(String heading, List<String> cells, boolean left, int width) {
    }

    private FlagTable() {
    }

    /** The heading and one line per flagged row, at most {@code width} characters each. */
    static List<String> lines(ViewState s, Results r, FrameInput in, int width) {
        List<FlaggedRow> rows = r.flags() == null ? List.of() : r.flags().rows();
        List<Column> columns = new ArrayList<>();
        columns.add(column("z", rows, f -> Figures.value(f.z()), false));
        columns.add(column("fit", rows, f -> Figures.value(f.fit()), false));
        columns.add(column("residual", rows, f -> Figures.value(f.residual()), false));
        if (s.groupColumn() != null) {
            columns.add(column(VisibleText.of(s.groupColumn()), rows, f -> VisibleText.of(f.group()), true));
        }
        boolean anyTime = false;
        for (FlaggedRow f : rows) {
            anyTime |= !f.time().isEmpty();
        }
        if (anyTime) {
            columns.add(column("time", rows, f -> shortTime(f.time()), true));
        }
        if (r.flags() != null) {
            // "line" for CSV, "row" for Parquet (the row index, or file:row in a data set)
            RowSource origin = r.flags().source();
            columns.add(column(origin.heading(), rows, f -> RowOrigin.shown(origin, f.line(), in.source()),
                    origin.isParquet()));
        }
        columns.add(column(VisibleText.of(s.response()), rows, f -> Figures.value(f.response()), false));
        int display = s.inputs().indexOf(s.displayInput());
        columns.add(column(VisibleText.of(s.displayInput()), rows, f -> Figures.value(f.inputs().get(display)), false));
        for (int j = 0; j < s.inputs().size(); j++) {
            if (j != display) {
                int input = j;
                columns.add(column(VisibleText.of(s.inputs().get(j)), rows, f -> Figures.value(f.inputs().get(input)),
                        false));
            }
        }
        // Whole columns give way from the least important end; the first three always stay.
        int total = 0;
        int kept = 0;
        for (Column c : columns) {
            int add = c.width() + (kept == 0 ? 0 : 2);
            if (kept >= 3 && total + add > width) {
                break;
            }
            total += add;
            kept++;
        }
        List<String> out = new ArrayList<>();
        out.add(line(columns, kept, -1));
        for (int i = 0; i < rows.size(); i++) {
            out.add(line(columns, kept, i));
        }
        return out;
    }

    private static Column column(String heading, List<FlaggedRow> rows, java.util.function.Function<FlaggedRow, String> cell,
            boolean left) {
        List<String> cells = new ArrayList<>(rows.size());
        int width = heading.length();
        for (FlaggedRow f : rows) {
            String c = cell.apply(f);
            cells.add(c);
            width = Math.max(width, c.length());
        }
        return new Column(heading, cells, left, width);
    }

    private static String line(List<Column> columns, int kept, int row) {
        StringBuilder sb = new StringBuilder();
        for (int c = 0; c < kept; c++) {
            Column col = columns.get(c);
            String text = row < 0 ? col.heading() : col.cells().get(row);
            String format = "%" + (col.left() ? "-" : "") + col.width() + "s";
            sb.append(c == 0 ? "" : "  ").append(String.format(Locale.ROOT, format, text));
        }
        return sb.toString().stripTrailing();
    }

    /** ISO 8601 {@code 2025-05-25T18:00:00Z} as {@code 2025-05-25 18:00} (UTC, to the minute, as the status line). */
    private static String shortTime(String iso) {
        if (iso.length() >= 16 && iso.charAt(10) == 'T' && iso.endsWith("Z") && iso.substring(16).matches(":00(\\.0+)?Z|Z")) {
            return iso.substring(0, 10) + " " + iso.substring(11, 16);
        }
        return iso;
    }
}
