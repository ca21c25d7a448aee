package nearfit.model;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.function.Consumer;

import nearfit.table.NearfitException;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The manifest bound to typed records through the JSON library: what a file of release 0.1.0 holds
 * reads back and writes back to the same bytes, and every wrong value is refused naming its field.
 */
@SuppressWarnings("unchecked")
class ManifestDocumentTest {
    @TempDir
    Path dir;

    private byte[] released() throws IOException {
        try (InputStream in = ManifestDocumentTest.class.getResourceAsStream("/model/tiny-v0.1.0.nfm")) {
            return in.readAllBytes();
        }
    }

    @Test
    void aReleasedModelWrittenAgainHasTheSameManifestBytesAndDigest() throws IOException {
        byte[] original = released();
        Path in = dir.resolve("released.nfm");
        Files.write(in, original);
        Path again = dir.resolve("again.nfm");

        ModelFile.write(ModelFile.read(in), again, false, List.of());

        Map<String, byte[]> before = ModelEdits.entries(original);
        Map<String, byte[]> after = ModelEdits.entries(Files.readAllBytes(again));
        assertEquals(new String(before.get(ModelArchive.MANIFEST)), new String(after.get(ModelArchive.MANIFEST)));
        assertArrayEquals(before.get(ModelArchive.MANIFEST_DIGEST), after.get(ModelArchive.MANIFEST_DIGEST));
    }

    @Test
    void aFieldThisBuildDoesNotKnowIsIgnored() throws IOException {
        Path p = edited("later.nfm", m -> {
            m.put("written_by_a_later_minor", Map.of("x", 1.0));
            ((Map<String, Object>) m.get("flags")).put("another", "value");
        });
        assertEquals(4, ModelFile.read(p).settings().k());
    }

    @Test
    void anAbsentFieldAndANullFieldAreToldApart() throws IOException {
        assertEquals("manifest field \"columns.group\" is missing",
                refusal(edited("a.nfm", m -> ((Map<String, Object>) m.get("columns")).remove("group"))));
        assertEquals("manifest field \"source\" is not an object", refusal(edited("b.nfm", m -> m.put("source", null))));
        assertEquals("manifest field \"tuning.best_k\" is missing",
                refusal(edited("c.nfm", m -> ((Map<String, Object>) m.get("tuning")).remove("best_k"))));
    }

    @Test
    void aValueOfTheWrongJsonTypeIsRefusedNamingItsPath() throws IOException {
        assertEquals("manifest field \"columns.inputs[1]\" is not text",
                refusal(edited("a.nfm", m -> ((Map<String, Object>) m.get("columns")).put("inputs", List.of("wind_ms", 5.0)))));
        assertEquals("manifest field \"metric\" is not text", refusal(edited("b.nfm", m -> m.put("metric", 1.0))));
        assertEquals("manifest field \"k\" is not a number", refusal(edited("c.nfm", m -> m.put("k", "4"))));
        assertEquals("manifest field \"scaling\" is not an object", refusal(edited("d.nfm", m -> m.put("scaling", List.of()))));
        assertEquals("manifest field \"tuning.rmse\" is not a list",
                refusal(edited("e.nfm", m -> ((Map<String, Object>) m.get("tuning")).put("rmse", 3.0))));
    }

    @Test
    void aWholeNumberBeyondEveryIntegerRangeIsRefusedNotWrapped() throws IOException {
        assertEquals("manifest field \"k\" is 100000000000000000000; it must be a whole number from 1 to 40",
                refusal(edited("a.nfm", m -> m.put("k", new java.math.BigInteger("100000000000000000000")))));
        assertEquals("manifest field \"tuning.k[0]\" is 4294967297; it must be a whole number from 1 to 2147483647",
                refusal(edited("b.nfm", m -> ((Map<String, Object>) m.get("tuning")).put("k", List.of(4294967297L)))));
    }

    private Path edited(String name, Consumer<Map<String, Object>> edit) throws IOException {
        Path p = dir.resolve(name);
        Files.write(p, ModelEdits.withManifest(released(), edit));
        return p;
    }

    private static String refusal(Path p) {
        NearfitException e = assertThrows(NearfitException.class, () -> ModelFile.read(p));
        assertEquals(1, e.getMessage().lines().count(), e.getMessage());
        return e.getMessage().substring(p.toString().length() + 2);
    }
}
