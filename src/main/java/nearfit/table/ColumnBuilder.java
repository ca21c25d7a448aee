package nearfit.table;

/**
 * One column's values as one parser thread reads them. Exactly one store is in use, chosen by the type:
 * doubles for numbers, longs for times, codes plus a dictionary for categories, counts only for text.
 * A category that outgrows {@link ChunkResult#MAX_LABELS} labels drops its codes and counts as text.
 */
final class ColumnBuilder {
    ColumnType type;
    DoubleChunks numbers;
    LongChunks times;
    IntChunks codes;
    LabelDictionary labels;
    int size;
    long missing;
    long bad;

    ColumnBuilder(ColumnType type) {
        this.type = type;
        switch (type) {
            case NUMBER -> numbers = new DoubleChunks();
            case TIME -> times = new LongChunks();
            case CATEGORY -> {
                codes = new IntChunks();
                labels = new LabelDictionary();
            }
            case TEXT -> { }
        }
    }

    void addMissing() {
        size++;
        missing++;
        switch (type) {
            case NUMBER -> numbers.add(Double.NaN);
            case TIME -> times.add(TimeColumn.MISSING);
            case CATEGORY -> codes.add(CategoryColumn.MISSING);
            case TEXT -> { }
        }
    }

    /** Adds a number already read (by {@link PlainRowReader}); only for a number column. */
    void addNumber(double v) {
        size++;
        numbers.add(v);
    }

    /**
     * Adds {@code v[0, n)}, numbers read from a file's binary values: NaN is a missing cell, an infinity a bad
     * one (a reading is never infinite), both stored as NaN. Rewrites those in {@code v}. Only for a number column.
     */
    void addNumbers(double[] v, int n) {
        for (int i = 0; i < n; i++) {
            double x = v[i];
            if (x - x != 0) { // NaN or infinite: rare, so one test on the common path
                missing++;
                if (x == x) {
                    bad++;
                }
                v[i] = Double.NaN;
            }
        }
        size += n;
        numbers.addAll(v, n);
    }

    /**
     * Adds {@code n} cells: where {@code defined[i]} is 0 a missing cell, else the next of {@code v}'s numbers
     * (as {@link #addNumbers}). Only for a number column.
     */
    void addNumbersAndNulls(double[] v, byte[] defined, int n) {
        int k = 0;
        for (int i = 0; i < n; i++) {
            double x = Double.NaN;
            if (defined[i] != 0) {
                x = v[k++];
            }
            if (x - x != 0) {
                missing++;
                if (x == x) {
                    bad++;
                }
                x = Double.NaN;
            }
            numbers.add(x);
        }
        size += n;
    }

    /**
     * Adds the cell {@code b[s..e)}.
     *
     * @param scratchInUse whether {@code b} is {@code scratch} itself (then a decimal comma is replaced
     *     in place, which is safe because the bytes are not read again)
     * @return false when the cell is a bad cell (present but not of the column's type)
     */
    boolean add(byte[] b, int s, int e, boolean decimalComma, byte[] scratch, boolean scratchInUse) {
        if (type == ColumnType.NUMBER) {
            // Hot path: most cells are plain decimals with no spaces, read in one pass.
            double v = CellText.parsePlainDecimal(b, s, e, decimalComma ? (byte) ',' : (byte) '.');
            if (v == v) {
                size++;
                numbers.add(v);
                return true;
            }
        }
        s = CellText.trimStart(b, s, e);
        e = CellText.trimEnd(b, s, e);
        if (CellText.isMissing(b, s, e)) {
            addMissing();
            return true;
        }
        size++;
        switch (type) {
            case NUMBER -> {
                double v = CellText.parseNumber(b, s, e, decimalComma, scratchInUse ? b : scratch);
                // A reading is never infinite: Infinity or 1e999 is a bad cell, read as missing.
                boolean bad = !Double.isFinite(v);
                numbers.add(bad ? Double.NaN : v);
                return countBad(bad);
            }
            case TIME -> {
                long t = TimeParser.parse(b, s, e);
                times.add(t);
                return countBad(t == TimeParser.NOT_A_TIME);
            }
            case CATEGORY -> {
                codes.add(labels.codeOf(b, s, e));
                if (labels.size() > ChunkResult.MAX_LABELS) {
                    becomeText();
                }
                return true;
            }
            default -> {
                return true;
            }
        }
    }

    private boolean countBad(boolean isBad) {
        if (isBad) {
            missing++;
            bad++;
        }
        return !isBad;
    }

    void becomeText() {
        type = ColumnType.TEXT;
        codes = null;
        labels = null;
    }
}
