package nearfit.table;

import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * Decides a file's {@link Layout} from its first block: byte order mark, delimiter, header, names and
 * column types. Types are guessed from a sample of rows; the parsers then confirm them over the whole
 * file, counting every cell that does not fit as bad.
 */
final class Sniffer {
    static final int SAMPLE_ROWS = 2000;
    /** A sampled text column with more distinct labels than this (and than half its cells) is text. */
    static final int CATEGORY_SAMPLE_LABELS = 1000;

    private Sniffer() {
    }

    /**
     * @param head  the first bytes of the input (up to a few MB)
     * @param n     how many bytes of {@code head} are valid
     * @param whole whether {@code head} holds the whole input
     */
    static Layout sniff(String source, byte[] head, int n, boolean whole, LoadOptions options) {
        int bom = n >= 3 && (head[0] & 0xff) == 0xEF && (head[1] & 0xff) == 0xBB && (head[2] & 0xff) == 0xBF ? 3 : 0;
        checkText(source, head, bom, n);
        char delimiter = options.delimiter() != 0 ? options.delimiter() : sniffDelimiter(head, bom, n, whole);
        RowTokenizer tok = new RowTokenizer(delimiter);
        List<String[]> rows = new ArrayList<>();
        List<Integer> ends = new ArrayList<>();
        List<Long> lines = new ArrayList<>();
        long line = 1;
        int p = bom;
        while (rows.size() <= SAMPLE_ROWS) {
            int next = tok.next(head, p, n, whole);
            if (next == RowTokenizer.END || next == RowTokenizer.NEED_MORE) {
                break;
            }
            if (next == RowTokenizer.UNCLOSED_QUOTE) {
                throw NearfitException.atLine(source, line, "the quote opened on this line is never closed");
            }
            if (!(tok.fields() == 1 && !tok.quoted(0) && tok.contentStart(0) == tok.contentEnd(0))) {
                String[] f = new String[tok.fields()];
                for (int i = 0; i < f.length; i++) {
                    f[i] = tok.text(head, i).strip();
                }
                rows.add(f);
                ends.add(next);
                lines.add(line);
            }
            line += tok.newlines();
            p = next;
        }
        if (rows.isEmpty()) {
            if (!whole) {
                throw NearfitException.atLine(source, 1, "line over 1 MB (a quote never closed, or not a CSV file?)");
            }
            throw NearfitException.inFile(source, "empty file: no header and no rows");
        }
        boolean decimalComma = delimiter == ';';
        boolean header = switch (options.header()) {
            case PRESENT -> true;
            case ABSENT -> false;
            case AUTO -> looksLikeHeader(rows, decimalComma);
        };
        if (header && rows.size() == 1 && whole) {
            throw NearfitException.inFile(source, "header only: no data rows");
        }
        int width = rows.get(0).length;
        List<String> renamed = new ArrayList<>();
        List<String> allNames = names(header ? rows.get(0) : null, width, renamed);
        List<String[]> data = header ? rows.subList(1, rows.size()) : rows;
        long dataOffset = header ? ends.get(0) : bom;
        long dataLine = header ? (rows.size() > 1 ? lines.get(1) : line) : lines.get(0);
        if (header && rows.size() == 1) {
            dataOffset = ends.get(0);
        }
        int[] fields = keptFields(source, allNames, options);
        if (options.keepFirstTimeColumn() && !options.keepsAll()) {
            fields = withFirstTime(fields, data, width, decimalComma);
        }
        List<String> names = new ArrayList<>();
        ColumnType[] types = new ColumnType[fields.length];
        for (int j = 0; j < fields.length; j++) {
            names.add(allNames.get(fields[j]));
            types[j] = typeOf(data, fields[j], decimalComma);
        }
        return new Layout(delimiter, decimalComma, header, width, names, fields, types, dataOffset, dataLine,
                renamed.isEmpty() ? List.of() : List.of("header names renamed to keep them unique: "
                        + String.join("; ", renamed)));
    }

    /** Refuses binary input: a NUL byte is never in a UTF-8 CSV file (common practice for text sniffing). */
    private static void checkText(String source, byte[] b, int s, int n) {
        boolean anyText = false;
        for (int i = s; i < n; i++) {
            byte c = b[i];
            if (c == 0) {
                throw NearfitException.inFile(source, "not a CSV text file: binary data (a NUL byte) at byte " + i);
            }
            if (c != ' ' && c != '\n' && c != '\r' && c != '\t') {
                anyText = true;
            }
        }
        if (!anyText) {
            throw NearfitException.inFile(source, "empty file: no header and no rows");
        }
    }

    /**
     * The candidate giving the most rows with the same number of fields (more than one) as the first row
     * over the first 50 rows; ties go to the earlier candidate. Quotes are respected.
     */
    static char sniffDelimiter(byte[] head, int s, int n, boolean whole) {
        char best = ',';
        long bestScore = 0;
        for (int c = 0; c < LoadOptions.SNIFFED_DELIMITERS.length(); c++) {
            char d = LoadOptions.SNIFFED_DELIMITERS.charAt(c);
            RowTokenizer tok = new RowTokenizer(d);
            int p = s;
            int first = -1;
            long score = 0;
            for (int r = 0; r < 50; r++) {
                int next = tok.next(head, p, n, whole);
                if (next < 0) {
                    break;
                }
                if (first < 0) {
                    first = tok.fields();
                }
                if (tok.fields() == first && first > 1) {
                    score += first; // more fields breaks ties between consistent candidates
                }
                p = next;
            }
            if (score > bestScore) {
                bestScore = score;
                best = d;
            }
        }
        return best;
    }

    /**
     * A first row is a header when every cell is a label or empty (not a number or time), and either
     * some column below holds numbers or times, or no label of the first row recurs in its column.
     */
    static boolean looksLikeHeader(List<String[]> rows, boolean decimalComma) {
        String[] first = rows.get(0);
        boolean anyLabel = false;
        for (String cell : first) {
            Kind k = cell.isEmpty() ? Kind.MISSING : kindOf(cell, decimalComma);
            if (k != Kind.LABEL && !cell.isEmpty()) {
                return false;
            }
            anyLabel |= k == Kind.LABEL;
        }
        if (!anyLabel) {
            return false;
        }
        if (rows.size() == 1) {
            return true;
        }
        List<String[]> data = rows.subList(1, rows.size());
        for (int f = 0; f < first.length; f++) {
            ColumnType t = typeOf(data, f, decimalComma);
            if (t == ColumnType.NUMBER || t == ColumnType.TIME) {
                boolean anyValue = false;
                for (String[] r : data) {
                    anyValue |= f < r.length && kindOf(r[f], decimalComma) != Kind.MISSING;
                }
                if (anyValue) {
                    return true;
                }
            }
        }
        for (int f = 0; f < first.length; f++) {
            for (String[] r : data) {
                if (f < r.length && !first[f].isEmpty() && r[f].equals(first[f])) {
                    return false;
                }
            }
        }
        return true;
    }

    private enum Kind { MISSING, NUMBER, TIME, LABEL }

    private static Kind kindOf(String cell, boolean decimalComma) {
        byte[] b = cell.getBytes(StandardCharsets.UTF_8);
        int s = CellText.trimStart(b, 0, b.length);
        int e = CellText.trimEnd(b, s, b.length);
        if (CellText.isMissing(b, s, e)) {
            return Kind.MISSING;
        }
        if (!Double.isNaN(CellText.parseNumber(b, s, e, decimalComma, new byte[b.length]))) {
            return Kind.NUMBER;
        }
        return TimeParser.parse(b, s, e) != TimeParser.NOT_A_TIME ? Kind.TIME : Kind.LABEL;
    }

    /** Number or time when at most one present cell in ten is not one (or none is present), else category or text. */
    static ColumnType typeOf(List<String[]> data, int f, boolean decimalComma) {
        int numbers = 0;
        int times = 0;
        int labels = 0;
        Set<String> distinct = new HashSet<>();
        for (String[] r : data) {
            if (f >= r.length) {
                continue;
            }
            switch (kindOf(r[f], decimalComma)) {
                case NUMBER -> numbers++;
                case TIME -> times++;
                case LABEL -> {
                    labels++;
                    distinct.add(r[f]);
                }
                case MISSING -> { }
            }
        }
        int present = numbers + times + labels;
        // A few labels among numbers or times are bad cells, not a sign of a category (up to 10%).
        if (labels * 10L <= present) {
            return times > numbers ? ColumnType.TIME : ColumnType.NUMBER;
        }
        if (distinct.size() > CATEGORY_SAMPLE_LABELS && distinct.size() * 2 > present) {
            return ColumnType.TEXT;
        }
        return ColumnType.CATEGORY;
    }

    /**
     * Header names made usable: blanks become colN, repeats get _2, _3, ... A new name never takes one the
     * header holds itself (in {@code a,a,a_2} the second {@code a} becomes {@code a_3}, so {@code a_2}
     * still means the header's own column). What was renamed is added to {@code renamed}, one note each.
     */
    static List<String> names(String[] header, int width, List<String> renamed) {
        Set<String> inHeader = new HashSet<>();
        for (int i = 0; header != null && i < width; i++) {
            if (!header[i].isEmpty()) {
                inHeader.add(header[i]);
            }
        }
        List<String> out = new ArrayList<>(width);
        Set<String> used = new HashSet<>();
        for (int i = 0; i < width; i++) {
            boolean blank = header == null || header[i].isEmpty();
            String name = blank ? "col" + (i + 1) : header[i];
            String unique = name;
            boolean free = blank ? !inHeader.contains(name) && used.add(name) : used.add(name);
            for (int k = 2; !free; k++) {
                unique = name + "_" + k;
                free = !inHeader.contains(unique) && used.add(unique);
            }
            out.add(unique);
            if (header != null && (blank || !unique.equals(name))) {
                renamed.add("column " + (i + 1) + (blank ? " (blank)" : " (\"" + name + "\" again)") + " as " + unique);
            }
        }
        return out;
    }

    /** As {@link #names(String[], int, List)}, without the notes. */
    static List<String> names(String[] header, int width) {
        return names(header, width, new ArrayList<>());
    }

    /** The field indexes of the kept columns, ascending and distinct; an unknown required name fails. */
    /** {@code fields} with the first field typed as a time added in file order, when there is one. */
    private static int[] withFirstTime(int[] fields, List<String[]> data, int width, boolean decimalComma) {
        for (int f = 0; f < width; f++) {
            if (typeOf(data, f, decimalComma) == ColumnType.TIME) {
                java.util.BitSet kept = new java.util.BitSet(width);
                for (int k : fields) {
                    kept.set(k);
                }
                kept.set(f);
                return kept.stream().toArray();
            }
        }
        return fields;
    }

        private static int[] keptFields(String source, List<String> names, LoadOptions options) {
        if (options.keepsAll()) {
            int[] all = new int[names.size()];
            for (int i = 0; i < all.length; i++) {
                all[i] = i;
            }
            return all;
        }
        Map<String, Integer> index = new HashMap<>();
        for (int i = 0; i < names.size(); i++) {
            index.put(names.get(i), i);
        }
        java.util.BitSet kept = new java.util.BitSet(names.size());
        for (String name : options.keepColumns()) {
            Integer i = index.get(name);
            if (i == null) {
                throw new NearfitException(source, NearfitException.NO_LINE, name,
                        "no such column; the columns are " + String.join(", ", names), null);
            }
            kept.set(i);
        }
        for (String name : options.keepIfPresent()) {
            Integer i = index.get(name);
            if (i != null) {
                kept.set(i);
            }
        }
        int[] out = new int[kept.cardinality()];
        for (int i = kept.nextSetBit(0), j = 0; i >= 0; i = kept.nextSetBit(i + 1), j++) {
            out[j] = i;
        }
        return out;
    }
}
