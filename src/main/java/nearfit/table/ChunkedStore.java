package nearfit.table;

import java.util.Arrays;

/**
 * The bookkeeping shared by the chunked primitive sequences ({@link DoubleChunks}, {@link LongChunks},
 * {@link IntChunks}): values live in fixed chunks of {@value #CHUNK}, so growing never copies what is
 * stored and no chunk is large enough to be a humongous object for the G1 collector.
 *
 * <p>Invariant: every chunk but the last is full; {@code size} values are stored in total; all chunks are
 * primitive arrays of the subclass's element type.
 */
abstract class ChunkedStore {
    static final int SHIFT = 15;
    static final int CHUNK = 1 << SHIFT;
    static final int MASK = CHUNK - 1;

    Object[] chunks = new Object[4];
    int chunkCount;
    int size;

    /** A new primitive array of {@link #CHUNK} elements. */
    abstract Object newArray();

    final int size() {
        return size;
    }

    /** Values in chunk {@code c}. */
    final int filled(int c) {
        return Math.min(CHUNK, size - c * CHUNK);
    }

    /** Appends a new chunk and returns it. */
    final Object newChunk() {
        Object a = newArray();
        append(a);
        return a;
    }

    /**
     * Moves all of {@code other}'s values (same element type) to the end, reusing its chunks instead of
     * allocating: each of its chunks first tops up this store's last chunk, then its remaining values are
     * moved to its front and the chunk itself is appended. So a join allocates nothing and copies each
     * value once (a young collection would otherwise copy the new chunks again).
     */
    final void drainFrom(ChunkedStore other) {
        for (int c = 0; c < other.chunkCount; c++) {
            Object src = other.chunks[c];
            int n = other.filled(c);
            other.chunks[c] = null;
            int at = size & MASK;
            int moved = 0;
            if (at != 0) {
                moved = Math.min(n, CHUNK - at);
                System.arraycopy(src, 0, chunks[chunkCount - 1], at, moved);
                size += moved;
            }
            if (n > moved) {
                System.arraycopy(src, moved, src, 0, n - moved);
                append(src);
                size += n - moved;
            }
        }
        other.chunkCount = 0;
        other.size = 0;
        chunksChanged();
        other.chunksChanged();
    }

    private void append(Object chunk) {
        if (chunkCount == chunks.length) {
            chunks = Arrays.copyOf(chunks, chunkCount * 2);
        }
        chunks[chunkCount++] = chunk;
    }

    /** Lets a subclass refresh its cached last chunk. */
    abstract void chunksChanged();
}
