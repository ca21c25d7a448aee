package nearfit.model;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * A small JSON (RFC 8259) writer and reader for the tool's own documents: model manifests and the
 * {@code --format json} outputs. Values read are {@code null}, {@link Boolean}, {@link Double},
 * {@link String}, {@link List} and {@link LinkedHashMap} (key order kept).
 *
 * <p>Non-finite numbers have no JSON form; the writer emits {@code null} for them.
 */
public final class Json {
    private Json() {
    }

    /** A streaming writer with automatic commas; compact output, one document per instance. */
    public static final class Writer {
        private final StringBuilder out = new StringBuilder();
        // One entry per open container: true until its first element is written.
        private final java.util.BitSet firstAtDepth = new java.util.BitSet();
        private int depth;
        private boolean afterKey;

        public Writer beginObject() {
            beforeValue();
            out.append('{');
            open();
            return this;
        }

        public Writer endObject() {
            depth--;
            out.append('}');
            return this;
        }

        public Writer beginArray() {
            beforeValue();
            out.append('[');
            open();
            return this;
        }

        public Writer endArray() {
            depth--;
            out.append(']');
            return this;
        }

        /** Writes an object key; the next call writes its value. */
        public Writer key(String name) {
            beforeValue();
            quote(name);
            out.append(':');
            afterKey = true;
            return this;
        }

        public Writer value(String s) {
            beforeValue();
            if (s == null) {
                out.append("null");
            } else {
                quote(s);
            }
            return this;
        }

        public Writer value(double d) {
            beforeValue();
            appendNumber(d);
            return this;
        }

        public Writer value(long n) {
            beforeValue();
            out.append(n);
            return this;
        }

        public Writer value(boolean b) {
            beforeValue();
            out.append(b);
            return this;
        }

        public Writer nullValue() {
            beforeValue();
            out.append("null");
            return this;
        }

        /**
         * Writes a value read by {@link Json#parse} or built of the same types: null, Boolean, Number,
         * String, List and Map with String keys.
         */
        public Writer any(Object v) {
            if (v == null) {
                return nullValue();
            } else if (v instanceof Boolean b) {
                return value(b.booleanValue());
            } else if (v instanceof Integer || v instanceof Long) {
                return value(((Number) v).longValue());
            } else if (v instanceof Number n) {
                return value(n.doubleValue());
            } else if (v instanceof String s) {
                return value(s);
            } else if (v instanceof double[] a) {
                return array(a);
            } else if (v instanceof int[] a) {
                return array(a);
            } else if (v instanceof List<?> list) {
                beginArray();
                for (Object o : list) {
                    any(o);
                }
                return endArray();
            } else if (v instanceof Map<?, ?> map) {
                beginObject();
                for (Map.Entry<?, ?> e : map.entrySet()) {
                    key(String.valueOf(e.getKey()));
                    any(e.getValue());
                }
                return endObject();
            }
            throw new IllegalArgumentException("no JSON form for " + v.getClass().getName());
        }

        /** Writes an array of numbers. */
        public Writer array(double[] values) {
            beginArray();
            for (double v : values) {
                value(v);
            }
            return endArray();
        }

        /** Writes an array of whole numbers. */
        public Writer array(int[] values) {
            beginArray();
            for (int v : values) {
                value(v);
            }
            return endArray();
        }

        /** Writes an array of strings. */
        public Writer array(List<String> values) {
            beginArray();
            for (String v : values) {
                value(v);
            }
            return endArray();
        }

        @Override
        public String toString() {
            return out.toString();
        }

        private void open() {
            depth++;
            firstAtDepth.set(depth);
        }

        private void beforeValue() {
            if (afterKey) {
                afterKey = false;
                return;
            }
            if (depth > 0) {
                if (firstAtDepth.get(depth)) {
                    firstAtDepth.clear(depth);
                } else {
                    out.append(',');
                }
            }
        }

        private void appendNumber(double d) {
            if (!Double.isFinite(d)) {
                out.append("null");
            } else if (d == Math.rint(d) && Math.abs(d) < 1e15) {
                out.append((long) d);
            } else {
                out.append(d);
            }
        }

        private void quote(String s) {
            out.append('"');
            for (int i = 0; i < s.length(); i++) {
                char c = s.charAt(i);
                switch (c) {
                    case '"' -> out.append("\\\"");
                    case '\\' -> out.append("\\\\");
                    case '\n' -> out.append("\\n");
                    case '\r' -> out.append("\\r");
                    case '\t' -> out.append("\\t");
                    default -> {
                        if (c < 0x20) {
                            out.append(String.format("\\u%04x", (int) c));
                        } else {
                            out.append(c);
                        }
                    }
                }
            }
            out.append('"');
        }
    }

    /** The compact JSON text of a value built of null, Boolean, Number, String, List and Map. */
    public static String write(Object value) {
        return new Writer().any(value).toString();
    }

    /**
     * Parses one JSON document.
     *
     * @throws IllegalArgumentException with the character offset when the text is not JSON
     */
    public static Object parse(String text) {
        Reader r = new Reader(text);
        r.skipSpace();
        Object v = r.readValue(0);
        r.skipSpace();
        if (r.pos != text.length()) {
            throw r.error("text after the end of the document");
        }
        return v;
    }

    private static final class Reader {
        private static final int MAX_DEPTH = 64;
        private final String s;
        private int pos;

        Reader(String s) {
            this.s = s;
        }

        Object readValue(int depth) {
            if (depth > MAX_DEPTH) {
                throw error("nesting too deep");
            }
            if (pos >= s.length()) {
                throw error("unexpected end");
            }
            char c = s.charAt(pos);
            switch (c) {
                case '{':
                    return readObject(depth);
                case '[':
                    return readArray(depth);
                case '"':
                    return readString();
                case 't':
                    expectWord("true");
                    return Boolean.TRUE;
                case 'f':
                    expectWord("false");
                    return Boolean.FALSE;
                case 'n':
                    expectWord("null");
                    return null;
                default:
                    return readNumber();
            }
        }

        private Map<String, Object> readObject(int depth) {
            Map<String, Object> map = new LinkedHashMap<>();
            pos++;
            skipSpace();
            if (peek() == '}') {
                pos++;
                return map;
            }
            while (true) {
                skipSpace();
                if (peek() != '"') {
                    throw error("expected a key");
                }
                String key = readString();
                if (map.containsKey(key)) {
                    throw error("the key \"" + key + "\" appears twice"); // which one counts would be a guess
                }
                skipSpace();
                expect(':');
                skipSpace();
                map.put(key, readValue(depth + 1));
                skipSpace();
                char c = next();
                if (c == '}') {
                    return map;
                }
                if (c != ',') {
                    throw error("expected , or }");
                }
            }
        }

        private List<Object> readArray(int depth) {
            List<Object> list = new ArrayList<>();
            pos++;
            skipSpace();
            if (peek() == ']') {
                pos++;
                return list;
            }
            while (true) {
                skipSpace();
                list.add(readValue(depth + 1));
                skipSpace();
                char c = next();
                if (c == ']') {
                    return list;
                }
                if (c != ',') {
                    throw error("expected , or ]");
                }
            }
        }

        private String readString() {
            expect('"');
            StringBuilder sb = new StringBuilder();
            while (true) {
                char c = next();
                if (c == '"') {
                    return sb.toString();
                }
                if (c == '\\') {
                    char e = next();
                    switch (e) {
                        case '"', '\\', '/' -> sb.append(e);
                        case 'b' -> sb.append('\b');
                        case 'f' -> sb.append('\f');
                        case 'n' -> sb.append('\n');
                        case 'r' -> sb.append('\r');
                        case 't' -> sb.append('\t');
                        case 'u' -> {
                            if (pos + 4 > s.length()) {
                                throw error("short \\u escape");
                            }
                            try {
                                sb.append((char) Integer.parseInt(s.substring(pos, pos + 4), 16));
                            } catch (NumberFormatException ex) {
                                throw error("bad \\u escape");
                            }
                            pos += 4;
                        }
                        default -> throw error("bad escape");
                    }
                } else if (c < 0x20) {
                    throw error("control character in a string");
                } else {
                    sb.append(c);
                }
            }
        }

        private Double readNumber() {
            int start = pos;
            while (pos < s.length() && "+-0123456789.eE".indexOf(s.charAt(pos)) >= 0) {
                pos++;
            }
            if (start == pos) {
                throw error("unexpected character '" + s.charAt(pos) + "'");
            }
            try {
                return Double.valueOf(s.substring(start, pos));
            } catch (NumberFormatException ex) {
                throw error("bad number");
            }
        }

        private void expectWord(String w) {
            if (!s.startsWith(w, pos)) {
                throw error("unexpected word");
            }
            pos += w.length();
        }

        private void expect(char c) {
            if (next() != c) {
                throw error("expected " + c);
            }
        }

        private char peek() {
            if (pos >= s.length()) {
                throw error("unexpected end");
            }
            return s.charAt(pos);
        }

        private char next() {
            char c = peek();
            pos++;
            return c;
        }

        void skipSpace() {
            while (pos < s.length() && " \t\r\n".indexOf(s.charAt(pos)) >= 0) {
                pos++;
            }
        }

        IllegalArgumentException error(String what) {
            return new IllegalArgumentException("not valid JSON at character " + pos + ": " + what);
        }
    }
}
