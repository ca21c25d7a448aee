package nearfit.model;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.zip.ZipEntry;
import java.util.zip.ZipOutputStream;

import nearfit.table.NearfitException;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class ModelArchiveTest {
    @TempDir
    Path dir;

    private Path writeSample() {
        Path p = dir.resolve("m.nfm");
        Map<String, Object> arrays = new LinkedHashMap<>();
        arrays.put("x0", new double[] {1.5, -2.25, Double.NaN});
        arrays.put("rows", new int[] {3, 7, 11});
        arrays.put("lines", new long[] {5L, 9L, 1L << 40});
        ModelArchive.write(p, false, List.of(), Map.of("k", 5), arrays);
        return p;
    }

    @Test
    void arraysAndManifestRoundTrip() {
        ModelArchive.Contents c = ModelArchive.read(writeSample());
        assertArrayEquals(new double[] {1.5, -2.25, Double.NaN}, c.doubles("x0"));
        assertArrayEquals(new int[] {3, 7, 11}, c.ints("rows"));
        assertArrayEquals(new long[] {5L, 9L, 1L << 40}, c.longs("lines"));
        assertEquals(5.0, ((java.math.BigDecimal) c.manifest().get("k")).doubleValue());
        assertEquals("1.1", c.manifest().get("format_version"));
    }

    // ZIP is an open container (PKWARE APPNOTE): the JDK's own reader lists the entries.
    @Test
    void isAPlainZipWithAManifestFirst() throws IOException {
        try (java.util.zip.ZipFile z = new java.util.zip.ZipFile(writeSample().toFile())) {
            assertEquals(ModelArchive.MANIFEST, z.entries().nextElement().getName());
            assertEquals(5, z.size()); // the manifest, its digest and three arrays
        }
    }

    @Test
    void aFlippedByteFailsTheCrcCheck() throws IOException {
        Path p = writeSample();
        byte[] b = Files.readAllBytes(p);
        // The last entry's data sits just before the central directory; flip a byte in the x0 data,
        // found by its known little-endian pattern for 1.5.
        int at = Bytes.indexOf(b, new byte[] {0, 0, 0, 0, 0, 0, (byte) 0xF8, 0x3F});
        b[at] ^= 0x01;
        Files.write(p, b);
        NearfitException e = assertThrows(NearfitException.class, () -> ModelArchive.read(p));
        assertTrue(e.getMessage().contains("CRC") || e.getMessage().contains("damaged"), e.getMessage());
    }

    @Test
    void aTruncatedFileIsReportedAsDamagedOrTruncated() throws IOException {
        Path p = writeSample();
        byte[] b = Files.readAllBytes(p);
        Files.write(p, java.util.Arrays.copyOf(b, b.length / 2));
        NearfitException e = assertThrows(NearfitException.class, () -> ModelArchive.read(p));
        assertTrue(e.getMessage().contains("damaged or truncated"), e.getMessage());
    }

    @Test
    void aFutureMajorVersionIsRefusedNamingBothVersions() throws IOException {
        Path p = dir.resolve("future.nfm");
        zipWithManifest(p, "{\"format\":\"nearfit-model\",\"format_version\":\"2.0\",\"entries\":[]}");
        NearfitException e = assertThrows(NearfitException.class, () -> ModelArchive.read(p));
        assertEquals(p + ": is a model file of format version 2.0; this build reads version 1.x", e.getMessage());
    }

    @Test
    void aFileThatIsNotAZipIsNotAModel() throws IOException {
        Path p = dir.resolve("notes.csv");
        Files.writeString(p, "a,b\n1,2\n");
        NearfitException e = assertThrows(NearfitException.class, () -> ModelArchive.read(p));
        assertTrue(e.getMessage().startsWith(p + ": is not a nearfit model file"), e.getMessage());
    }

    @Test
    void aZipWithoutManifestIsNotAModel() throws IOException {
        Path p = dir.resolve("other.zip");
        try (ZipOutputStream z = new ZipOutputStream(Files.newOutputStream(p))) {
            z.putNextEntry(new ZipEntry("readme.txt"));
            z.write("hello".getBytes(StandardCharsets.UTF_8));
        }
        NearfitException e = assertThrows(NearfitException.class, () -> ModelArchive.read(p));
        assertEquals(p + ": is a ZIP file but not a nearfit model (no manifest.json)", e.getMessage());
    }

    @Test
    void anEntryLargerThanItsManifestSaysIsRefused() throws IOException {
        Path p = dir.resolve("big.nfm");
        try (ZipOutputStream z = new ZipOutputStream(Files.newOutputStream(p))) {
            z.putNextEntry(new ZipEntry(ModelArchive.MANIFEST));
            z.write(("{\"format\":\"nearfit-model\",\"format_version\":\"1.0\",\"entries\":"
                    + "[{\"name\":\"x\",\"type\":\"f64\",\"count\":1,\"crc32\":0}]}").getBytes(StandardCharsets.UTF_8));
            z.putNextEntry(new ZipEntry("data/x.f64"));
            z.write(new byte[1 << 20]); // a deflated megabyte of zeros where 8 bytes are declared
        }
        NearfitException e = assertThrows(NearfitException.class, () -> ModelArchive.read(p));
        assertTrue(e.getMessage().contains("entry x has") || e.getMessage().contains("larger than allowed"), e.getMessage());
    }

    private static void zipWithManifest(Path p, String json) throws IOException {
        try (ZipOutputStream z = new ZipOutputStream(Files.newOutputStream(p))) {
            z.putNextEntry(new ZipEntry(ModelArchive.MANIFEST));
            z.write(json.getBytes(StandardCharsets.UTF_8));
        }
    }

}
