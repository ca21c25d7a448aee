package nearfit.table;

import java.nio.charset.StandardCharsets;
import java.util.Arrays;

/**
 * Splits UTF-8 bytes into rows and fields by RFC 4180 section 2: fields separated by a delimiter, rows by
 * LF or CRLF, a field in double quotes may hold delimiters, line breaks and doubled quotes.
 *
 * <p>Lenient where the RFC is silent: a quote inside an unquoted field is literal, and text after a
 * closing quote is kept as part of the field. One instance is reused for every row of one thread; the
 * field bounds of the last row stay valid until the next call.
 */
final class RowTokenizer {
    /** The row is incomplete: more input is needed. */
    static final int NEED_MORE = -1;
    /** No row: the input ended. */
    static final int END = -2;
    /** The input ended inside a quoted field. */
    static final int UNCLOSED_QUOTE = -3;

    private final byte delimiter;
    private int[] start = new int[64];
    private int[] end = new int[64];
    /** 0 plain, 1 simple quoted (content is start+1..end-1), 2 needs {@link #unescape}. */
    private byte[] kind = new byte[64];
    private int fields;
    private int newlines;
    private boolean doubled;

    RowTokenizer(char delimiter) {
        this.delimiter = (byte) delimiter;
    }

    /**
     * Reads one row from {@code b[p..limit)}.
     *
     * @param eof whether {@code limit} is the end of the input
     * @return the position after the row's terminator, or {@link #NEED_MORE}, {@link #END},
     *     {@link #UNCLOSED_QUOTE}
     */
    int next(byte[] b, int p, int limit, boolean eof) {
        if (p >= limit) {
            return eof ? END : NEED_MORE;
        }
        fields = 0;
        newlines = 0;
        final byte d = delimiter;
        while (true) {
            int fieldStart = p;
            int quoteEnd = -1; // index after the closing quote of a quoted field
            doubled = false;
            if (p < limit && b[p] == '"') {
                int q = closingQuote(b, p + 1, limit);
                if (q == NEED_MORE) {
                    return eof ? UNCLOSED_QUOTE : NEED_MORE;
                }
                if (q == QUOTE_AT_LIMIT) {
                    if (!eof) {
                        return NEED_MORE;
                    }
                    q = limit - 1;
                }
                quoteEnd = q + 1;
                p = quoteEnd;
            }
            p = FieldScan.next(b, p, limit, d);
            if (p >= limit && !eof) {
                return NEED_MORE;
            }
            boolean rowEnds = p >= limit || b[p] == '\n';
            int fieldEnd = p;
            if (rowEnds && fieldEnd > fieldStart && b[fieldEnd - 1] == '\r' && fieldEnd - 1 >= quoteEnd) {
                fieldEnd--;
            }
            byte k = quoteEnd < 0 ? 0 : (doubled || fieldEnd > quoteEnd) ? (byte) 2 : (byte) 1;
            add(fieldStart, fieldEnd, k);
            if (rowEnds) {
                if (p < limit) {
                    newlines++;
                    return p + 1;
                }
                return limit;
            }
            p++; // the delimiter
        }
    }

    /**
     * Finds the closing quote of a quoted field whose content starts at {@code p}, counting line breaks
     * and noting doubled quotes. Returns its index, {@link #NEED_MORE}, or {@link #QUOTE_AT_LIMIT} when a
     * quote is the last byte available (closing at the end of input, or the first of a doubled pair).
     */
    private int closingQuote(byte[] b, int p, int limit) {
        while ((p = FieldScan.nextQuoteOrNewline(b, p, limit)) < limit) {
            byte c = b[p];
            if (c == '"') {
                if (p + 1 >= limit) {
                    return QUOTE_AT_LIMIT;
                }
                if (b[p + 1] == '"') {
                    doubled = true;
                    p += 2;
                    continue;
                }
                return p;
            }
            if (c == '\n') {
                newlines++;
            }
            p++;
        }
        return NEED_MORE;
    }

    private static final int QUOTE_AT_LIMIT = -4;

    private void add(int s, int e, byte k) {
        if (fields == start.length) {
            int n = fields * 2;
            start = Arrays.copyOf(start, n);
            end = Arrays.copyOf(end, n);
            kind = Arrays.copyOf(kind, n);
        }
        start[fields] = s;
        end[fields] = e;
        kind[fields] = k;
        fields++;
    }

    int fields() {
        return fields;
    }

    /** Line breaks inside the last row, its terminator included. */
    int newlines() {
        return newlines;
    }

    /** Start of field {@code i}'s content (inside the quotes for a simple quoted field). */
    int contentStart(int i) {
        return kind[i] == 1 ? start[i] + 1 : start[i];
    }

    /** End (exclusive) of field {@code i}'s content. */
    int contentEnd(int i) {
        return kind[i] == 1 ? end[i] - 1 : end[i];
    }

    /** Whether field {@code i} has doubled quotes or text after its closing quote. */
    boolean needsUnescape(int i) {
        return kind[i] == 2;
    }

    /** Start of field {@code i} as written, quotes included. */
    int rawStart(int i) {
        return start[i];
    }

    /** End (exclusive) of field {@code i} as written. */
    int rawEnd(int i) {
        return end[i];
    }

    /** Whether field {@code i} was quoted. */
    boolean quoted(int i) {
        return kind[i] != 0;
    }

    /** Field {@code i}'s text, quotes removed and doubled quotes undone. */
    String text(byte[] b, int i) {
        if (kind[i] != 2) {
            return new String(b, contentStart(i), contentEnd(i) - contentStart(i), StandardCharsets.UTF_8);
        }
        byte[] out = new byte[end[i] - start[i]];
        int n = unescape(b, start[i], end[i], out);
        return new String(out, 0, n, StandardCharsets.UTF_8);
    }

    /** Writes the content of a quoted raw field {@code b[s..e)} into {@code out}; returns its length. */
    static int unescape(byte[] b, int s, int e, byte[] out) {
        int n = 0;
        int p = s + 1;
        while (p < e) {
            byte c = b[p];
            if (c == '"') {
                if (p + 1 < e && b[p + 1] == '"') {
                    out[n++] = '"';
                    p += 2;
                    continue;
                }
                p++;
                break; // closing quote
            }
            out[n++] = c;
            p++;
        }
        while (p < e) {
            out[n++] = b[p++];
        }
        return n;
    }
}
