package nearfit.table;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.BufferedWriter;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Random;
import java.util.concurrent.TimeUnit;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The storage bound: a table of N rows and C numeric columns holds at most 1.3 x 8 N C bytes plus 8 N for
 * the line numbers. Checked in a child JVM whose heap limit is that bound plus a fixed 24 MB for the
 * JVM itself and the loader's buffers (5 MB per thread), so a loader that kept doubling copies, boxed
 * values or the file's text would run out of memory.
 */
class HeapBoundTest {
    static final int ROWS = 1_000_000;
    static final int COLUMNS = 4;

    @TempDir
    Path dir;

    @Test
    void aMillionRowsOfFourNumbersLoadWithinTheBoundUnderATightHeap() throws Exception {
        Path file = fourColumns();
        Matcher m = probe(file, COLUMNS);
        assertEquals(COLUMNS, Long.parseLong(m.group(3)));
    }

    @Test
    void keepingTwoOfTheFourColumnsHoldsNoMoreThanTheBoundForTwo() throws Exception {
        // The bound for two columns is 28.8 MB; the four columns' numbers and line numbers alone are 40 MB.
        Matcher m = probe(fourColumns(), 2, "power_kw,wind_ms");
        assertEquals(2, Long.parseLong(m.group(3)));
    }

    private Path fourColumns() throws IOException {
        Path file = dir.resolve("four.csv");
        Random rnd = new Random(3);
        try (BufferedWriter w = Files.newBufferedWriter(file, StandardCharsets.UTF_8)) {
            w.write("wind_ms,power_kw,rotor_rpm,temp_c\n");
            for (int i = 0; i < ROWS; i++) {
                w.write(rnd.nextInt(25000) / 1000.0 + "," + rnd.nextInt(300000) / 100.0 + ","
                        + rnd.nextInt(20000) / 1000.0 + "," + (rnd.nextInt(6000) - 2000) / 100.0 + "\n");
            }
        }
        return file;
    }

    /** Loads {@code file} in a child JVM whose heap is the bound for {@code columns} plus 24 MB; checks the bound. */
    private static Matcher probe(Path file, int columns, String... keep) throws Exception {
        long bound = (long) (1.3 * 8 * ROWS * columns) + 8L * ROWS;
        long heapMb = bound / (1 << 20) + 24;
        String java = Path.of(System.getProperty("java.home"), "bin", "java").toString();
        List<String> cmd = new java.util.ArrayList<>(List.of(java, "-Xmx" + heapMb + "m", "-XX:ActiveProcessorCount=2",
                "-cp", System.getProperty("java.class.path"), HeapProbe.class.getName(), file.toString()));
        cmd.addAll(List.of(keep));
        Process p = new ProcessBuilder(cmd).redirectErrorStream(true).start();
        String out = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
        assertTrue(p.waitFor(120, TimeUnit.SECONDS));
        assertEquals(0, p.exitValue(), "child JVM with -Xmx" + heapMb + "m: " + out);
        Matcher m = Pattern.compile("held=(\\d+) rows=(\\d+) columns=(\\d+)").matcher(out);
        assertTrue(m.find(), out);
        assertEquals(ROWS, Long.parseLong(m.group(2)));
        long held = Long.parseLong(m.group(1));
        assertTrue(held <= bound, "held " + held + " bytes, bound " + bound);
        assertTrue(held >= 8L * ROWS * columns, "held " + held + " bytes is less than the data itself: not measured");
        return m;
    }
}
