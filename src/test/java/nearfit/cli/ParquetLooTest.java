package nearfit.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeSet;

import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import nearfit.table.CsvLoader;
import nearfit.table.LoadOptions;
import nearfit.table.NumericColumn;
import nearfit.table.Table;

/**
 * {@code predict --loo} of a model fitted on Parquet names each reference row by its file and row index, as
 * {@code predict} names Parquet rows, and refuses a data set whose files changed since the fit. The data are
 * the DuckDB fixtures of scripts/reference/make-parquet-fixtures (an outside writer): the partitioned data set
 * site-set/ and site.parquet with its CSV twin site.csv, written by DuckDB's CSV writer.
 */
class ParquetLooTest {
    private static final String[] MODEL = {"-x", "wind_ms,temp_c", "-y", "power_kw", "--group", "unit", "--k", "12",
            "--quiet", "--threads", "2"};

    @TempDir
    Path dir;
    private Path set;
    private Path model;

    private static Path fixture(String name) {
        return Path.of(ParquetCommandsTest.fixture(name));
    }

    private static CliRun.Result ok(String... args) {
        return ParquetCommandsTest.ok(args);
    }

    private static String[] fit(Path data, Path out) {
        List<String> a = new java.util.ArrayList<>(List.of("fit", data.toString(), "-o", out.toString()));
        a.addAll(List.of(MODEL));
        return a.toArray(new String[0]);
    }

    @BeforeEach
    void fitOnACopyOfTheDataSet() throws IOException {
        set = dir.resolve("set");
        Path from = fixture("site-set");
        try (var walk = Files.walk(from)) {
            for (Path p : walk.toList()) {
                Path to = set.resolve(from.relativize(p).toString());
                if (Files.isDirectory(p)) {
                    Files.createDirectories(to);
                } else {
                    Files.copy(p, to);
                }
            }
        }
        model = dir.resolve("set.nfm");
        ok(fit(set, model));
    }

    @Test
    void eachRowOfADataSetModelIsNamedByAFileAndARowIndexThatHoldTheRow() {
        List<String> loo = ok("predict", model.toString(), set.toString(), "--loo", "--quiet").out().lines().toList();
        assertEquals("file,row,unit,wind_ms,temp_c,power_kw,fit,band_lo,band_hi,resid,z", loo.get(0));
        Map<String, Table> files = new HashMap<>();
        TreeSet<String> named = new TreeSet<>();
        for (String line : loo.subList(1, loo.size())) {
            String[] cells = line.split(",", -1);
            named.add(cells[0]);
            // Read the file the row names by itself: its row at that index holds the row's inputs and response.
            Table t = files.computeIfAbsent(cells[0], f -> CsvLoader.load(Path.of(f), f, LoadOptions.builder().build()));
            int row = Integer.parseInt(cells[1]);
            assertEquals(Double.parseDouble(cells[3]), ((NumericColumn) t.column("wind_ms")).asDouble(row), 0.0, line);
            assertEquals(Double.parseDouble(cells[4]), ((NumericColumn) t.column("temp_c")).asDouble(row), 0.0, line);
            assertEquals(Double.parseDouble(cells[5]), ((NumericColumn) t.column("power_kw")).asDouble(row), 0.0, line);
        }
        assertEquals(5, named.size(), "every file of the data set holds reference rows: " + named);
        // predict names the same rows' files the same way.
        TreeSet<String> predicted = new TreeSet<>();
        for (String line : ok("predict", model.toString(), set.toString(), "--quiet").out().lines().skip(1).toList()) {
            predicted.add(line.substring(0, line.indexOf(',')));
        }
        assertEquals(predicted, named);
    }

    @Test
    void oneParquetFilesRowIndexesAreItsCsvTwinsLinesLessTwo() {
        Path parquetModel = dir.resolve("p.nfm");
        Path csvModel = dir.resolve("c.nfm");
        ok(fit(fixture("site.parquet"), parquetModel));
        ok(fit(fixture("site.csv"), csvModel));
        List<String> p = ok("predict", parquetModel.toString(), fixture("site.parquet").toString(), "--loo", "--quiet")
                .out().lines().toList();
        List<String> c = ok("predict", csvModel.toString(), fixture("site.csv").toString(), "--loo", "--quiet")
                .out().lines().toList();
        assertEquals("line,unit,wind_ms,temp_c,power_kw,fit,band_lo,band_hi,resid,z", c.get(0));
        assertEquals("row" + c.get(0).substring("line".length()), p.get(0));
        assertEquals(c.size(), p.size());
        assertTrue(c.size() > 100, "the fixture's reference rows");
        for (int i = 1; i < c.size(); i++) {
            int cut = c.get(i).indexOf(',');
            int at = p.get(i).indexOf(',');
            // DuckDB's CSV twin: a header, then row r of the Parquet file on line r + 2.
            assertEquals(Long.parseLong(c.get(i).substring(0, cut)), Long.parseLong(p.get(i).substring(0, at)) + 2);
            assertEquals(c.get(i).substring(cut), p.get(i).substring(at));
        }
    }

    @Test
    void aReplacedFileOfTheDataSetIsRefusedInOneLineNamingIt() throws IOException {
        Path replaced = set.resolve("unit=T02").resolve("data_0.parquet");
        Files.copy(set.resolve("unit=T03").resolve("data_0.parquet"), replaced,
                java.nio.file.StandardCopyOption.REPLACE_EXISTING);
        CliRun.Result r = CliRun.inProcess("predict", model.toString(), set.toString(), "--loo", "--quiet");
        assertEquals(2, r.status(), r::toString);
        assertEquals(List.of("nearfit: " + set + "/unit=T02/data_0.parquet: --loo: is not the file the model's "
                + "reference rows come from (" + set + "/unit=T02/data_0.parquet; its SHA-256 differs)"),
                r.err().lines().toList());
    }

    @Test
    void aFileGoneFromTheDataSetIsRefusedInOneLineNamingIt() throws IOException {
        Files.delete(set.resolve("unit=T04").resolve("data_0.parquet"));
        CliRun.Result r = CliRun.inProcess("predict", model.toString(), set.toString(), "--loo", "--quiet");
        assertEquals(2, r.status(), r::toString);
        assertEquals(List.of("nearfit: " + set + "/unit=T04/data_0.parquet: --loo: no such file; the model's reference "
                + "rows come from " + set + "/unit=T04/data_0.parquet"), r.err().lines().toList());
    }

    @Test
    void aSingleFileIsNotTheDataSet() {
        CliRun.Result r = CliRun.inProcess("predict", model.toString(), fixture("site.parquet").toString(), "--loo",
                "--quiet");
        assertEquals(2, r.status(), r::toString);
        assertEquals(1, r.err().lines().count(), r.err());
        assertTrue(r.err().contains("is not the model's reference data set"), r.err());
    }

    @Test
    void looWritesParquetWhenTheNameEndsSoWithTheCsvsColumnsAndRows() {
        Path csv = dir.resolve("loo.csv");
        Path parquet = dir.resolve("loo.parquet");
        ok("predict", model.toString(), set.toString(), "--loo", "--quiet", "-o", csv.toString());
        ok("predict", model.toString(), set.toString(), "--loo", "--quiet", "-o", parquet.toString());
        Table a = CsvLoader.load(csv, "csv", LoadOptions.builder().build());
        Table b = CsvLoader.load(parquet, "parquet", LoadOptions.builder().build());
        assertEquals(a.names(), b.names());
        assertEquals(a.rowCount(), b.rowCount());
        NumericColumn za = (NumericColumn) a.column("z");
        NumericColumn zb = (NumericColumn) b.column("z");
        NumericColumn ra = (NumericColumn) a.column("row");
        NumericColumn rb = (NumericColumn) b.column("row");
        for (int i = 0; i < a.rowCount(); i++) {
            assertEquals(za.asDouble(i), zb.asDouble(i), 0.0);
            assertEquals(ra.asDouble(i), rb.asDouble(i), 0.0);
        }
    }
}
