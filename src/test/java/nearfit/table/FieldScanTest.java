package nearfit.table;

import static org.junit.jupiter.api.Assertions.assertEquals;

import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;

class FieldScanTest {
    private static int byteAtATime(byte[] b, int p, int limit, byte d) {
        while (p < limit && b[p] != d && b[p] != '\n') {
            p++;
        }
        return p;
    }

    // Oracle: the plain byte loop. Bytes are drawn from a small set (delimiters, quote, newline, high
    // bytes such as UTF-8 continuation bytes) so that matches at every word position occur.
    @Property(tries = 2000)
    void findsTheSameFirstDelimiterOrNewlineAsAByteLoop(@ForAll("bytes") byte[] b, @ForAll("delims") byte d) {
        for (int p = 0; p <= b.length; p++) {
            assertEquals(byteAtATime(b, p, b.length, d), FieldScan.next(b, p, b.length, d));
            int limit = Math.max(p, b.length - 3);
            assertEquals(byteAtATime(b, p, limit, d), FieldScan.next(b, p, limit, d));
        }
    }

    @Provide
    Arbitrary<byte[]> bytes() {
        return Arbitraries.of((byte) 'a', (byte) ',', (byte) ';', (byte) '"', (byte) '\n', (byte) 0x80,
                (byte) 0xFF, (byte) 0x0B, (byte) 0x09, (byte) '7').array(byte[].class).ofMaxSize(40);
    }

    @Provide
    Arbitrary<Byte> delims() {
        return Arbitraries.of((byte) ',', (byte) ';', (byte) '\t', (byte) '|', (byte) '"');
    }
}
