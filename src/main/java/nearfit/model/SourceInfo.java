package nearfit.model;

/**
 * Where a model's reference rows came from, as recorded in the manifest.
 *
 * @param name         the file name as the user gave it ({@code -} for standard input)
 * @param sizeBytes    the file's size in bytes, or -1 for standard input
 * @param sha256       the file's SHA-256 in lower-case hex, or {@code null} for standard input
 * @param rowCondition the row condition that chose the reference rows, or {@code null} for all rows
 */
public record SourceInfo(String name, long sizeBytes, String sha256, String rowCondition) {
    /** Checks that the name is present and the checksum, when present, is 64 hex digits. */
    public SourceInfo {
        if (name == null || name.isEmpty()) {
            throw new IllegalArgumentException("source name is required");
        }
        if (sha256 != null && !sha256.matches("[0-9a-f]{64}")) {
            throw new IllegalArgumentException("source sha256 must be 64 lower-case hex digits");
        }
    }
}
