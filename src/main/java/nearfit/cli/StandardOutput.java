package nearfit.cli;

import java.io.IOException;
import java.io.OutputStream;
import java.io.PrintWriter;

/**
 * Standard output that remembers its first write error, since the print writers over it swallow them.
 *
 * <p>After the run, {@link #status} turns a failed write (a full disk under a redirect, a closed
 * descriptor) into status 2 and one line on standard error; a reader that went away (EPIPE, as
 * {@code | head} does once it has its lines) is not an error, as for other Unix tools. After the first
 * failure every write fails at once, so the rest of the output costs nothing.
 */
final class StandardOutput extends OutputStream {
    private final OutputStream out;
    private IOException failure;

    StandardOutput(OutputStream out) {
        this.out = out;
    }

    @Override
    public synchronized void write(int b) throws IOException {
        check();
        try {
            out.write(b);
        } catch (IOException e) {
            throw failed(e);
        }
    }

    @Override
    public synchronized void write(byte[] b, int off, int len) throws IOException {
        check();
        try {
            out.write(b, off, len);
        } catch (IOException e) {
            throw failed(e);
        }
    }

    @Override
    public synchronized void flush() throws IOException {
        check();
        try {
            out.flush();
        } catch (IOException e) {
            throw failed(e);
        }
    }

    private void check() throws IOException {
        if (failure != null) {
            throw failure;
        }
    }

    private IOException failed(IOException e) {
        failure = e;
        return e;
    }

    /**
     * The run's exit status given its own {@code status}: unchanged when every write succeeded or the
     * reader went away; otherwise 2, with a line on {@code err} saying why.
     */
    synchronized int status(int status, PrintWriter err) {
        if (failure == null || readerWentAway(failure)) {
            return status;
        }
        String why = failure.getMessage() == null ? failure.getClass().getSimpleName() : failure.getMessage();
        err.println("nearfit: standard output: cannot write: " + why);
        err.flush();
        return Main.EXIT_USAGE;
    }

    /** EPIPE: Java ignores SIGPIPE, so the write fails with this message instead of ending the process. */
    static boolean readerWentAway(IOException e) {
        return e.getMessage() != null && e.getMessage().contains("Broken pipe");
    }
}
