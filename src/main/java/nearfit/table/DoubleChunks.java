package nearfit.table;

/** A growable sequence of doubles in fixed chunks; see {@link ChunkedStore}. */
final class DoubleChunks extends ChunkedStore {
    private double[] last;

    @Override
    Object newArray() {
        return new double[CHUNK];
    }

    void add(double v) {
        int at = size & MASK;
        if (at == 0) {
            last = (double[]) newChunk();
        }
        last[at] = v;
        size++;
    }

    /** Appends {@code src[0, n)}, chunk by chunk. */
    void addAll(double[] src, int n) {
        int from = 0;
        while (from < n) {
            int at = size & MASK;
            if (at == 0) {
                last = (double[]) newChunk();
            }
            int k = Math.min(n - from, CHUNK - at);
            System.arraycopy(src, from, last, at, k);
            from += k;
            size += k;
        }
    }

    double get(int i) {
        return ((double[]) chunks[i >>> SHIFT])[i & MASK];
    }

    @Override
    void chunksChanged() {
        last = chunkCount == 0 ? null : (double[]) chunks[chunkCount - 1];
    }
}
