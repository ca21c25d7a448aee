package nearfit.model;

import java.util.ArrayList;
import java.util.List;

import nearfit.table.RowSource;

/**
 * Where a model's reference rows came from, as recorded in the manifest.
 *
 * @param name         the file name as the user gave it ({@code -} for standard input)
 * @param sizeBytes    the file's size in bytes, or -1 for standard input or a folder
 * @param sha256       the file's SHA-256 in lower-case hex, or {@code null} for standard input or a folder
 * @param rowCondition the row condition that chose the reference rows, or {@code null} for all rows
 * @param parquetFiles for Parquet rows, the files they come from in the order of the rows' file numbers
 *                     ({@link RowSource}); {@code null} for CSV lines (and for every model file written before
 *                     Parquet rows were recorded)
 */
public record SourceInfo(String name, long sizeBytes, String sha256, String rowCondition,
                         List<SourceFile> parquetFiles) {
    /** Checks that the name is present and the checksum, when present, is 64 hex digits. */
    public SourceInfo {
        if (name == null || name.isEmpty()) {
            throw new IllegalArgumentException("source name is required");
        }
        if (sha256 != null && !sha256.matches("[0-9a-f]{64}")) {
            throw new IllegalArgumentException("source sha256 must be 64 lower-case hex digits");
        }
        if (parquetFiles != null) {
            if (parquetFiles.isEmpty()) {
                throw new IllegalArgumentException("Parquet rows need at least one file");
            }
            parquetFiles = List.copyOf(parquetFiles);
        }
    }

    /** A source of CSV lines. */
    public SourceInfo(String name, long sizeBytes, String sha256, String rowCondition) {
        this(name, sizeBytes, sha256, rowCondition, null);
    }

    /**
     * One Parquet file of a model's reference: its name as the fit was given it (the data set's folder, then the
     * path within it), size and SHA-256, so that {@code predict --loo} can tell that the rows' file and row
     * indexes still point at the same rows.
     */
    public record SourceFile(String name, long sizeBytes, String sha256) {
        /** Checks the name, the size and the checksum (64 lower-case hex digits). */
        public SourceFile {
            if (name == null || name.isEmpty()) {
                throw new IllegalArgumentException("a Parquet file's name is required");
            }
            if (sizeBytes < 0) {
                throw new IllegalArgumentException("a Parquet file's size cannot be negative");
            }
            if (sha256 == null || !sha256.matches("[0-9a-f]{64}")) {
                throw new IllegalArgumentException("a Parquet file's sha256 must be 64 lower-case hex digits");
            }
        }
    }

    /** What the rows' source values mean: CSV lines, or rows of {@link #parquetFiles}. */
    public RowSource rowSource() {
        if (parquetFiles == null) {
            return RowSource.CSV_LINES;
        }
        List<String> names = new ArrayList<>(parquetFiles.size());
        for (SourceFile f : parquetFiles) {
            names.add(f.name());
        }
        return RowSource.parquet(names);
    }
}
