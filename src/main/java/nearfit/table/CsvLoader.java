package nearfit.table;

import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.io.InputStream;
import java.io.SequenceInputStream;
import java.nio.channels.Channels;
import java.nio.channels.FileChannel;
import java.nio.file.AccessDeniedException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.atomic.AtomicLong;
import java.util.zip.GZIPInputStream;

/**
 * Loads a CSV file, plain or gzip, or standard input, into a {@link Table}.
 *
 * <p>Plain files are parsed in parallel: the data are cut into one stretch per thread, each starting after
 * a line break; a stretch that turns out to start inside a quoted field (its predecessor did not end
 * where it began) is parsed again from where the predecessor ended. Gzip and standard input are
 * decompressed and read on one thread while another parses. Every failure is a {@link NearfitException}
 * naming the file and, where one applies, the line.
 */
public final class CsvLoader {
    /** Bytes read before parsing to sniff the dialect and types. */
    static final int HEAD_BYTES = 2 * ChunkParser.MAX_ROW_BYTES;

    private final LoadOptions options;

    private CsvLoader(LoadOptions options) {
        this.options = options;
    }

    /** Loads {@code source}: a file path, or "-" for standard input. */
    public static Table load(String source, LoadOptions options) {
        if ("-".equals(source)) {
            return load(System.in, "-", options);
        }
        return load(Path.of(source), source, options);
    }

    /** Loads a plain or gzip file; {@code name} is how messages name it. */
    public static Table load(Path path, String name, LoadOptions options) {
        return new CsvLoader(options).loadFile(path, name);
    }

    /** Loads a stream (gzip detected by its first bytes); {@code name} is how messages name it. */
    public static Table load(InputStream in, String name, LoadOptions options) {
        return new CsvLoader(options).loadStream(in, name, -1, System.nanoTime());
    }

    private Table loadFile(Path path, String name) {
        if (ParquetLoader.isParquet(path)) {
            return ParquetLoader.load(path, name, options); // by its magic bytes, or a folder as a data set
        }
        long t0 = System.nanoTime();
        try {
            if (!Files.isRegularFile(path) && Files.exists(path)) {
                // A pipe such as <(zcat log.gz) has no size and can be read once: read it as a stream
                // (FileInputStream, since the channel stream of Files.newInputStream seeks, which pipes refuse).
                try (InputStream in = new java.io.FileInputStream(path.toFile())) {
                    return loadStream(in, name, -1, t0);
                }
            }
            FileSnapshot before = FileSnapshot.of(path);
            Table table;
            if (isGzip(path)) {
                try (InputStream in = new PrefixStream(Files.newInputStream(path), before.size())) {
                    table = loadStream(in, name, -1, t0);
                }
            } else {
                table = loadPlain(path, name, before.size(), t0);
            }
            return before.confirm(path, name, table);
        } catch (java.nio.channels.ClosedByInterruptException ex) {
            throw new LoadCancelledException(name); // the loading thread was interrupted
        } catch (NoSuchFileException ex) {
            throw NearfitException.inFile(name, "no such file");
        } catch (AccessDeniedException ex) {
            throw NearfitException.inFile(name, "permission denied");
        } catch (IOException ex) {
            throw NearfitException.inFile(name, "cannot read: " + ex.getMessage(), ex);
        }
    }

    /** Gzip by its magic bytes 1f 8b (RFC 1952 section 2.3.1), never by the file's name. */
    private static boolean isGzip(Path path) throws IOException {
        try (InputStream in = Files.newInputStream(path)) {
            return in.read() == 0x1f && in.read() == 0x8b;
        }
    }

    private Table loadPlain(Path path, String name, long size, long t0) throws IOException {
        byte[] head = new byte[(int) Math.min(size, HEAD_BYTES)];
        int n;
        try (InputStream in = Files.newInputStream(path)) {
            n = in.readNBytes(head, 0, head.length);
        }
        Layout layout = Sniffer.sniff(name, head, n, n == size, options);
        ChunkParser.Shared shared = shared(size);
        List<ChunkResult> parts;
        int threads = options.threads();
        if (threads == 1 || size < options.parallelMinBytes()) {
            try (FileChannel ch = FileChannel.open(path, StandardOpenOption.READ)) {
                ChunkParser parser = new ChunkParser(layout, name, false, shared);
                InputStream in = new PrefixStream(Channels.newInputStream(ch.position(layout.dataOffset())),
                        size - layout.dataOffset());
                parts = List.of(parser.parse(in, layout.dataOffset(), Long.MAX_VALUE, layout.dataLine()));
            }
        } else {
            parts = new ParallelPlainParse(path, name, size, layout, shared, threads).run();
        }
        return TableAssembly.assemble(name, layout, parts, shared.bytes().get(), System.nanoTime() - t0);
    }

    private ChunkParser.Shared shared(long total) {
        return new ChunkParser.Shared(new AtomicLong(), new AtomicLong(), total, options.progress(),
                options.cancelSignal());
    }

    /** Gzip or not, from a stream: one thread reads (and inflates), the calling thread parses. */
    private Table loadStream(InputStream raw, String name, long size, long t0) {
        try (BlockPipe pipe = BlockPipe.start(raw, name)) {
            InputStream in = pipe.stream();
            byte[] head = new byte[HEAD_BYTES];
            int n = 0;
            IOException early = null;
            try {
                int r;
                while (n < head.length && (r = in.read(head, n, head.length - n)) >= 0) {
                    n += r;
                }
            } catch (IOException ex) {
                early = ex;
            }
            boolean whole = n < head.length && early == null;
            if (n == 0 && early != null) {
                throw NearfitException.inFile(name, pipe.gzip()
                        ? "truncated or damaged gzip stream before any row (" + early.getMessage() + ")"
                        : "cannot read: " + early.getMessage(), early);
            }
            Layout layout = Sniffer.sniff(name, head, n, whole, options);
            int from = (int) layout.dataOffset();
            InputStream rest = early == null ? in : failing(early);
            InputStream data = new SequenceInputStream(new ByteArrayInputStream(head, from, n - from), rest);
            ChunkParser.Shared shared = shared(size);
            ChunkResult part = new ChunkParser(layout, name, pipe.gzip(), shared)
                    .parse(data, from, Long.MAX_VALUE, layout.dataLine());
            return TableAssembly.assemble(name, layout, List.of(part), shared.bytes().get() + from,
                    System.nanoTime() - t0);
        }
    }

    private static InputStream failing(IOException ex) {
        return new InputStream() {
            @Override
            public int read() throws IOException {
                throw ex;
            }
        };
    }

    /** Parses stretches of a plain file on a pool of threads, then checks that the stretches join. */
    private record ParallelPlainParse(Path path, String name, long size, Layout layout,
            ChunkParser.Shared shared, int threads) {
        List<ChunkResult> run() throws IOException {
            long from = layout.dataOffset();
            long[] nominal = new long[threads + 1];
            for (int i = 0; i <= threads; i++) {
                nominal[i] = from + (size - from) * i / threads;
            }
            ExecutorService pool = Executors.newFixedThreadPool(threads, r -> {
                Thread t = new Thread(r, "nearfit-load");
                t.setDaemon(true);
                return t;
            });
            try {
                List<Future<ChunkResult>> futures = new ArrayList<>();
                long[] starts = new long[threads];
                for (int i = 0; i < threads; i++) {
                    long start = i == 0 ? from : afterLineBreak(nominal[i]);
                    long line = i == 0 ? layout.dataLine() : 0;
                    long stop = nominal[i + 1];
                    starts[i] = start;
                    futures.add(pool.submit(() -> parse(start, stop, line)));
                }
                List<ChunkResult> parts = new ArrayList<>();
                for (int i = 0; i < threads; i++) {
                    ChunkResult r = await(futures.get(i), futures);
                    if (i > 0) {
                        ChunkResult prev = parts.get(i - 1);
                        if (prev.endOffset != starts[i]) {
                            r = parse(prev.endOffset, nominal[i + 1], prev.endLine); // began inside quotes
                        } else {
                            r.shiftLines(prev.endLine - r.firstLine);
                            r.endLine += prev.endLine - r.firstLine;
                        }
                    }
                    parts.add(r);
                    if (r.failure != null) {
                        break; // a kept stretch failed: the assembly reports it
                    }
                }
                return parts;
            } finally {
                pool.shutdownNow();
            }
        }

        private ChunkResult parse(long start, long stop, long line) throws IOException {
            try (FileChannel ch = FileChannel.open(path, StandardOpenOption.READ)) {
                // Bounded by the size at the start, so a row appended meanwhile is not half read.
                InputStream in = new PrefixStream(Channels.newInputStream(ch.position(start)), size - start);
                return new ChunkParser(layout, name, false, shared).parse(in, start, stop, line);
            }
        }

        /** The first offset at or after {@code p} that follows a line feed (or the file's size). */
        private long afterLineBreak(long p) throws IOException {
            try (FileChannel ch = FileChannel.open(path, StandardOpenOption.READ)) {
                java.nio.ByteBuffer buf = java.nio.ByteBuffer.allocate(64 << 10);
                long at = p - 1;
                while (at < size) {
                    buf.clear();
                    int n = ch.read(buf, at);
                    if (n <= 0) {
                        break;
                    }
                    for (int i = 0; i < n; i++) {
                        if (buf.get(i) == '\n') {
                            return at + i + 1;
                        }
                    }
                    at += n;
                }
                return size;
            }
        }

        private ChunkResult await(Future<ChunkResult> f, List<Future<ChunkResult>> all) {
            try {
                return f.get();
            } catch (InterruptedException ex) {
                for (Future<ChunkResult> g : all) {
                    g.cancel(true);
                }
                Thread.currentThread().interrupt();
                throw new LoadCancelledException(name);
            } catch (ExecutionException ex) {
                Throwable c = ex.getCause();
                if (c instanceof NearfitException ne) {
                    throw ne;
                }
                if (c instanceof OutOfMemoryError) {
                    throw NearfitException.inFile(name, "out of memory while loading; give Java more heap "
                            + "(for example NEARFIT_JAVA_OPTS=-Xmx16g)", c);
                }
                throw NearfitException.inFile(name, "cannot read: " + c, c);
            }
        }
    }
}
