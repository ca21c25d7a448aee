package nearfit.table;

import java.util.ArrayList;
import java.util.List;

/**
 * What the loader found in the file, for the explorer's load-report panel and anyone else who lists
 * it: the {@link LoadReport} and the missing cells of each column that has any.
 *
 * @param report  the loader's report
 * @param columns the columns with blank or bad cells, in file order
 * @param source  what the gaps' first lines are (CSV lines, or Parquet file and row index): the table's
 */
public record LoadNotes(LoadReport report, List<ColumnGaps> columns, RowSource source) {
    /** Lines of missing cells kept per column. */
    public static final int FIRST_LINES = 3;

    /** Copies the list so that the record stays immutable. */
    public LoadNotes {
        columns = List.copyOf(columns);
        java.util.Objects.requireNonNull(source, "source");
    }

    /** Notes of a CSV, whose gaps are listed by line. */
    public LoadNotes(LoadReport report, List<ColumnGaps> columns) {
        this(report, columns, RowSource.CSV_LINES);
    }

    /**
     * One note per loader warning about the file (it grew, was touched or deleted while read), one per
     * column with blank cells, per column with bad cells, and one for ragged rows.
     */
    public int count() {
        int n = report.warnings().size() + (report.raggedRows() > 0 ? 1 : 0);
        for (ColumnGaps c : columns) {
            n += (c.blank() > 0 ? 1 : 0) + (c.bad() > 0 ? 1 : 0);
        }
        return n;
    }

    /**
     * The notes of a loaded table. Each column with missing cells is scanned until its first
     * {@link #FIRST_LINES} are found: at most one pass over the column, and far less when gaps are common.
     */
    public static LoadNotes of(Table table) {
        LoadReport report = table.report();
        List<ColumnGaps> out = new ArrayList<>();
        for (Column c : table.columns()) {
            if (c.missingCount() == 0) {
                continue;
            }
            List<BadCell> bad = new ArrayList<>();
            for (BadCell b : report.badExamples()) {
                if (c.name().equals(b.column())) {
                    bad.add(b);
                }
            }
            // When every bad cell of the column is among the examples, the other missing cells are blank.
            boolean blankOnly = bad.size() == c.badCount();
            long blank = c.missingCount() - c.badCount();
            List<Long> first = blankOnly && blank == 0 ? List.of() : firstMissing(table, c, blankOnly ? bad : List.of());
            out.add(new ColumnGaps(c.name(), blank, c.badCount(), first, blankOnly, bad));
        }
        return new LoadNotes(report, out, table.rowSource());
    }

    private static List<Long> firstMissing(Table table, Column c, List<BadCell> skip) {
        List<Long> lines = new ArrayList<>(FIRST_LINES);
        int n = table.rowCount();
        for (int row = 0; row < n && lines.size() < FIRST_LINES; row++) {
            if (c.isMissing(row)) {
                long line = table.lineOf(row);
                if (!isListed(skip, line)) {
                    lines.add(line);
                }
            }
        }
        return lines;
    }

    private static boolean isListed(List<BadCell> cells, long line) {
        for (BadCell b : cells) {
            if (b.line() == line) {
                return true;
            }
        }
        return false;
    }
}
