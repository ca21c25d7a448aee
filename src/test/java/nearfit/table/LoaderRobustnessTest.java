package nearfit.table;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTimeoutPreemptively;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.BufferedWriter;
import java.io.IOException;
import java.io.RandomAccessFile;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.List;
import java.util.concurrent.atomic.AtomicBoolean;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The loader on inputs that are large, odd or change under it: counted bad cells or one located message. */
class LoaderRobustnessTest {
    /** A hang detector, not a speed bound: the slowest case here takes a few seconds. */
    private static final Duration HANG = Duration.ofSeconds(120);

    @TempDir
    Path dir;

    private Path numbers(String name, int rows) throws IOException {
        Path p = dir.resolve(name);
        try (BufferedWriter w = Files.newBufferedWriter(p, StandardCharsets.UTF_8)) {
            w.write("wind_ms,power_kw\n");
            for (int i = 0; i < rows; i++) {
                w.write((i % 250) / 10.0 + "," + (i % 2000) + ".5\n");
            }
        }
        return p;
    }

    @Test
    void everySpellingOfInfinityIsABadCellSoTheSummaryStaysFinite() {
        String[] spellings = {"Infinity", "-Infinity", "inf", "-inf", "+Inf", "INF", "1e999", "-1e999", "infinity"};
        StringBuilder sb = new StringBuilder("wind_ms,power_kw\n");
        for (int i = 0; i < 200; i++) {
            String w = i % 20 == 5 && i / 20 < spellings.length ? spellings[i / 20] : Double.toString(3 + i % 10);
            sb.append(w).append(',').append(i).append('\n');
        }
        Table t = CsvFiles.load(dir, sb.toString());
        Column wind = t.column("wind_ms");
        assertEquals(ColumnType.NUMBER, wind.type());
        assertEquals(spellings.length, wind.badCount());
        ColumnSummary s = ColumnSummary.of(wind);
        assertEquals(3.0, s.min(), 0);
        assertEquals(12.0, s.max(), 0);
        assertTrue(Double.isFinite(s.mean()) && Double.isFinite(s.sd()), s.toString());
    }

    @Test
    void aColumnThatTurnsToTextAfterAMillionRowsCountsBadCellsWithTheirLines() throws IOException {
        Path p = dir.resolve("turns.csv");
        int rows = 1_000_000;
        try (BufferedWriter w = Files.newBufferedWriter(p, StandardCharsets.UTF_8)) {
            w.write("wind_ms,status\n");
            for (int i = 0; i < rows + 500; i++) {
                w.write((i % 250) / 10.0 + "," + (i < rows ? Integer.toString(i % 7) : "offline since " + i) + "\n");
            }
        }
        Table t = assertTimeoutPreemptively(HANG, () -> CsvLoader.load(p, "turns.csv", LoadOptions.DEFAULT));
        assertEquals(rows + 500, t.rowCount());
        Column status = t.column("status");
        assertEquals(ColumnType.NUMBER, status.type(), "typed from the first rows");
        assertEquals(500, status.badCount());
        BadCell first = t.report().badExamples().get(0);
        assertEquals(rows + 2, first.line(), "header is line 1, so row index 1 000 000 is line 1 000 002");
        assertEquals("offline since 1000000", first.text());
    }

    @Test
    void aLineOfSeveralMegabytesIsRefusedWithItsLineNumber() throws IOException {
        Path p = dir.resolve("wide.csv");
        try (BufferedWriter w = Files.newBufferedWriter(p, StandardCharsets.UTF_8)) {
            w.write("wind_ms,power_kw\n1,2\n3,\"");
            for (int i = 0; i < 5 << 20; i++) {
                w.write('x');
            }
            w.write("\"\n5,6\n");
        }
        NearfitException ex = assertTimeoutPreemptively(HANG, () -> org.junit.jupiter.api.Assertions.assertThrows(
                NearfitException.class, () -> CsvLoader.load(p, "wide.csv", LoadOptions.DEFAULT)));
        assertEquals("wide.csv", ex.file());
        assertEquals(3, ex.line());
    }

    /** Truncates the file to a third of its size the first time the loader reports progress. */
    private static LoadProgress truncateOnFirstReport(Path p, AtomicBoolean done) {
        return (bytes, total, rows) -> {
            if (done.compareAndSet(false, true)) {
                try (RandomAccessFile f = new RandomAccessFile(p.toFile(), "rw")) {
                    f.setLength(f.length() / 3);
                } catch (IOException ex) {
                    throw new java.io.UncheckedIOException(ex);
                }
            }
        };
    }

    /** Runs {@code change} on the file the first time the loader reports progress (after its first block). */
    private static LoadProgress onFirstReport(AtomicBoolean done, IoAction change) {
        return (bytes, total, rows) -> {
            if (done.compareAndSet(false, true)) {
                try {
                    change.run();
                } catch (IOException ex) {
                    throw new java.io.UncheckedIOException(ex);
                }
            }
        };
    }

    /** A file operation done from inside the loader's progress callback. */
    @FunctionalInterface
    private interface IoAction {
        void run() throws IOException;
    }

    @Test
    void aFileCutShorterWhileLoadingFailsSayingItShrank() throws IOException {
        // Before: the rows left were loaded (sometimes with a half row), with no word of the change.
        for (int threads : new int[] {1, 2}) {
            Path p = numbers("shrinking-" + threads + ".csv", 3_000_000);
            long size = Files.size(p);
            AtomicBoolean cut = new AtomicBoolean();
            LoadOptions o = LoadOptions.builder().threads(threads).progress(truncateOnFirstReport(p, cut)).build();
            NearfitException ex = assertTimeoutPreemptively(HANG, () -> assertThrows(NearfitException.class,
                    () -> CsvLoader.load(p, "shrinking.csv", o)));
            assertTrue(cut.get(), "the file was cut during the load");
            assertEquals("shrinking.csv", ex.file(), ex.getMessage());
            assertEquals("shrank from " + size + " to " + size / 3 + " bytes while it was read, so the rows read may "
                    + "be cut or mixed; load it again once it is complete", ex.detail(), "threads " + threads);
        }
    }

    @Test
    void aFileThatGrowsWhileLoadingGivesTheRowsItHadAndAWarning() throws IOException {
        for (int threads : new int[] {1, 2}) {
            Path p = numbers("growing-" + threads + ".csv", 3_000_000);
            long size = Files.size(p);
            AtomicBoolean grown = new AtomicBoolean();
            // A log still being written: a whole row, then half of the next one.
            byte[] more = "99.5,1234.5\n98".getBytes(StandardCharsets.UTF_8);
            LoadOptions o = LoadOptions.builder().threads(threads).parallelMinBytes(1 << 20).progress(onFirstReport(
                    grown, () -> Files.write(p, more, java.nio.file.StandardOpenOption.APPEND))).build();
            Table t = assertTimeoutPreemptively(HANG, () -> CsvLoader.load(p, "growing.csv", o));
            assertTrue(grown.get());
            assertEquals(3_000_000, t.rowCount(), "threads " + threads);
            assertEquals((2_999_999 % 2000) + 0.5, ((DecimalColumn) t.column("power_kw")).get(2_999_999), 0);
            assertEquals(List.of("growing.csv: grew from " + size + " to " + (size + more.length) + " bytes while it "
                    + "was read; only the first " + size + " bytes were read"), t.report().warnings());
        }
    }

    @Test
    void aFileModifiedInPlaceWhileLoadingGivesAWarning() throws IOException {
        Path p = numbers("touched.csv", 1_500_000);
        long size = Files.size(p);
        AtomicBoolean touched = new AtomicBoolean();
        LoadOptions o = LoadOptions.builder().threads(1).progress(onFirstReport(touched, () -> Files.setLastModifiedTime(
                p, java.nio.file.attribute.FileTime.fromMillis(Files.getLastModifiedTime(p).toMillis() + 5_000)))).build();
        Table t = assertTimeoutPreemptively(HANG, () -> CsvLoader.load(p, "touched.csv", o));
        assertEquals(1_500_000, t.rowCount());
        assertEquals(List.of("touched.csv: was modified while it was read (same size, " + size + " bytes); if it was "
                + "rewritten, load it again"), t.report().warnings());
    }

    @Test
    void aFileReplacedWhileLoadingFailsSayingSo() throws IOException {
        // A log rotated under the reader: the path now names another file.
        Path p = numbers("rotated.csv", 1_500_000);
        Path next = numbers("next.csv", 10);
        AtomicBoolean moved = new AtomicBoolean();
        LoadOptions o = LoadOptions.builder().threads(1).progress(onFirstReport(moved,
                () -> Files.move(next, p, java.nio.file.StandardCopyOption.REPLACE_EXISTING))).build();
        NearfitException ex = assertTimeoutPreemptively(HANG, () -> assertThrows(NearfitException.class,
                () -> CsvLoader.load(p, "rotated.csv", o)));
        assertEquals("rotated.csv: was replaced by another file while it was read; load it again", ex.getMessage());
    }

    @Test
    void aFileLeftAloneGivesNoWarning() throws IOException {
        Path p = numbers("quiet.csv", 1000);
        assertEquals(List.of(), CsvLoader.load(p, "quiet.csv", LoadOptions.DEFAULT).report().warnings());
    }

    @Test
    void aFileDeletedWhileLoadingIsStillReadWholeThroughTheOpenHandle() throws IOException {
        // POSIX: unlinking a file leaves its data readable through descriptors already open.
        Path p = numbers("vanishing.csv", 1_500_000);
        AtomicBoolean gone = new AtomicBoolean();
        LoadOptions o = LoadOptions.builder().threads(1).progress(onFirstReport(gone, () -> Files.delete(p))).build();
        Table t = assertTimeoutPreemptively(HANG, () -> CsvLoader.load(p, "vanishing.csv", o));
        assertTrue(gone.get());
        assertEquals(1_500_000, t.rowCount());
        assertEquals(List.of("vanishing.csv: was deleted while it was read; the rows are those it held when the load "
                + "began"), t.report().warnings());
    }

    /** Makes a named pipe and feeds it {@code bytes} from another thread, as {@code <(zcat log.gz)} would. */
    private Path pipeFeeding(byte[] bytes) throws Exception {
        Path fifo = dir.resolve("pipe");
        Process mk = new ProcessBuilder("mkfifo", fifo.toString()).start();
        org.junit.jupiter.api.Assumptions.assumeTrue(mk.waitFor() == 0, "mkfifo is not available");
        Thread feeder = new Thread(() -> {
            try (java.io.OutputStream out = new java.io.FileOutputStream(fifo.toFile())) {
                out.write(bytes);
            } catch (IOException ex) {
                // The reader went away; the assertions below say what it saw.
            }
        });
        feeder.setDaemon(true);
        feeder.start();
        return fifo;
    }

    @Test
    void aNamedPipeIsReadOnceAsAStreamNotTakenForAnEmptyFile() throws Exception {
        // Before the fix: "pipe: empty file: no header and no rows", since a pipe's size is 0.
        Path fifo = pipeFeeding("wind_ms,power_kw\n3,20\n5,90\n7,300\n".getBytes(StandardCharsets.UTF_8));
        Table t = assertTimeoutPreemptively(HANG, () -> CsvLoader.load(fifo, "pipe", LoadOptions.DEFAULT));
        assertEquals(3, t.rowCount());
        assertEquals(300.0, ((DecimalColumn) t.column("power_kw")).get(2), 0);
    }

    @Test
    void aNamedPipeCarryingGzipIsInflated() throws Exception {
        Path fifo = pipeFeeding(CsvFiles.gzip("wind_ms,power_kw\n3,20\n5,90\n".getBytes(StandardCharsets.UTF_8)));
        Table t = assertTimeoutPreemptively(HANG, () -> CsvLoader.load(fifo, "pipe", LoadOptions.DEFAULT));
        assertEquals(2, t.rowCount());
    }
}
