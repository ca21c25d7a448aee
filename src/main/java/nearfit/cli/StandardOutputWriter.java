package nearfit.cli;

import java.io.OutputStream;
import java.io.OutputStreamWriter;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;

/**
 * The process's standard output as text (UTF-8), with the byte stream under it for a picture written to
 * {@code -} ({@code plot --png -}).
 */
final class StandardOutputWriter extends PrintWriter {
    private final OutputStream bytes;

    StandardOutputWriter(OutputStream bytes) {
        super(new OutputStreamWriter(bytes, StandardCharsets.UTF_8), true);
        this.bytes = bytes;
    }

    /** The byte stream, after the text written so far has been flushed into it. */
    OutputStream bytes() {
        flush();
        return bytes;
    }
}
