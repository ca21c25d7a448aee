package nearfit.table;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

class ChunkedStoreTest {
    @Test
    void drainingAppendsAcrossPartialChunksInOrderAndEmptiesTheSource() {
        DoubleChunks a = new DoubleChunks();
        DoubleChunks b = new DoubleChunks();
        int na = ChunkedStore.CHUNK + 123;
        int nb = 2 * ChunkedStore.CHUNK + 7;
        for (int i = 0; i < na; i++) {
            a.add(i);
        }
        for (int i = 0; i < nb; i++) {
            b.add(na + i);
        }
        a.drainFrom(b);
        assertEquals(na + nb, a.size());
        assertEquals(0, b.size());
        for (int i = 0; i < na + nb; i++) {
            assertEquals(i, a.get(i), "index " + i);
        }
        a.add(-1);
        assertEquals(-1, a.get(na + nb), "adding after a drain continues the last chunk");
    }

    // Oracle: the values in order, as a plain array would hold them. Sizes include 0 and exact multiples.
    @net.jqwik.api.Property(tries = 60)
    void drainingSeveralStoresKeepsEveryValueInOrder(
            @net.jqwik.api.ForAll("sizes") int n0, @net.jqwik.api.ForAll("sizes") int n1,
            @net.jqwik.api.ForAll("sizes") int n2) {
        LongChunks head = new LongChunks();
        long next = 0;
        for (int i = 0; i < n0; i++) {
            head.add(next++);
        }
        for (int n : new int[] {n1, n2}) {
            LongChunks part = new LongChunks();
            for (int i = 0; i < n; i++) {
                part.add(next++);
            }
            head.drainFrom(part);
        }
        head.add(next++);
        assertEquals(next, head.size());
        for (int i = 0; i < next; i++) {
            assertEquals(i, head.get(i), "index " + i);
        }
    }

    @net.jqwik.api.Provide
    net.jqwik.api.Arbitrary<Integer> sizes() {
        int c = ChunkedStore.CHUNK;
        return net.jqwik.api.Arbitraries.oneOf(net.jqwik.api.Arbitraries.of(0, 1, c - 1, c, c + 1, 2 * c),
                net.jqwik.api.Arbitraries.integers().between(0, 3 * c));
    }

    @Test
    void drainingReusesTheSourcesChunksInsteadOfAllocating() {
        DoubleChunks a = new DoubleChunks();
        DoubleChunks b = new DoubleChunks();
        for (int i = 0; i < 10; i++) {
            a.add(i);
        }
        for (int i = 0; i < 3 * ChunkedStore.CHUNK; i++) {
            b.add(i);
        }
        Object[] sources = java.util.Arrays.copyOf(b.chunks, b.chunkCount);
        a.drainFrom(b);
        assertEquals(4, a.chunkCount);
        for (int c = 1; c < a.chunkCount; c++) {
            org.junit.jupiter.api.Assertions.assertSame(sources[c - 1], a.chunks[c], "chunk " + c);
        }
    }

    @Test
    void intCodesAreRemappedButMissingStays() {
        IntChunks c = new IntChunks();
        c.add(0);
        c.add(-1);
        c.add(1);
        c.remap(new int[] {5, 3});
        assertEquals(5, c.get(0));
        assertEquals(-1, c.get(1));
        assertEquals(3, c.get(2));
    }
}
