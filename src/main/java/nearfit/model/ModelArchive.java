package nearfit.model;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.lang.reflect.Array;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
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
 * The container of a model file: a ZIP archive (PKWARE APPNOTE) holding {@code manifest.json} and
 * named arrays as little-endian binary entries, stored uncompressed so that loading runs at the speed
 * of reading the file.
 *
 * <p>The manifest's {@code "entries"} list records each array's name, element type ({@code f64},
 * {@code i32}, {@code i64}), element count and CRC-32. Reading checks the format name and major
 * version, each entry's size against its count and its CRC against the manifest, and reads no entry
 * larger than the manifest declares, so a damaged or hostile file cannot make it allocate without
 * bound. No Java serialization is involved.
 */
public final class ModelArchive {
    /** The manifest's {@code "format"} value. */
    public static final String FORMAT_NAME = "nearfit-model";
    /** The major format version this build reads and writes; files of another major are refused. */
    public static final int FORMAT_MAJOR = 1;
    /** The minor format version this build writes; newer minors only add manifest fields. */
    public static final int FORMAT_MINOR = 0;
    /** The name of the manifest entry. */
    public static final String MANIFEST = "manifest.json";

    private static final long MAX_MANIFEST_BYTES = 16L << 20;
    private static final long MAX_ENTRY_BYTES = Integer.MAX_VALUE - 16L;

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
     * @param manifest the manifest's fields; {@code format}, {@code format_version} and {@code entries}
     *                 are added here
     * @param arrays   named arrays, each a double[], int[] or long[]
     */
    public static void write(Path target, boolean force, Collection<Path> inputs,
                             Map<String, Object> manifest, Map<String, Object> arrays) {
        Map<String, Object> full = new LinkedHashMap<>();
        full.put("format", FORMAT_NAME);
        full.put("format_version", FORMAT_MAJOR + "." + FORMAT_MINOR);
        full.putAll(manifest);
        List<Object> entries = new ArrayList<>();
        ArrayBytes pieces = new ArrayBytes();
        Map<String, Long> crcs = new LinkedHashMap<>();
        for (Map.Entry<String, Object> e : arrays.entrySet()) {
            ElementType type = typeOf(e.getValue());
            long crc = crcOf(pieces, e.getValue());
            Map<String, Object> entry = new LinkedHashMap<>();
            entry.put("name", e.getKey());
            entry.put("type", type.code());
            entry.put("count", (long) Array.getLength(e.getValue()));
            entry.put("crc32", crc);
            entries.add(entry);
            crcs.put(e.getKey(), crc);
        }
        full.put("entries", entries);
        byte[] manifestBytes = (Json.write(full) + "\n").getBytes(StandardCharsets.UTF_8);
        SafeOutput.write(target, force, inputs, out -> {
            ZipOutputStream zip = new ZipOutputStream(out, StandardCharsets.UTF_8);
            putStored(zip, MANIFEST, manifestBytes);
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
     * Reads a model file, checking format, version, sizes and checksums.
     *
     * @throws NearfitException naming the file when it is missing, not a model, damaged, truncated
     *                          or of an unknown major version
     */
    public static Contents read(Path path) {
        String name = path.toString();
        if (Files.isDirectory(path)) {
            throw NearfitException.inFile(name, "is a folder, not a model file");
        }
        try (ZipFile zip = new ZipFile(path.toFile(), StandardCharsets.UTF_8)) {
            Map<String, Object> manifest = readManifest(zip, name);
            Map<String, Object> arrays = new LinkedHashMap<>();
            for (Object o : listOf(manifest.get("entries"), name)) {
                readEntry(zip, name, o, arrays);
            }
            return new Contents(manifest, arrays);
        } catch (NoSuchFileException | java.io.FileNotFoundException e) {
            throw NearfitException.inFile(name, "no such file");
        } catch (ZipException e) {
            throw NearfitException.inFile(name, "is not a nearfit model file, or it is damaged or truncated ("
                    + e.getMessage() + ")", e);
        } catch (IOException e) {
            throw NearfitException.inFile(name, "cannot read: " + e.getMessage(), e);
        }
    }

    private static Map<String, Object> readManifest(ZipFile zip, String name) throws IOException {
        ZipEntry entry = zip.getEntry(MANIFEST);
        if (entry == null) {
            throw NearfitException.inFile(name, "is a ZIP file but not a nearfit model (no " + MANIFEST + ")");
        }
        byte[] b = readCapped(zip, entry, MAX_MANIFEST_BYTES, name);
        Object parsed;
        try {
            parsed = Json.parse(new String(b, StandardCharsets.UTF_8));
        } catch (IllegalArgumentException e) {
            throw NearfitException.inFile(name, "damaged manifest: " + e.getMessage());
        }
        if (!(parsed instanceof Map<?, ?>) || !FORMAT_NAME.equals(((Map<?, ?>) parsed).get("format"))) {
            throw NearfitException.inFile(name, "is not a nearfit model (its manifest names another format)");
        }
        @SuppressWarnings("unchecked")
        Map<String, Object> manifest = (Map<String, Object>) parsed;
        checkVersion(manifest.get("format_version"), name);
        return manifest;
    }

    private static void checkVersion(Object version, String name) {
        String v = String.valueOf(version);
        int major;
        try {
            major = Integer.parseInt(v.contains(".") ? v.substring(0, v.indexOf('.')) : v);
        } catch (NumberFormatException e) {
            throw NearfitException.inFile(name, "damaged manifest: format_version \"" + v + "\"");
        }
        if (major != FORMAT_MAJOR) {
            throw NearfitException.inFile(name, "is a model file of format version " + v
                    + "; this build reads version " + FORMAT_MAJOR + ".x");
        }
    }

    private static void readEntry(ZipFile zip, String name, Object o, Map<String, Object> arrays)
            throws IOException {
        if (!(o instanceof Map<?, ?> m)) {
            throw NearfitException.inFile(name, "damaged manifest: an entry is not an object");
        }
        String arrayName = String.valueOf(m.get("name"));
        ElementType type = ElementType.ofCode(String.valueOf(m.get("type")));
        if (type == null || !(m.get("count") instanceof Double count) || !(m.get("crc32") instanceof Double crc)) {
            throw NearfitException.inFile(name, "damaged manifest: entry " + arrayName);
        }
        long expected = (long) (double) count * type.width();
        ZipEntry entry = zip.getEntry(entryName(arrayName, type));
        if (entry == null) {
            throw NearfitException.inFile(name, "is damaged: entry " + arrayName + " is missing");
        }
        if (expected > MAX_ENTRY_BYTES || (entry.getSize() >= 0 && entry.getSize() != expected)) {
            throw NearfitException.inFile(name, "is damaged: entry " + arrayName + " has "
                    + entry.getSize() + " bytes, the manifest says " + expected);
        }
        CRC32 c = new CRC32();
        long[] read = new long[1];
        Object array;
        try (InputStream in = zip.getInputStream(entry)) {
            array = new ArrayBytes().read(in, type, (int) (expected / type.width()), c, read);
            if (array != null && in.read() != -1) {
                throw NearfitException.inFile(name, "is damaged: entry " + entry.getName() + " is larger than allowed");
            }
        } catch (ZipException e) {
            throw NearfitException.inFile(name, "is damaged: entry " + entry.getName() + ": " + e.getMessage(), e);
        }
        if (array == null) {
            throw NearfitException.inFile(name, "is truncated: entry " + arrayName + " has " + read[0]
                    + " bytes, the manifest says " + expected);
        }
        if (c.getValue() != (long) (double) crc) {
            throw NearfitException.inFile(name, "is damaged: entry " + arrayName + " fails its CRC-32 check");
        }
        arrays.put(arrayName, array);
    }

    private static long crcOf(ArrayBytes pieces, Object array) {
        try {
            return pieces.crc(array);
        } catch (IOException e) {
            throw new UncheckedIOException(e); // no I/O: the sink only updates a checksum
        }
    }

    private static byte[] readCapped(ZipFile zip, ZipEntry entry, long cap, String name) throws IOException {
        if (entry.getSize() > cap) {
            throw NearfitException.inFile(name, "is damaged: entry " + entry.getName() + " is larger than allowed");
        }
        try (InputStream in = zip.getInputStream(entry)) {
            byte[] b = in.readNBytes((int) Math.min(cap, MAX_ENTRY_BYTES));
            if (in.read() != -1) {
                throw NearfitException.inFile(name, "is damaged: entry " + entry.getName() + " is larger than allowed");
            }
            return b;
        } catch (ZipException e) {
            throw NearfitException.inFile(name, "is damaged: entry " + entry.getName() + ": " + e.getMessage(), e);
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
