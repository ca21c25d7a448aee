package nearfit.table;

/**
 * Receives progress while a file loads. It may be called from any of the loader's threads, about once per
 * block of input (a few MB), so it must be thread-safe and quick.
 */
@FunctionalInterface
public interface LoadProgress {
    /** Ignores progress. */
    LoadProgress NONE = (bytes, total, rows) -> { };

    /**
     * @param bytesRead  input bytes consumed so far (decompressed bytes for gzip)
     * @param totalBytes the input's size in bytes, or -1 when unknown (gzip, standard input)
     * @param rows       rows parsed so far, counted over all threads
     */
    void update(long bytesRead, long totalBytes, long rows);
}
