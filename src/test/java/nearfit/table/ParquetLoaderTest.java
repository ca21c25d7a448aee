package nearfit.table;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.net.URISyntaxException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * Parquet written by an outside writer (DuckDB 1.4.4 through its JDBC driver, scripts/reference/
 * make-parquet-fixtures; versions in src/test/resources/parquet/VERSIONS.txt) loads into the same columns
 * and summaries as the CSV twin DuckDB wrote of the same rows: nulls, timestamps with and without UTC
 * adjustment in milli, micro and nano units, dates, decimals stored as INT32, INT64 and fixed bytes,
 * dictionary-encoded strings, booleans and five row groups.
 */
class ParquetLoaderTest {
    @TempDir
    Path dir;

    static Path fixture(String name) {
        try {
            return Path.of(ParquetLoaderTest.class.getResource("/parquet/" + name).toURI());
        } catch (URISyntaxException e) {
            throw new IllegalStateException(e);
        }
    }

    private static Map<String, ColumnSummary> summaries(Table t) {
        Map<String, ColumnSummary> out = new HashMap<>();
        for (ColumnSummary s : ColumnSummary.ofAll(t.columns(), 2)) {
            out.put(s.name(), s);
        }
        return out;
    }

    private static Table load(Path p) {
        return CsvLoader.load(p, p.getFileName().toString(), LoadOptions.builder().threads(2).build());
    }

    @ParameterizedTest(name = "{0}")
    @ValueSource(strings = {"site.parquet", "site-gzip.parquet", "site-zstd.parquet", "site-none.parquet", "site-set"})
    void everyCodecAndTheDataSetSummariseAsTheCsvTwin(String name) {
        Table csv = load(fixture("site.csv"));
        Table parquet = load(fixture(name));
        assertEquals(csv.rowCount(), parquet.rowCount());
        Map<String, ColumnSummary> expected = summaries(csv);
        Map<String, ColumnSummary> actual = summaries(parquet);
        assertEquals(expected.keySet(), actual.keySet(), "the list and struct columns are left out");
        for (String column : expected.keySet()) {
            ColumnSummary e = expected.get(column);
            ColumnSummary a = actual.get(column);
            if (name.equals("site-set") && Double.isFinite(e.mean())) {
                // The data set holds the rows grouped by unit: sums run in another order, so the mean and SD
                // may differ in the last bits; everything else is exact.
                assertEquals(e.mean(), a.mean(), 1e-12 * Math.abs(e.mean()), column);
                assertEquals(e.sd(), a.sd(), 1e-12 * Math.abs(e.sd()), column);
                a = new ColumnSummary(a.name(), a.type(), a.count(), a.missing(), a.bad(), a.min(), a.p01(), a.p25(),
                        a.median(), a.p75(), a.p99(), a.max(), e.mean(), e.sd(), a.distinct(), a.top());
            }
            assertEquals(e, a, column);
        }
        assertEquals(LoadReport.PARQUET, parquet.report().delimiter());
    }

    @Test
    void typesFollowTheParquetAnnotations() {
        Table t = load(fixture("site.parquet"));
        for (String time : List.of("t_utc", "t_local", "t_ms", "t_ns", "day")) {
            assertEquals(ColumnType.TIME, t.column(time).type(), time);
        }
        for (String number : List.of("wind_ms", "power_kw", "temp_c", "energy", "blades")) {
            assertEquals(ColumnType.NUMBER, t.column(number).type(), number);
        }
        assertEquals(ColumnType.CATEGORY, t.column("unit").type());
        assertEquals(ColumnType.CATEGORY, t.column("running").type());
        assertEquals(List.of("true", "false"), ((CategoryColumn) t.column("running")).labels().stream().sorted(
                java.util.Comparator.reverseOrder()).toList());
    }

    @Test
    void timestampsKeepTheirWallClockOrInstantToTheMillisecond() {
        Table t = load(fixture("site.parquet"));
        // Row 2 (DuckDB): t_utc 2025-03-01 00:20:00.000002+00 (micros dropped), t_local 00:20:00.002, t_ns 23:00:02.
        NumericColumn utc = t.numeric("t_utc");
        NumericColumn local = t.numeric("t_local");
        NumericColumn ns = t.numeric("t_ns");
        long base = java.time.Instant.parse("2025-03-01T00:00:00Z").toEpochMilli();
        assertEquals(base + 20 * 60_000, (long) utc.asDouble(2));
        assertEquals(base + 20 * 60_000 + 2, (long) local.asDouble(2));
        assertEquals(java.time.Instant.parse("2024-12-31T23:00:02Z").toEpochMilli(), (long) ns.asDouble(2));
    }

    @Test
    void nullsAreMissingCellsCountedPerColumn() {
        Table t = load(fixture("site.parquet"));
        assertEquals(12, t.column("wind_ms").missingCount(), "i % 53 == 3 for i < 600");
        assertEquals(15, t.column("unit").missingCount(), "i % 41 == 7 for i < 600");
        assertEquals(0, t.column("power_kw").badCount());
    }

    @Test
    void nestedColumnsAreLeftOutWithANoteNamingThem() {
        Table t = load(fixture("site.parquet"));
        assertFalse(t.hasColumn("tags"));
        assertFalse(t.hasColumn("extra"));
        assertEquals(List.of("columns left out (nested, list, map or of a type not read): tags (list), extra (nested)"),
                t.report().warnings());
    }

    @Test
    void rowsCarryTheirFileAndRowIndex() {
        Table one = load(fixture("site.parquet"));
        assertTrue(one.rowSource().isParquet());
        assertEquals("row", one.rowSource().heading());
        assertEquals("599", one.rowSource().label(one.lineOf(599)));
        Table set = load(fixture("site-set"));
        // Files in path order: unit=NULL first, so row 15 is the first row of unit=T01/data_0.parquet.
        assertEquals("site-set/unit=NULL/data_0.parquet:14", set.rowSource().label(set.lineOf(14)));
        assertEquals("site-set/unit=T01/data_0.parquet:0", set.rowSource().label(set.lineOf(15)));
        assertEquals(RowSource.CSV_LINES, load(fixture("site.csv")).rowSource());
        assertEquals(2, load(fixture("site.csv")).lineOf(0));
    }

    @Test
    void onlyTheKeptColumnsAreRead() {
        Table t = CsvLoader.load(fixture("site.parquet"), "site.parquet",
                LoadOptions.builder().keepColumns(List.of("power_kw", "wind_ms")).keepFirstTimeColumn(true).build());
        assertEquals(List.of("t_utc", "wind_ms", "power_kw"), t.names());
        NearfitException e = assertThrows(NearfitException.class, () -> CsvLoader.load(fixture("site.parquet"),
                "site.parquet", LoadOptions.builder().keepColumns(List.of("speed")).build()));
        assertEquals("speed", e.column());
        assertTrue(e.getMessage().contains("no such column; the columns are unit, t_utc,"), e.getMessage());
    }

    @Test
    void aDataSetWhoseFilesDisagreeOnAColumnsTypeIsRefusedNamingTheFile() {
        NearfitException e = assertThrows(NearfitException.class, () -> load(fixture("mixed-types")));
        assertEquals("mixed-types/part-1.parquet: column power_kw is a category here and a number in the data set's first file",
                e.getMessage());
    }

    @Test
    void aFileIsParquetByItsMagicBytesNotItsName() throws IOException {
        Path named = dir.resolve("log.csv");
        Files.copy(fixture("site.parquet"), named);
        assertEquals(600, load(named).rowCount());
        Path csv = dir.resolve("log.parquet");
        Files.copy(fixture("site.csv"), csv);
        assertEquals(',', load(csv).report().delimiter());
    }

    @Test
    void aFolderWithoutParquetFilesIsRefused() throws IOException {
        Files.writeString(dir.resolve("a.csv"), "x\n1\n");
        NearfitException e = assertThrows(NearfitException.class, () -> CsvLoader.load(dir, "logs",
                LoadOptions.builder().build()));
        assertEquals("logs: is a folder with no Parquet file (a CSV file must be named itself)", e.getMessage());
    }

    @Test
    void aDamagedPageIsOneErrorNamingTheFile() throws IOException {
        byte[] b = Files.readAllBytes(fixture("site-none.parquet"));
        for (int i = 200; i < 1200; i++) {
            b[i] = (byte) 0xff; // the first row group's pages, past the magic bytes
        }
        Path p = dir.resolve("damaged.parquet");
        Files.write(p, b);
        NearfitException e = assertThrows(NearfitException.class, () -> load(p));
        assertTrue(e.getMessage().startsWith("damaged.parquet: column "), e.getMessage());
    }

    @Test
    void snappyRoundTripsThroughOurEncoderAndDecoder() {
        byte[] in = new byte[200_000];
        for (int i = 0; i < in.length; i++) {
            in[i] = (byte) (i % 97 < 50 ? i % 7 : (i * 31) >>> 3);
        }
        byte[] z = ParquetCodec.snappyCompress(in, in.length);
        assertTrue(z.length < in.length, "compressible input shrinks");
        assertEquals(java.util.Arrays.toString(in), java.util.Arrays.toString(ParquetCodec.snappy(z, 0, z.length, in.length)));
    }
}
