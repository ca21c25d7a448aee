package nearfit.table;

import java.util.List;

/**
 * The columns, line numbers, counts and examples one {@link ChunkParser} produced for one stretch of
 * input, plus where the stretch ended. Line numbers are as the parser counted them (see
 * {@link #shiftLines}).
 */
final class ChunkResult {
    /** A category with more labels than this becomes text: it is not a group any more. */
    static final int MAX_LABELS = 1 << 16;

    final Layout layout;
    final ColumnBuilder[] columns;
    final LongChunks lines = new LongChunks();
    final List<BadCell> raggedExamples = ChunkParser.newExamples();
    final List<BadCell> badExamples = ChunkParser.newExamples();
    final long firstLine;
    long shortRows;
    long longRows;
    long endOffset;
    long endLine;
    /** For unescaped fields and decimal commas; grows to the longest field that needs it. */
    private byte[] scratch = new byte[256];
    /** The first failure, or null; thrown by the loader only if this stretch is kept. */
    Failure failure;

    /** A failure found while parsing; {@code atLine} says whether the message is prefixed with the line. */
    record Failure(long line, String detail, boolean atLine) {
    }

    ChunkResult(Layout layout, long firstLine) {
        this.layout = layout;
        this.firstLine = firstLine;
        columns = new ColumnBuilder[layout.fields().length];
        for (int j = 0; j < columns.length; j++) {
            columns[j] = new ColumnBuilder(layout.types()[j]);
        }
    }

    int rows() {
        return lines.size();
    }

    void fail(long line, String detail, boolean atLine) {
        if (failure == null) {
            failure = new Failure(line, detail, atLine);
        }
    }

    ChunkResult end(long offset, long line) {
        endOffset = offset;
        endLine = line;
        return this;
    }

    /**
     * Adds one tokenized row that starts on {@code line}; blank lines are skipped. A ragged row (more
     * or fewer fields than the header) is counted and not used at all: with a field missing or one too
     * many, nothing says which field it was, so keeping its cells in order would put values after the
     * gap into other columns (a decimal comma splitting a number moved rotor speeds into oil temperature).
     */
    void row(byte[] b, RowTokenizer tok, long line) {
        int n = tok.fields();
        if (n == 1 && !tok.quoted(0) && tok.contentEnd(0) == tok.contentStart(0)) {
            return;
        }
        int width = layout.width();
        if (n != width) {
            ragged(n, width, line);
            return;
        }
        int[] fields = layout.fields();
        for (int j = 0; j < columns.length; j++) {
            int f = fields[j];
            ColumnBuilder c = columns[j];
            if (tok.rawEnd(f) - tok.rawStart(f) > scratch.length) {
                scratch = new byte[Math.max(tok.rawEnd(f) - tok.rawStart(f), 2 * scratch.length)];
            }
            byte[] src = b;
            int s;
            int e;
            if (tok.needsUnescape(f)) {
                src = scratch;
                s = 0;
                e = RowTokenizer.unescape(b, tok.rawStart(f), tok.rawEnd(f), scratch);
            } else {
                s = tok.contentStart(f);
                e = tok.contentEnd(f);
            }
            if (!c.add(src, s, e, layout.decimalComma(), scratch, src == scratch)) {
                keepBad(line, j, src, s, e);
            }
        }
        lines.add(line);
    }

    /** Adds the row {@code reader} just accepted, which starts on {@code line}. */
    void plainRow(byte[] b, PlainRowReader reader, long line) {
        for (int j = 0; j < columns.length; j++) {
            ColumnBuilder c = columns[j];
            if (layout.types()[j] == ColumnType.NUMBER) {
                c.addNumber(reader.values[j]);
                continue;
            }
            int s = reader.starts[j];
            int e = reader.ends[j];
            if (e - s > scratch.length) {
                scratch = new byte[Math.max(e - s, 2 * scratch.length)];
            }
            if (!c.add(b, s, e, layout.decimalComma(), scratch, false)) {
                keepBad(line, j, b, s, e);
            }
        }
        lines.add(line);
    }

    private void ragged(int n, int width, long line) {
        if (n < width) {
            shortRows++;
        } else {
            longRows++;
        }
        ChunkParser.keep(raggedExamples, line, null, n + " fields, not " + width + "; row dropped");
    }

    private void keepBad(long line, int column, byte[] b, int s, int e) {
        if (badExamples.size() < LoadReport.EXAMPLES) {
            String text = new String(b, s, Math.min(e - s, 320), java.nio.charset.StandardCharsets.UTF_8);
            ChunkParser.keep(badExamples, line, layout.names().get(column), text);
        }
    }

    /** Adds {@code delta} to every line number held, once the stretch's true first line is known. */
    void shiftLines(long delta) {
        if (delta == 0) {
            return;
        }
        lines.addToAll(delta);
        shift(raggedExamples, delta);
        shift(badExamples, delta);
        if (failure != null) {
            failure = new Failure(failure.line() + delta, failure.detail(), failure.atLine());
        }
    }

    private static void shift(List<BadCell> list, long delta) {
        for (int i = 0; i < list.size(); i++) {
            BadCell c = list.get(i);
            list.set(i, new BadCell(c.line() + delta, c.column(), c.text()));
        }
    }
}
