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
                numbers.add(v);
                return countBad(Double.isNaN(v));
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
