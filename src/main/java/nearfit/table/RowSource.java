package nearfit.table;

import java.util.List;

/**
 * What a table's source-row values ({@link Table#lineOf(int)}) mean: for CSV the 1-based line where a row
 * starts; for Parquet the file (of a data set) and the 0-based index of the row in it, packed into one
 * {@code long} as {@code file << 40 | row} (a file holds fewer than 2^40 rows). Faces print a row's origin
 * through {@link #label(long)} under {@link #heading()}.
 */
public final class RowSource {
    /** Rows numbered by CSV line. */
    public static final RowSource CSV_LINES = new RowSource(null);
    private static final int FILE_SHIFT = 40;
    private static final long ROW_MASK = (1L << FILE_SHIFT) - 1;
    /** The most files whose number fits above the row index in a positive {@code long}. */
    public static final int MAX_FILES = 1 << (63 - FILE_SHIFT);

    private final List<String> files;

    private RowSource(List<String> files) {
        if (files != null && (files.isEmpty() || files.size() > MAX_FILES)) {
            throw new IllegalArgumentException("Parquet rows come from 1 to " + MAX_FILES + " files, not " + files.size());
        }
        this.files = files == null ? null : List.copyOf(files);
    }

    /**
     * Rows of Parquet files, named as given (one name for a single file; for a data set, the folder as given
     * followed by the path within it). At most 2^23 files: the packed value stays positive.
     */
    public static RowSource parquet(List<String> files) {
        return new RowSource(files);
    }

    /** Packs a file's position in {@link #files()} and a row index. */
    static long pack(int file, long row) {
        return (long) file << FILE_SHIFT | row;
    }

    /** Whether rows are Parquet rows (file and row index) rather than CSV lines. */
    public boolean isParquet() {
        return files != null;
    }

    /** The Parquet files, in the order their rows are; empty for CSV. */
    public List<String> files() {
        return files == null ? List.of() : files;
    }

    /** "line" for CSV, "row" for Parquet: the heading of a column of {@link #label(long)}s. */
    public String heading() {
        return files == null ? "line" : "row";
    }

    /** The 0-based row index in its file of a Parquet source-row value (the value itself for CSV). */
    public long rowIndex(long value) {
        return files == null ? value : value & ROW_MASK;
    }

    /**
     * Whether {@code value} is a source-row value this source can hold: for Parquet a file number below
     * {@code files().size()} and a row index of at least 0; for CSV any value (lines are not checked).
     */
    public boolean holds(long value) {
        return files == null || value >= 0 && (value >>> FILE_SHIFT) < files.size();
    }

    /** The file a Parquet source-row value comes from, or null for CSV. */
    public String fileOf(long value) {
        return files == null ? null : files.get((int) (value >>> FILE_SHIFT));
    }

    /** A value as text: the line for CSV; the row index for one Parquet file; file:row for a data set. */
    public String label(long value) {
        if (files == null) {
            return Long.toString(value);
        }
        if (files.size() == 1) {
            return Long.toString(value & ROW_MASK);
        }
        return fileOf(value) + ":" + (value & ROW_MASK);
    }
}
