package nearfit.table;

import java.io.IOException;
import java.io.InputStream;
import java.nio.file.AccessDeniedException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;

/**
 * Loads a Parquet file, or a folder of them (a data set, whose {@code key=value} folder names become
 * columns), into a {@link Table} as {@link CsvLoader} loads CSV: the same column types, missing and bad
 * cell counts, kept columns and load report. Only the kept columns are read, in parallel, one task per
 * (file, row group, column), and joined in file order. A row's source-row value is its
 * file and row index ({@link RowSource}). Recognised by the magic bytes {@code PAR1}, never by the name.
 */
public final class ParquetLoader {
    /** The four bytes a Parquet file starts and ends with. Here, not in ParquetFile, so that checking a CSV
     * file loads none of the Parquet library's classes. */
    static final byte[] MAGIC = {'P', 'A', 'R', '1'};

    private ParquetLoader() {
    }

    /** Whether {@code path} is a folder (read as a Parquet data set) or a file starting with {@code PAR1}. */
    public static boolean isParquet(Path path) {
        if (Files.isDirectory(path)) {
            return true;
        }
        if (!Files.isRegularFile(path)) {
            return false;
        }
        return startsWithMagic(path);
    }

    private static boolean startsWithMagic(Path path) {
        try (InputStream in = Files.newInputStream(path)) {
            return Arrays.equals(in.readNBytes(4), MAGIC);
        } catch (IOException e) {
            return false; // the CSV loader reports the unreadable file
        }
    }

    /** Loads a Parquet file or data-set folder; {@code name} is how messages name it. */
    public static Table load(Path path, String name, LoadOptions options) {
        long t0 = System.nanoTime();
        List<Part> parts = Files.isDirectory(path) ? dataSet(path, name) : List.of(new Part(path, name, Map.of()));
        List<ParquetFile> files = new ArrayList<>(parts.size());
        long bytes = 0;
        for (Part p : parts) {
            files.add(open(p));
            bytes += sizeOf(p);
        }
        ParquetSchema schema = files.get(0).schema;
        for (int i = 1; i < files.size(); i++) {
            checkSameSchema(schema, files.get(i).schema, parts.get(i).shownName);
        }
        List<String> partitionKeys = new ArrayList<>(parts.get(0).partition.keySet());
        for (Part p : parts) {
            if (!p.partition.keySet().equals(parts.get(0).partition.keySet())) {
                throw NearfitException.inFile(p.shownName, "its folders name other keys (" + String.join(", ", p.partition.keySet())
                        + ") than the first file's (" + String.join(", ", partitionKeys) + ")");
            }
        }
        List<String> allNames = new ArrayList<>();
        for (ParquetSchema.Field f : schema.fields()) {
            allNames.add(f.name());
        }
        allNames.addAll(partitionKeys);
        int[] kept = keptColumns(name, allNames, schema, options);
        List<String> names = new ArrayList<>();
        ColumnType[] types = new ColumnType[kept.length];
        for (int j = 0; j < kept.length; j++) {
            int k = kept[j];
            names.add(allNames.get(k));
            types[j] = k < schema.fields().size() ? schema.fields().get(k).reading().columnType()
                    : partitionType(parts, allNames.get(k));
        }
        List<String> notes = schema.leftOut().isEmpty() ? List.of()
                : List.of("columns left out (nested, list, map or of a type not read): " + String.join(", ", schema.leftOut()));
        Layout layout = new Layout(LoadReport.PARQUET, false, true, allNames.size(), names, kept, types, 0, 0, notes);
        List<ChunkResult> results = readAll(files, parts, schema, kept, layout, name, options.threads());
        List<String> shown = new ArrayList<>();
        for (Part p : parts) {
            shown.add(p.shownName);
        }
        Table table = TableAssembly.assemble(name, layout, results, bytes, System.nanoTime() - t0, RowSource.parquet(shown));
        return asText(table, types);
    }

    /** One file of the load with its partition values (empty for a single file). */
    private record Part(Path path, String shownName, Map<String, String> partition) {
    }

    private static List<Part> dataSet(Path folder, String name) {
        List<Path> found = new ArrayList<>();
        try (var walk = Files.walk(folder)) {
            walk.filter(p -> Files.isRegularFile(p) && !hidden(folder.relativize(p))).sorted().forEach(found::add);
        } catch (IOException | java.io.UncheckedIOException e) {
            throw NearfitException.inFile(name, "cannot read the folder: " + e.getMessage(), e);
        }
        List<Part> parts = new ArrayList<>();
        for (Path p : found) {
            if (!startsWithMagic(p)) {
                continue; // not Parquet: a _SUCCESS marker, a checksum, a note
            }
            Path rel = folder.relativize(p);
            Map<String, String> partition = new LinkedHashMap<>();
            for (int i = 0; i < rel.getNameCount() - 1; i++) {
                String dir = rel.getName(i).toString();
                int eq = dir.indexOf('=');
                if (eq > 0) {
                    partition.put(dir.substring(0, eq), unescape(dir.substring(eq + 1)));
                }
            }
            parts.add(new Part(p, name.endsWith("/") ? name + rel : name + "/" + rel, partition));
        }
        if (parts.isEmpty()) {
            throw NearfitException.inFile(name, "is a folder with no Parquet file (a CSV file must be named itself)");
        }
        return parts;
    }

    /** Names starting with "." or "_" are a writer's side files (checksums, markers, temporary folders). */
    private static boolean hidden(Path rel) {
        for (Path part : rel) {
            String s = part.toString();
            if (s.startsWith(".") || s.startsWith("_")) {
                return true;
            }
        }
        return false;
    }

    /** A partition value as the folder name spells it: %XX escapes decoded (as data-set writers escape). */
    private static String unescape(String s) {
        if (s.indexOf('%') < 0) {
            return s;
        }
        try {
            return java.net.URLDecoder.decode(s.replace("+", "%2B"), java.nio.charset.StandardCharsets.UTF_8);
        } catch (IllegalArgumentException e) {
            return s;
        }
    }

    /** A partition column is a number when every value reads as one (or is missing), else a category. */
    private static ColumnType partitionType(List<Part> parts, String key) {
        for (Part p : parts) {
            String v = p.partition.get(key);
            byte[] b = v.getBytes(java.nio.charset.StandardCharsets.UTF_8);
            if (!isMissingPartition(v) && !Double.isFinite(CellText.parseNumber(b, 0, b.length, false, new byte[b.length + 1]))) {
                return ColumnType.CATEGORY;
            }
        }
        return ColumnType.NUMBER;
    }

    /** The folder name data-set writers give a null partition value. */
    private static boolean isMissingPartition(String v) {
        byte[] b = v.getBytes(java.nio.charset.StandardCharsets.UTF_8);
        return "__HIVE_DEFAULT_PARTITION__".equals(v) || CellText.isMissing(b, 0, b.length);
    }

    private static ParquetFile open(Part p) {
        try {
            return ParquetFile.open(p.path);
        } catch (NoSuchFileException e) {
            throw NearfitException.inFile(p.shownName, "no such file");
        } catch (AccessDeniedException e) {
            throw NearfitException.inFile(p.shownName, "permission denied");
        } catch (IllegalArgumentException e) {
            throw NearfitException.inFile(p.shownName, e.getMessage());
        } catch (IOException e) {
            throw NearfitException.inFile(p.shownName, "cannot read: " + e.getMessage(), e);
        }
    }

    private static long sizeOf(Part p) {
        try {
            return Files.size(p.path);
        } catch (IOException e) {
            return 0;
        }
    }

    private static void checkSameSchema(ParquetSchema first, ParquetSchema other, String file) {
        Map<String, ParquetSchema.Field> byName = new LinkedHashMap<>();
        for (ParquetSchema.Field f : other.fields()) {
            byName.put(f.name(), f);
        }
        for (ParquetSchema.Field f : first.fields()) {
            ParquetSchema.Field g = byName.get(f.name());
            if (g == null || g.reading().columnType() != f.reading().columnType()) {
                throw NearfitException.inFile(file, "column " + f.name() + (g == null ? " is missing"
                        : " is a " + g.reading().columnType().label() + " here and a " + f.reading().columnType().label()
                        + " in the data set's first file"));
            }
        }
    }

    /** Indexes into {@code names} of the kept columns, in file order, as the CSV sniffer keeps them. */
    private static int[] keptColumns(String source, List<String> names, ParquetSchema schema, LoadOptions options) {
        if (options.keepsAll()) {
            int[] all = new int[names.size()];
            for (int i = 0; i < all.length; i++) {
                all[i] = i;
            }
            return all;
        }
        java.util.BitSet kept = new java.util.BitSet(names.size());
        for (String name : options.keepColumns()) {
            int i = names.indexOf(name);
            if (i < 0) {
                throw new NearfitException(source, NearfitException.NO_LINE, name,
                        "no such column; the columns are " + String.join(", ", names), null);
            }
            kept.set(i);
        }
        for (String name : options.keepIfPresent()) {
            int i = names.indexOf(name);
            if (i >= 0) {
                kept.set(i);
            }
        }
        if (options.keepFirstTimeColumn()) {
            for (int i = 0; i < schema.fields().size(); i++) {
                if (schema.fields().get(i).reading().columnType() == ColumnType.TIME) {
                    kept.set(i);
                    break;
                }
            }
        }
        return kept.stream().toArray();
    }

    /**
     * Reads every kept column of every row group: one task per (file, row group, kept column) on
     * {@code threads} threads, so a file of few row groups still keeps every thread busy. The tasks of a
     * row group fill the columns of its one {@link ChunkResult} (each task its own column; the first also the
     * rows' source values), joined in file order. Each task borrows a {@link ParquetDirectDecoder} from a
     * stack of at most {@code threads}, so the decoders' scratch arrays are reused from task to task.
     */
    private static List<ChunkResult> readAll(List<ParquetFile> files, List<Part> parts, ParquetSchema schema, int[] kept,
                                             Layout layout, String name, int threads) {
        List<ChunkResult> out = new ArrayList<>();
        List<int[]> tasks = new ArrayList<>(); // (file, row group, index of the group's ChunkResult in out, kept column)
        for (int f = 0; f < files.size(); f++) {
            long row = 0;
            for (int g = 0; g < files.get(f).rowGroups().size(); g++) {
                for (int j = 0; j < Math.max(1, kept.length); j++) {
                    tasks.add(new int[] {f, g, out.size(), j});
                }
                out.add(new ChunkResult(layout, 0));
                row += files.get(f).rowGroups().get(g).getNum_rows();
            }
            if (row != files.get(f).rowCount()) {
                throw NearfitException.inFile(parts.get(f).shownName, "damaged: the row groups hold " + row
                        + " rows, the footer says " + files.get(f).rowCount());
            }
        }
        if (tasks.isEmpty()) {
            return List.of(new ChunkResult(layout, 0));
        }
        int n = Math.max(1, Math.min(threads, tasks.size()));
        java.util.concurrent.ConcurrentLinkedDeque<ParquetDirectDecoder> decoders = new java.util.concurrent.ConcurrentLinkedDeque<>();
        ExecutorService pool = n == 1 ? null : Executors.newFixedThreadPool(n, r -> {
            Thread t = new Thread(r, "nearfit-parquet");
            t.setDaemon(true);
            return t;
        });
        try {
            List<Future<ChunkResult>> futures = new ArrayList<>();
            for (int[] t : tasks) {
                ParquetFile file = files.get(t[0]);
                Part part = parts.get(t[0]);
                ChunkResult into = out.get(t[2]);
                java.util.concurrent.Callable<ChunkResult> job = () -> {
                    ParquetDirectDecoder decoder = decoders.pollFirst();
                    if (decoder == null) {
                        decoder = new ParquetDirectDecoder();
                    }
                    readColumn(file, part, t[0], t[1], t[3], into, schema, kept, layout, decoder);
                    decoders.addFirst(decoder); // not returned after a failure: the load ends anyway
                    return into;
                };
                if (pool == null) {
                    call(job, part.shownName);
                } else {
                    futures.add(pool.submit(job));
                }
            }
            for (int i = 0; i < futures.size(); i++) {
                get(futures.get(i), parts.get(tasks.get(i)[0]).shownName);
            }
            return out;
        } finally {
            if (pool != null) {
                pool.shutdownNow();
            }
        }
    }

    private static ChunkResult call(java.util.concurrent.Callable<ChunkResult> job, String file) {
        try {
            return job.call();
        } catch (IllegalArgumentException e) {
            throw NearfitException.inFile(file, e.getMessage());
        } catch (IOException e) {
            throw NearfitException.inFile(file, "cannot read: " + e.getMessage(), e);
        } catch (RuntimeException e) {
            throw e;
        } catch (Exception e) {
            throw new IllegalStateException(e);
        }
    }

    private static ChunkResult get(Future<ChunkResult> f, String file) {
        try {
            return f.get();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new LoadCancelledException(file);
        } catch (ExecutionException e) {
            Throwable c = e.getCause();
            if (c instanceof NearfitException ne) {
                throw ne;
            }
            if (c instanceof IllegalArgumentException) {
                throw NearfitException.inFile(file, c.getMessage());
            }
            if (c instanceof IOException) {
                throw NearfitException.inFile(file, "cannot read: " + c.getMessage(), c);
            }
            if (c instanceof OutOfMemoryError oom) {
                throw oom;
            }
            throw new IllegalStateException("reading " + file, c);
        }
    }

    /**
     * Reads kept column {@code j} of row group {@code group} into {@code r}; the task of column 0 also adds the
     * rows' source values (file and row index). With no kept column, only those.
     */
    private static void readColumn(ParquetFile file, Part part, int fileIndex, int group, int j, ChunkResult r,
                                   ParquetSchema schema, int[] kept, Layout layout, ParquetDirectDecoder decoder)
            throws IOException {
        long rows = file.rowGroups().get(group).getNum_rows();
        if (j == 0) {
            long first = 0;
            for (int g = 0; g < group; g++) {
                first += file.rowGroups().get(g).getNum_rows();
            }
            for (long i = 0; i < rows; i++) {
                r.lines.add(RowSource.pack(fileIndex, first + i));
            }
        }
        if (j >= kept.length) {
            return;
        }
        int fields = schema.fields().size();
        ColumnBuilder into = r.columns[j];
        if (kept[j] < fields) {
            file.read(group, schema.fields().get(kept[j]), into, decoder);
            return;
        }
        String v = part.partition.get(layout.names().get(j));
        byte[] b = v.getBytes(java.nio.charset.StandardCharsets.UTF_8);
        boolean missing = isMissingPartition(v);
        byte[] scratch = new byte[b.length + 1];
        for (long i = 0; i < rows; i++) {
            if (missing) {
                into.addMissing();
            } else {
                into.add(b, 0, b.length, false, scratch, false);
            }
        }
    }

    /**
     * Applies the CSV sniffer's text rule to the whole column (the CSV loader applies it to a sample): a
     * category with more than {@link Sniffer#CATEGORY_SAMPLE_LABELS} labels that are more than half its
     * present cells is text, not a group.
     */
    private static Table asText(Table table, ColumnType[] types) {
        List<Column> columns = new ArrayList<>(table.columns());
        boolean changed = false;
        for (int j = 0; j < columns.size(); j++) {
            if (columns.get(j) instanceof CategoryColumn c) {
                long present = c.size() - c.missingCount();
                if (c.labels().size() > Sniffer.CATEGORY_SAMPLE_LABELS && c.labels().size() * 2L > present) {
                    columns.set(j, new TextColumn(c.name(), c.size(), c.missingCount()));
                    changed = true;
                }
            }
        }
        return changed ? table.withColumns(columns) : table;
    }
}
