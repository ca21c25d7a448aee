package nearfit.table;

import java.util.List;

/**
 * A column of few distinct labels (a group such as a turbine id), stored as {@code int} codes into a
 * dictionary. Code -1 marks a missing value; codes are numbered in order of first appearance in the file.
 */
public final class CategoryColumn implements Column {
    /** The code stored for a missing label. */
    public static final int MISSING = -1;

    private final String name;
    private final IntChunks codes;
    private final List<String> labels;
    private final long missing;

    CategoryColumn(String name, IntChunks codes, List<String> labels, long missing) {
        this.name = name;
        this.codes = codes;
        this.labels = List.copyOf(labels);
        this.missing = missing;
    }

    /** The label code at {@code row}, or {@link #MISSING}. */
    public int code(int row) {
        return codes.get(row);
    }

    /** The label at {@code row}, or {@code null} when missing. */
    public String label(int row) {
        int c = codes.get(row);
        return c == MISSING ? null : labels.get(c);
    }

    /** The dictionary: the label of code {@code i} is {@code labels().get(i)}. */
    public List<String> labels() {
        return labels;
    }

    /** The code of {@code label}, or {@link #MISSING} when the label does not occur. */
    public int codeOf(String label) {
        return labels.indexOf(label);
    }

    @Override
    public String name() {
        return name;
    }

    @Override
    public ColumnType type() {
        return ColumnType.CATEGORY;
    }

    @Override
    public int size() {
        return codes.size();
    }

    @Override
    public boolean isMissing(int row) {
        return codes.get(row) == MISSING;
    }

    @Override
    public long missingCount() {
        return missing;
    }

    /** Always 0: any text is a valid label. */
    @Override
    public long badCount() {
        return 0;
    }
}
