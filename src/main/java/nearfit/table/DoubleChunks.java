package nearfit.table;

import java.util.Arrays;

/**
 * A growable sequence of doubles held in fixed chunks of {@value #CHUNK} values, so growing never copies
 * what is already stored and no chunk is large enough to be a humongous object for the collector.
 *
 * <p>Invariant: every chunk but the last is full; {@code size} values are stored in total.
 */
final class DoubleChunks {
    static final int SHIFT = 15;
    static final int CHUNK = 1 << SHIFT;
    static final int MASK = CHUNK - 1;

    private double[][] chunks = new double[4][];
    private int chunkCount;
    private int size;

    void add(double v) {
        int at = size & MASK;
        if (at == 0) {
            newChunk();
        }
        chunks[chunkCount - 1][at] = v;
        size++;
    }

    double get(int i) {
        return chunks[i >>> SHIFT][i & MASK];
    }

    int size() {
        return size;
    }

    /** Moves all of {@code other}'s values to the end of this sequence, releasing its chunks as they go. */
    void drainFrom(DoubleChunks other) {
        for (int c = 0; c < other.chunkCount; c++) {
            double[] src = other.chunks[c];
            int n = Math.min(CHUNK, other.size - c * CHUNK);
            int done = 0;
            while (done < n) {
                int at = size & MASK;
                if (at == 0) {
                    newChunk();
                }
                int len = Math.min(n - done, CHUNK - at);
                System.arraycopy(src, done, chunks[chunkCount - 1], at, len);
                size += len;
                done += len;
            }
            other.chunks[c] = null;
        }
        other.chunkCount = 0;
        other.size = 0;
    }

    private void newChunk() {
        if (chunkCount == chunks.length) {
            chunks = Arrays.copyOf(chunks, chunkCount * 2);
        }
        chunks[chunkCount++] = new double[CHUNK];
    }
}
