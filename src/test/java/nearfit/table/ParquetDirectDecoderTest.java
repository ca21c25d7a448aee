package nearfit.table;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.math.BigDecimal;
import java.net.URISyntaxException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

import org.apache.parquet.format.ColumnMetaData;
import org.apache.parquet.format.PageHeader;
import org.apache.parquet.format.Util;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * The direct page decoder ({@link ParquetDirectDecoder}) against parquet-column's reader (the general path)
 * and against the values the writers themselves printed, on fixtures from two outside writers
 * (scripts/reference/make-parquet-direct-fixtures; versions in src/test/resources/parquet-direct/VERSIONS.txt):
 * DuckDB 1.4.4 (data pages v1, PLAIN and dictionary pages, nulls, NaN and infinities, three row groups,
 * snappy, zstd, gzip and none) and arrow-rs through parquet-wasm 0.8.0 (data pages v2 and v1, required and
 * optional columns, several pages per chunk, pages stored uncompressed inside compressed chunks).
 */
class ParquetDirectDecoderTest {
    @TempDir
    Path dir;

    private static Path fixture(String name) {
        try {
            return Path.of(ParquetDirectDecoderTest.class.getResource("/parquet-direct/" + name).toURI());
        } catch (URISyntaxException e) {
            throw new IllegalStateException(e);
        }
    }

    private static final String[] ALL = {"duck-snappy.parquet", "duck-zstd.parquet", "duck-gzip.parquet",
        "duck-none.parquet", "arrow-v2-snappy.parquet", "arrow-v2-zstd.parquet", "arrow-v2-gzip.parquet",
        "arrow-v2-none.parquet", "arrow-v1-snappy.parquet"};

    /** Every column chunk read both ways gives the same cells, bit for bit, and the same counts. */
    @ParameterizedTest(name = "{0}")
    @ValueSource(strings = {"duck-snappy.parquet", "duck-zstd.parquet", "duck-gzip.parquet", "duck-none.parquet",
        "arrow-v2-snappy.parquet", "arrow-v2-zstd.parquet", "arrow-v2-gzip.parquet", "arrow-v2-none.parquet",
        "arrow-v1-snappy.parquet"})
    void theDirectPathGivesTheGeneralPathsCells(String name) throws IOException {
        ParquetFile file = ParquetFile.open(fixture(name));
        ParquetDirectDecoder direct = new ParquetDirectDecoder();
        int chunks = 0;
        assertEquals(3, file.rowGroups().size(), "several row groups");
        for (int g = 0; g < file.rowGroups().size(); g++) {
            for (ParquetSchema.Field f : file.schema.fields()) {
                assertTrue(ParquetDirectDecoder.reads(f), f.name() + " is a plain numeric column");
                ColumnBuilder general = new ColumnBuilder(ColumnType.NUMBER);
                ColumnBuilder fast = new ColumnBuilder(ColumnType.NUMBER);
                file.read(g, f, general, null);
                file.read(g, f, fast, direct);
                chunks++;
                assertEquals(general.size, fast.size, f.name());
                assertEquals(general.missing, fast.missing, f.name());
                assertEquals(general.bad, fast.bad, f.name());
                for (int i = 0; i < general.size; i++) {
                    assertEquals(Double.doubleToRawLongBits(general.numbers.get(i)),
                            Double.doubleToRawLongBits(fast.numbers.get(i)), f.name() + " row " + i + " of group " + g);
                }
            }
        }
        assertEquals(chunks, direct.chunksDecoded, "every chunk went through the direct decoder");
    }

    /** A column's expected cells, as the writer printed them in its CSV twin. */
    private record Expected(double[] values, long missing, long bad) {
    }

    /**
     * Reads column {@code c} of a writer's CSV twin: empty is null (missing), "nan" missing, "inf"/"-inf" a bad
     * cell; floats through Float.parseFloat (the writer printed the float's shortest decimal), unsigned
     * 64-bit integers through BigDecimal (the correctly rounded double of the exact integer).
     */
    private static Expected expected(List<String[]> rows, int c, String column) {
        double[] v = new double[rows.size()];
        long missing = 0;
        long bad = 0;
        for (int i = 0; i < v.length; i++) {
            String s = rows.get(i)[c];
            double x;
            if (s.isEmpty() || s.equalsIgnoreCase("nan")) {
                x = Double.NaN;
            } else if (s.endsWith("inf") || s.endsWith("Infinity")) {
                x = Double.NaN;
                bad++;
            } else if (column.startsWith("f_")) {
                x = Float.parseFloat(s);
            } else if (column.startsWith("u64")) {
                x = new BigDecimal(s).doubleValue();
            } else {
                x = Double.parseDouble(s);
            }
            if (x != x) {
                missing++;
            }
            v[i] = x;
        }
        return new Expected(v, missing, bad);
    }

    private static List<String[]> csv(String name) throws IOException {
        List<String[]> rows = new ArrayList<>();
        for (String line : Files.readAllLines(fixture(name))) {
            rows.add(line.split(",", -1));
        }
        return rows;
    }

    /** The whole load (parallel tasks per row group and column) holds the writers' own printed values. */
    @ParameterizedTest(name = "{0}")
    @ValueSource(strings = {"duck-snappy.parquet", "duck-zstd.parquet", "duck-gzip.parquet", "duck-none.parquet",
        "arrow-v2-snappy.parquet", "arrow-v2-zstd.parquet", "arrow-v2-gzip.parquet", "arrow-v2-none.parquet",
        "arrow-v1-snappy.parquet"})
    void theLoadHoldsTheValuesTheWriterPrinted(String name) throws IOException {
        List<String[]> rows = csv(name.startsWith("duck") ? "duck.csv" : "arrow.csv");
        String[] header = rows.remove(0);
        Table t = CsvLoader.load(fixture(name), name, LoadOptions.builder().threads(2).build());
        assertEquals(rows.size(), t.rowCount());
        assertEquals(header.length, t.columns().size());
        long bad = 0;
        for (int c = 0; c < header.length; c++) {
            Expected e = expected(rows, c, header[c]);
            DecimalColumn col = (DecimalColumn) t.column(header[c]);
            assertEquals(e.missing(), col.missingCount(), header[c]);
            assertEquals(e.bad(), col.badCount(), header[c]);
            bad += e.bad();
            for (int i = 0; i < e.values().length; i++) {
                assertEquals(Double.doubleToRawLongBits(e.values()[i]), Double.doubleToRawLongBits(col.get(i)),
                        header[c] + " row " + i + ": " + rows.get(i)[c]);
            }
        }
        assertEquals(name.startsWith("duck") ? 3 : 0, bad, "DuckDB's d_plain holds three infinities");
    }

    /**
     * Unsigned 64-bit integers become the correctly rounded double (ties to even). Expected values: Python 3's
     * float(int), which rounds correctly (e.g. float(2**63 + 1025) == 9223372036854777856.0).
     */
    @Test
    void unsignedSixtyFourBitValuesRoundToTheNearestDouble() {
        long[] unsigned = {Long.MIN_VALUE + 1025, Long.MIN_VALUE + 1024, Long.MIN_VALUE + 3072, Long.MIN_VALUE + 3073,
            Long.MIN_VALUE + 2047, -1L, Long.MIN_VALUE + 1, Long.MIN_VALUE + 4095, Long.MAX_VALUE, 0, 12345};
        double[] python = {9223372036854777856.0, 9223372036854775808.0, 9223372036854779904.0, 9223372036854779904.0,
            9223372036854777856.0, 18446744073709551616.0, 9223372036854775808.0, 9223372036854779904.0,
            9223372036854775808.0, 0.0, 12345.0};
        for (int i = 0; i < unsigned.length; i++) {
            String u = Long.toUnsignedString(unsigned[i]);
            assertEquals(python[i], ParquetFile.unsignedToDouble(unsigned[i]), u);
            assertEquals(new BigDecimal(u).doubleValue(), ParquetFile.unsignedToDouble(unsigned[i]), u);
        }
        // DuckDB's u64 column (rows 0-7 are the first eight values above) loads the same way.
        Table t = CsvLoader.load(fixture("duck-none.parquet"), "duck-none.parquet", LoadOptions.builder().threads(1).build());
        DecimalColumn u64 = (DecimalColumn) t.column("u64");
        for (int i = 0; i < 8; i++) {
            assertEquals(python[i], u64.get(i), "row " + i);
        }
    }

    /** The chunk of {@code column} in the first row group: its metadata and first page header. */
    private record FirstPage(int headerAt, int headerLength, PageHeader header, ColumnMetaData meta) {
    }

    private static FirstPage firstDataPage(Path p, String column) throws IOException {
        ParquetFile file = ParquetFile.open(p);
        ParquetSchema.Field f = file.schema.fields().stream().filter(x -> x.name().equals(column)).findFirst().orElseThrow();
        ColumnMetaData meta = file.rowGroups().get(0).getColumns().get(f.chunk()).getMeta_data();
        byte[] b = Files.readAllBytes(p);
        int at = (int) meta.getData_page_offset();
        ByteArrayInputStream in = new ByteArrayInputStream(b, at, b.length - at);
        PageHeader h = Util.readPageHeader(in);
        return new FirstPage(at, b.length - at - in.available(), h, meta);
    }

    /** Writes {@code b} as {@code name} and returns the one-line message the load fails with. */
    private String loadFails(byte[] b, String name) throws IOException {
        Path p = dir.resolve(name);
        Files.write(p, b);
        NearfitException e = assertThrows(NearfitException.class,
                () -> CsvLoader.load(p, name, LoadOptions.builder().threads(2).build()));
        assertFalse(e.getMessage().contains("\n"), e.getMessage());
        return e.getMessage();
    }

    /** Replaces the page header at {@code page} by {@code h} re-encoded, which must keep its length. */
    private static byte[] withHeader(byte[] b, FirstPage page, PageHeader h) throws IOException {
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        Util.writePageHeader(h, out);
        byte[] header = out.toByteArray();
        assertEquals(page.headerLength(), header.length, "the changed header keeps its length");
        byte[] c = b.clone();
        System.arraycopy(header, 0, c, page.headerAt(), header.length);
        return c;
    }

    @Test
    void aPageOfTheWrongSizeIsOneLineNamingTheFileAndColumn() throws IOException {
        for (String name : List.of("duck-none.parquet", "duck-snappy.parquet", "arrow-v2-zstd.parquet")) {
            Path p = fixture(name);
            String column = name.startsWith("duck") ? "d_plain" : "d_req";
            FirstPage page = firstDataPage(p, column);
            PageHeader h = page.header().deepCopy();
            h.setUncompressed_page_size(h.getUncompressed_page_size() - 1);
            String m = loadFails(withHeader(Files.readAllBytes(p), page, h), "sizes-" + name);
            assertTrue(m.startsWith("sizes-" + name + ": column " + column + ": "), m);
        }
    }

    @Test
    void aPageRunningPastItsChunkIsOneLineNamingTheFileAndColumn() throws IOException {
        Path p = fixture("duck-none.parquet");
        FirstPage page = firstDataPage(p, "i64_plain");
        PageHeader h = page.header().deepCopy();
        h.setCompressed_page_size(h.getCompressed_page_size() + 100);
        h.setUncompressed_page_size(h.getUncompressed_page_size() + 100);
        String m = loadFails(withHeader(Files.readAllBytes(p), page, h), "long.parquet");
        assertEquals("long.parquet: column i64_plain: a page runs past its column chunk", m);
    }

    @Test
    void damagedLevelsAndIndexesAreOneLineNamingTheFileAndColumn() throws IOException {
        Path p = fixture("duck-none.parquet");
        byte[] b = Files.readAllBytes(p);
        // d_plain's first page: a 4-byte little-endian length of its definition levels, set past the page.
        FirstPage plain = firstDataPage(p, "d_plain");
        byte[] levels = b.clone();
        int at = plain.headerAt() + plain.headerLength();
        levels[at + 3] = 0x7f;
        String m = loadFails(levels, "levels.parquet");
        assertTrue(m.startsWith("levels.parquet: column d_plain: definition levels of "), m);
        // i32_dict's first page: levels, then the bit width of the dictionary indexes, set to 40.
        FirstPage dict = firstDataPage(p, "i32_dict");
        byte[] width = b.clone();
        at = dict.headerAt() + dict.headerLength();
        int levelBytes = (b[at] & 0xff) | (b[at + 1] & 0xff) << 8 | (b[at + 2] & 0xff) << 16 | (b[at + 3] & 0xff) << 24;
        width[at + 4 + levelBytes] = 40;
        assertEquals("width.parquet: column i32_dict: dictionary indexes of 40 bits", loadFails(width, "width.parquet"));
        // The same page with every index byte 0xff: bit-packed runs past the page, or indexes past the dictionary.
        byte[] indexes = b.clone();
        for (int i = at + 5 + levelBytes; i < at + dict.header().getCompressed_page_size(); i++) {
            indexes[i] = (byte) 0xff;
        }
        m = loadFails(indexes, "indexes.parquet");
        assertTrue(m.startsWith("indexes.parquet: column i32_dict: "), m);
    }

    @Test
    void aTruncatedPageIsOneLineNamingTheFileAndColumn() throws IOException {
        for (String name : List.of("duck-snappy.parquet", "arrow-v2-gzip.parquet")) {
            Path p = fixture(name);
            String column = name.startsWith("duck") ? "f_plain" : "f_opt";
            FirstPage page = firstDataPage(p, column);
            PageHeader h = page.header().deepCopy();
            // The header now claims half the compressed bytes: the stream ends inside an element.
            h.setCompressed_page_size(h.getCompressed_page_size() / 2);
            String m = loadFails(withHeader(Files.readAllBytes(p), page, h), "cut-" + name);
            assertTrue(m.startsWith("cut-" + name + ": column " + column + ": "), m);
        }
    }

    /** Every fixture is in {@link #ALL}, so each parameterised test covers the same files. */
    @Test
    void theFixtureListIsComplete() throws IOException {
        try (var files = Files.list(fixture("VERSIONS.txt").getParent())) {
            assertEquals(ALL.length, files.filter(f -> f.toString().endsWith(".parquet")).count());
        }
    }
}
