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
