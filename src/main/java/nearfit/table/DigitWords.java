package nearfit.table;

import java.lang.invoke.MethodHandles;
import java.lang.invoke.VarHandle;
import java.nio.ByteOrder;

/**
 * Reads runs of ASCII digits eight bytes at a time, as one little-endian {@code long} (the first byte in
 * the lowest bits). The conversion multiplies pairs, quads and octets of digits together in three steps
 * (a widely used SWAR technique; see Lemire, "Faster integer parsing", 2018, and Muła's SWAR notes).
 */
final class DigitWords {
    private static final VarHandle LONGS =
            MethodHandles.byteArrayViewVarHandle(long[].class, ByteOrder.LITTLE_ENDIAN);
    private static final long NIBBLES_HIGH = 0xF0F0F0F0F0F0F0F0L;
    private static final long ZEROS = 0x3030303030303030L;
    private static final long SIXES = 0x0606060606060606L;

    /** 10^0 .. 10^8 as longs. */
    static final long[] POW10 = {1L, 10L, 100L, 1_000L, 10_000L, 100_000L, 1_000_000L, 10_000_000L,
        100_000_000L};

    private DigitWords() {
    }

    /** The eight bytes at {@code b[i..i+8)}. */
    static long word(byte[] b, int i) {
        return (long) LONGS.get(b, i);
    }

    /**
     * How many of the word's bytes, from its first, are digits '0'..'9' (0 to 8). A byte x is a digit
     * when its high nibble is 3 and so is that of x + 6; a carry out of a byte can disturb only bytes after
     * a non-digit, which are not counted.
     */
    static int leadingDigits(long w) {
        long notDigit = ((w & NIBBLES_HIGH) ^ ZEROS) | (((w + SIXES) & NIBBLES_HIGH) ^ ZEROS);
        return Long.numberOfTrailingZeros(notDigit) >>> 3;
    }

    /** The value of the word's first {@code n} bytes (0 to 7), all digits. */
    static long value(long w, int n) {
        if (n == 0) {
            return 0;
        }
        long v = (w << (64 - 8 * n)) & 0x0F0F0F0F0F0F0F0FL; // the n digits in the top bytes, zeros below
        v = (v * (10 * 256 + 1)) >>> 8 & 0x00FF00FF00FF00FFL;
        v = (v * (100 * 65536 + 1)) >>> 16 & 0x0000FFFF0000FFFFL;
        return (v * (10000L * (1L << 32) + 1)) >>> 32;
    }
}
