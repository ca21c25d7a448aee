package nearfit.table;

/** A growable sequence of longs in fixed chunks; see {@link ChunkedStore}. */
final class LongChunks extends ChunkedStore {
    private long[] last;

    @Override
    Object newArray() {
        return new long[CHUNK];
    }

    void add(long v) {
        int at = size & MASK;
        if (at == 0) {
            last = (long[]) newChunk();
        }
        last[at] = v;
        size++;
    }

    long get(int i) {
        return ((long[]) chunks[i >>> SHIFT])[i & MASK];
    }

    /** Adds {@code delta} to every stored value (turns a worker's local line numbers into file lines). */
    void addToAll(long delta) {
        for (int c = 0; c < chunkCount; c++) {
            long[] a = (long[]) chunks[c];
            for (int i = 0, n = filled(c); i < n; i++) {
                a[i] += delta;
            }
        }
    }

    @Override
    void chunksChanged() {
        last = chunkCount == 0 ? null : (long[]) chunks[chunkCount - 1];
    }
}
