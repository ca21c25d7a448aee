package nearfit.table;

import java.io.BufferedInputStream;
import java.io.IOException;
import java.io.InputStream;
import java.util.concurrent.ArrayBlockingQueue;
import java.util.concurrent.BlockingQueue;
import java.util.zip.GZIPInputStream;

/**
 * Reads (and, for gzip, inflates) a stream on its own thread into 1 MB blocks handed to the parsing
 * thread through a small queue, so decompression and parsing overlap. Gzip is recognised by the magic
 * bytes 1f 8b (RFC 1952 section 2.3.1). A read failure reaches the parser in order, after the blocks
 * read before it.
 */
final class BlockPipe implements AutoCloseable {
    private static final int BLOCK = 1 << 20;
    private static final byte[] END = new byte[0];

    private final BlockingQueue<Object> queue = new ArrayBlockingQueue<>(4);
    private final boolean gzip;
    private final Thread reader;

    private BlockPipe(InputStream source, boolean gzip) {
        this.gzip = gzip;
        this.reader = new Thread(() -> pump(source), "nearfit-inflate");
        reader.setDaemon(true);
    }

    /** Starts reading {@code raw}; fails with a message naming {@code name} when it cannot be read. */
    static BlockPipe start(InputStream raw, String name) {
        BufferedInputStream in = new BufferedInputStream(raw, 1 << 16);
        boolean gzip;
        InputStream source;
        try {
            in.mark(2);
            gzip = in.read() == 0x1f && in.read() == 0x8b;
            in.reset();
            source = gzip ? new GZIPInputStream(in, 1 << 16) : in;
        } catch (java.io.EOFException ex) {
            // The gzip header (RFC 1952: 10 bytes) is cut short; EOFException carries no message.
            throw NearfitException.inFile(name, "truncated gzip stream: the file ends inside the gzip header "
                    + "(it holds the gzip magic bytes, but no compressed data)", ex);
        } catch (IOException ex) {
            throw NearfitException.inFile(name, (ex instanceof java.util.zip.ZipException
                    ? "not a valid gzip stream: " : "cannot read: ") + (ex.getMessage() == null
                    ? ex.getClass().getSimpleName() : ex.getMessage()), ex);
        }
        BlockPipe pipe = new BlockPipe(source, gzip);
        pipe.reader.start();
        return pipe;
    }

    boolean gzip() {
        return gzip;
    }

    private void pump(InputStream source) {
        try {
            while (true) {
                byte[] block = new byte[BLOCK];
                int n = source.readNBytes(block, 0, BLOCK);
                if (n > 0) {
                    queue.put(n == BLOCK ? block : java.util.Arrays.copyOf(block, n));
                }
                if (n < BLOCK) {
                    queue.put(END);
                    return;
                }
            }
        } catch (IOException | RuntimeException | Error ex) {
            // Every failure goes to the reader, or it would wait for a block forever (an out-of-memory
            // error here once hung a gzip load instead of ending it with one line).
            try {
                queue.put(ex);
            } catch (InterruptedException ie) {
                Thread.currentThread().interrupt();
            }
        } catch (InterruptedException ex) {
            Thread.currentThread().interrupt(); // closed by the parser
        }
    }

    /** The blocks as one stream; a read failure on the reading thread is thrown from here. */
    InputStream stream() {
        return new InputStream() {
            private byte[] block = new byte[0];
            private int at;
            private boolean done;

            @Override
            public int read() throws IOException {
                byte[] one = new byte[1];
                return read(one, 0, 1) < 0 ? -1 : one[0] & 0xff;
            }

            @Override
            public int read(byte[] b, int off, int len) throws IOException {
                while (at == block.length) {
                    if (done) {
                        return -1;
                    }
                    Object next;
                    try {
                        next = queue.take();
                    } catch (InterruptedException ex) {
                        Thread.currentThread().interrupt();
                        throw new java.io.InterruptedIOException("interrupted");
                    }
                    if (next instanceof IOException ex) {
                        done = true;
                        throw ex;
                    }
                    if (next instanceof RuntimeException ex) {
                        done = true;
                        throw ex;
                    }
                    if (next instanceof Error ex) {
                        done = true;
                        throw ex;
                    }
                    block = (byte[]) next;
                    at = 0;
                    done = block == END;
                }
                int n = Math.min(len, block.length - at);
                System.arraycopy(block, at, b, off, n);
                at += n;
                return n;
            }
        };
    }

    @Override
    public void close() {
        reader.interrupt();
        queue.clear();
    }
}
