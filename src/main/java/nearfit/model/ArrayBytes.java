package nearfit.model;

import java.io.IOException;
import java.io.InputStream;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.util.zip.CRC32;
import nearfit.model.ModelArchive.ElementType;

/**
 * The little-endian bytes of a {@code double[]}, {@code int[]} or {@code long[]}, produced and
 * consumed in pieces of {@link #PIECE} bytes, so a model of ten million rows is written and read
 * with no byte copy of a whole column (three such copies used to push a 10M-row {@code fit} past a
 * 1 GiB heap). Not thread-safe: one instance per archive being written or read.
 */
final class ArrayBytes {
    /** Bytes per piece: a multiple of every element width. */
    static final int PIECE = 1 << 16;

    /** Receives one piece: bytes 0 until {@code length} of {@code bytes}, valid during the call. */
    interface Sink {
        void accept(byte[] bytes, int length) throws IOException;
    }

    private final ByteBuffer buffer = ByteBuffer.allocate(PIECE).order(ByteOrder.LITTLE_ENDIAN);

    /** Passes the array's bytes to the sink, piece by piece, in order. */
    void forEachPiece(Object array, Sink sink) throws IOException {
        if (array instanceof double[] d) {
            for (int i = 0; i < d.length; ) {
                int m = Math.min(d.length - i, PIECE / 8);
                buffer.clear();
                buffer.asDoubleBuffer().put(d, i, m);
                sink.accept(buffer.array(), m * 8);
                i += m;
            }
        } else if (array instanceof int[] a) {
            for (int i = 0; i < a.length; ) {
                int m = Math.min(a.length - i, PIECE / 4);
                buffer.clear();
                buffer.asIntBuffer().put(a, i, m);
                sink.accept(buffer.array(), m * 4);
                i += m;
            }
        } else {
            long[] l = (long[]) array;
            for (int i = 0; i < l.length; ) {
                int m = Math.min(l.length - i, PIECE / 8);
                buffer.clear();
                buffer.asLongBuffer().put(l, i, m);
                sink.accept(buffer.array(), m * 8);
                i += m;
            }
        }
    }

    /** The CRC-32 of the array's bytes. */
    long crc(Object array) throws IOException {
        CRC32 crc = new CRC32();
        forEachPiece(array, (b, n) -> crc.update(b, 0, n));
        return crc.getValue();
    }

    /**
     * Reads {@code count} elements of the type from the stream into a new array, updating the CRC;
     * returns the number of bytes read when the stream ends early (the array is then incomplete)
     * as a negative number minus one, else the array.
     */
    Object read(InputStream in, ElementType type, int count, CRC32 crc, long[] bytesRead) throws IOException {
        Object array = switch (type) {
            case F64 -> new double[count];
            case I32 -> new int[count];
            case I64 -> new long[count];
        };
        int width = type.width();
        long total = 0;
        for (int i = 0; i < count; ) {
            int m = Math.min(count - i, PIECE / width);
            int got = in.readNBytes(buffer.array(), 0, m * width);
            total += got;
            crc.update(buffer.array(), 0, got);
            if (got < m * width) {
                bytesRead[0] = total;
                return null;
            }
            buffer.clear();
            switch (type) {
                case F64 -> buffer.asDoubleBuffer().get((double[]) array, i, m);
                case I32 -> buffer.asIntBuffer().get((int[]) array, i, m);
                case I64 -> buffer.asLongBuffer().get((long[]) array, i, m);
            }
            i += m;
        }
        bytesRead[0] = total;
        return array;
    }
}
