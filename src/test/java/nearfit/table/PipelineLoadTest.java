package nearfit.table;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayInputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.concurrent.atomic.AtomicInteger;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The two-thread gzip and stream pipeline reads what the plain path reads; cancelling stops a load. */
class PipelineLoadTest {
    @TempDir
    Path dir;

    private static byte[] log(int rows) {
        StringBuilder sb = new StringBuilder("turbine;wind_ms;note\n");
        for (int i = 0; i < rows; i++) {
            sb.append("T0").append(1 + i % 8).append(';').append(i % 250).append(",5;\"n;")
                    .append(i % 7 == 0 ? "\n" : "").append(i).append("\"\n");
        }
        return sb.toString().getBytes(StandardCharsets.UTF_8);
    }

    @Test
    void gzipAndStreamGiveTheSameTableAsThePlainFile() {
        byte[] plain = log(120_000); // several 1 MB blocks, so rows straddle block ends
        Table a = CsvLoader.load(CsvFiles.write(dir, "p.csv", plain), "p.csv",
                LoadOptions.builder().parallelMinBytes(0).build());
        Table b = CsvLoader.load(CsvFiles.write(dir, "g.csv.gz", CsvFiles.gzip(plain)), "g.csv.gz", LoadOptions.DEFAULT);
        Table c = CsvLoader.load(new ByteArrayInputStream(plain), "-", LoadOptions.DEFAULT);
        for (Table t : new Table[] {b, c}) {
            assertEquals(a.rowCount(), t.rowCount());
            DecimalColumn wa = (DecimalColumn) a.column("wind_ms");
            DecimalColumn wt = (DecimalColumn) t.column("wind_ms");
            CategoryColumn ta = (CategoryColumn) a.column("turbine");
            CategoryColumn tt = (CategoryColumn) t.column("turbine");
            for (int row = 0; row < a.rowCount(); row++) {
                assertEquals(wa.get(row), wt.get(row));
                assertEquals(ta.label(row), tt.label(row));
                assertEquals(a.lineOf(row), t.lineOf(row));
            }
        }
        assertEquals(119_999 % 250 + 0.5, ((DecimalColumn) a.column("wind_ms")).get(119_999), "decimal comma");
    }

    @Test
    void aSignalRaisedMidwayCancelsAParallelLoad() {
        Path p = CsvFiles.write(dir, "big.csv", log(200_000));
        AtomicInteger polls = new AtomicInteger();
        LoadOptions o = LoadOptions.builder().parallelMinBytes(0).threads(2)
                .cancelSignal(() -> polls.incrementAndGet() > 1).build();
        LoadCancelledException ex = assertThrows(LoadCancelledException.class, () -> CsvLoader.load(p, "big.csv", o));
        assertEquals("big.csv: loading cancelled", ex.getMessage());
        assertTrue(polls.get() > 1);
    }

    @Test
    void anInterruptedLoaderThreadCancels() throws Exception {
        Path p = CsvFiles.write(dir, "big.csv", log(200_000));
        Throwable[] seen = new Throwable[1];
        Thread t = new Thread(() -> {
            Thread.currentThread().interrupt(); // interrupted before it starts: the first poll sees it
            try {
                CsvLoader.load(p, "big.csv", LoadOptions.builder().threads(1).build());
            } catch (Throwable ex) {
                seen[0] = ex;
            }
        });
        t.start();
        t.join();
        assertTrue(seen[0] instanceof LoadCancelledException, String.valueOf(seen[0]));
    }
}
