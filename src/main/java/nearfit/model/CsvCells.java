package nearfit.model;

/**
 * Cell text for CSV files the tool writes.
 *
 * <p>Text cells that a spreadsheet would take for a formula are neutralised as the OWASP guidance on
 * CSV injection describes: a cell starting with {@code =}, {@code +}, {@code -}, {@code @}, tab or
 * carriage return gets a leading single quote. Numbers are written by {@link #number(double)}, never
 * through {@link #text(String)}, so a negative reading stays a number.
 */
public final class CsvCells {
    private CsvCells() {
    }

    /** A text cell, neutralised when it could be read as a formula. */
    public static String text(String s) {
        if (s == null || s.isEmpty()) {
            return "";
        }
        char c = s.charAt(0);
        if (c == '=' || c == '+' || c == '-' || c == '@' || c == '\t' || c == '\r') {
            return "'" + s;
        }
        return s;
    }

    /**
     * A number cell: empty for NaN (missing), whole numbers without a fraction, others in Java's
     * round-trip decimal form, so that reading the cell back gives the same double.
     */
    public static String number(double v) {
        if (Double.isNaN(v)) {
            return "";
        }
        if (Double.isInfinite(v)) {
            return v > 0 ? "inf" : "-inf";
        }
        if (v == Math.rint(v) && Math.abs(v) < 1e15) {
            return Long.toString((long) v);
        }
        return Double.toString(v);
    }
}
