package nearfit.model;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTimeoutPreemptively;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;

import nearfit.knn.Estimates;
import nearfit.table.NearfitException;

/**
 * Random damage to a real small model file, and what must follow: a {@link NearfitException} of one
 * line naming the file, or a correct result, within a time bound. Four kinds, each drawn from a seed:
 * <ul>
 * <li>byte edits of the file as it is (1 to 4 bytes changed, or the file cut short): every accepted
 *     file must give exactly the original estimates, since the checksums let no change of meaning
 *     through;</li>
 * <li>field edits of the manifest (a value replaced by one from a list of hostile values, or a field
 *     removed), rewritten with every checksum and digest recomputed, as a deliberate editor would:
 *     an accepted file must give estimates that are missing or inside the range of its usable stored
 *     responses (a weighted mean or a quantile of neighbours' responses, with weights of 0 or more,
 *     lies within their range: common practice);</li>
 * <li>1 to 3 bytes of the manifest's text changed, its CRC-32 and digest recomputed: the same range
 *     rule;</li>
 * <li>byte edits of one array, its checksums recomputed: the same range rule.</li>
 * </ul>
 */
final class ModelMutations {
    /** The bound of one load and estimate; a small model takes milliseconds, a spin forever. */
    static final Duration BOUND = Duration.ofSeconds(30);

    private static final Object[] HOSTILE = {0.0, -0.0, -1.0, 1.0, 2.0, 0.5, 1e-320, 2.5e-308, 1e308, -1e308,
        4294967306.0, 2147483648.0, 1e15, 119.0, 120.0, 121.0, 7.0, null, "", "x", "z", "none", "mahalanobis",
        "reference", "1.0", "2.0", true, List.of(), Map.of(), List.of(0.0)};

    /** How one trial ended. */
    enum Ending {
        REFUSED, SAME_ESTIMATES, ESTIMATES_IN_RANGE
    }

    /**
     * One trial.
     *
     * @param edit   what was done to the file, for the report
     * @param ending how it ended
     * @param detail the refusal without the file name, or empty
     */
    record Trial(String edit, Ending ending, String detail) {
    }

    private final byte[] original;
    private final Estimates expected;
    private final List<String> leaves;
    private final Path dir;

    ModelMutations(byte[] original, Path dir) {
        this.original = original;
        this.dir = dir;
        this.expected = SmallModel.estimates(write("original.nfm", original));
        this.leaves = ModelEdits.leafPaths(ModelEdits.manifest(original), "");
    }

    /** One trial drawn from the seed; asserts its ending (fails the test otherwise). */
    Trial run(long seed) {
        SplittableRandom r = new SplittableRandom(seed);
        int kind = r.nextInt(4);
        StringBuilder edit = new StringBuilder();
        byte[] damaged = switch (kind) {
            case 0 -> byteEdits(r, edit);
            case 1 -> fieldEdit(r, edit);
            case 2 -> manifestTextEdit(r, edit);
            default -> arrayEdit(r, edit);
        };
        Path p = write("mutated-" + seed + ".nfm", damaged);
        try {
            return outcome(p, kind == 0, edit.toString());
        } finally {
            try {
                Files.deleteIfExists(p);
            } catch (IOException e) {
                throw new UncheckedIOException(e);
            }
        }
    }

    private byte[] byteEdits(SplittableRandom r, StringBuilder edit) {
        byte[] b = original.clone();
        if (r.nextInt(8) == 0) {
            int length = r.nextInt(b.length);
            edit.append("cut to ").append(length).append(" bytes");
            return java.util.Arrays.copyOf(b, length);
        }
        int n = 1 + r.nextInt(4);
        for (int i = 0; i < n; i++) {
            int at = r.nextInt(b.length);
            byte value = (byte) r.nextInt(256);
            edit.append(i == 0 ? "bytes " : ", ").append(at).append('=').append(value & 0xff);
            b[at] = value;
        }
        return b;
    }

    private byte[] fieldEdit(SplittableRandom r, StringBuilder edit) {
        String path = leaves.get(r.nextInt(leaves.size()));
        Object value = HOSTILE[r.nextInt(HOSTILE.length)];
        boolean remove = r.nextInt(10) == 0 && !path.endsWith("]");
        edit.append(remove ? "remove " + path : path + " = " + JsonTrees.write(value));
        return ModelEdits.withManifest(original, m -> {
            if (remove) {
                removeLeaf(m, path);
            } else {
                ModelEdits.set(m, path, value instanceof List<?> l ? new ArrayList<>(l) : value);
            }
        });
    }

    private static void removeLeaf(Map<String, Object> m, String path) {
        int dot = path.lastIndexOf('.');
        if (dot < 0) {
            m.remove(path);
            return;
        }
        // set the parent's key to a marker, then drop it: reuse set() to reach the parent
        ModelEdits.set(m, path, REMOVED);
        dropMarker(m);
    }

    private static final Object REMOVED = new Object();

    private static void dropMarker(Object node) {
        if (node instanceof Map<?, ?> map) {
            map.values().removeIf(v -> v == REMOVED);
            map.values().forEach(ModelMutations::dropMarker);
        } else if (node instanceof List<?> list) {
            list.forEach(ModelMutations::dropMarker);
        }
    }

    /** 1 to 3 bytes of the manifest's text changed, its CRC-32 and digest recomputed: the parser's turn. */
    private byte[] manifestTextEdit(SplittableRandom r, StringBuilder edit) {
        Map<String, byte[]> entries = ModelEdits.entries(original);
        byte[] text = entries.get(ModelArchive.MANIFEST).clone();
        int n = 1 + r.nextInt(3);
        edit.append("manifest text");
        for (int i = 0; i < n; i++) {
            int at = r.nextInt(text.length);
            // mostly characters that keep JSON almost valid, sometimes any byte
            String likely = "0123456789-.eE,:[]{}\"n ";
            text[at] = r.nextInt(4) == 0 ? (byte) r.nextInt(256) : (byte) likely.charAt(r.nextInt(likely.length()));
            edit.append(i == 0 ? " byte " : ", ").append(at).append('=').append(text[at] & 0xff);
        }
        entries.put(ModelArchive.MANIFEST, text);
        entries.put(ModelArchive.MANIFEST_DIGEST,
                (ModelEdits.sha256(text) + "\n").getBytes(java.nio.charset.StandardCharsets.US_ASCII));
        return ModelEdits.stored(entries);
    }

    private byte[] arrayEdit(SplittableRandom r, StringBuilder edit) {
        Map<String, byte[]> entries = ModelEdits.entries(original);
        List<String> arrays = new ArrayList<>();
        for (String name : entries.keySet()) {
            if (name.startsWith("data/")) {
                arrays.add(name);
            }
        }
        String entry = arrays.get(r.nextInt(arrays.size()));
        byte[] b = entries.get(entry).clone();
        int at = r.nextInt(b.length);
        b[at] = (byte) r.nextInt(256);
        String array = entry.substring(5, entry.lastIndexOf('.'));
        edit.append(array).append(" byte ").append(at).append('=').append(b[at] & 0xff);
        return ModelEdits.withArrayBytes(original, array, b);
    }

    private Trial outcome(Path p, boolean sameMeaning, String edit) {
        Object result = assertTimeoutPreemptively(BOUND, () -> {
            try {
                return SmallModel.estimates(p);
            } catch (NearfitException e) {
                return e;
            }
        }, () -> edit + ": no end within " + BOUND);
        if (result instanceof NearfitException e) {
            String message = e.getMessage();
            assertEquals(1, message.lines().count(), () -> edit + ": " + message);
            assertTrue(message.startsWith(p + ": "), () -> edit + ": " + message);
            return new Trial(edit, Ending.REFUSED, message.substring(p.toString().length() + 2));
        }
        Estimates got = (Estimates) result;
        if (sameMeaning) {
            assertArrayEquals(expected.fit(), got.fit(), edit);
            assertArrayEquals(expected.bandLow(), got.bandLow(), edit);
            assertArrayEquals(expected.bandHigh(), got.bandHigh(), edit);
            return new Trial(edit, Ending.SAME_ESTIMATES, "");
        }
        double[] y = ModelFile.read(p).rows().response();
        double[] range = {Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY};
        for (double v : y) {
            if (!Double.isNaN(v)) {
                range[0] = Math.min(range[0], v);
                range[1] = Math.max(range[1], v);
            }
        }
        double lo = range[0];
        double hi = range[1];
        for (double[] a : new double[][] {got.fit(), got.bandLow(), got.bandHigh()}) {
            for (double v : a) {
                double value = v;
                assertTrue(Double.isNaN(value) || (value >= lo && value <= hi),
                        () -> edit + ": estimate " + value + " outside the responses' range " + lo + " to " + hi);
            }
        }
        return new Trial(edit, Ending.ESTIMATES_IN_RANGE, "");
    }

    private Path write(String name, byte[] b) {
        try {
            Path p = dir.resolve(name);
            Files.write(p, b);
            return p;
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
