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
