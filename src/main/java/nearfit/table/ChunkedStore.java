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
        if (chunkCount == chunks.length) {
            chunks = Arrays.copyOf(chunks, chunkCount * 2);
        }
        Object a = newArray();
        chunks[chunkCount++] = a;
        return a;
    }

    /** Moves all of {@code other}'s values (same element type) to the end, releasing its chunks as they go. */
    final void drainFrom(ChunkedStore other) {
        for (int c = 0; c < other.chunkCount; c++) {
            Object src = other.chunks[c];
            int n = other.filled(c);
            int done = 0;
            while (done < n) {
                int at = size & MASK;
                Object dst = at == 0 ? newChunk() : chunks[chunkCount - 1];
                int len = Math.min(n - done, CHUNK - at);
                System.arraycopy(src, done, dst, at, len);
                size += len;
                done += len;
            }
            other.chunks[c] = null;
        }
        other.chunkCount = 0;
        other.size = 0;
        chunksChanged();
        other.chunksChanged();
    }

    /** Lets a subclass refresh its cached last chunk. */
    abstract void chunksChanged();
}
