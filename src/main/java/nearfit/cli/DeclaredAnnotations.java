package nearfit.cli;

import java.io.DataInputStream;
import java.io.IOException;
import java.io.InputStream;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * The annotations a class and its fields carry, read from the class file itself (JVM specification, chapter
 * 4.7.16 "The RuntimeVisibleAnnotations Attribute"), not through reflection. Why: reflection makes each
 * annotation a dynamic proxy, and generating the proxy classes cost a fresh process about 0.14 s of CPU
 * (Java 25 with a start-up cache; docs/bench-startup.md), half of a small {@code describe}. The quick lane
 * ({@link PlainLine}) reads the option parser's own annotations this way, so both lanes share one definition.
 *
 * <p>Element values: strings, numbers and booleans as themselves ({@link Integer}, {@link Boolean}, ...), an
 * enum constant as its name, a class as its binary name ({@code nearfit.cli.OptionNumbers$Count}), an array as
 * a {@code List}, a nested annotation as an {@link Annotation}. Only the elements written in the source are in
 * a class file; defaults are not.
 */
final class DeclaredAnnotations {
    /** One annotation: its type's binary name and the elements written in the source, in order. */
    record Annotation(String type, Map<String, Object> elements) {
    }

    /** One field: its name and its annotations. */
    record FieldAnnotations(String name, List<Annotation> annotations) {
    }

    /** A class's own annotations and those of its fields, fields in declaration order. */
    record OfClass(List<Annotation> annotations, List<FieldAnnotations> fields) {
    }

    private DeclaredAnnotations() {
    }

    /** The annotations of {@code c}, or null when its class file cannot be read (then callers take the slow lane). */
    static OfClass of(Class<?> c) {
        String name = c.getName();
        try (InputStream in = c.getResourceAsStream(name.substring(name.lastIndexOf('.') + 1) + ".class")) {
            return in == null ? null : read(new DataInputStream(in));
        } catch (IOException | RuntimeException e) {
            return null;
        }
    }

    private static OfClass read(DataInputStream in) throws IOException {
        if (in.readInt() != 0xCAFEBABE) {
            return null;
        }
        in.readUnsignedShort(); // minor version
        in.readUnsignedShort(); // major version
        Object[] pool = new Object[in.readUnsignedShort()];
        for (int i = 1; i < pool.length; i++) {
            int tag = in.readUnsignedByte();
            switch (tag) {
                case 1 -> pool[i] = in.readUTF(); // modified UTF-8 with its u2 length, as DataInput reads it
                case 3 -> pool[i] = in.readInt();
                case 4 -> pool[i] = in.readFloat();
                case 5 -> pool[i++] = in.readLong(); // takes two entries
                case 6 -> pool[i++] = in.readDouble();
                case 7, 8, 16, 19, 20 -> in.readUnsignedShort();
                case 15 -> {
                    in.readUnsignedByte();
                    in.readUnsignedShort();
                }
                case 9, 10, 11, 12, 17, 18 -> in.readInt();
                default -> throw new IOException("constant pool tag " + tag);
            }
        }
        in.readUnsignedShort(); // access flags
        in.readUnsignedShort(); // this class
        in.readUnsignedShort(); // super class
        in.skipNBytes(2L * in.readUnsignedShort()); // interfaces
        List<FieldAnnotations> fields = new ArrayList<>();
        int fieldCount = in.readUnsignedShort();
        for (int f = 0; f < fieldCount; f++) {
            in.readUnsignedShort(); // access flags
            String fieldName = (String) pool[in.readUnsignedShort()];
            in.readUnsignedShort(); // descriptor
            fields.add(new FieldAnnotations(fieldName, attributes(in, pool)));
        }
        int methodCount = in.readUnsignedShort();
        for (int m = 0; m < methodCount; m++) {
            in.skipNBytes(6);
            attributes(in, pool);
        }
        return new OfClass(attributes(in, pool), fields);
    }

    /** Reads an attribute table; returns the annotations of its RuntimeVisibleAnnotations, skipping the rest. */
    private static List<Annotation> attributes(DataInputStream in, Object[] pool) throws IOException {
        List<Annotation> found = new ArrayList<>();
        int count = in.readUnsignedShort();
        for (int a = 0; a < count; a++) {
            String name = (String) pool[in.readUnsignedShort()];
            long length = in.readInt() & 0xFFFFFFFFL;
            if ("RuntimeVisibleAnnotations".equals(name)) {
                int n = in.readUnsignedShort();
                for (int i = 0; i < n; i++) {
                    found.add(annotation(in, pool));
                }
            } else {
                in.skipNBytes(length);
            }
        }
        return found;
    }

    private static Annotation annotation(DataInputStream in, Object[] pool) throws IOException {
        String type = binaryName((String) pool[in.readUnsignedShort()]);
        Map<String, Object> elements = new LinkedHashMap<>();
        int n = in.readUnsignedShort();
        for (int i = 0; i < n; i++) {
            String name = (String) pool[in.readUnsignedShort()];
            elements.put(name, value(in, pool));
        }
        return new Annotation(type, elements);
    }

    private static Object value(DataInputStream in, Object[] pool) throws IOException {
        int tag = in.readUnsignedByte();
        return switch (tag) {
            case 'Z' -> ((Integer) pool[in.readUnsignedShort()]) != 0;
            case 'B', 'C', 'I', 'S', 'D', 'F', 'J', 's' -> pool[in.readUnsignedShort()];
            case 'e' -> {
                in.readUnsignedShort(); // the enum's type
                yield pool[in.readUnsignedShort()];
            }
            case 'c' -> binaryName((String) pool[in.readUnsignedShort()]);
            case '@' -> annotation(in, pool);
            case '[' -> {
                List<Object> values = new ArrayList<>();
                int n = in.readUnsignedShort();
                for (int i = 0; i < n; i++) {
                    values.add(value(in, pool));
                }
                yield values;
            }
            default -> throw new IOException("element value tag " + (char) tag);
        };
    }

    /** {@code Lpicocli/CommandLine$Option;} as {@code picocli.CommandLine$Option}; {@code V} and arrays as they are. */
    private static String binaryName(String descriptor) {
        return descriptor.startsWith("L") && descriptor.endsWith(";")
                ? descriptor.substring(1, descriptor.length() - 1).replace('/', '.') : descriptor;
    }
}
