package nearfit.table;

import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;

import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;

/** A bounded fuzz: damaged CSV bytes load (with bad cells counted) or fail with a located NearfitException. */
class MutatedInputTest {
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
        Path dir = Files.createTempDirectory("nearfit-fuzz");
        Path file = Files.write(dir.resolve("damaged.csv"), apply(BASE, ms));
        try {
            for (int threads : new int[] {1, 2}) {
                LoadOptions o = LoadOptions.builder().threads(threads).parallelMinBytes(0).build();
                try {
                    Table t = CsvLoader.load(file, "damaged.csv", o);
                    assertTrue(t.rowCount() > 0);
                    for (Column c : t.columns()) {
                        assertTrue(c.badCount() <= c.missingCount() && c.size() == t.rowCount());
                        assertNotNull(ColumnSummary.of(c));
                    }
                } catch (NearfitException ex) {
                    assertTrue("damaged.csv".equals(ex.file()), ex.getMessage());
                }
            }
        } finally {
            Files.delete(file);
            Files.delete(dir);
        }
    }
}
