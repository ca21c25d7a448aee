package nearfit.model;

import java.io.IOException;
import java.io.InputStream;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.security.MessageDigest;
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

    /** The CRC-32 and the SHA-256 of the array's bytes, in one pass. */
    Sums sums(Object array) throws IOException {
        CRC32 crc = new CRC32();
        MessageDigest sha = Sums.newSha256();
        forEachPiece(array, (b, n) -> {
            crc.update(b, 0, n);
            sha.update(b, 0, n);
        });
        return new Sums(crc.getValue(), Sums.hex(sha.digest()));
    }

    /**
     * The two checksums of an entry's uncompressed bytes.
     *
     * @param crc32  the CRC-32 (ZIP's own check), 0 to 2^32 - 1
     * @param sha256 the SHA-256 in 64 lower-case hex digits
     */
    record Sums(long crc32, String sha256) {
        static MessageDigest newSha256() {
            try {
                return MessageDigest.getInstance("SHA-256");
            } catch (java.security.NoSuchAlgorithmException e) {
                throw new IllegalStateException("every Java platform has SHA-256", e);
            }
        }

        static String hex(byte[] digest) {
            return java.util.HexFormat.of().formatHex(digest);
        }
    }

    /**
     * Reads {@code count} elements of the type from the stream into a new array, updating the CRC
     * and the digest; returns {@code null} when the stream ends early (the array would be incomplete),
     * else the array, and the number of bytes read in {@code bytesRead[0]}. Reads no more than
     * {@code count} elements' bytes.
     */
    Object read(InputStream in, ElementType type, int count, boolean growing, CRC32 crc, MessageDigest sha,
                long[] bytesRead) throws IOException {
        int width = type.width();
        // A stored entry's bytes are in the file, so its array is allocated whole; an inflated one
        // grows as its bytes arrive, so a few deflated bytes claiming gigabytes allocate nothing big.
        int capacity = growing ? Math.min(count, PIECE) : count;
        Object array = allocate(type, capacity);
        long total = 0;
        for (int i = 0; i < count; ) {
            int m = Math.min(count - i, PIECE / width);
            int got = in.readNBytes(buffer.array(), 0, m * width);
            total += got;
            crc.update(buffer.array(), 0, got);
            sha.update(buffer.array(), 0, got);
            if (got < m * width) {
                bytesRead[0] = total;
                return null;
            }
            if (i + m > capacity) {
                capacity = (int) Math.min(count, Math.max(i + m, 2L * capacity));
                array = grow(array, capacity);
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

    private static Object allocate(ElementType type, int count) {
        return switch (type) {
            case F64 -> new double[count];
            case I32 -> new int[count];
            case I64 -> new long[count];
        };
    }

    private static Object grow(Object array, int capacity) {
        if (array instanceof double[] d) {
            return java.util.Arrays.copyOf(d, capacity);
        } else if (array instanceof int[] a) {
            return java.util.Arrays.copyOf(a, capacity);
        }
        return java.util.Arrays.copyOf((long[]) array, capacity);
    }
}
