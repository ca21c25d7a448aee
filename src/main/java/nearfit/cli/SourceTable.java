package nearfit.cli;

import java.io.IOException;
import java.io.InputStream;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.CompletionException;

import nearfit.model.SourceInfo;
import nearfit.table.CategoryColumn;
import nearfit.table.Column;
import nearfit.table.CsvLoader;
import nearfit.table.LoadOptions;
import nearfit.table.LoadReport;
import nearfit.table.NearfitException;
import nearfit.table.NumericColumn;
import nearfit.table.RowSet;
import nearfit.table.RowSource;
import nearfit.table.Table;
import nearfit.table.VisibleText;

/**
 * A CSV source as a command reads it: the loaded table, the file's size and its SHA-256 (computed on
 * another thread while the table loads; none for standard input), and column look-ups whose
 * messages name the option, the column and the file, listing the columns there are.
 */
final class SourceTable {
    private final String name;
    private final Table table;
    private final long sizeBytes;
    /** The digest beside the load; null until asked when the load was told it is not needed. */
    private CompletableFuture<String> sha256;

    private SourceTable(String name, Table table, long sizeBytes, CompletableFuture<String> sha256) {
        this.name = name;
        this.table = table;
        this.sizeBytes = sizeBytes;
        this.sha256 = sha256;
    }

    /**
     * Loads {@code name} ({@code -} for standard input), keeping only the columns {@code request} asks
     * for. Unless {@code quiet}, says on {@code err} how many rows were read and how many bad cells they
     * held; the load report's warnings (say, the file changed while it was read) go to {@code err} even
     * when quiet, since they are about the data, not progress. {@code keepTime} also keeps the file's first
     * time column, so that scored rows can be traced by their time. With {@code digest} the file's SHA-256 is
     * computed beside the load (a model records it); without, only if {@link #sha256()} is asked, so commands
     * that never record it do not spend a core on it while the load and the search run.
     */
    static SourceTable load(String name, ColumnRequest request, boolean keepTime, boolean digest, int threads,
                            boolean quiet, PrintWriter err) {
        boolean stdin = "-".equals(name);
        Path path = stdin ? null : ArgumentPath.of(name);
        if (!stdin && !Files.exists(path)) {
            throw NearfitException.inFile(name, "no such file");
        }
        // A named pipe, <(zcat x) or /dev/stdin is read once as a stream, like standard input: no size, no digest;
        // nor has a folder (a Parquet data set).
        boolean stream = stdin || !Files.isRegularFile(path);
        CompletableFuture<String> sha = stream ? CompletableFuture.completedFuture(null)
                : digest ? CompletableFuture.supplyAsync(() -> sha256Of(path, name)) : null;
        LoadOptions options = LoadOptions.builder().threads(threads).keepColumns(request.required())
                .keepIfPresent(request.optional()).keepFirstTimeColumn(keepTime).build();
        long start = System.nanoTime();
        Table table;
        try {
            table = loadTable(name, path, options);
        } catch (NearfitException e) {
            throw unknownKeptColumn(e, name, request);
        }
        long size = stream ? -1 : sizeOf(path, name);
        LoadReport report = table.report();
        if (!quiet) {
            String bad = report.badCells() == 0 ? "" : String.format(Locale.ROOT, " (%d bad cells, read as missing)",
                    report.badCells());
            if (report.droppedRows() > 0) {
                bad += String.format(Locale.ROOT, "; %d ragged rows dropped (another number of fields than the "
                        + "header; describe lists their lines)", report.droppedRows());
            }
            err.printf(Locale.ROOT, "nearfit: read %d rows from %s in %.1f s%s%n", table.rowCount(), VisibleText.of(name),
                    (System.nanoTime() - start) / 1e9, bad);
        }
        printWarnings(report, err);
        return new SourceTable(name, table, size, sha);
    }

    /** Each warning of a load report as one line {@code nearfit: warning: ...}, then flushes. */
    static void printWarnings(LoadReport report, PrintWriter err) {
        for (String w : report.warnings()) {
            err.println("nearfit: warning: " + VisibleText.of(w));
        }
        err.flush();
    }

    /**
     * Loads {@code path} (or standard input when it is {@code null}), naming it {@code name}. Running out of
     * heap here is said to happen while loading, naming the file, whichever thread it struck.
     */
    static Table loadTable(String name, Path path, LoadOptions options) {
        try {
            return path == null ? CsvLoader.load(System.in, name, options) : CsvLoader.load(path, name, options);
        } catch (OutOfMemoryError e) {
            throw NearfitException.inFile(name, "out of memory while loading; give Java more heap "
                    + "(for example NEARFIT_JAVA_OPTS=-Xmx16g)", e);
        }
    }

    /**
     * The loader refuses a kept column the file lacks, naming the column and listing the others;
     * restates that in the commands' form, naming the option that asked for it.
     */
    private static NearfitException unknownKeptColumn(NearfitException e, String name, ColumnRequest request) {
        String marker = "the columns are ";
        int at = e.detail().indexOf(marker);
        if (e.column() == null || !request.required().contains(e.column()) || at < 0) {
            return e;
        }
        return new NearfitException(request.optionOf(e.column()) + ": no column \"" + e.column() + "\" in " + name
                + " (columns: " + e.detail().substring(at + marker.length()) + ")");
    }

    String name() {
        return name;
    }

    Table table() {
        return table;
    }

    /** The file's size in bytes, or -1 for standard input. */
    long sizeBytes() {
        return sizeBytes;
    }

    /** The file's SHA-256 in lower-case hex, or {@code null} for standard input; waits for it. */
    String sha256() {
        if (sha256 == null) {
            sha256 = CompletableFuture.completedFuture(sha256Of(ArgumentPath.of(name), name));
        }
        try {
            return sha256.join();
        } catch (CompletionException e) {
            throw e.getCause() instanceof NearfitException ne ? ne : e;
        }
    }

    /**
     * For Parquet rows, each file they come from (named as the table's {@link nearfit.table.RowSource} names it),
     * with its size and SHA-256, so a model records what its row indexes point at; {@code null} for CSV lines.
     * A data set's files are hashed here, one after the other (a single file's digest is {@link #sha256()}).
     */
    List<SourceInfo.SourceFile> parquetFiles() {
        RowSource rows = table.rowSource();
        if (!rows.isParquet()) {
            return null;
        }
        Path base = "-".equals(name) ? null : ArgumentPath.of(name);
        List<SourceInfo.SourceFile> out = new ArrayList<>();
        if (base == null || !Files.isDirectory(base)) {
            String sha = sha256();
            if (sha == null) {
                throw NearfitException.inFile(name, "a model's Parquet rows need a named file or folder, not a stream");
            }
            out.add(new SourceInfo.SourceFile(rows.files().get(0), sizeBytes, sha));
            return out;
        }
        String prefix = name.endsWith("/") ? name : name + "/";
        for (String file : rows.files()) {
            // The loader names a data set's file as the folder given, then its path within the folder.
            Path path = file.startsWith(prefix) ? base.resolve(file.substring(prefix.length())) : Path.of(file);
            out.add(new SourceInfo.SourceFile(file, sizeOf(path, file), sha256Of(path, file)));
        }
        return out;
    }

    /** The rows meeting the row condition, or every row when it is {@code null}. */
    RowSet rows(String where) {
        if (where == null || where.isBlank()) {
            return table.allRows();
        }
        try {
            return table.where(where);
        } catch (NearfitException e) {
            throw new NearfitException("--where: " + e.getMessage());
        }
    }

    /** The column named by {@code option}, failing with the file's column list when there is none. */
    Column column(String option, String column) {
        if (!table.hasColumn(column)) {
            throw new NearfitException(option + ": no column \"" + column + "\" in " + name + " (columns: "
                    + String.join(", ", table.names()) + ")");
        }
        return table.column(column);
    }

    /** A number or time column. */
    NumericColumn numeric(String option, String column) {
        Column c = column(option, column);
        if (!(c instanceof NumericColumn n)) {
            throw new NearfitException(option + ": column \"" + column + "\" in " + name + " is a "
                    + c.type().label() + " column, not a number or time");
        }
        return n;
    }

    /** A category column. */
    CategoryColumn category(String option, String column) {
        Column c = column(option, column);
        if (!(c instanceof CategoryColumn cat)) {
            throw new NearfitException(option + ": column \"" + column + "\" in " + name + " is a "
                    + c.type().label() + " column, not a category");
        }
        return cat;
    }

    /** The values of a numeric column at the given rows, as a new array (times as epoch ms). */
    static double[] values(NumericColumn column, RowSet rows) {
        double[] out = new double[rows.size()];
        column.copyValues(rows, out, 0);
        return out;
    }

    private static long sizeOf(Path path, String name) {
        try {
            return Files.size(path);
        } catch (IOException e) {
            throw NearfitException.inFile(name, "cannot read: " + e.getMessage(), e);
        }
    }

    static String sha256Of(Path path, String name) {
        try (InputStream in = Files.newInputStream(path)) {
            MessageDigest digest = MessageDigest.getInstance("SHA-256");
            byte[] buffer = new byte[1 << 16];
            for (int n = in.read(buffer); n >= 0; n = in.read(buffer)) {
                digest.update(buffer, 0, n);
            }
            return HexFormat.of().formatHex(digest.digest());
        } catch (IOException e) {
            throw NearfitException.inFile(name, "cannot read: " + e.getMessage(), e);
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("every Java runtime has SHA-256", e);
        }
    }
}
