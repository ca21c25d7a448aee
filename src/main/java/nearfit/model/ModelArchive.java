package nearfit.model;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.lang.reflect.Array;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.util.ArrayList;
import java.util.Collection;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.zip.CRC32;
import java.util.zip.ZipEntry;
import java.util.zip.ZipException;
import java.util.zip.ZipFile;
import java.util.zip.ZipOutputStream;


import nearfit.table.NearfitException;

/**
 * The container of a model file: a ZIP archive (PKWARE APPNOTE) holding {@code manifest.json},
 * {@code manifest.sha256} and named arrays as little-endian binary entries, stored uncompressed so
 * that loading runs at the speed of reading the file.
 *
 * <p>The manifest's {@code "entries"} list records each array's name, element type ({@code f64},
 * {@code i32}, {@code i64}), element count, CRC-32 and SHA-256 (of the entry's uncompressed bytes);
 * {@code manifest.sha256} holds the SHA-256 of the manifest's bytes in hex. So no single edit of
 * any entry passes: a changed array fails its digest in the manifest, a changed manifest fails its
 * CRC-32 and the digest beside it. This guards against damage and casual edits, not against someone
 * who recomputes the digests. Files of format 1.0 have no digests and are read with the CRC-32 of
 * every entry checked, the manifest's included.
 *
 * <p>Reading is in two steps: {@link #open} reads and checks the manifest, then
 * {@link Opened#read} reads only the arrays the caller needs, each once, with the element count the
 * caller requires; it never inflates more bytes than that count asks for, and an inflated entry's
 * array grows with the bytes that actually arrive. No Java serialization is involved.
 */
public final class ModelArchive {
    /** The manifest's {@code "format"} value. */
    public static final String FORMAT_NAME = "nearfit-model";
    /** The major format version this build reads and writes; files of another major are refused. */
    public static final int FORMAT_MAJOR = 1;
    /** The minor format version this build writes; minor 1 added the SHA-256 digests. */
    public static final int FORMAT_MINOR = 1;
    /** The name of the manifest entry. */
    public static final String MANIFEST = "manifest.json";
    /** The entry holding the SHA-256 of the manifest's bytes, 64 hex digits and a line feed. */
    public static final String MANIFEST_DIGEST = "manifest.sha256";

    private static final long MAX_MANIFEST_BYTES = 16L << 20;
    private static final long MAX_DIGEST_BYTES = 256;
    private static final long MAX_ENTRY_BYTES = Integer.MAX_VALUE - 16L;
    /** Array names: what the writer uses (input.0, response, ...), nothing that could leave data/. */
    private static final java.util.regex.Pattern ARRAY_NAME = java.util.regex.Pattern.compile("[A-Za-z0-9_.]{1,64}");
    private static final java.util.regex.Pattern SHA256_HEX = java.util.regex.Pattern.compile("[0-9a-f]{64}");

    /** Element types of stored arrays. */
    public enum ElementType {
        F64("f64", 8), I32("i32", 4), I64("i64", 8);

        private final String code;
        private final int width;

        ElementType(String code, int width) {
            this.code = code;
            this.width = width;
        }

        /** The manifest spelling. */
        public String code() {
            return code;
        }

        /** Bytes per element. */
        public int width() {
            return width;
        }

        static ElementType ofCode(String code) {
            for (ElementType t : values()) {
                if (t.code.equals(code)) {
                    return t;
                }
            }
            return null;
        }
    }

    /**
     * One array as the manifest lists it.
     *
     * @param crc32  CRC-32 of the uncompressed bytes
     * @param sha256 SHA-256 of the uncompressed bytes in lower-case hex, or {@code null} in a 1.0 file
     */
    public record Listed(String name, ElementType type, long count, long crc32, String sha256) {
    }

    /** An array a reader needs: name, element type and the element count it must have. */
    public record Need(String name, ElementType type, int count) {
    }

    /** What a model file holds: the manifest and the arrays by name (double[], int[] or long[]). */
    public record Contents(Map<String, Object> manifest, Map<String, Object> arrays) {
        /** The double array stored under {@code name}. */
        public double[] doubles(String name) {
            return (double[]) require(name, double[].class);
        }

        /** The int array stored under {@code name}. */
        public int[] ints(String name) {
            return (int[]) require(name, int[].class);
        }

        /** The long array stored under {@code name}. */
        public long[] longs(String name) {
            return (long[]) require(name, long[].class);
        }

        private Object require(String name, Class<?> type) {
            Object a = arrays.get(name);
            if (!type.isInstance(a)) {
                throw new NearfitException("the model file has no " + type.getComponentType() + " entry " + name);
            }
            return a;
        }
    }

    private ModelArchive() {
    }

    /**
     * Writes a model file atomically (see {@link SafeOutput}).
     *
     * @param manifest the manifest's fields, a map or a record (its components in order, named in
     *                 snake_case); {@code format}, {@code format_version} and {@code entries} are added here
     * @param arrays   named arrays, each a double[], int[] or long[]
     */
    public static void write(Path target, boolean force, Collection<Path> inputs,
                             Object manifest, Map<String, Object> arrays) {
        Map<String, Object> full = new LinkedHashMap<>();
        full.put("format", FORMAT_NAME);
        full.put("format_version", FORMAT_MAJOR + "." + FORMAT_MINOR);
        full.putAll(JsonText.fieldsOf(manifest));
        List<Object> entries = new ArrayList<>();
        ArrayBytes pieces = new ArrayBytes();
        Map<String, Long> crcs = new LinkedHashMap<>();
        for (Map.Entry<String, Object> e : arrays.entrySet()) {
            ElementType type = typeOf(e.getValue());
            ArrayBytes.Sums sums = sumsOf(pieces, e.getValue());
            Map<String, Object> entry = new LinkedHashMap<>();
            entry.put("name", e.getKey());
            entry.put("type", type.code());
            entry.put("count", (long) Array.getLength(e.getValue()));
            entry.put("crc32", sums.crc32());
            entry.put("sha256", sums.sha256());
            entries.add(entry);
            crcs.put(e.getKey(), sums.crc32());
        }
        full.put("entries", entries);
        byte[] manifestBytes = (JsonText.write(full) + "\n").getBytes(StandardCharsets.UTF_8);
        byte[] digestBytes = (sha256(manifestBytes) + "\n").getBytes(StandardCharsets.US_ASCII);
        SafeOutput.write(target, force, inputs, out -> {
            ZipOutputStream zip = new ZipOutputStream(out, StandardCharsets.UTF_8);
            putStored(zip, MANIFEST, manifestBytes);
            putStored(zip, MANIFEST_DIGEST, digestBytes);
            for (Map.Entry<String, Object> e : arrays.entrySet()) {
                Object a = e.getValue();
                ElementType type = typeOf(a);
                long size = (long) Array.getLength(a) * type.width();
                startStored(zip, entryName(e.getKey(), type), size, crcs.get(e.getKey()));
                pieces.forEachPiece(a, (b, n) -> zip.write(b, 0, n));
                zip.closeEntry();
            }
            zip.finish();
        });
    }

    /**
     * Reads a model file with every array its manifest lists, each with its listed count; for tools
     * that read an archive without knowing what it holds. {@link ModelFile} reads only what it needs.
     *
     * @throws NearfitException naming the file when it is missing, not a model, damaged, truncated
     *                          or of an unknown major version
     */
    public static Contents read(Path path) {
        try (Opened a = open(path)) {
            List<Need> all = new ArrayList<>();
            for (Listed l : a.listed().values()) {
                all.add(new Need(l.name(), l.type(), (int) l.count()));
            }
            return a.read(all);
        }
    }

    /**
     * Opens a model file and reads and checks its manifest: CRC-32, the digest beside it (format 1.1
     * and later), format name, major version and the entries list.
     *
     * @throws NearfitException naming the file when it is missing, not a model, damaged or of an
     *                          unknown major version
     */
    public static Opened open(Path path) {
        String name = path.toString();
        if (Files.isDirectory(path)) {
            throw NearfitException.inFile(name, "is a folder, not a model file");
        }
        ZipFile zip = null;
        try {
            long fileSize = Files.size(path);
            zip = openZip(path);
            Opened opened = new Opened(name, zip, fileSize);
            opened.readManifest();
            return opened;
        } catch (NoSuchFileException | java.io.FileNotFoundException e) {
            throw NearfitException.inFile(name, "no such file");
        } catch (IOException | RuntimeException e) {
            closeQuietly(zip);
            throw failure(name, e);
        }
    }

    /**
     * The ZIP reader takes a {@link java.io.File}, whose name is a string in the locale's encoding: under
     * {@code LC_ALL=C} (cron) a name with other bytes cannot be spelled, though the {@link Path} (made from the
     * argument's bytes) opens. Such a file is opened through a symbolic link with a plain name in the temporary
     * folder, removed as soon as the file is open (the reader keeps its descriptor).
     */
    private static ZipFile openZip(Path path) throws IOException {
        java.io.File file = path.toFile();
        try {
            if (file.toPath().equals(path)) {
                return new ZipFile(file, StandardCharsets.UTF_8);
            }
        } catch (java.nio.file.InvalidPathException e) {
            // the name's bytes are not in the locale's encoding: through a link below
        }
        Path link = Files.createTempFile("nearfit-model-", ".nfm");
        try {
            Files.delete(link);
            Files.createSymbolicLink(link, path.toAbsolutePath());
            return new ZipFile(link.toFile(), StandardCharsets.UTF_8);
        } finally {
            Files.deleteIfExists(link);
        }
    }

    /** An open model file whose manifest has been checked; reads the arrays asked for, each once. */
    public static final class Opened implements AutoCloseable {
        private final String name;
        private final ZipFile zip;
        private final long fileSize;
        private Map<String, Object> manifest;
        private final Map<String, Listed> listed = new LinkedHashMap<>();

        private Opened(String name, ZipFile zip, long fileSize) {
            this.name = name;
            this.zip = zip;
            this.fileSize = fileSize;
        }

        /** The file as the user named it. */
        public String fileName() {
            return name;
        }

        /** The parsed manifest (format, format_version and entries included), as {@link JsonText#parse} gives it. */
        public Map<String, Object> manifest() {
            return manifest;
        }

        /** The arrays the manifest lists, by name, in its order. */
        public Map<String, Listed> listed() {
            return java.util.Collections.unmodifiableMap(listed);
        }

        /**
         * Reads the arrays asked for (names distinct), each checked against the manifest's type and
         * count, the ZIP entry's size, and its CRC-32 and SHA-256; other entries are not touched.
         *
         * @throws NearfitException naming the file when an array is missing, of another type or
         *                          count, damaged or truncated
         */
        public Contents read(List<Need> needs) {
            Map<String, Object> arrays = new LinkedHashMap<>();
            long storedBytes = 0;
            try {
                for (Need need : needs) {
                    if (arrays.containsKey(need.name())) {
                        throw new IllegalArgumentException("array " + need.name() + " asked for twice");
                    }
                    ZipEntry entry = zip.getEntry(entryName(need.name(), need.type()));
                    // Stored arrays are allocated whole, so together they must fit in the file: entries
                    // whose headers all point at the same bytes cannot multiply the allocation.
                    storedBytes += entry != null && entry.getMethod() == ZipEntry.STORED ? entry.getCompressedSize() : 0;
                    if (storedBytes > fileSize) {
                        throw NearfitException.inFile(name, "is damaged: its entries claim more bytes than the file's "
                                + fileSize);
                    }
                    arrays.put(need.name(), readArray(need));
                }
            } catch (IOException e) {
                throw failure(name, e);
            }
            return new Contents(manifest, arrays);
        }

        @Override
        public void close() {
            closeQuietly(zip);
        }

        private void readManifest() throws IOException {
            ZipEntry entry = zip.getEntry(MANIFEST);
            if (entry == null) {
                throw NearfitException.inFile(name, "is a ZIP file but not a nearfit model (no " + MANIFEST + ")");
            }
            byte[] b = readChecked(entry, MAX_MANIFEST_BYTES);
            ZipEntry digestEntry = zip.getEntry(MANIFEST_DIGEST);
            if (digestEntry != null) {
                String recorded = new String(readChecked(digestEntry, MAX_DIGEST_BYTES), StandardCharsets.US_ASCII).trim();
                if (!recorded.equals(sha256(b))) {
                    throw NearfitException.inFile(name, "is damaged: " + MANIFEST + " does not match the SHA-256 in "
                            + MANIFEST_DIGEST);
                }
            }
            Object parsed;
            try {
                parsed = JsonText.parse(new String(b, StandardCharsets.UTF_8));
            } catch (IllegalArgumentException e) {
                throw NearfitException.inFile(name, "damaged manifest: " + e.getMessage());
            }
            if (!(parsed instanceof Map<?, ?> object) || !FORMAT_NAME.equals(object.get("format"))) {
                throw NearfitException.inFile(name, "is not a nearfit model (its manifest names another format)");
            }
            @SuppressWarnings("unchecked")
            Map<String, Object> m = (Map<String, Object>) object;
            int minor = checkVersion(m.get("format_version"), name);
            boolean digests = minor >= 1;
            if (digests && digestEntry == null) {
                throw NearfitException.inFile(name, "is damaged: " + MANIFEST_DIGEST + " is missing (a model file of "
                        + "format " + FORMAT_MAJOR + ".1 or later has one)");
            }
            for (Object o : listOf(m.get("entries"), name)) {
                Listed l = listedOf(o, digests);
                if (listed.put(l.name(), l) != null) {
                    throw NearfitException.inFile(name, "damaged manifest: entry " + l.name() + " is listed twice");
                }
            }
            manifest = m;
        }

        private Listed listedOf(Object entry, boolean digests) {
            if (!(entry instanceof Map<?, ?> m)) {
                throw NearfitException.inFile(name, "damaged manifest: an entry is not an object");
            }
            String arrayName = m.get("name") instanceof String s ? s : null;
            if (arrayName == null || !ARRAY_NAME.matcher(arrayName).matches()) {
                throw NearfitException.inFile(name, "damaged manifest: an entry has no valid name");
            }
            String code = m.get("type") instanceof String s ? s : null;
            ElementType type = code != null ? ElementType.ofCode(code) : null;
            if (type == null) {
                throw bad(arrayName, "type", "is not f64, i32 or i64");
            }
            long count = wholeIn(m.get("count"), MAX_ENTRY_BYTES / type.width(), arrayName, "count");
            long crc = wholeIn(m.get("crc32"), 0xFFFF_FFFFL, arrayName, "crc32");
            Object sha = m.get("sha256");
            boolean given = sha != null;
            if ((given || digests) && !(sha instanceof String hex && SHA256_HEX.matcher(hex).matches())) {
                throw bad(arrayName, "sha256", "is not 64 lower-case hex digits");
            }
            return new Listed(arrayName, type, count, crc, given ? (String) sha : null);
        }

        private long wholeIn(Object v, long max, String arrayName, String field) {
            if (!(v instanceof java.math.BigDecimal d) || d.signum() != 0 && d.stripTrailingZeros().scale() > 0
                    || d.signum() < 0 || d.compareTo(java.math.BigDecimal.valueOf(max)) > 0) {
                throw bad(arrayName, field, "is not a whole number from 0 to " + max);
            }
            return d.longValueExact();
        }

        private NearfitException bad(String arrayName, String field, String what) {
            return NearfitException.inFile(name, "damaged manifest: entry " + arrayName + ": \"" + field + "\" " + what);
        }

        private Object readArray(Need need) throws IOException {
            Listed l = listed.get(need.name());
            if (l == null) {
                throw NearfitException.inFile(name, "is damaged: its manifest lists no entry " + need.name());
            }
            if (l.type() != need.type() || l.count() != need.count()) {
                throw NearfitException.inFile(name, "is damaged: entry " + l.name() + " is listed as " + l.count()
                        + " " + l.type().code() + " values, the model needs " + need.count() + " "
                        + need.type().code() + " values");
            }
            long expected = l.count() * l.type().width();
            ZipEntry entry = zip.getEntry(entryName(l.name(), l.type()));
            if (entry == null) {
                throw NearfitException.inFile(name, "is damaged: entry " + l.name() + " is missing");
            }
            boolean stored = entry.getMethod() == ZipEntry.STORED;
            if (entry.getSize() != expected || (stored && (entry.getCompressedSize() != expected
                    || expected > fileSize))) {
                throw NearfitException.inFile(name, "is damaged: entry " + l.name() + " has " + entry.getSize()
                        + " bytes, the manifest says " + expected);
            }
            CRC32 crc = new CRC32();
            MessageDigest sha = ArrayBytes.Sums.newSha256();
            long[] read = new long[1];
            Object array;
            try (InputStream in = zip.getInputStream(entry)) {
                array = new ArrayBytes().read(in, l.type(), need.count(), !stored, crc, sha, read);
                if (array != null && in.read() != -1) {
                    throw NearfitException.inFile(name, "is damaged: entry " + entry.getName() + " is larger than allowed");
                }
            }
            if (array == null) {
                throw NearfitException.inFile(name, "is truncated: entry " + l.name() + " has " + read[0]
                        + " bytes, the manifest says " + expected);
            }
            if (crc.getValue() != l.crc32()) {
                throw NearfitException.inFile(name, "is damaged: entry " + l.name() + " fails its CRC-32 check");
            }
            if (l.sha256() != null && !l.sha256().equals(ArrayBytes.Sums.hex(sha.digest()))) {
                throw NearfitException.inFile(name, "is damaged: entry " + l.name() + " fails its SHA-256 check");
            }
            return array;
        }

        /** Reads a small entry whole, capped, and checks it against the CRC-32 the ZIP records for it. */
        private byte[] readChecked(ZipEntry entry, long cap) throws IOException {
            if (entry.getSize() > cap) {
                throw NearfitException.inFile(name, "is damaged: entry " + entry.getName() + " is larger than allowed");
            }
            byte[] b;
            try (InputStream in = zip.getInputStream(entry)) {
                b = in.readNBytes((int) cap);
                if (in.read() != -1) {
                    throw NearfitException.inFile(name, "is damaged: entry " + entry.getName() + " is larger than allowed");
                }
            }
            CRC32 crc = new CRC32();
            crc.update(b);
            if (entry.getCrc() != crc.getValue()) {
                throw NearfitException.inFile(name, "is damaged: entry " + entry.getName() + " fails its CRC-32 check");
            }
            return b;
        }
    }

    /** The one-line error for a failure while reading the archive. */
    private static NearfitException failure(String name, Exception e) {
        if (e instanceof NearfitException ne) {
            return ne;
        } else if (e instanceof ZipException) {
            return NearfitException.inFile(name, "is not a nearfit model file, or it is damaged or truncated ("
                    + e.getMessage() + ")", e);
        } else if (e instanceof java.io.EOFException) {
            return NearfitException.inFile(name, "is truncated (" + e.getMessage() + ")", e);
        } else if (e instanceof IOException) {
            return NearfitException.inFile(name, "cannot read: " + e.getMessage(), e);
        } else if (e instanceof RuntimeException re) {
            throw re;
        }
        throw new IllegalStateException(e);
    }

    private static void closeQuietly(ZipFile zip) {
        if (zip != null) {
            try {
                zip.close();
            } catch (IOException ignored) {
                // reading is over; a failed close of a read-only file loses nothing
            }
        }
    }

    /** The major.minor version as "1" or "1.1"; returns the minor (0 when absent). */
    private static int checkVersion(Object version, String name) {
        String v = version instanceof String s ? s : JsonText.write(version);
        java.util.regex.Matcher m = java.util.regex.Pattern.compile("(\\d{1,6})(?:\\.(\\d{1,6}))?").matcher(v);
        if (!(version instanceof String) || !m.matches()) {
            throw NearfitException.inFile(name, "damaged manifest: format_version \"" + v + "\"");
        }
        if (Integer.parseInt(m.group(1)) != FORMAT_MAJOR) {
            throw NearfitException.inFile(name, "is a model file of format version " + v
                    + "; this build reads version " + FORMAT_MAJOR + ".x");
        }
        return m.group(2) == null ? 0 : Integer.parseInt(m.group(2));
    }

    private static String sha256(byte[] b) {
        return ArrayBytes.Sums.hex(ArrayBytes.Sums.newSha256().digest(b));
    }

    private static ArrayBytes.Sums sumsOf(ArrayBytes pieces, Object array) {
        try {
            return pieces.sums(array);
        } catch (IOException e) {
            throw new UncheckedIOException(e); // no I/O: the sink only updates checksums
        }
    }

    private static List<?> listOf(Object o, String name) {
        if (!(o instanceof List<?> list)) {
            throw NearfitException.inFile(name, "damaged manifest: no entries list");
        }
        return list;
    }

    private static void putStored(ZipOutputStream zip, String entryName, byte[] b) throws IOException {
        CRC32 crc = new CRC32();
        crc.update(b);
        startStored(zip, entryName, b.length, crc.getValue());
        zip.write(b);
        zip.closeEntry();
    }

    /** Starts a stored (uncompressed) entry of known size and CRC; the caller writes it and closes it. */
    private static void startStored(ZipOutputStream zip, String entryName, long size, long crc) throws IOException {
        ZipEntry e = new ZipEntry(entryName);
        e.setMethod(ZipEntry.STORED);
        e.setSize(size);
        e.setCompressedSize(size);
        e.setCrc(crc);
        e.setTime(0L);
        zip.putNextEntry(e);
    }

    private static String entryName(String arrayName, ElementType type) {
        return "data/" + arrayName + "." + type.code();
    }

    private static ElementType typeOf(Object a) {
        if (a instanceof double[]) {
            return ElementType.F64;
        } else if (a instanceof int[]) {
            return ElementType.I32;
        } else if (a instanceof long[]) {
            return ElementType.I64;
        }
        throw new IllegalArgumentException("arrays are double[], int[] or long[], not " + a.getClass());
    }
}
