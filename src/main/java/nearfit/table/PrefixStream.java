package nearfit.table;

import java.io.FilterInputStream;
import java.io.IOException;
import java.io.InputStream;

/**
 * At most the first {@code limit} bytes of a stream: the loader reads a file up to the size it had when
 * the load began, so rows appended meanwhile (a log still being written) are not half read.
 */
final class PrefixStream extends FilterInputStream {
    private long left;

    PrefixStream(InputStream in, long limit) {
        super(in);
        this.left = Math.max(0, limit);
    }

    @Override
    public int read() throws IOException {
        if (left == 0) {
            return -1;
        }
        int b = in.read();
        if (b >= 0) {
            left--;
        }
        return b;
    }

    @Override
    public int read(byte[] b, int off, int len) throws IOException {
        if (len == 0) {
            return 0;
        }
        if (left == 0) {
            return -1;
        }
        int n = in.read(b, off, (int) Math.min(len, left));
        if (n > 0) {
            left -= n;
        }
        return n;
    }

    @Override
    public long skip(long n) throws IOException {
        long s = in.skip(Math.min(n, left));
        left -= s;
        return s;
    }

    @Override
    public int available() throws IOException {
        return (int) Math.min(in.available(), left);
    }

    @Override
    public boolean markSupported() {
        return false;
    }
}
