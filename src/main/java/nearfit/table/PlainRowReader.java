package nearfit.table;

/**
 * Reads the common row of an equipment log in a single pass over its bytes: exactly {@code width}
 * unquoted fields ended by LF or CRLF, with every number column holding a plain decimal
 * {@code [-+]digits[.digits]} (no spaces, at most 18 digits, mantissa at most 2^53, at most 22 decimals).
 * The number is built while the delimiter is searched for, so its bytes are read once.
 *
 * <p>Any other row (a quote at a field's start, a missing or bad number, a ragged or blank row, a row not
 * complete in the buffer) is declined with {@link #NOT_PLAIN} and nothing is stored; the caller then
 * reads it with {@link RowTokenizer}, which handles everything. So this class must only be right about
 * the rows it accepts: for those it gives exactly the fields and values the general path gives
 * ({@link CellText#parsePlainDecimal} is the same arithmetic: Clinger's exact fast path).
 *
 * <p>One instance per parser thread; the values of the last accepted row stay valid until the next call.
 */
final class PlainRowReader {
    /** The row is not of the plain form (or not complete): read it with the tokenizer. */
    static final int NOT_PLAIN = -1;

    /** Exact powers of ten up to 10^22, the largest that a double holds exactly. */
    private static final double[] POW10 = {1e0, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11,
        1e12, 1e13, 1e14, 1e15, 1e16, 1e17, 1e18, 1e19, 1e20, 1e21, 1e22};
    private static final long MAX_EXACT = 1L << 53;

    private final byte delimiter;
    private final byte point;
    private final int width;
    /** For each field of a row, the kept column it feeds, or -1. */
    private final int[] columnOfField;
    /** For each field, whether it feeds a number column (parsed inline). */
    private final boolean[] numberField;
    /** Per kept column: the value of the last row (number columns). */
    final double[] values;
    /** Per kept column: the content bounds in the buffer of the last row (other columns). */
    final int[] starts;
    final int[] ends;
    /** The digits of the last decimal read, as an integer, and how many of them follow the point. */
    private long mantissa;
    private int decimals;

    PlainRowReader(Layout layout) {
        delimiter = (byte) layout.delimiter();
        point = layout.decimalComma() ? (byte) ',' : (byte) '.';
        width = layout.width();
        columnOfField = new int[width];
        numberField = new boolean[width];
        java.util.Arrays.fill(columnOfField, -1);
        int[] fields = layout.fields();
        for (int j = 0; j < fields.length; j++) {
            columnOfField[fields[j]] = j;
            numberField[fields[j]] = layout.types()[j] == ColumnType.NUMBER;
        }
        values = new double[fields.length];
        starts = new int[fields.length];
        ends = new int[fields.length];
    }

    /** Reads the row at {@code b[p..limit)}; returns the position after its line feed, or {@link #NOT_PLAIN}. */
    int read(byte[] b, int p, int limit) {
        int rowStart = p;
        int lastField = width - 1;
        for (int f = 0; f <= lastField; f++) {
            byte end = f == lastField ? (byte) '\n' : delimiter;
            p = numberField[f] ? number(b, p, limit, end, columnOfField[f]) : other(b, p, limit, end, f);
            if (p < 0 || p - rowStart > ChunkParser.MAX_ROW_BYTES) {
                return NOT_PLAIN;
            }
        }
        return p;
    }

    /** A plain decimal ended by {@code end} (or CR LF when {@code end} is LF); the position after it. */
    private int number(byte[] b, int p, int limit, byte end, int column) {
        int i = p;
        boolean negative = false;
        if (i < limit && (b[i] == '-' || b[i] == '+')) {
            negative = b[i] == '-';
            i++;
        }
        int after = i + 18 <= limit ? decimalByWords(b, i) : -1;
        if (after < 0) {
            after = decimalByBytes(b, i, limit);
        }
        if (after < 0 || after >= limit) {
            return NOT_PLAIN;
        }
        byte c = b[after];
        if (c == '\r' && end == '\n' && after + 1 < limit) {
            c = b[++after];
        }
        if (c != end) {
            return NOT_PLAIN;
        }
        long m = mantissa;
        int decimals = this.decimals;
        double v = decimals == 0 ? (double) m : m / POW10[decimals];
        values[column] = negative ? -v : v;
        return after + 1;
    }

    /**
     * {@code digits[.digits]} at {@code b[i..limit)} one byte at a time, into {@link #mantissa} and
     * {@link #decimals}; the position after it, or -1 unless there are 1 to 18 digits, the mantissa is at
     * most 2^53 and there are at most 22 decimals (so the value is exact by Clinger's fast path).
     */
    private int decimalByBytes(byte[] b, int i, int limit) {
        long m = 0;
        int from = i;
        int d;
        while (i < limit && (d = b[i] - '0') >= 0 && d <= 9) {
            m = m * 10 + d;
            i++;
        }
        int digits = i - from;
        int decimals = 0;
        if (i < limit && b[i] == point) {
            from = ++i;
            while (i < limit && (d = b[i] - '0') >= 0 && d <= 9) {
                m = m * 10 + d;
                i++;
            }
            decimals = i - from;
            digits += decimals;
        }
        if (digits == 0 || digits > 18 || m > MAX_EXACT || decimals > 22) {
            return -1;
        }
        mantissa = m;
        this.decimals = decimals;
        return i;
    }

    /**
     * As {@link #decimalByBytes} for up to 7 digits before and 7 after the point, eight bytes at a time
     * (needs 17 readable bytes at {@code i}); -1 for anything else, which the byte loop then decides.
     */
    int decimalByWords(byte[] b, int i) {
        long w = DigitWords.word(b, i);
        int n = DigitWords.leadingDigits(w);
        if (n == 8) {
            return -1;
        }
        long m = DigitWords.value(w, n);
        i += n;
        int k = 0;
        if (b[i] == point) {
            long f = DigitWords.word(b, ++i);
            k = DigitWords.leadingDigits(f);
            if (k == 8) {
                return -1;
            }
            m = m * DigitWords.POW10[k] + DigitWords.value(f, k);
            i += k;
        }
        if (n + k == 0) {
            return -1;
        }
        mantissa = m;
        decimals = k;
        return i;
    }

    /** A field of another column (or not kept), unquoted; the position after its end byte. */
    private int other(byte[] b, int p, int limit, byte end, int f) {
        if (p < limit && b[p] == '"') {
            return NOT_PLAIN;
        }
        int i = FieldScan.next(b, p, limit, delimiter);
        if (i >= limit || b[i] != end) {
            return NOT_PLAIN;
        }
        int e = end == '\n' && i > p && b[i - 1] == '\r' ? i - 1 : i;
        if (width == 1 && e == p) {
            return NOT_PLAIN; // a blank line: the general path skips it
        }
        int j = columnOfField[f];
        if (j >= 0) {
            starts[j] = p;
            ends[j] = e;
        }
        return i + 1;
    }
}
