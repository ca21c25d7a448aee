package nearfit.table;

import java.io.EOFException;
import java.io.IOException;
import java.io.InputStream;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.atomic.AtomicLong;
import java.util.function.BooleanSupplier;
import java.util.zip.ZipException;

/**
 * Parses the rows of one stretch of input into column chunks: one instance per thread and stretch.
 *
 * <p>Rows are taken while they start before {@code stopAt}; the last one may run past it. Line numbers
 * count from {@code firstLine}, which is 0 for a stretch whose true first line is not yet known (the
 * caller adds it later). Failures are kept, not thrown, because a stretch parsed from a wrong guess of
 * where a row starts is thrown away; {@link ChunkResult#failure} holds the first one.
 */
final class ChunkParser {
    /** The longest row accepted, in bytes; longer ones are reported as an error. */
    static final int MAX_ROW_BYTES = 1 << 20;
    static final int BUFFER_BYTES = 2 << 20;

    private final Layout layout;
    private final String source;
    private final boolean gzip;
    private final Shared shared;

    /** Counters and signals shared by the threads of one load. */
    record Shared(AtomicLong bytes, AtomicLong rows, long totalBytes, LoadProgress progress,
            BooleanSupplier cancel) {
    }

    ChunkParser(Layout layout, String source, boolean gzip, Shared shared) {
        this.layout = layout;
        this.source = source;
        this.gzip = gzip;
        this.shared = shared;
    }

    /** Parses from {@code in}, positioned at absolute offset {@code start}, until a row starts at {@code stopAt}. */
    ChunkResult parse(InputStream in, long start, long stopAt, long firstLine) {
        ChunkResult r = new ChunkResult(layout, firstLine);
        RowTokenizer tok = new RowTokenizer(layout.delimiter());
        PlainRowReader plain = new PlainRowReader(layout);
        byte[] buf = new byte[BUFFER_BYTES];
        long bufOffset = start;
        int pos = 0;
        int limit = 0;
        boolean eof = false;
        long line = firstLine;
        long rowsAtBlock = 0;
        while (true) {
            if (shared.cancel().getAsBoolean() || Thread.currentThread().isInterrupted()) {
                throw new LoadCancelledException(source);
            }
            if (!eof) {
                System.arraycopy(buf, pos, buf, 0, limit - pos);
                bufOffset += pos;
                limit -= pos;
                pos = 0;
                int n;
                try {
                    n = in.read(buf, limit, buf.length - limit);
                } catch (java.io.InterruptedIOException | java.nio.channels.ClosedByInterruptException ex) {
                    throw new LoadCancelledException(source);
                } catch (IOException ex) {
                    r.fail(line, readFailure(ex, line), !gzip);
                    return r.end(bufOffset, line);
                }
                if (n < 0) {
                    eof = true;
                } else {
                    limit += n;
                    report(n, r.rows() - rowsAtBlock);
                    rowsAtBlock = r.rows();
                }
            }
            while (true) {
                if (bufOffset + pos >= stopAt) {
                    return r.end(bufOffset + pos, line);
                }
                int fast = plain.read(buf, pos, limit);
                if (fast >= 0) {
                    r.plainRow(buf, plain, line);
                    line++;
                    pos = fast;
                    continue;
                }
                int next = tok.next(buf, pos, limit, eof);
                if (next == RowTokenizer.END) {
                    report(0, r.rows() - rowsAtBlock);
                    return r.end(bufOffset + pos, line);
                }
                if (next == RowTokenizer.UNCLOSED_QUOTE) {
                    r.fail(line, "the quote opened on this line is never closed", true);
                    return r.end(bufOffset + pos, line);
                }
                if (next == RowTokenizer.NEED_MORE ? limit - pos > MAX_ROW_BYTES : next - pos > MAX_ROW_BYTES) {
                    r.fail(line, "line over 1 MB (a quote never closed, or not a CSV file?)", true);
                    return r.end(bufOffset + pos, line);
                }
                if (next == RowTokenizer.NEED_MORE) {
                    break;
                }
                r.row(buf, tok, line);
                line += tok.newlines();
                pos = next;
            }
        }
    }

    private void report(long bytes, long rows) {
        long b = shared.bytes().addAndGet(bytes);
        long n = shared.rows().addAndGet(rows);
        shared.progress().update(b, shared.totalBytes(), n);
    }

    /** The words for a read failure after the rows before {@code line}. */
    private String readFailure(IOException ex, long line) {
        long after = line - 1;
        if (gzip && ex instanceof EOFException) {
            return "truncated gzip stream after line " + after + "; the rows read are not used";
        }
        if (gzip && ex instanceof ZipException) {
            return "damaged gzip stream after line " + after + " (" + ex.getMessage() + ")";
        }
        return "read error: " + ex.getMessage();
    }

    /** Examples kept while parsing; shared helper for ragged rows and bad cells. */
    static void keep(List<BadCell> list, long line, String column, String text) {
        if (list.size() < LoadReport.EXAMPLES) {
            list.add(new BadCell(line, column, text.length() > 80 ? text.substring(0, 80) : text));
        }
    }

    static List<BadCell> newExamples() {
        return new ArrayList<>(LoadReport.EXAMPLES);
    }
}
