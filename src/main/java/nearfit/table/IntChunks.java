package nearfit.table;

/** A growable sequence of ints in fixed chunks; see {@link ChunkedStore}. */
final class IntChunks extends ChunkedStore {
    private int[] last;

    @Override
    Object newArray() {
        return new int[CHUNK];
    }

    void add(int v) {
        int at = size & MASK;
        if (at == 0) {
            last = (int[]) newChunk();
        }
        last[at] = v;
        size++;
    }

    int get(int i) {
        return ((int[]) chunks[i >>> SHIFT])[i & MASK];
    }

    /** Sets every stored value {@code v >= 0} to {@code map[v]}; negative values (missing) stay. */
    void remap(int[] map) {
        for (int c = 0; c < chunkCount; c++) {
            int[] a = (int[]) chunks[c];
            for (int i = 0, n = filled(c); i < n; i++) {
                if (a[i] >= 0) {
                    a[i] = map[a[i]];
                }
            }
        }
    }

    @Override
    void chunksChanged() {
        last = chunkCount == 0 ? null : (int[]) chunks[chunkCount - 1];
    }
}
