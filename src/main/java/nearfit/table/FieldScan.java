package nearfit.table;

import java.lang.invoke.MethodHandles;
import java.lang.invoke.VarHandle;
import java.nio.ByteOrder;

/**
 * Finds the end of an unquoted field eight bytes at a time (SWAR: SIMD within a register). A byte equal
 * to {@code c} is found as a zero byte of {@code x ^ c*0x0101..01}, and a word has a zero byte when
 * {@code (w - 0x01..01) & ~w & 0x80..80} is not 0 (Hacker's Delight, 2nd ed., section 6-1). That test can
 * mark bytes above the first zero byte wrongly but never below it, so in a little-endian word the lowest
 * marked byte is the first match.
 */
final class FieldScan {
    private static final VarHandle LONGS =
            MethodHandles.byteArrayViewVarHandle(long[].class, ByteOrder.LITTLE_ENDIAN);
    private static final long ONES = 0x0101010101010101L;
    private static final long HIGHS = 0x8080808080808080L;
    private static final long NEWLINES = '\n' * ONES;

    private FieldScan() {
    }

    /** The index of the first delimiter {@code d} or line feed in {@code b[p..limit)}, or {@code limit}. */
    static int next(byte[] b, int p, int limit, byte d) {
        long ds = (d & 0xFF) * ONES;
        while (p + 8 <= limit) {
            long w = (long) LONGS.get(b, p);
            long marks = zeroBytes(w ^ ds) | zeroBytes(w ^ NEWLINES);
            if (marks != 0) {
                return p + (Long.numberOfTrailingZeros(marks) >>> 3);
            }
            p += 8;
        }
        while (p < limit && b[p] != d && b[p] != '\n') {
            p++;
        }
        return p;
    }

    /** The index of the first quote or line feed in {@code b[p..limit)}, or {@code limit}. */
    static int nextQuoteOrNewline(byte[] b, int p, int limit) {
        return next(b, p, limit, (byte) '"');
    }

    private static long zeroBytes(long w) {
        return (w - ONES) & ~w & HIGHS;
    }
}
