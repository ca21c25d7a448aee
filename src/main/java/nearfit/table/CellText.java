package nearfit.table;

import ch.randelshofer.fastdoubleparser.JavaDoubleParser;

/** Reading one cell's bytes: missing-value tokens, trimming, and numbers (with a decimal comma or not). */
final class CellText {
    private CellText() {
    }

    /**
     * Whether {@code b[s..e)} (already trimmed) is a missing-value token: empty, NA, NaN, null, n/a or -,
     * case-insensitive (common practice in exported logs; the same set pandas reads as missing by default).
     */
    static boolean isMissing(byte[] b, int s, int e) {
        switch (e - s) {
            case 0:
                return true;
            case 1:
                return b[s] == '-';
            case 2:
                return lower(b[s]) == 'n' && lower(b[s + 1]) == 'a';
            case 3:
                return (lower(b[s]) == 'n' && lower(b[s + 1]) == 'a' && lower(b[s + 2]) == 'n')
                        || (lower(b[s]) == 'n' && b[s + 1] == '/' && lower(b[s + 2]) == 'a');
            case 4:
                return lower(b[s]) == 'n' && lower(b[s + 1]) == 'u' && lower(b[s + 2]) == 'l'
                        && lower(b[s + 3]) == 'l';
            default:
                return false;
        }
    }

    private static int lower(byte c) {
        return c | 0x20;
    }

    /** The first index at or after {@code s} that is not a space or tab. */
    static int trimStart(byte[] b, int s, int e) {
        while (s < e && (b[s] == ' ' || b[s] == '\t')) {
            s++;
        }
        return s;
    }

    /** The index after the last byte before {@code e} that is not a space or tab. */
    static int trimEnd(byte[] b, int s, int e) {
        while (e > s && (b[e - 1] == ' ' || b[e - 1] == '\t')) {
            e--;
        }
        return e;
    }

    /**
     * The number in {@code b[s..e)} (trimmed, not missing), or NaN when it is not one. Only decimal
     * notation is accepted (digits, sign, point, exponent; Infinity too), not Java's hexadecimal or
     * {@code d}/{@code f} suffixes. With {@code decimalComma}, a comma is the decimal separator.
     *
     * @param scratch at least {@code e - s} bytes, used when a comma must become a point
     */
    static double parseNumber(byte[] b, int s, int e, boolean decimalComma, byte[] scratch) {
        double fast = parsePlainDecimal(b, s, e, decimalComma ? (byte) ',' : (byte) '.');
        if (fast == fast) {
            return fast;
        }
        byte last = b[e - 1];
        if ((last < '0' || last > '9') && last != '.' && last != 'y' && !(decimalComma && last == ',')) {
            return Double.NaN; // rejects 1.0d, 2f, 0x1p3 and most words cheaply
        }
        if (decimalComma) {
            int n = e - s;
            boolean comma = false;
            for (int i = 0; i < n; i++) {
                byte c = b[s + i];
                if (c == ',') {
                    comma = true;
                    c = '.';
                }
                scratch[i] = c;
            }
            if (comma) {
                return parseDecimal(scratch, 0, n);
            }
        }
        return parseDecimal(b, s, e - s);
    }

    /** Exact powers of ten up to 10^22, the largest that a double holds exactly. */
    private static final double[] POW10 = {1e0, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11,
        1e12, 1e13, 1e14, 1e15, 1e16, 1e17, 1e18, 1e19, 1e20, 1e21, 1e22};

    /**
     * The common case of a logged reading, {@code [-+]digits[.digits]} with a mantissa below 2^53 and at
     * most 22 decimals, done exactly: both m and 10^k are exact doubles, so m / 10^k is one correctly
     * rounded division (Clinger 1990, "How to read floating point numbers accurately", the fast path).
     * NaN when the text is not of that form; the caller then tries the general parser.
     */
    static double parsePlainDecimal(byte[] b, int s, int e, byte point) {
        int i = s;
        boolean negative = false;
        if (i < e && (b[i] == '-' || b[i] == '+')) {
            negative = b[i] == '-';
            i++;
        }
        long m = 0;
        int digits = 0;
        int decimals = -1;
        for (; i < e; i++) {
            int d = b[i] - '0';
            if (d >= 0 && d <= 9) {
                m = m * 10 + d;
                digits++;
                if (decimals >= 0) {
                    decimals++;
                }
            } else if (b[i] == point && decimals < 0) {
                decimals = 0;
            } else {
                return Double.NaN;
            }
        }
        if (digits == 0 || digits > 18 || m > (1L << 53) || decimals > 22) {
            return Double.NaN;
        }
        double v = decimals <= 0 ? (double) m : m / POW10[decimals];
        return negative ? -v : v;
    }

    private static double parseDecimal(byte[] b, int off, int len) {
        for (int i = off, end = off + Math.min(len, 3); i < end; i++) { // hex needs 0x within 3 bytes
            byte c = b[i];
            if (c == 'x' || c == 'X') {
                return Double.NaN;
            }
        }
        try {
            return JavaDoubleParser.parseDouble(b, off, len);
        } catch (NumberFormatException ex) {
            return Double.NaN; // the caller counts a bad cell
        }
    }
}
