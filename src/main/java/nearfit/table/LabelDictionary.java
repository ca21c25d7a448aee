package nearfit.table;

import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * Codes for category labels, looked up straight from the input bytes so a repeated label allocates
 * nothing. Open addressing with linear probing over a power-of-two table, kept at most half full.
 * Codes are numbered 0, 1, ... in order of first appearance.
 */
final class LabelDictionary {
    private int[] table = new int[64]; // code + 1; 0 = empty slot
    private final List<byte[]> byCode = new ArrayList<>();

    /** The code of the label {@code b[s..e)}, adding it when new. */
    int codeOf(byte[] b, int s, int e) {
        int h = hash(b, s, e);
        int mask = table.length - 1;
        for (int i = h & mask;; i = (i + 1) & mask) {
            int slot = table[i];
            if (slot == 0) {
                return add(Arrays.copyOfRange(b, s, e), i);
            }
            byte[] k = byCode.get(slot - 1);
            if (Arrays.equals(k, 0, k.length, b, s, e)) {
                return slot - 1;
            }
        }
    }

    /** The code of {@code label}, adding it when new. */
    int codeOf(String label) {
        byte[] b = label.getBytes(StandardCharsets.UTF_8);
        return codeOf(b, 0, b.length);
    }

    private int add(byte[] key, int slot) {
        int code = byCode.size();
        byCode.add(key);
        table[slot] = code + 1;
        if (byCode.size() * 2 > table.length) {
            rehash();
        }
        return code;
    }

    private void rehash() {
        int[] t = new int[table.length * 2];
        int mask = t.length - 1;
        for (int c = 0; c < byCode.size(); c++) {
            byte[] k = byCode.get(c);
            int i = hash(k, 0, k.length) & mask;
            while (t[i] != 0) {
                i = (i + 1) & mask;
            }
            t[i] = c + 1;
        }
        table = t;
    }

    private static int hash(byte[] b, int s, int e) {
        int h = 1;
        for (int i = s; i < e; i++) {
            h = 31 * h + b[i];
        }
        return h ^ (h >>> 16);
    }

    /** The number of labels. */
    int size() {
        return byCode.size();
    }

    /** The label of {@code code}. */
    String label(int code) {
        return new String(byCode.get(code), StandardCharsets.UTF_8);
    }

    /** All labels in code order. */
    List<String> labels() {
        List<String> out = new ArrayList<>(byCode.size());
        for (int c = 0; c < byCode.size(); c++) {
            out.add(label(c));
        }
        return out;
    }
}
