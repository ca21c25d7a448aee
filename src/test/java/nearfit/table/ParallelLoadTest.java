package nearfit.table;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.IOException;
import java.io.Reader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;

import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVRecord;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The parallel path must give exactly what Commons CSV reads, whatever the threads and cut points. */
class ParallelLoadTest {
    @TempDir
    static Path dir;
    static Path file;
    static List<CSVRecord> oracle;

    /** A log whose notes often hold quoted line breaks, so many cut points fall inside quotes. */
    @BeforeAll
    static void writeFile() throws IOException {
        Random rnd = new Random(42);
        StringBuilder sb = new StringBuilder("turbine,note,wind_ms,time\r\n");
        for (int i = 0; i < 15_000; i++) {
            sb.append('T').append(String.format("%02d", 1 + rnd.nextInt(8))).append(',');
            if (rnd.nextInt(3) == 0) {
                sb.append("\"line\none, \"\"quoted\"\"\n").append("\n".repeat(rnd.nextInt(3))).append("end\"");
            } else {
                sb.append("ok");
            }
            sb.append(',').append(rnd.nextInt(10) == 0 ? "" : String.valueOf(rnd.nextDouble() * 25)).append(',');
            sb.append(String.format("2025-03-%02dT%02d:%02d:00Z", 1 + rnd.nextInt(28), rnd.nextInt(24), rnd.nextInt(60)));
            sb.append(rnd.nextBoolean() ? "\r\n" : "\n");
        }
        file = Files.writeString(dir.resolve("notes.csv"), sb.toString(), StandardCharsets.UTF_8);
        try (Reader r = Files.newBufferedReader(file)) {
            oracle = new ArrayList<>(CSVFormat.RFC4180.builder().setHeader().get().parse(r).getRecords());
        }
    }

    private static Table load(int threads) {
        return CsvLoader.load(file, "notes.csv", LoadOptions.builder().threads(threads).parallelMinBytes(0).build());
    }

    @Test
    void everyThreadCountReadsTheSameValuesAsCommonsCsv() {
        for (int threads : new int[] {1, 2, 3, 7}) {
            Table t = load(threads);
            assertEquals(oracle.size(), t.rowCount(), "threads " + threads);
            CategoryColumn turbine = (CategoryColumn) t.column("turbine");
            DecimalColumn wind = (DecimalColumn) t.column("wind_ms");
            for (int row = 0; row < oracle.size(); row++) {
                CSVRecord r = oracle.get(row);
                assertEquals(r.get("turbine"), turbine.label(row), "threads " + threads + " row " + row);
                String w = r.get("wind_ms");
                assertEquals(w.isEmpty() ? Double.NaN : Double.parseDouble(w), wind.get(row), "row " + row);
            }
        }
    }

    @Test
    void lineNumbersMatchWhereCommonsCsvFindsEachRecord() throws IOException {
        // Commons CSV gives each record's character position; the line is 1 + the line feeds before it.
        String text = Files.readString(file);
        long[] expected = new long[oracle.size()];
        long line = 1;
        int at = 0;
        for (int row = 0; row < expected.length; row++) {
            long pos = oracle.get(row).getCharacterPosition();
            for (; at < pos; at++) {
                line += text.charAt(at) == '\n' ? 1 : 0;
            }
            expected[row] = line;
        }
        for (int threads : new int[] {1, 2, 5}) {
            Table t = load(threads);
            for (int row = 0; row < expected.length; row++) {
                assertEquals(expected[row], t.lineOf(row), "threads " + threads + " row " + row);
            }
        }
    }
}
