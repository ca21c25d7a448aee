package nearfit.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.Writer;
import java.math.BigInteger;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** A load that was told no digest is needed still gives the right one when it is asked for after all. */
class SourceTableDigestTest {
    @TempDir
    Path dir;

    @Test
    void theDigestIsTheSameWhetherComputedBesideTheLoadOrWhenAsked() throws IOException, NoSuchAlgorithmException {
        Path csv = Files.writeString(dir.resolve("log.csv"), "wind_ms,power_kw\n3.5,80\n8,700\n12.5,1950\n");
        // The JDK's SHA-256 over the file's bytes, written out as 64 hex digits.
        byte[] sum = MessageDigest.getInstance("SHA-256").digest(Files.readAllBytes(csv));
        String expected = String.format("%064x", new BigInteger(1, sum));
        PrintWriter quiet = new PrintWriter(Writer.nullWriter());
        ColumnRequest request = ColumnRequest.NONE.require("-x", "wind_ms");
        for (boolean digest : new boolean[] {true, false}) {
            SourceTable t = SourceTable.load(csv.toString(), request, false, digest, 1, true, quiet);
            assertEquals(3, t.table().rowCount(), "rows");
            assertEquals(expected, t.sha256(), "digest " + (digest ? "beside the load" : "when asked"));
            assertEquals(expected.length(), t.sha256().length());
        }
    }
}
