package nearfit.table;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.Arrays;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Every kind of bad input ends in one NearfitException whose message names the file (and line). */
class BadInputTest {
    @TempDir
    Path dir;

    private String failure(String name, byte[] bytes) {
        Path p = CsvFiles.write(dir, name, bytes);
        return assertThrows(NearfitException.class, () -> CsvLoader.load(p, name, LoadOptions.DEFAULT)).getMessage();
    }

    private String failure(String name, String text) {
        return failure(name, text.getBytes(StandardCharsets.UTF_8));
    }

    @Test
    void anEmptyFileSaysSo() {
        assertEquals("empty.csv: empty file: no header and no rows", failure("empty.csv", ""));
        assertEquals("blank.csv: empty file: no header and no rows", failure("blank.csv", "\n\r\n  \n"));
    }

    @Test
    void aHeaderWithoutRowsSaysSo() {
        assertEquals("head.csv: header only: no data rows", failure("head.csv", "wind_ms,power_kw\n"));
        assertEquals("head2.csv: header only: no data rows", failure("head2.csv", "wind_ms,power_kw\n\n\n"));
    }

    @Test
    void binaryGarbageIsNotReadAsText() {
        byte[] junk = new byte[300];
        for (int i = 0; i < junk.length; i++) {
            junk[i] = (byte) (i * 37);
        }
        assertEquals("junk.bin: not a CSV text file: binary data (a NUL byte) at byte 0", failure("junk.bin", junk));
    }

    @Test
    void aLineOverOneMegabyteNamesTheLine() {
        char[] wide = new char[(1 << 20) + 10];
        Arrays.fill(wide, 'x');
        String text = "a,b\n" + "1,2\n".repeat(3) + "3," + new String(wide) + "\n4,5\n";
        assertEquals("wide.csv:5: line over 1 MB (a quote never closed, or not a CSV file?)", failure("wide.csv", text));
    }

    @Test
    void aQuoteNeverClosedNamesTheLineWhereItOpened() {
        assertEquals("open.csv:3: the quote opened on this line is never closed",
                failure("open.csv", "a,b\n1,2\n3,\"oops\n4,5\n"));
    }

    @Test
    void aTruncatedGzipStreamSaysAfterWhichLineAndUsesNoRows() {
        StringBuilder sb = new StringBuilder("a,b\n");
        java.util.Random rnd = new java.util.Random(7);
        for (int i = 0; i < 200_000; i++) {
            sb.append(rnd.nextInt(1000)).append(',').append(rnd.nextDouble()).append('\n');
        }
        byte[] gz = CsvFiles.gzip(sb.toString().getBytes(StandardCharsets.UTF_8));
        String msg = failure("cut.csv.gz", Arrays.copyOf(gz, gz.length / 2));
        assertEquals(true, msg.matches("cut\\.csv\\.gz: truncated gzip stream after line \\d+; the rows read are not used"), msg);
        long line = Long.parseLong(msg.replaceAll("\\D+(\\d+).*", "$1"));
        assertEquals(true, line > 1000 && line < 200_001, msg);
    }

    @Test
    void aGzipCutInsideItsFirstBlockIsStillNamed() {
        byte[] gz = CsvFiles.gzip("a,b\n1,2\n3,4\n".getBytes(StandardCharsets.UTF_8));
        String msg = failure("tiny.gz", Arrays.copyOf(gz, gz.length - 4));
        assertEquals(true, msg.startsWith("tiny.gz: truncated"), msg);
    }

    @Test
    void aMissingFileSaysSo() {
        Path p = dir.resolve("nowhere.csv");
        NearfitException ex = assertThrows(NearfitException.class, () -> CsvLoader.load(p, "nowhere.csv", LoadOptions.DEFAULT));
        assertEquals("nowhere.csv: no such file", ex.getMessage());
        assertEquals("nowhere.csv", ex.file());
    }

    @Test
    void aDirectoryIsNotAFile() {
        // A folder is read as a Parquet data set; one holding no Parquet file is refused, pointing at the CSV case.
        NearfitException ex = assertThrows(NearfitException.class, () -> CsvLoader.load(dir, "logs", LoadOptions.DEFAULT));
        assertEquals("logs: is a folder with no Parquet file (a CSV file must be named itself)", ex.getMessage());
    }

    @Test
    void anUnknownColumnToKeepIsNamed() {
        Path p = CsvFiles.write(dir, "k.csv", "a,b\n1,2\n");
        NearfitException ex = assertThrows(NearfitException.class, () -> CsvLoader.load(p, "k.csv",
                LoadOptions.builder().keepColumns(java.util.List.of("c")).build()));
        assertEquals("k.csv: column c: no such column; the columns are a, b", ex.getMessage());
    }
}
