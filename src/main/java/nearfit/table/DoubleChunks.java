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

    double get(int i) {
        return ((double[]) chunks[i >>> SHIFT])[i & MASK];
    }

    @Override
    void chunksChanged() {
        last = chunkCount == 0 ? null : (double[]) chunks[chunkCount - 1];
    }
}
