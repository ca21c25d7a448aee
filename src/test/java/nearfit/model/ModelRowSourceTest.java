package nearfit.model;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.zip.ZipFile;

import nearfit.table.NearfitException;
import nearfit.table.RowSource;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** A model fitted on Parquet rows records the files its rows' file numbers point at; a CSV model records nothing new. */
class ModelRowSourceTest {
    /** A source-row value of the second file (number 1), row index 7: {@code 1 << 40 | 7} (RowSource's packing). */
    private static final long SECOND_FILE_ROW_7 = (1L << 40) | 7;

    @TempDir
    Path dir;

    private static final List<SourceInfo.SourceFile> FILES = List.of(
            new SourceInfo.SourceFile("set/unit=T01/part-0.parquet", 1200, "0a".repeat(32)),
            new SourceInfo.SourceFile("set/unit=T02/part-0.parquet", 1300, "1b".repeat(32)));

    /** ModelFileTest's sample with Parquet rows: lines become file numbers and row indexes. */
    private static ReferenceModel parquetSample(long[] origins) {
        ReferenceModel m = ModelFileTest.sample(true);
        ReferenceRows r = m.rows();
        ReferenceRows rows = new ReferenceRows(r.inputs(), r.response(), null, r.groupCodes(), origins);
        SourceInfo source = new SourceInfo("set", -1, null, null, FILES);
        return new ReferenceModel(m.toolVersion(), m.created(), source, m.columns(), m.settings(), m.scaleCenter(),
                m.scaleSpread(), m.whitening(), m.residualScale(), m.tuning(), rows);
    }

    private Path saved(ReferenceModel m) {
        Path p = dir.resolve("ref.nfm");
        ModelFile.write(m, p, false, List.of());
        return p;
    }

    private static String manifestText(Path model) throws IOException {
        try (ZipFile z = new ZipFile(model.toFile())) {
            return new String(z.getInputStream(z.getEntry("manifest.json")).readAllBytes(), StandardCharsets.UTF_8);
        }
    }

    @Test
    void theParquetFilesSurviveSavingAndLoadingAndTheRowsReadAsFileAndRowIndex() {
        long[] origins = {0, 5, SECOND_FILE_ROW_7, (1L << 40)};
        ReferenceModel back = ModelFile.read(saved(parquetSample(origins)));
        assertEquals(FILES, back.source().parquetFiles());
        assertArrayEquals(origins, back.rows().sourceLines());
        RowSource source = back.source().rowSource();
        assertEquals("row", source.heading());
        assertEquals("set/unit=T02/part-0.parquet:7", source.label(SECOND_FILE_ROW_7));
        assertEquals("set/unit=T01/part-0.parquet:5", source.label(5));
    }

    @Test
    void aCsvModelWritesNoParquetFilesAndReadsAsCsvLines() throws IOException {
        Path p = saved(ModelFileTest.sample(true));
        // No key at all, so a CSV model's manifest (and its SHA-256) is what it was before Parquet rows were recorded.
        assertFalse(manifestText(p).contains("parquet_files"), manifestText(p));
        ReferenceModel back = ModelFile.read(p);
        assertNull(back.source().parquetFiles());
        assertSame(RowSource.CSV_LINES, back.source().rowSource());
    }

    @Test
    void aSourceValueNamingNoRecordedFileIsRefused() {
        Path p = dir.resolve("origin.nfm");
        ReferenceModel m = parquetSample(new long[] {0, 1, 2, 3});
        Map<String, Object> arrays = arraysOf(m);
        arrays.put("source_line", new long[] {0, 1, (2L << 40) | 3, 3}); // file number 2 of 2 files
        ModelArchive.write(p, false, List.of(), ModelFile.manifestOf(m), arrays);
        NearfitException e = assertThrows(NearfitException.class, () -> ModelFile.read(p));
        assertEquals(p + ": entry source_line holds " + ((2L << 40) | 3) + " at stored row 3, which names no file of "
                + "\"source.parquet_files\"", e.getMessage());
    }

    @Test
    void aDamagedStoredRowOfParquetOriginIsNamedByFileAndRowIndexNotByItsPackedValue() {
        Path p = dir.resolve("nan.nfm");
        ReferenceModel m = parquetSample(new long[] {0, 1, SECOND_FILE_ROW_7, 3});
        Map<String, Object> arrays = arraysOf(m);
        double[] x = m.rows().inputs()[1].clone();
        x[2] = Double.NaN;
        arrays.put("input.1", x);
        ModelArchive.write(p, false, List.of(), ModelFile.manifestOf(m), arrays);
        NearfitException e = assertThrows(NearfitException.class, () -> ModelFile.read(p));
        assertEquals(p + ": entry input.1 (" + m.columns().inputs().get(1) + ") holds NaN at stored row 3 (source row "
                + "set/unit=T02/part-0.parquet:7); stored inputs must be finite", e.getMessage());
    }

    @Test
    void aParquetFileEntryWithABadDigestIsADamagedModelNamingTheField() {
        Path p = dir.resolve("digest.nfm");
        ReferenceModel m = parquetSample(new long[] {0, 1, 2, 3});
        Map<String, Object> manifest = JsonText.fieldsOf(ModelFile.manifestOf(m));
        Map<String, Object> source = JsonText.fieldsOf(manifest.get("source"));
        source.put("parquet_files", List.of(Map.of("name", "set/a.parquet", "size", 10, "sha256", "AB".repeat(32))));
        manifest.put("source", source);
        ModelArchive.write(p, false, List.of(), manifest, arraysOf(m));
        NearfitException e = assertThrows(NearfitException.class, () -> ModelFile.read(p));
        assertEquals(p + ": manifest field \"source.parquet_files[0].sha256\" is not 64 lower-case hex digits",
                e.getMessage());
    }

    private static Map<String, Object> arraysOf(ReferenceModel m) {
        Map<String, Object> arrays = new LinkedHashMap<>();
        arrays.put("input.0", m.rows().inputs()[0]);
        arrays.put("input.1", m.rows().inputs()[1]);
        arrays.put("response", m.rows().response());
        arrays.put("group_code", m.rows().groupCodes());
        arrays.put("source_line", m.rows().sourceLines());
        return arrays;
    }
}
