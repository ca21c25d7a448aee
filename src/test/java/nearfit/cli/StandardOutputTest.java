package nearfit.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.OutputStream;
import java.io.PrintWriter;
import java.io.StringWriter;

import org.junit.jupiter.api.Test;

/** The standard-output check in-process; the child-JVM cases are in {@link OutputSafetyTest}. */
class StandardOutputTest {
    /** A stream whose writes fail after {@code room} bytes with {@code message}, as a full disk or a closed pipe. */
    private static OutputStream failingAfter(int room, String message) {
        return new OutputStream() {
            private int written;

            @Override
            public void write(int b) throws IOException {
                if (++written > room) {
                    throw new IOException(message);
                }
            }
        };
    }

    @Test
    void aFailedWriteTurnsTheStatusInto2WithOneLine() {
        StandardOutput stdout = new StandardOutput(failingAfter(3, "No space left on device"));
        PrintWriter out = new PrintWriter(stdout);
        out.print("more than three bytes");
        out.flush();
        assertTrue(out.checkError(), "the print writer swallowed the error");
        StringWriter err = new StringWriter();
        assertEquals(2, stdout.status(1, new PrintWriter(err)));
        assertEquals("nearfit: standard output: cannot write: No space left on device\n", err.toString());
    }

    @Test
    void aReaderThatWentAwayLeavesTheStatusAsItWasAndSaysNothing() {
        StandardOutput stdout = new StandardOutput(failingAfter(0, "Broken pipe"));
        PrintWriter out = new PrintWriter(stdout);
        out.print("x");
        out.flush();
        StringWriter err = new StringWriter();
        assertEquals(1, stdout.status(1, new PrintWriter(err)));
        assertEquals("", err.toString());
    }

    @Test
    void afterTheFirstFailureEveryWriteFailsAtOnce() throws IOException {
        StandardOutput stdout = new StandardOutput(failingAfter(0, "No space left on device"));
        assertThrows(IOException.class, () -> stdout.write(1));
        IOException again = assertThrows(IOException.class, () -> stdout.write(new byte[10], 0, 10));
        assertEquals("No space left on device", again.getMessage());
    }
}
