package nearfit.model;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTimeoutPreemptively;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.function.Consumer;

import nearfit.knn.Estimates;
import nearfit.knn.Metric;
import nearfit.table.NearfitException;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * A model file is trusted only as far as it checks out: the manifest against its CRC-32 and its
 * SHA-256, each array against its own; every manifest value in range and consistent with the
 * arrays, so no file can make the index search spin; and decompression bounded by what the model
 * needs. Each refusal is one line naming the file.
 */
class ModelTrustTest {
    /** Loading a small model takes milliseconds; this bound only catches a spin or an unbounded inflate. */
    private static final Duration BOUND = Duration.ofSeconds(30);

    @TempDir
    static Path dir;
    static byte[] euclidean;
    static byte[] mahalanobis;
    static Estimates expected;

    @BeforeAll
    static void fitTheModels() {
        euclidean = SmallModel.bytes(Metric.EUCLIDEAN, dir);
        mahalanobis = SmallModel.bytes(Metric.MAHALANOBIS, dir);
        expected = SmallModel.estimates(dir.resolve("small-euclidean.nfm"));
    }

    private static Path file(String name, byte[] b) throws IOException {
        Path p = dir.resolve(name);
        Files.write(p, b);
        return p;
    }

    /** The one line a refused file gives, read within the bound. */
    private static String refusal(Path p) {
        NearfitException e = assertTimeoutPreemptively(BOUND,
                () -> assertThrows(NearfitException.class, () -> SmallModel.estimates(p)));
        assertEquals(1, e.getMessage().lines().count(), e.getMessage());
        assertTrue(e.getMessage().startsWith(p + ": "), e.getMessage());
        return e.getMessage().substring(p.toString().length() + 2);
    }

    private static void assertSameEstimates(Path p) {
        Estimates got = assertTimeoutPreemptively(BOUND, () -> SmallModel.estimates(p));
        assertArrayEquals(expected.fit(), got.fit());
        assertArrayEquals(expected.bandLow(), got.bandLow());
    }

    // Item 1: the manifest is verified like every other entry.

    @ParameterizedTest(name = "{0} -> {1}")
    @CsvSource({"'\"threshold\":3.5', '\"threshold\":9.5'", "'\"k\":7', '\"k\":9'", "'\"spread\":[3', '\"spread\":[9'"})
    void aManifestByteChangedWithoutItsCrcFailsTheCrcCheck(String from, String to) throws IOException {
        Path p = file("crc.nfm", ModelEdits.editManifestInPlace(euclidean, from, to, false));
        assertEquals("is damaged: entry manifest.json fails its CRC-32 check", refusal(p));
    }

    @ParameterizedTest(name = "{0} -> {1}")
    @CsvSource({"'\"threshold\":3.5', '\"threshold\":9.5'", "'\"k\":7', '\"k\":9'", "'\"spread\":[3', '\"spread\":[9'"})
    void aManifestEditWithItsCrcFixedUpFailsTheManifestDigest(String from, String to) throws IOException {
        Path p = file("digest.nfm", ModelEdits.editManifestInPlace(euclidean, from, to, true));
        assertEquals("is damaged: manifest.json does not match the SHA-256 in manifest.sha256", refusal(p));
    }

    @Test
    void anArrayChangedWithItsCrcFixedUpFailsItsSha256() throws IOException {
        byte[] input = ModelEdits.entries(euclidean).get("data/input.0.f64").clone();
        input[8] ^= 0x01;
        Path p = file("array.nfm", ModelEdits.withArrayBytes(euclidean, "input.0", input, false));
        assertEquals("is damaged: entry input.0 fails its SHA-256 check", refusal(p));
    }

    @Test
    void aFileOfTheCurrentFormatWithoutTheManifestDigestIsRefused() throws IOException {
        Map<String, byte[]> entries = ModelEdits.entries(euclidean);
        entries.remove(ModelArchive.MANIFEST_DIGEST);
        Path p = file("no-digest.nfm", ModelEdits.stored(entries));
        assertEquals("is damaged: manifest.sha256 is missing (a model file of format 1.1 or later has one)",
                refusal(p));
    }

    /** A format 1.0 file, as earlier builds wrote it: no digests; read with every CRC-32 checked. */
    private static byte[] formatOneZero() {
        Map<String, Object> m = ModelEdits.manifest(euclidean);
        m.put("format_version", "1.0");
        for (Object o : (List<?>) m.get("entries")) {
            ((Map<?, ?>) o).remove("sha256");
        }
        Map<String, byte[]> entries = ModelEdits.entries(euclidean);
        entries.remove(ModelArchive.MANIFEST_DIGEST);
        entries.put(ModelArchive.MANIFEST, (JsonTrees.write(m) + "\n").getBytes(StandardCharsets.UTF_8));
        return ModelEdits.stored(entries);
    }

    @Test
    void aFormatOneZeroFileWithoutDigestsIsStillRead() throws IOException {
        assertSameEstimates(file("v10.nfm", formatOneZero()));
    }

    @Test
    void aFormatOneZeroFileStillHasItsManifestCrcChecked() throws IOException {
        Path p = file("v10-edited.nfm", ModelEdits.editManifestInPlace(formatOneZero(), "\"k\":7", "\"k\":9", false));
        assertEquals("is damaged: entry manifest.json fails its CRC-32 check", refusal(p));
    }

    // Item 2: every manifest value is checked; no model can hang the tool.

    @ParameterizedTest(name = "{0} = {1}")
    @CsvSource(delimiter = '|', value = {
            "scaling.spread[0] | 0 | manifest field \"scaling.spread[0]\" is 0; a spread must be positive",
            "scaling.spread[1] | 1e-320 | manifest field \"scaling.spread[1]\" is 1.0E-320; a spread must be positive"
                    + " and at least 2.2250738585072014E-308",
            "scaling.spread[0] | -3.5 | manifest field \"scaling.spread[0]\" is -3.5; a spread must be positive",
            "scaling.spread[0] | null | manifest field \"scaling.spread[0]\" is missing (null); it must be a finite"
                    + " number",
            "scaling.center[1] | '\"x\"' | manifest field \"scaling.center[1]\" is not a number",
            "k | 4294967306 | manifest field \"k\" is 4294967306; it must be a whole number from 1 to 120",
            "k | 121 | manifest field \"k\" is 121; it must be a whole number from 1 to 120",
            "k | 0 | manifest field \"k\" is 0; it must be a whole number from 1 to 120",
            "k | 2.5 | manifest field \"k\" is 2.5; it must be a whole number from 1 to 120",
            "flags.threshold | 0 | manifest field \"flags.threshold\" is 0; a flag threshold must be positive",
            "flags.threshold | null | manifest field \"flags.threshold\" is not a finite number",
            "flags.residual_scale | -1 | manifest field \"flags.residual_scale\" is -1; a scale cannot be negative",
            "metric | '\"cosine\"' | manifest field \"metric\" is \"cosine\"; it must be one of euclidean, manhattan,"
                    + " chebyshev, mahalanobis",
            "scaling.whitening | '[1,0,0,1]' | manifest field \"scaling.whitening\" must be null for the euclidean"
                    + " metric",
            "rows | 1e10 | manifest field \"rows\" is 10000000000; it must be a whole number from 0 to 2147483647",
            "rows | 119 | is damaged: entry input.0 is listed as 120 f64 values, the model needs 119 f64 values",
            "source.size | -4 | manifest field \"source.size\" is -4; it must be a whole number from 0 to"
                    + " 9007199254740992",
            "created | '\"yesterday\"' | manifest field \"created\" is not an ISO 8601 UTC time: yesterday",
            "columns.inputs[1] | '\"wind_ms\"' | manifest field \"columns\": inputs must be distinct",
            "entries[0].count | 4294967306 | damaged manifest: entry input.0: \"count\" is not a whole number from 0"
                    + " to 268435453"})
    void aManifestValueOutOfRangeIsRefusedNamingTheField(String path, String json, String message)
            throws IOException {
        Path p = file("field.nfm", ModelEdits.withManifest(euclidean, m -> ModelEdits.set(m, path, JsonTrees.parse(json))));
        assertEquals(message, refusal(p));
    }

    @ParameterizedTest(name = "{0} = {1}")
    @CsvSource(delimiter = '|', value = {
            "scaling.whitening[0] | null | manifest field \"scaling.whitening[0]\" is missing (null); it must be a"
                    + " finite number",
            "scaling.whitening[0] | -1 | manifest field \"scaling.whitening[0]\" is -1; the diagonal of the whitening"
                    + " matrix must be positive",
            "scaling.whitening[1] | 0.25 | manifest field \"scaling.whitening[1]\" is 0.25; the whitening matrix is"
                    + " lower triangular, so it must be 0",
            "scaling.whitening | null | manifest field \"scaling.whitening\" is missing (null); the mahalanobis"
                    + " metric needs it"})
    void aWhiteningValueOutOfRangeIsRefusedNamingTheField(String path, String json, String message)
            throws IOException {
        Path p = file("white.nfm", ModelEdits.withManifest(mahalanobis, m -> ModelEdits.set(m, path, JsonTrees.parse(json))));
        assertEquals(message, refusal(p));
    }

    @Test
    void aSpreadSoSmallThatAScaledInputOverflowsIsRefusedNamingTheSpread() throws IOException {
        // 2.5e-308 is a normal double, but an input 4 or more from the centre divided by it is infinite.
        Path p = file("tiny.nfm", ModelEdits.withManifest(euclidean, m -> ModelEdits.set(m, "scaling.spread[0]", 2.5e-308)));
        String message = refusal(p);
        assertTrue(message.startsWith("manifest field \"scaling.spread[0]\" is 2.5E-308, which makes input wind_ms of"
                + " stored row ") && message.endsWith(" infinite once scaled"), message);
    }

    private static byte[] doubles(double[] values) {
        ByteBuffer b = ByteBuffer.allocate(values.length * 8).order(ByteOrder.LITTLE_ENDIAN);
        b.asDoubleBuffer().put(values);
        return b.array();
    }

    private static double[] stored(String entry) {
        byte[] b = ModelEdits.entries(euclidean).get(entry);
        double[] d = new double[b.length / 8];
        ByteBuffer.wrap(b).order(ByteOrder.LITTLE_ENDIAN).asDoubleBuffer().get(d);
        return d;
    }

    @Test
    void aStoredInputThatIsNotFiniteIsRefusedNamingItsRow() throws IOException {
        double[] x = stored("data/input.1.f64");
        x[3] = Double.NaN;
        Path p = file("nan-input.nfm", ModelEdits.withArrayBytes(euclidean, "input.1", doubles(x)));
        assertEquals("entry input.1 (air_temp_c) holds NaN at stored row 4 (source line "
                + ModelFile.read(file("plain.nfm", euclidean)).rows().sourceLines()[3] + "); stored inputs must be finite",
                refusal(p));
    }

    @Test
    void aModelWhoseRowsAllLackAResponseSaysSoNamingTheFile() throws IOException {
        double[] y = new double[120];
        java.util.Arrays.fill(y, Double.NaN);
        Path p = file("no-response.nfm", ModelEdits.withArrayBytes(euclidean, "response", doubles(y)));
        assertEquals("the model holds no usable reference rows (every stored row misses its response power_kw)",
                refusal(p));
    }

    @Test
    void aModelWithEmptyArraysSaysItHoldsNoUsableRows() throws IOException {
        byte[] b = euclidean;
        for (String name : List.of("input.0", "input.1", "response", "source_line")) {
            b = ModelEdits.withArrayBytes(b, name, new byte[0]);
        }
        byte[] emptied = b;
        Path p = file("empty.nfm", ModelEdits.withManifest(emptied, m -> {
            m.put("rows", 0L);
            for (Object o : (List<?>) m.get("entries")) {
                @SuppressWarnings("unchecked")
                Map<String, Object> e = (Map<String, Object>) o;
                e.put("count", 0L);
            }
        }));
        assertEquals("the model holds no usable reference rows (its manifest says \"rows\": 0)", refusal(p));
    }

    @Test
    void aJsonKeyGivenTwiceIsRefused() throws IOException {
        byte[] b = ModelEdits.entries(euclidean).get(ModelArchive.MANIFEST);
        String twice = new String(b, StandardCharsets.UTF_8).replace("\"k\":7", "\"k\":7,\"k\":70");
        Map<String, byte[]> entries = ModelEdits.entries(euclidean);
        byte[] manifest = twice.getBytes(StandardCharsets.UTF_8);
        entries.put(ModelArchive.MANIFEST, manifest);
        entries.put(ModelArchive.MANIFEST_DIGEST, (ModelEdits.sha256(manifest) + "\n").getBytes(StandardCharsets.US_ASCII));
        String message = refusal(file("twice.nfm", ModelEdits.stored(entries)));
        assertTrue(message.startsWith("damaged manifest: not valid JSON at character ")
                && message.endsWith("the key \"k\" appears twice"), message);
    }

    // Item 3: decompression is bounded by what the model needs.

    @Test
    void anEntryListedManyTimesIsRefusedBeforeAnyIsRead() throws IOException {
        Path p = file("listed.nfm", ModelEdits.withManifest(euclidean, m -> {
            @SuppressWarnings("unchecked")
            List<Object> entries = (List<Object>) m.get("entries");
            Object first = entries.get(0);
            for (int i = 0; i < 1000; i++) {
                entries.add(new LinkedHashMap<>((Map<?, ?>) first));
            }
        }));
        assertEquals("damaged manifest: entry input.0 is listed twice", refusal(p));
    }

    /**
     * The model with entry {@code name} (f64) replaced or added as deflated zeros, 16 MiB inflated,
     * and the manifest edited by {@code listed}, its digest fixed up.
     */
    private static byte[] withZeros(String name, Consumer<Map<String, Object>> listed) {
        Map<String, byte[]> head = ModelEdits.entries(euclidean);
        head.remove("data/" + name + ".f64");
        Map<String, Object> m = ModelEdits.manifest(euclidean);
        listed.accept(m);
        byte[] manifest = (JsonTrees.write(m) + "\n").getBytes(StandardCharsets.UTF_8);
        head.put(ModelArchive.MANIFEST, manifest);
        head.put(ModelArchive.MANIFEST_DIGEST, (ModelEdits.sha256(manifest) + "\n").getBytes(StandardCharsets.US_ASCII));
        return ModelEdits.withDeflatedZeros(ModelEdits.stored(head), "data/" + name + ".f64", 16L << 20);
    }

    @Test
    void anUnusedEntryIsNeverInflated() throws IOException {
        // Listed with a CRC and digest it fails: were it read, loading would fail.
        Path p = file("unused.nfm", withZeros("junk", m -> {
            Map<String, Object> junk = new LinkedHashMap<>();
            junk.put("name", "junk");
            junk.put("type", "f64");
            junk.put("count", (double) (2L << 20));
            junk.put("crc32", 1.0);
            junk.put("sha256", "0".repeat(64));
            @SuppressWarnings("unchecked")
            List<Object> entries = (List<Object>) m.get("entries");
            entries.add(junk);
        }));
        assertSameEstimates(p);
    }

    @Test
    void aNeededEntryListedLargerThanTheRowsIsRefusedBeforeItIsInflated() throws IOException {
        // input.0 becomes 16 MiB of deflated zeros, listed truthfully as 2 Mi values; the rows say 120.
        Path p = file("bigger.nfm", withZeros("input.0", m -> ModelEdits.set(m, "entries[0].count", 2097152.0)));
        assertEquals("is damaged: entry input.0 is listed as 2097152 f64 values, the model needs 120 f64 values",
                refusal(p));
    }

    @Test
    void storedEntriesThatShareTheirBytesCannotMultiplyTheAllocation() throws IOException {
        // A hand-made ZIP (PKWARE APPNOTE 4.3): one stored array of 2000 values, and central-directory
        // records for the other three arrays pointing at its bytes; 4 x 16 000 bytes claimed from a
        // file of about 19 KB.
        int rows = 2000;
        byte[] data = doubles(new double[rows]);
        Map<String, Object> m = ModelEdits.manifest(euclidean);
        m.put("rows", (double) rows);
        for (Object o : (List<?>) m.get("entries")) {
            @SuppressWarnings("unchecked")
            Map<String, Object> e = (Map<String, Object>) o;
            e.put("count", (double) rows);
            java.util.zip.CRC32 crc = new java.util.zip.CRC32();
            crc.update(data);
            e.put("crc32", (double) crc.getValue());
            e.put("sha256", ModelEdits.sha256(data));
        }
        byte[] manifest = (JsonTrees.write(m) + "\n").getBytes(StandardCharsets.UTF_8);
        byte[] digest = (ModelEdits.sha256(manifest) + "\n").getBytes(StandardCharsets.US_ASCII);
        HandZip zip = new HandZip();
        zip.add(ModelArchive.MANIFEST, manifest);
        zip.add(ModelArchive.MANIFEST_DIGEST, digest);
        int shared = zip.add("data/input.0.f64", data);
        zip.alias("data/input.1.f64", shared, data);
        zip.alias("data/response.f64", shared, data);
        zip.alias("data/source_line.i64", shared, data);
        Path p = file("shared.nfm", zip.finish());
        assertEquals("is damaged: its entries claim more bytes than the file's " + Files.size(p), refusal(p));
    }

    /** Writes stored entries and central-directory records by hand, so two records can share bytes. */
    private static final class HandZip {
        private final java.io.ByteArrayOutputStream out = new java.io.ByteArrayOutputStream();
        private final java.io.ByteArrayOutputStream central = new java.io.ByteArrayOutputStream();
        private int records;

        int add(String name, byte[] data) {
            int offset = out.size();
            byte[] n = name.getBytes(StandardCharsets.UTF_8);
            le(out, 0x04034b50, 4);
            le(out, 20, 2);
            le(out, 0, 2);
            le(out, 0, 2); // stored
            le(out, 0, 4); // time and date
            le(out, crc(data), 4);
            le(out, data.length, 4);
            le(out, data.length, 4);
            le(out, n.length, 2);
            le(out, 0, 2);
            out.writeBytes(n);
            out.writeBytes(data);
            alias(name, offset, data);
            return offset;
        }

        void alias(String name, int offset, byte[] data) {
            byte[] n = name.getBytes(StandardCharsets.UTF_8);
            le(central, 0x02014b50, 4);
            le(central, 20, 2);
            le(central, 20, 2);
            le(central, 0, 2);
            le(central, 0, 2);
            le(central, 0, 4);
            le(central, crc(data), 4);
            le(central, data.length, 4);
            le(central, data.length, 4);
            le(central, n.length, 2);
            le(central, 0, 2);
            le(central, 0, 2);
            le(central, 0, 2);
            le(central, 0, 2);
            le(central, 0, 4);
            le(central, offset, 4);
            central.writeBytes(n);
            records++;
        }

        byte[] finish() {
            int at = out.size();
            out.writeBytes(central.toByteArray());
            le(out, 0x06054b50, 4);
            le(out, 0, 2);
            le(out, 0, 2);
            le(out, records, 2);
            le(out, records, 2);
            le(out, central.size(), 4);
            le(out, at, 4);
            le(out, 0, 2);
            return out.toByteArray();
        }

        private static long crc(byte[] data) {
            java.util.zip.CRC32 c = new java.util.zip.CRC32();
            c.update(data);
            return c.getValue();
        }

        private static void le(java.io.ByteArrayOutputStream o, long v, int bytes) {
            for (int i = 0; i < bytes; i++) {
                o.write((int) (v >>> (8 * i)) & 0xff);
            }
        }
    }
}
