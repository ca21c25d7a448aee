package nearfit.table;

import java.util.ArrayList;
import java.util.List;

/**
 * Joins the stretches parsed by the loader's threads into one {@link Table}: the first stretch's stores are
 * kept, later ones are appended chunk by chunk and released as they go, so the join needs at most one
 * extra chunk per column. Category codes of later stretches are renumbered into the first's dictionary.
 */
final class TableAssembly {
    private TableAssembly() {
    }

    static Table assemble(String source, Layout layout, List<ChunkResult> parts, long bytes, long nanos) {
        return assemble(source, layout, parts, bytes, nanos, RowSource.CSV_LINES);
    }

    /** As above, with the meaning of the parts' source-row values (Parquet files and row indexes). */
    static Table assemble(String source, Layout layout, List<ChunkResult> parts, long bytes, long nanos,
                          RowSource rowSource) {
        for (ChunkResult p : parts) {
            if (p.failure != null) {
                ChunkResult.Failure f = p.failure;
                throw f.atLine() ? NearfitException.atLine(source, f.line(), f.detail())
                        : NearfitException.inFile(source, f.detail());
            }
        }
        ChunkResult first = parts.get(0);
        long shortRows = 0;
        long longRows = 0;
        List<BadCell> ragged = new ArrayList<>();
        List<BadCell> bad = new ArrayList<>();
        for (ChunkResult p : parts) {
            shortRows += p.shortRows;
            longRows += p.longRows;
            addExamples(ragged, p.raggedExamples);
            addExamples(bad, p.badExamples);
            if (p != first) {
                first.lines.drainFrom(p.lines);
            }
        }
        int rows = first.lines.size();
        if (rows == 0 && shortRows + longRows > 0) {
            throw NearfitException.inFile(source, "no data rows: all " + (shortRows + longRows)
                    + " rows have another number of fields than the " + (layout.header() ? "header" : "first row")
                    + " (" + layout.width() + "), so none is used");
        }
        if (rows == 0) {
            throw NearfitException.inFile(source, layout.header() ? "header only: no data rows" : "no data rows");
        }
        List<Column> columns = new ArrayList<>();
        long badCells = 0;
        for (int j = 0; j < first.columns.length; j++) {
            Column c = join(layout.names().get(j), parts, j, rows);
            badCells += c.badCount();
            columns.add(c);
        }
        LoadReport report = new LoadReport(source, rows, bytes, layout.delimiter(), layout.header(),
                layout.decimalComma(), shortRows, longRows, ragged, badCells, bad, nanos, layout.notes());
        return new Table(columns, first.lines, report, rowSource);
    }

    private static void addExamples(List<BadCell> into, List<BadCell> from) {
        for (BadCell c : from) {
            if (into.size() < LoadReport.EXAMPLES) {
                into.add(c);
            }
        }
    }

    private static Column join(String name, List<ChunkResult> parts, int j, int rows) {
        ColumnBuilder head = parts.get(0).columns[j];
        long missing = 0;
        long bad = 0;
        boolean text = false;
        for (ChunkResult p : parts) {
            ColumnBuilder c = p.columns[j];
            missing += c.missing;
            bad += c.bad;
            text |= c.type == ColumnType.TEXT;
        }
        if (text) {
            return new TextColumn(name, rows, missing);
        }
        switch (head.type) {
            case NUMBER -> {
                for (int i = 1; i < parts.size(); i++) {
                    head.numbers.drainFrom(parts.get(i).columns[j].numbers);
                }
                return new DecimalColumn(name, head.numbers, missing, bad);
            }
            case TIME -> {
                for (int i = 1; i < parts.size(); i++) {
                    head.times.drainFrom(parts.get(i).columns[j].times);
                }
                return new TimeColumn(name, head.times, missing, bad);
            }
            default -> {
                return joinCategory(name, parts, j, rows, missing);
            }
        }
    }

    private static Column joinCategory(String name, List<ChunkResult> parts, int j, int rows, long missing) {
        ColumnBuilder head = parts.get(0).columns[j];
        LabelDictionary dict = head.labels;
        for (int i = 1; i < parts.size(); i++) {
            ColumnBuilder c = parts.get(i).columns[j];
            int[] map = new int[c.labels.size()];
            for (int code = 0; code < map.length; code++) {
                map[code] = dict.codeOf(c.labels.label(code));
            }
            if (dict.size() > ChunkResult.MAX_LABELS) {
                return new TextColumn(name, rows, missing);
            }
            c.codes.remap(map);
            head.codes.drainFrom(c.codes);
        }
        return new CategoryColumn(name, head.codes, dict.labels(), missing);
    }
}
