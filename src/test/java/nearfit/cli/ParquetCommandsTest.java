package nearfit.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.net.URISyntaxException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import nearfit.table.ColumnSummary;
import nearfit.table.CsvLoader;
import nearfit.table.LoadOptions;
import nearfit.table.Table;

/**
 * Every batch command on the Parquet fixture written by DuckDB (scripts/reference/make-parquet-fixtures)
 * gives the figures it gives on DuckDB's CSV twin of the same rows; only the row's origin differs (the
 * CSV's line is the Parquet row index + 2: a header, then one line per row). The explorer's run on Parquet
 * is in {@link ViewCommandTest} through the bad-input corpus.
 */
class ParquetCommandsTest {
    private static final String[] MODEL = {"-x", "wind_ms,temp_c", "-y", "power_kw", "--group", "unit", "--quiet",
            "--threads", "2"};

    @TempDir
    Path dir;

    static String fixture(String name) {
        try {
            return Path.of(ParquetCommandsTest.class.getResource("/parquet/" + name).toURI()).toString();
        } catch (URISyntaxException e) {
            throw new IllegalStateException(e);
        }
    }

    static CliRun.Result ok(String... args) {
        CliRun.Result r = CliRun.inProcess(args);
        assertEquals(0, r.status(), () -> String.join(" ", args) + ": " + r);
        return r;
    }

    private static String[] args(String command, String file, String... more) {
        List<String> a = new ArrayList<>(List.of(command, file));
        a.addAll(List.of(MODEL));
        a.addAll(List.of(more));
        return a.toArray(new String[0]);
    }

    /** A JSON document as plain maps and lists (numbers as Double), through the tool's own strict reader. */
    private static Map<?, ?> json(String text) {
        return (Map<?, ?>) nearfit.model.JsonTrees.parse(text);
    }

    @Test
    void describeGivesTheCsvTwinsColumns() throws IOException {
        Map<?, ?> csv = json(ok("describe", "--quiet", "--format", "json", fixture("site.csv")).out());
        Map<?, ?> parquet = json(ok("describe", "--quiet", "--format", "json", fixture("site.parquet")).out());
        assertEquals(csv.get("columns"), parquet.get("columns"));
        assertEquals(csv.get("rows"), parquet.get("rows"));
    }

    @Test
    void tuneAndPlotGiveTheSameFigures() {
        String csv = ok(args("tune", fixture("site.csv"), "--kmax", "30")).out();
        String parquet = ok(args("tune", fixture("site.parquet"), "--kmax", "30")).out();
        assertEquals(csv.replace(fixture("site.csv"), "FILE"), parquet.replace(fixture("site.parquet"), "FILE"));
        String plotCsv = ok("plot", fixture("site.csv"), "-x", "wind_ms", "-y", "power_kw", "--ascii", "--size", "80x24",
                "--quiet").out();
        String plotParquet = ok("plot", fixture("site.parquet"), "-x", "wind_ms", "-y", "power_kw", "--ascii", "--size",
                "80x24", "--quiet").out();
        assertEquals(plotCsv.replace("site.csv", "FILE"), plotParquet.replace("site.parquet", "FILE"));
    }

    @Test
    void fitPredictAndCheckGiveTheSameFiguresWithRowIndexesForLines() throws IOException {
        Path modelCsv = dir.resolve("csv.nfm");
        Path modelParquet = dir.resolve("parquet.nfm");
        ok(args("fit", fixture("site.csv"), "-o", modelCsv.toString(), "--k", "12"));
        ok(args("fit", fixture("site.parquet"), "-o", modelParquet.toString(), "--k", "12"));
        // The two models score the same rows alike.
        String byCsvModel = ok("predict", modelCsv.toString(), fixture("site.csv"), "--quiet").out();
        String byParquetModel = ok("predict", modelParquet.toString(), fixture("site.csv"), "--quiet").out();
        assertEquals(byCsvModel, byParquetModel);
        // Predicting the Parquet rows: the same cells after the first column, which is the row index.
        String fromParquet = ok("predict", modelCsv.toString(), fixture("site.parquet"), "--quiet").out();
        List<String> a = List.of(byCsvModel.split("\n"));
        List<String> b = List.of(fromParquet.split("\n"));
        assertEquals(a.size(), b.size());
        assertTrue(a.get(0).startsWith("line,"), a.get(0));
        assertEquals("row," + a.get(0).substring("line,".length()), b.get(0));
        for (int i = 1; i < a.size(); i++) {
            assertEquals(Integer.toString(i + 1), a.get(i).substring(0, a.get(i).indexOf(',')));
            assertEquals(Integer.toString(i - 1), b.get(i).substring(0, b.get(i).indexOf(',')));
            assertEquals(a.get(i).substring(a.get(i).indexOf(',')), b.get(i).substring(b.get(i).indexOf(',')));
        }
        Map<?, ?> checkCsv = json(ok("check", modelCsv.toString(), fixture("site.csv"), "--format", "json",
                "--quiet", "--limit", "100").out());
        Map<?, ?> checkParquet = json(ok("check", modelCsv.toString(), fixture("site.parquet"), "--format", "json",
                "--quiet", "--limit", "100").out());
        for (String field : List.of("rows", "scored", "flagged", "by_group")) {
            assertEquals(checkCsv.get(field), checkParquet.get(field), field);
        }
        List<?> worstCsv = (List<?>) checkCsv.get("worst");
        List<?> worstParquet = (List<?>) checkParquet.get("worst");
        assertEquals(worstCsv.size(), worstParquet.size());
        assertTrue(worstCsv.size() > 0, "the fixture has rows far from the curve");
        for (int i = 0; i < worstCsv.size(); i++) {
            Map<Object, Object> c = new java.util.LinkedHashMap<>((Map<?, ?>) worstCsv.get(i));
            Map<Object, Object> p = new java.util.LinkedHashMap<>((Map<?, ?>) worstParquet.get(i));
            assertEquals(((Number) c.remove("line")).longValue(), ((Number) p.remove("row")).longValue() + 2);
            assertEquals(fixture("site.parquet"), p.remove("file"));
            assertEquals(c, p);
        }
    }

    @Test
    void predictAndCheckWriteParquetWhenTheNameEndsSoAndItReadsBackAsTheCsv() throws IOException {
        Path model = dir.resolve("m.nfm");
        ok(args("fit", fixture("site.csv"), "-o", model.toString(), "--k", "12"));
        Path csv = dir.resolve("p.csv");
        Path parquet = dir.resolve("p.parquet");
        ok("predict", model.toString(), fixture("site.parquet"), "-o", csv.toString(), "--quiet");
        ok("predict", model.toString(), fixture("site.parquet"), "-o", parquet.toString(), "--quiet");
        assertEquals("PAR1", new String(Files.readAllBytes(parquet), 0, 4, java.nio.charset.StandardCharsets.US_ASCII));
        assertSameSummaries(csv, parquet);
        Path flaggedCsv = dir.resolve("f.csv");
        Path flaggedParquet = dir.resolve("f.PARQUET");
        CliRun.Result c1 = CliRun.inProcess("check", model.toString(), fixture("site.csv"), "-o", flaggedCsv.toString(),
                "--quiet", "--threshold", "0.5");
        CliRun.Result c2 = CliRun.inProcess("check", model.toString(), fixture("site.csv"), "-o",
                flaggedParquet.toString(), "--quiet", "--threshold", "0.5");
        assertEquals(c1.status(), c2.status(), c2::toString);
        assertSameSummaries(flaggedCsv, flaggedParquet);
    }

    private static void assertSameSummaries(Path csv, Path parquet) {
        Table a = CsvLoader.load(csv, "csv", LoadOptions.builder().build());
        Table b = CsvLoader.load(parquet, "parquet", LoadOptions.builder().build());
        assertTrue(a.rowCount() > 0);
        assertEquals(a.names(), b.names());
        assertEquals(a.rowCount(), b.rowCount());
        List<ColumnSummary> sa = ColumnSummary.ofAll(a.columns(), 1);
        List<ColumnSummary> sb = ColumnSummary.ofAll(b.columns(), 1);
        for (int i = 0; i < sa.size(); i++) {
            ColumnSummary x = sa.get(i);
            ColumnSummary y = sb.get(i);
            // The CSV holds numbers in the shortest form that reads back exactly, so the values are equal.
            assertEquals(x, y, x.name());
        }
    }

    /**
     * A damaged page of a column read by the direct page decoder (DuckDB's file from
     * scripts/reference/make-parquet-direct-fixtures, its first page header overwritten) ends the command
     * with exit status 2 and one line naming the file and the column.
     */
    @Test
    void aDamagedNumberPageEndsWithOneLineNamingTheFileAndColumn() throws IOException, URISyntaxException {
        byte[] b = Files.readAllBytes(Path.of(ParquetCommandsTest.class.getResource("/parquet-direct/duck-none.parquet").toURI()));
        for (int i = 4; i < 24; i++) {
            b[i] = (byte) 0xff; // the first column chunk (d_plain) starts right after the magic bytes
        }
        Path damaged = dir.resolve("damaged.parquet");
        Files.write(damaged, b);
        CliRun.Result r = CliRun.inProcess("describe", damaged.toString());
        assertEquals(2, r.status(), r.toString());
        assertEquals("nearfit: " + damaged + ": column d_plain: a damaged page header\n", r.err());
    }
}
