package nearfit.model;

import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.function.Consumer;
import java.util.zip.CRC32;
import java.util.zip.ZipEntry;
import java.util.zip.ZipInputStream;
import java.util.zip.ZipOutputStream;

/**
 * Edits of a model file's bytes for the tests of damaged and hostile models: a casual edit (bytes
 * changed in place, CRC-32 fixed up or not) and a deliberate one (the archive rewritten with its
 * manifest changed and every checksum and digest recomputed, as someone with the tools would).
 */
public final class ModelEdits {
    private ModelEdits() {
    }

    /** The entries of a model file in order: name to uncompressed bytes. */
    public static Map<String, byte[]> entries(byte[] zip) {
        Map<String, byte[]> out = new LinkedHashMap<>();
        try (ZipInputStream in = new ZipInputStream(new ByteArrayInputStream(zip))) {
            for (ZipEntry e = in.getNextEntry(); e != null; e = in.getNextEntry()) {
                out.put(e.getName(), in.readAllBytes());
            }
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return out;
    }

    /** The manifest as parsed JSON (mutable maps and lists). */
    @SuppressWarnings("unchecked")
    public static Map<String, Object> manifest(byte[] zip) {
        return (Map<String, Object>) JsonTrees.parse(new String(entries(zip).get(ModelArchive.MANIFEST),
                StandardCharsets.UTF_8));
    }

    /**
     * The model file with its manifest changed by {@code edit} and rewritten with fresh CRC-32s and
     * a fresh manifest digest: what a deliberate editor produces. Entries stay stored, in order.
     */
    public static byte[] withManifest(byte[] zip, Consumer<Map<String, Object>> edit) {
        Map<String, Object> m = manifest(zip);
        edit.accept(m);
        Map<String, byte[]> entries = entries(zip);
        byte[] manifest = (JsonTrees.write(m) + "\n").getBytes(StandardCharsets.UTF_8);
        entries.put(ModelArchive.MANIFEST, manifest);
        entries.put(ModelArchive.MANIFEST_DIGEST, (sha256(manifest) + "\n").getBytes(StandardCharsets.US_ASCII));
        return stored(entries);
    }

    /**
     * The model file with the bytes of data entry {@code array} (as named in the manifest) replaced,
     * its CRC-32 and SHA-256 in the manifest and the manifest's digest all recomputed.
     */
    public static byte[] withArrayBytes(byte[] zip, String array, byte[] bytes) {
        return withArrayBytes(zip, array, bytes, true);
    }

    /** As {@link #withArrayBytes(byte[], String, byte[])}; without {@code fixSha} only the CRC-32 is fixed up. */
    public static byte[] withArrayBytes(byte[] zip, String array, byte[] bytes, boolean fixSha) {
        Map<String, byte[]> entries = entries(zip);
        String entryName = null;
        for (String n : entries.keySet()) {
            if (n.startsWith("data/" + array + ".")) {
                entryName = n;
            }
        }
        if (entryName == null) {
            throw new AssertionError("no entry " + array);
        }
        entries.put(entryName, bytes);
        Map<String, Object> m = manifest(zip);
        for (Object o : (List<?>) m.get("entries")) {
            @SuppressWarnings("unchecked")
            Map<String, Object> e = (Map<String, Object>) o;
            if (array.equals(e.get("name"))) {
                CRC32 crc = new CRC32();
                crc.update(bytes);
                e.put("crc32", crc.getValue());
                if (fixSha) {
                    e.put("sha256", sha256(bytes));
                }
            }
        }
        byte[] manifest = (JsonTrees.write(m) + "\n").getBytes(StandardCharsets.UTF_8);
        entries.put(ModelArchive.MANIFEST, manifest);
        entries.put(ModelArchive.MANIFEST_DIGEST, (sha256(manifest) + "\n").getBytes(StandardCharsets.US_ASCII));
        return stored(entries);
    }

    /** Writes the entries as a ZIP of stored entries, in order. */
    public static byte[] stored(Map<String, byte[]> entries) {
        ByteArrayOutputStream bytes = new ByteArrayOutputStream();
        try (ZipOutputStream z = new ZipOutputStream(bytes, StandardCharsets.UTF_8)) {
            for (Map.Entry<String, byte[]> e : entries.entrySet()) {
                ZipEntry ze = new ZipEntry(e.getKey());
                ze.setMethod(ZipEntry.STORED);
                ze.setSize(e.getValue().length);
                ze.setCompressedSize(e.getValue().length);
                CRC32 crc = new CRC32();
                crc.update(e.getValue());
                ze.setCrc(crc.getValue());
                z.putNextEntry(ze);
                z.write(e.getValue());
                z.closeEntry();
            }
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return bytes.toByteArray();
    }

    /**
     * The same bytes with the manifest's text {@code from} replaced in place by {@code to} (same
     * length), and, when {@code fixCrc}, the manifest's CRC-32 in its local and central headers
     * recomputed, so only the manifest digest can tell.
     */
    public static byte[] editManifestInPlace(byte[] zip, String from, String to, boolean fixCrc) {
        if (from.length() != to.length()) {
            throw new IllegalArgumentException("an in-place edit keeps the length");
        }
        byte[] b = zip.clone();
        byte[] manifest = entries(zip).get(ModelArchive.MANIFEST);
        int start = Bytes.indexOf(b, manifest);
        int at = Bytes.indexOf(manifest, from.getBytes(StandardCharsets.UTF_8));
        byte[] replacement = to.getBytes(StandardCharsets.UTF_8);
        System.arraycopy(replacement, 0, b, start + at, replacement.length);
        if (fixCrc) {
            CRC32 crc = new CRC32();
            crc.update(b, start, manifest.length);
            int value = (int) crc.getValue();
            byte[] name = ModelArchive.MANIFEST.getBytes(StandardCharsets.UTF_8);
            for (int p = 0; p + 46 < b.length; p++) {
                if (le32(b, p) == 0x04034b50 && matches(b, p + 30, name)) {
                    put32(b, p + 14, value); // local file header: CRC-32 at offset 14
                } else if (le32(b, p) == 0x02014b50 && matches(b, p + 46, name)) {
                    put32(b, p + 16, value); // central directory header: CRC-32 at offset 16
                }
            }
        }
        return b;
    }

    /** A ZIP entry of {@code size} zero bytes, deflated (about a thousandth of its size on disk). */
    public static byte[] withDeflatedZeros(byte[] zip, String entryName, long size) {
        Map<String, byte[]> entries = entries(zip);
        ByteArrayOutputStream bytes = new ByteArrayOutputStream();
        try (ZipOutputStream z = new ZipOutputStream(bytes, StandardCharsets.UTF_8)) {
            for (Map.Entry<String, byte[]> e : entries.entrySet()) {
                ZipEntry ze = new ZipEntry(e.getKey());
                ze.setMethod(ZipEntry.STORED);
                ze.setSize(e.getValue().length);
                ze.setCompressedSize(e.getValue().length);
                CRC32 crc = new CRC32();
                crc.update(e.getValue());
                ze.setCrc(crc.getValue());
                z.putNextEntry(ze);
                z.write(e.getValue());
                z.closeEntry();
            }
            z.putNextEntry(new ZipEntry(entryName));
            byte[] zeros = new byte[1 << 16];
            for (long left = size; left > 0; left -= zeros.length) {
                z.write(zeros, 0, (int) Math.min(left, zeros.length));
            }
            z.closeEntry();
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return bytes.toByteArray();
    }

    /** SHA-256 in lower-case hex. */
    public static String sha256(byte[] b) {
        try {
            return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(b));
        } catch (NoSuchAlgorithmException e) {
            throw new AssertionError(e);
        }
    }

    /** The leaf paths of a manifest ("k", "scaling.spread[0]", "entries[2].count"), in document order. */
    public static List<String> leafPaths(Object node, String path) {
        List<String> out = new ArrayList<>();
        if (node instanceof Map<?, ?> m) {
            for (Map.Entry<?, ?> e : m.entrySet()) {
                out.addAll(leafPaths(e.getValue(), path.isEmpty() ? String.valueOf(e.getKey()) : path + "." + e.getKey()));
            }
        } else if (node instanceof List<?> l) {
            for (int i = 0; i < l.size(); i++) {
                out.addAll(leafPaths(l.get(i), path + "[" + i + "]"));
            }
        } else {
            out.add(path);
        }
        return out;
    }

    /** Sets the value at a leaf path made by {@link #leafPaths}. */
    @SuppressWarnings("unchecked")
    public static void set(Map<String, Object> manifest, String path, Object value) {
        Object parent = manifest;
        String[] parts = path.split("\\.");
        for (int p = 0; p < parts.length; p++) {
            String part = parts[p];
            int bracket = part.indexOf('[');
            String key = bracket < 0 ? part : part.substring(0, bracket);
            List<Integer> indexes = new ArrayList<>();
            for (int i = bracket; i >= 0; i = part.indexOf('[', i + 1)) {
                indexes.add(Integer.parseInt(part.substring(i + 1, part.indexOf(']', i))));
            }
            boolean last = p == parts.length - 1;
            Map<String, Object> map = (Map<String, Object>) parent;
            if (indexes.isEmpty()) {
                if (last) {
                    map.put(key, value);
                    return;
                }
                parent = map.get(key);
                continue;
            }
            Object node = map.get(key);
            for (int i = 0; i < indexes.size(); i++) {
                List<Object> list = (List<Object>) node;
                if (last && i == indexes.size() - 1) {
                    list.set(indexes.get(i), value);
                    return;
                }
                node = list.get(indexes.get(i));
            }
            parent = node;
        }
    }

    private static int le32(byte[] b, int p) {
        return (b[p] & 0xff) | (b[p + 1] & 0xff) << 8 | (b[p + 2] & 0xff) << 16 | (b[p + 3] & 0xff) << 24;
    }

    private static void put32(byte[] b, int p, int v) {
        for (int i = 0; i < 4; i++) {
            b[p + i] = (byte) (v >>> (8 * i));
        }
    }

    private static boolean matches(byte[] b, int p, byte[] name) {
        if (p + name.length > b.length) {
            return false;
        }
        for (int i = 0; i < name.length; i++) {
            if (b[p + i] != name[i]) {
                return false;
            }
        }
        return true;
    }
}
