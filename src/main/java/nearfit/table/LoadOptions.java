package nearfit.table;

import java.util.List;
import java.util.Objects;
import java.util.function.BooleanSupplier;

/**
 * How to load a CSV file: an immutable value made with {@link #builder()}. {@link #DEFAULT} sniffs the
 * delimiter and the header, keeps every column and uses every available processor.
 *
 * <pre>{@code
 * LoadOptions o = LoadOptions.builder().delimiter(';').keepColumns(List.of("wind_ms", "power_kw")).build();
 * }</pre>
 */
public final class LoadOptions {
    /** Sniffed delimiter, detected header, all columns, all processors, no progress. */
    public static final LoadOptions DEFAULT = builder().build();

    /** The delimiters the sniffer chooses among: comma, semicolon, tab, vertical bar. */
    public static final String SNIFFED_DELIMITERS = ",;\t|";

    private final char delimiter;
    private final HeaderMode header;
    private final int threads;
    private final LoadProgress progress;
    private final List<String> keepColumns;
    private final List<String> keepIfPresent;
    private final boolean keepFirstTimeColumn;
    private final BooleanSupplier cancelSignal;
    private final long parallelMinBytes;

    private LoadOptions(Builder b) {
        this.parallelMinBytes = b.parallelMinBytes;
        this.delimiter = b.delimiter;
        this.header = b.header;
        this.threads = b.threads;
        this.progress = b.progress;
        this.keepColumns = b.keepColumns;
        this.keepIfPresent = b.keepIfPresent;
        this.keepFirstTimeColumn = b.keepFirstTimeColumn;
        this.cancelSignal = b.cancelSignal;
    }

    /** A builder with the default settings. */
    public static Builder builder() {
        return new Builder();
    }

    /** A builder starting from this value's settings. */
    public Builder toBuilder() {
        Builder b = new Builder();
        b.delimiter = delimiter;
        b.header = header;
        b.threads = threads;
        b.progress = progress;
        b.keepColumns = keepColumns;
        b.keepIfPresent = keepIfPresent;
        b.keepFirstTimeColumn = keepFirstTimeColumn;
        b.cancelSignal = cancelSignal;
        b.parallelMinBytes = parallelMinBytes;
        return b;
    }

    /** The delimiter, or 0 to sniff it among {@link #SNIFFED_DELIMITERS}. */
    public char delimiter() {
        return delimiter;
    }

    /** Whether the first row is a header. */
    public HeaderMode header() {
        return header;
    }

    /** Parser threads for plain files (gzip and standard input use one decompressing, one parsing). */
    public int threads() {
        return threads;
    }

    /** Where progress goes. */
    public LoadProgress progress() {
        return progress;
    }

    /**
     * The columns to keep by name; the table holds them in file order. When both this list and
     * {@link #keepIfPresent()} are empty every column is kept.
     */
    public List<String> keepColumns() {
        return keepColumns;
    }

    /** Columns kept when the file has them and skipped without complaint when it has not. */
    public List<String> keepIfPresent() {
        return keepIfPresent;
    }

    /** Whether the file's first time column is kept too, whatever its name (for traceable output rows). */
    public boolean keepFirstTimeColumn() {
        return keepFirstTimeColumn;
    }

    /** Whether every column is kept: no column was named to keep, required or optional. */
    boolean keepsAll() {
        return keepColumns.isEmpty() && keepIfPresent.isEmpty();
    }

    /** Polled about once per block; when it answers true the load throws {@link LoadCancelledException}. */
    public BooleanSupplier cancelSignal() {
        return cancelSignal;
    }

    /** Plain files smaller than this are parsed on one thread (8 MiB; lowered by tests). */
    long parallelMinBytes() {
        return parallelMinBytes;
    }

    /** Builds {@link LoadOptions}; each setter returns the builder. */
    public static final class Builder {
        private char delimiter;
        private HeaderMode header = HeaderMode.AUTO;
        private int threads = Runtime.getRuntime().availableProcessors();
        private LoadProgress progress = LoadProgress.NONE;
        private List<String> keepColumns = List.of();
        private List<String> keepIfPresent = List.of();
        private boolean keepFirstTimeColumn;
        private BooleanSupplier cancelSignal = () -> false;
        private long parallelMinBytes = 8L << 20;

        private Builder() {
        }

        /** Uses this delimiter instead of sniffing; 0 restores sniffing. Quote and newline are refused. */
        public Builder delimiter(char d) {
            if (d == '"' || d == '\n' || d == '\r' || d > 127) {
                throw new NearfitException("the delimiter must be one ASCII character other than quote and newline");
            }
            this.delimiter = d;
            return this;
        }

        /** Whether the first row is a header; {@link HeaderMode#AUTO} by default. */
        public Builder header(HeaderMode h) {
            this.header = Objects.requireNonNull(h);
            return this;
        }

        /** Parser threads, at least 1. */
        public Builder threads(int n) {
            if (n < 1) {
                throw new NearfitException("threads must be at least 1, not " + n);
            }
            this.threads = n;
            return this;
        }

        /** Where progress goes. */
        public Builder progress(LoadProgress p) {
            this.progress = Objects.requireNonNull(p);
            return this;
        }

        /** Keeps only these columns (by header name or generated name); an unknown name fails the load. */
        public Builder keepColumns(List<String> names) {
            this.keepColumns = List.copyOf(names);
            return this;
        }

        /**
         * Also keeps these columns when the file has them (say a response that a file of new readings
         * may lack); a name the file lacks is skipped. Names may repeat those of {@link #keepColumns}.
         */
        public Builder keepIfPresent(List<String> names) {
            this.keepIfPresent = List.copyOf(names);
            return this;
        }

        /**
         * Also keeps the file's first column typed as a time, when only some columns are kept: a scored row
         * can then be traced by its time as well as its line.
         */
        public Builder keepFirstTimeColumn(boolean keep) {
            this.keepFirstTimeColumn = keep;
            return this;
        }

        /** A signal polled about once per block; true cancels the load. */
        public Builder cancelSignal(BooleanSupplier s) {
            this.cancelSignal = Objects.requireNonNull(s);
            return this;
        }

        /** Lets tests exercise the parallel path on small files. */
        Builder parallelMinBytes(long bytes) {
            this.parallelMinBytes = bytes;
            return this;
        }

        /** The immutable options. */
        public LoadOptions build() {
            return new LoadOptions(this);
        }
    }
}
