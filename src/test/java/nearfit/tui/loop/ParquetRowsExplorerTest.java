package nearfit.tui.loop;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.net.URISyntaxException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import com.googlecode.lanterna.input.KeyType;

import nearfit.table.CsvLoader;
import nearfit.table.LoadOptions;
import nearfit.table.NumericColumn;
import nearfit.table.Table;
import nearfit.tui.bench.CoreWorkbench;
import nearfit.tui.bench.Workbench;
import nearfit.tui.keys.ExportKind;
import nearfit.tui.keys.ViewState;
import nearfit.tui.paint.Look;
import nearfit.tui.results.FlaggedRow;
import nearfit.tui.results.FlaggedRows;

/**
 * The explorer on Parquet written by DuckDB (scripts/reference/make-flagged-parquet-fixture: planted outliers in a
 * data set of two files, one file, and DuckDB's CSV of the same rows): the flagged-row table, its
 * export and the mark message name each row by its file and row index instead of a CSV line, and each name leads
 * back to the row (read from that file alone, or from DuckDB's CSV twin of the same rows).
 */
class ParquetRowsExplorerTest {
    private static Path fixture(String name) {
        try {
            return Path.of(ParquetRowsExplorerTest.class.getResource("/parquet-flagged/" + name).toURI());
        } catch (URISyntaxException e) {
            throw new IllegalStateException(e);
        }
    }

    private static Workbench load(Path data) {
        return CoreWorkbench.of(CsvLoader.load(data, data.toString(), LoadOptions.DEFAULT), data.toString());
    }

    private static VirtualScreen open(Workbench wb) throws Exception {
        ViewState first = ViewState.initial("power_kw", List.of("wind_ms"), 12);
        // 160 columns: room for the table's origin column beside z, fit, residual and time
        return new VirtualScreen(wb, first, 160, 40, new Look(false, true));
    }

    private static double value(Table t, String column, long row) {
        return ((NumericColumn) t.column(column)).asDouble((int) row);
    }

    @Test
    void aDataSetsFlaggedRowsAreNamedByFileAndRowIndexInTheTableTheExportAndTheMark(@TempDir Path dir)
            throws Exception {
        Path set = fixture("set");
        try (VirtualScreen v = open(load(set))) {
            FlaggedRows f = v.explorer.results().flags();
            assertTrue(f.rows().size() >= 6, "flagged rows: " + f.rows().size());
            assertEquals("row", f.source().heading());
            Map<String, Table> files = new HashMap<>();
            for (FlaggedRow row : f.rows()) {
                String label = f.origin(row);
                int colon = label.lastIndexOf(':');
                String file = label.substring(0, colon);
                assertTrue(file.startsWith(set + "/unit="), label);
                long index = Long.parseLong(label.substring(colon + 1));
                // The file the label names, read by itself, holds the row at that index.
                Table t = files.computeIfAbsent(file, n -> CsvLoader.load(Path.of(n), n, LoadOptions.DEFAULT));
                assertEquals(row.response(), value(t, "power_kw", index), 0.0, label);
                assertEquals(row.inputs().get(0), value(t, "wind_ms", index), 0.0, label);
            }
            v.type("F");
            String first = f.origin(f.rows().get(0)).substring(set.toString().length() + 1);
            assertTrue(v.text().matches("(?s).*\\bz\\s+fit\\s+residual.*\\brow\\b.*"), v.text());
            assertTrue(v.text().contains(first), "the table shows " + first + " within the data set:\n" + v.text());
            assertFalse(v.text().contains(" line "), v.text());
            v.key(KeyType.Enter);
            assertTrue(v.text().contains("row " + f.origin(f.rows().get(0)) + " marked on the plot"), v.text());

            Path out = dir.resolve("flagged.csv");
            v.type("e2");
            for (int i = 0; i < ExportKind.FLAGS_CSV.defaultFile().length(); i++) {
                v.key(KeyType.Backspace);
            }
            v.type(out.toString()).key(KeyType.Enter);
            List<String> lines = Files.readAllLines(out);
            assertTrue(lines.get(0).startsWith("file,row,"), lines.get(0));
            List<String> header = List.of(lines.get(0).split(","));
            int power = header.indexOf("power_kw");
            assertEquals(f.rows().size() + 1, lines.size());
            for (String line : lines.subList(1, lines.size())) {
                String[] cells = line.split(",", -1);
                Table t = files.computeIfAbsent(cells[0], n -> CsvLoader.load(Path.of(n), n, LoadOptions.DEFAULT));
                assertEquals(Double.parseDouble(cells[power]), value(t, "power_kw", Long.parseLong(cells[1])), 0.0, line);
            }
        }
    }

    @Test
    void oneParquetFilesFlaggedRowsAreItsRowIndexesTheCsvTwinsLinesLessTwo() throws Exception {
        List<FlaggedRow> parquet;
        FlaggedRows parquetFlags;
        try (VirtualScreen v = open(load(fixture("one.parquet")))) {
            parquetFlags = v.explorer.results().flags();
            parquet = parquetFlags.rows();
        }
        List<FlaggedRow> csv;
        try (VirtualScreen v = open(load(fixture("one.csv")))) {
            FlaggedRows f = v.explorer.results().flags();
            assertEquals("line", f.source().heading());
            csv = f.rows();
        }
        assertEquals("row", parquetFlags.source().heading());
        assertTrue(csv.size() >= 6, "flagged rows: " + csv.size());
        // The six rows the fixture script planted at 5 kW lead the table, by their row index in the file.
        java.util.Set<String> top = new java.util.TreeSet<>();
        for (int i = 0; i < 6; i++) {
            top.add(parquetFlags.origin(parquet.get(i)));
        }
        assertEquals(new java.util.TreeSet<>(List.of("6", "61", "131", "202", "258", "329")), top);
        assertEquals(csv.size(), parquet.size());
        for (int i = 0; i < csv.size(); i++) {
            // DuckDB's CSV twin: a header line, then row r of the Parquet file on line r + 2.
            assertEquals(Long.toString(csv.get(i).line() - 2), parquetFlags.origin(parquet.get(i)));
            assertEquals(csv.get(i).z(), parquet.get(i).z(), 0.0);
        }
    }
}
