package nearfit.table;

import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTimeoutPreemptively;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.Arrays;
import java.util.List;

import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;

/**
 * A bounded fuzz: damaged CSV bytes load (with bad cells counted) or fail with a located NearfitException,
 * never with another exception, never hanging (each load runs under a generous timeout, a hang detector
 * rather than a speed bound) and never holding more rows or allocating more than the input justifies.
 */
class MutatedInputTest {
    /** Far above any load of these few kilobytes; only a loop that never ends reaches it. */
    private static final Duration HANG = Duration.ofSeconds(30);

    /**
     * Bytes one single-threaded load of a small input may allocate: the per-thread buffers (about 5 MB,
     * see HeapBoundTest) and the sniffer's sample, plus a generous 400 bytes per input byte.
     */
    private static final long FIXED_ALLOCATION = 24L << 20;

    private static final byte[] BASE = ("time,turbine,wind_ms,\"note, free\"\r\n"
            + "2025-03-01T00:00:00Z,T01,5.5,\"a \"\"quoted\"\" note\"\r\n"
            + "2025-03-01T00:10:00Z,T02,6.25,\"two\nlines\"\r\n"
            + "2025-03-01T00:20:00Z,T01,NA,plain\r\n"
            + "2025-03-01T00:30:00Z,T03,7,\r\n").getBytes(StandardCharsets.UTF_8);

    record Mutation(int kind, int at, int length, byte value) {
    }

    @Provide
    Arbitrary<List<Mutation>> mutations() {
        Arbitrary<Mutation> one = Combinators.combine(Arbitraries.integers().between(0, 3),
                Arbitraries.integers().between(0, BASE.length - 1), Arbitraries.integers().between(1, 12),
                Arbitraries.of((byte) '"', (byte) ',', (byte) '\n', (byte) '\r', (byte) ';', (byte) 0xC3, (byte) 'x',
                        (byte) 0x1f, (byte) 0x8b)).as(Mutation::new);
        return one.list().ofMinSize(1).ofMaxSize(6);
    }

    static byte[] apply(byte[] in, List<Mutation> ms) {
        byte[] b = in;
        for (Mutation m : ms) {
            int at = Math.min(m.at(), b.length);
            int len = Math.min(m.length(), b.length - at);
            b = switch (m.kind()) {
                case 0 -> concat(Arrays.copyOf(b, at), Arrays.copyOfRange(b, at + len, b.length)); // delete
                case 1 -> concat(Arrays.copyOf(b, at + len), Arrays.copyOfRange(b, at, b.length)); // duplicate
                case 2 -> concat(concat(Arrays.copyOf(b, at), new byte[] {m.value()}), Arrays.copyOfRange(b, at, b.length));
                default -> concat(concat(Arrays.copyOf(b, at), new byte[] {'"'}), Arrays.copyOfRange(b, at, b.length));
            };
        }
        return b;
    }

    private static byte[] concat(byte[] a, byte[] c) {
        byte[] out = Arrays.copyOf(a, a.length + c.length);
        System.arraycopy(c, 0, out, a.length, c.length);
        return out;
    }

    @Property(tries = 200)
    void damagedInputLoadsOrFailsWithALocatedMessage(@ForAll("mutations") List<Mutation> ms) throws IOException {
        byte[] b = apply(BASE, ms);
        loadsOrFailsWithALocatedMessage(b, b, "damaged.csv");
    }

    /** A longer log (about 40 KB, several parser blocks' worth of rows) to mutate. */
    private static final byte[] LONG_BASE = longBase();

    private static byte[] longBase() {
        StringBuilder sb = new StringBuilder("time,turbine,wind_ms,power_kw,note\n");
        for (int i = 0; i < 600; i++) {
            sb.append("2025-03-01T").append(String.format(java.util.Locale.ROOT, "%02d:%02d", i / 60 % 24, i % 60))
                    .append(":00Z,T0").append(1 + i % 8).append(',').append(3 + i % 20 * 0.5).append(',')
                    .append(i * 3 % 2000).append(i % 50 == 0 ? ",\"a, \"\"quoted\"\"\nnote\"\n" : ",\n");
        }
        return sb.toString().getBytes(StandardCharsets.UTF_8);
    }

    @Provide
    Arbitrary<List<Mutation>> longMutations() {
        Arbitrary<Mutation> one = Combinators.combine(Arbitraries.integers().between(0, 3),
                Arbitraries.integers().between(0, LONG_BASE.length - 1), Arbitraries.integers().between(1, 4000),
                Arbitraries.of((byte) '"', (byte) ',', (byte) '\n', (byte) 0, (byte) 0xFF, (byte) '\t'))
                .as(Mutation::new);
        return one.list().ofMinSize(1).ofMaxSize(8);
    }

    @Property(tries = 60)
    void aLongDamagedLogLoadsOrFailsWithALocatedMessage(@ForAll("longMutations") List<Mutation> ms) throws IOException {
        byte[] b = apply(LONG_BASE, ms);
        loadsOrFailsWithALocatedMessage(b, b, "long.csv");
    }

    @Property(tries = 40)
    void aDamagedGzipLogLoadsOrFailsWithALocatedMessage(@ForAll("longMutations") List<Mutation> ms) throws IOException {
        // Damage the compressed bytes themselves (the 10-byte header is kept so the file is taken for gzip).
        byte[] gz = CsvFiles.gzip(LONG_BASE);
        byte[] damaged = apply(Arrays.copyOfRange(gz, 10, gz.length), ms);
        byte[] whole = Arrays.copyOf(gz, 10 + damaged.length);
        System.arraycopy(damaged, 0, whole, 10, damaged.length);
        // The gzip trailer's CRC-32 (RFC 1952) lets only the undamaged text through, so its lines bound the rows.
        loadsOrFailsWithALocatedMessage(whole, LONG_BASE, "long.csv.gz");
    }

    /** Loads {@code bytes} on one and two threads; {@code text} is the text they decode to when loading succeeds. */
    private static void loadsOrFailsWithALocatedMessage(byte[] bytes, byte[] text, String name) throws IOException {
        Path dir = Files.createTempDirectory("nearfit-fuzz");
        Path file = Files.write(dir.resolve(name), bytes);
        try {
            for (int threads : new int[] {1, 2}) {
                LoadOptions o = LoadOptions.builder().threads(threads).parallelMinBytes(0).build();
                assertTimeoutPreemptively(HANG, () -> loadOnce(file, name, o, bytes.length, text));
            }
        } finally {
            Files.delete(file);
            Files.delete(dir);
        }
    }

    private static void loadOnce(Path file, String name, LoadOptions o, int size, byte[] text) {
        com.sun.management.ThreadMXBean mx = (com.sun.management.ThreadMXBean) java.lang.management.ManagementFactory
                .getThreadMXBean();
        long before = mx.getCurrentThreadAllocatedBytes();
        try {
            Table t = CsvLoader.load(file, name, o);
            long allocated = mx.getCurrentThreadAllocatedBytes() - before;
            assertTrue(t.rowCount() > 0);
            assertTrue(t.rowCount() <= lineBreaks(text) + 1, "rows " + t.rowCount() + " from " + lineBreaks(text) + " line breaks");
            for (Column c : t.columns()) {
                assertTrue(c.badCount() <= c.missingCount() && c.size() == t.rowCount());
                assertNotNull(ColumnSummary.of(c));
            }
            if (o.threads() == 1 && !name.endsWith(".gz")) {
                // Only this thread works on a plain single-threaded load, so its count is the load's.
                assertTrue(allocated <= FIXED_ALLOCATION + 400L * size, "allocated " + allocated + " bytes for " + size);
            }
        } catch (NearfitException ex) {
            assertTrue(name.equals(ex.file()), ex.getMessage());
        }
    }

    private static long lineBreaks(byte[] b) {
        long n = 0;
        for (byte x : b) {
            if (x == '\n' || x == '\r') {
                n++;
            }
        }
        return n;
    }
}
