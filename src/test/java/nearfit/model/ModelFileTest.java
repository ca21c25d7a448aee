package nearfit.model;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.zip.ZipEntry;
import java.util.zip.ZipFile;
import java.util.zip.ZipOutputStream;

import nearfit.knn.Band;
import nearfit.knn.FlagScale;
import nearfit.knn.KnnSettings;
import nearfit.knn.Metric;
import nearfit.knn.Scaling;
import nearfit.knn.Weighting;
import nearfit.table.NearfitException;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class ModelFileTest {
    @TempDir
    Path dir;

    static ReferenceModel sample(boolean withGroup) {
        ReferenceRows rows = new ReferenceRows(
                new double[][] {{3.5, 7.25, 11.0, -0.5}, {12.0, 11.5, 10.0, 9.0}},
                new double[] {120.0, 980.5, 2010.0, Double.NaN}, null,
                withGroup ? new int[] {0, 1, 1, -1} : null, new long[] {2, 3, 5, 8});
        ModelColumns columns = new ModelColumns(List.of("wind_ms", "temp_c"), "power_kw", List.of(),
                withGroup ? "turbine" : null, withGroup ? List.of("T01", "T02") : List.of());
        TuningSummary tuning = new TuningSummary(4, new int[] {1, 2}, new double[] {10, 9},
                new double[] {1, 1.5}, new double[] {8, 7}, new double[] {400, 324}, new double[] {0.5, 0.6},
                null, null, 2, 2, -1);
        return new ReferenceModel("0.1.0", Instant.parse("2026-03-01T10:15:30Z"),
                new SourceInfo("site-log.csv.gz", 1234, "ab".repeat(32), "turbine != T03"), columns,
                new KnnSettings(2, Metric.MAHALANOBIS, Weighting.TRICUBE, Scaling.ROBUST, Band.SD2, 3.0,
                        FlagScale.GLOBAL_MAD, 1),
                new double[] {7.0, 10.5}, new double[] {2.0, 1.25}, new double[] {1, 0, 0.5, 2},
                new ReferenceModel.ResidualScale(-0.5, 42.0), tuning, rows);
    }

    private Path saved(ReferenceModel m) {
        Path p = dir.resolve("ref.nfm");
        ModelFile.write(m, p, false, List.of());
        return p;
    }

    @Test
    void everyFieldSurvivesSavingAndLoading() {
        ReferenceModel m = sample(true);
        ReferenceModel back = ModelFile.read(saved(m));
        assertEquals(m.settings(), back.settings());
        assertEquals(m.columns(), back.columns());
        assertEquals(m.source(), back.source());
        assertEquals(m.created(), back.created());
        assertEquals(m.residualScale(), back.residualScale());
        assertArrayEquals(m.scaleSpread(), back.scaleSpread());
        assertArrayEquals(m.whitening(), back.whitening());
        assertArrayEquals(m.rows().inputs()[1], back.rows().inputs()[1]);
        assertArrayEquals(m.rows().response(), back.rows().response());
        assertArrayEquals(m.rows().groupCodes(), back.rows().groupCodes());
        assertArrayEquals(m.rows().sourceLines(), back.rows().sourceLines());
        assertEquals(JsonTrees.write(m.tuning().toJson()), JsonTrees.write(back.tuning().toJson()));
    }

    @Test
    void theHeldOutSchemeOfTheTuningTableSurvivesAndAnOlderFileWithoutItReadsAsNotRecorded() {
        ReferenceModel m = sample(true);
        assertNull(ModelFile.read(saved(m)).tuning().scheme(), "the sample's table records no scheme");
        ReferenceModel withScheme = m.withTuning(m.tuning().withScheme("5-fold cross-validation"));
        Path p = dir.resolve("scheme.nfm");
        ModelFile.write(withScheme, p, false, List.of());
        assertEquals("5-fold cross-validation", ModelFile.read(p).tuning().scheme());
        assertFalse(JsonTrees.write(m.tuning().toJson()).contains("scheme"), "no key when not recorded, as before");
    }

    @Test
    void aModelWithoutGroupOrTuningHasNeither() {
        ReferenceModel m = sample(false);
        // Without whitening, so with a metric other than Mahalanobis.
        KnnSettings euclidean = m.settings().withMetric(Metric.EUCLIDEAN);
        ReferenceModel plain = new ReferenceModel(m.toolVersion(), m.created(),
                new SourceInfo("-", -1, null, null), m.columns(), euclidean, m.scaleCenter(),
                m.scaleSpread(), null, m.residualScale(), null, m.rows());
        ReferenceModel back = ModelFile.read(saved(plain));
        assertNull(back.columns().group());
        assertNull(back.rows().groupCodes());
        assertNull(back.tuning());
        assertNull(back.whitening());
        assertNull(back.source().sha256());
        assertEquals(-1, back.source().sizeBytes());
    }

    @Test
    void theManifestStatesTheCreationTimeInIso8601Utc() throws IOException {
        try (ZipFile z = new ZipFile(saved(sample(true)).toFile())) {
            String manifest = new String(z.getInputStream(z.getEntry("manifest.json")).readAllBytes(),
                    StandardCharsets.UTF_8);
            assertTrue(manifest.contains("\"created\":\"2026-03-01T10:15:30Z\""), manifest);
            assertTrue(manifest.contains("\"metric\":\"mahalanobis\""), manifest);
        }
    }

    @Test
    void aManifestMissingAFieldIsADamagedModelNamingTheField() throws IOException {
        Path p = dir.resolve("nok.nfm");
        Map<String, Object> manifest = JsonText.fieldsOf(ModelFile.manifestOf(sample(false)));
        manifest.remove("metric");
        Map<String, Object> arrays = new LinkedHashMap<>();
        arrays.put("source_line", new long[0]);
        ModelArchive.write(p, false, List.of(), manifest, arrays);
        NearfitException e = assertThrows(NearfitException.class, () -> ModelFile.read(p));
        assertEquals(p + ": manifest field \"metric\" is missing", e.getMessage());
    }

    @Test
    void aRowCountThatDisagreesWithTheArraysIsRefused() {
        Path p = dir.resolve("rows.nfm");
        ReferenceModel m = sample(false);
        Map<String, Object> manifest = JsonText.fieldsOf(ModelFile.manifestOf(m));
        manifest.put("rows", 5L);
        ModelArchive.write(p, false, List.of(), manifest, arraysOf(m));
        NearfitException e = assertThrows(NearfitException.class, () -> ModelFile.read(p));
        assertEquals(p + ": is damaged: entry input.0 is listed as 4 f64 values, the model needs 5 f64 values",
                e.getMessage());
    }

    @Test
    void aGroupCodeOutsideTheDictionaryIsRefused() {
        Path p = dir.resolve("codes.nfm");
        ReferenceModel m = sample(true);
        Map<String, Object> arrays = arraysOf(m);
        arrays.put("group_code", new int[] {0, 1, 2, 0});
        ModelArchive.write(p, false, List.of(), ModelFile.manifestOf(m), arrays);
        NearfitException e = assertThrows(NearfitException.class, () -> ModelFile.read(p));
        assertTrue(e.getMessage().contains("group_code"), e.getMessage());
    }

    @Test
    void aFlippedByteIsReportedAsDamaged() throws IOException {
        Path p = saved(sample(false));
        byte[] b = Files.readAllBytes(p);
        // 2010.0 little-endian: 00 00 00 00 00 68 9F 40; flip a bit inside the response array.
        int at = Bytes.indexOf(b, new byte[] {0, 0, 0, 0, 0, 0x68, (byte) 0x9F, 0x40});
        b[at + 5] ^= 0x10;
        Files.write(p, b);
        NearfitException e = assertThrows(NearfitException.class, () -> ModelFile.read(p));
        assertTrue(e.getMessage().contains("CRC-32"), e.getMessage());
    }

    @Test
    void aModelReadFromItsBytesEqualsTheFileAndErrorsNameTheGivenFile() throws IOException {
        Path p = saved(sample(true));
        byte[] b = Files.readAllBytes(p);
        ReferenceModel fromFile = ModelFile.read(p);
        ReferenceModel fromBytes = ModelFile.read(b, "lake/spring.nfm");
        assertEquals(fromFile.columns(), fromBytes.columns());
        assertEquals(fromFile.settings(), fromBytes.settings());
        assertArrayEquals(fromFile.rows().response(), fromBytes.rows().response());
        NearfitException e = assertThrows(NearfitException.class,
                () -> ModelFile.read(java.util.Arrays.copyOf(b, b.length - 40), "lake/spring.nfm"));
        assertTrue(e.getMessage().startsWith("lake/spring.nfm: ") && e.getMessage().contains("damaged or truncated"),
                e.getMessage());
    }

    @Test
    void aTruncatedFileIsReportedAsTruncatedOrDamaged() throws IOException {
        Path p = saved(sample(false));
        byte[] b = Files.readAllBytes(p);
        Files.write(p, java.util.Arrays.copyOf(b, b.length - 40));
        NearfitException e = assertThrows(NearfitException.class, () -> ModelFile.read(p));
        assertTrue(e.getMessage().contains("damaged or truncated"), e.getMessage());
    }

    @Test
    void aFutureMajorVersionNamesTheVersions() throws IOException {
        Path p = dir.resolve("future.nfm");
        try (ZipOutputStream z = new ZipOutputStream(Files.newOutputStream(p))) {
            z.putNextEntry(new ZipEntry("manifest.json"));
            z.write("{\"format\":\"nearfit-model\",\"format_version\":\"3.1\",\"entries\":[]}"
                    .getBytes(StandardCharsets.UTF_8));
        }
        NearfitException e = assertThrows(NearfitException.class, () -> ModelFile.read(p));
        assertTrue(e.getMessage().contains("3.1") && e.getMessage().contains("1.x"), e.getMessage());
    }

    @Test
    void aCsvFileIsNotAModel() throws IOException {
        Path p = dir.resolve("site-log.csv");
        Files.writeString(p, "time,turbine,wind_ms,power_kw\n2026-01-01T00:00Z,T01,7.5,900\n");
        NearfitException e = assertThrows(NearfitException.class, () -> ModelFile.read(p));
        assertTrue(e.getMessage().startsWith(p + ": is not a nearfit model file"), e.getMessage());
    }

    private static Map<String, Object> arraysOf(ReferenceModel m) {
        Map<String, Object> arrays = new LinkedHashMap<>();
        arrays.put("input.0", m.rows().inputs()[0]);
        arrays.put("input.1", m.rows().inputs()[1]);
        arrays.put("response", m.rows().response());
        if (m.rows().groupCodes() != null) {
            arrays.put("group_code", m.rows().groupCodes());
        }
        arrays.put("source_line", m.rows().sourceLines());
        return arrays;
    }

}
