package nearfit.cli;

import java.io.PrintWriter;
import java.lang.reflect.Field;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.concurrent.Callable;

import nearfit.cli.DeclaredAnnotations.Annotation;
import nearfit.cli.DeclaredAnnotations.FieldAnnotations;
import picocli.CommandLine;

/**
 * The quick lane: a plain command line read without building the option parser's model, which costs a fresh
 * process 0.3 to 0.6 s of CPU (docs/bench-startup.md), more than a small {@code describe} or {@code tune} does.
 *
 * <p>There is one definition of every option: the parser's annotations on the command and its mixins, read
 * here from the class files ({@link DeclaredAnnotations}); values go through the same converters. This lane
 * takes only lines it can read exactly as the parser would, and says nothing itself: any other line, and any
 * value a converter refuses, is left to the parser (null), whose messages, help and suggestions stay the only
 * ones. A plain line: a command's name first, then its positional parameters (none starting with {@code -}
 * except {@code -} itself, none empty) and options each given at most once, as {@code NAME VALUE} or
 * {@code --NAME=VALUE} (a value not starting with {@code -} unless it is {@code -}), flags alone. Left to the
 * parser: help and version options, {@code @}files, {@code --}, unknown, repeated or clustered options,
 * missing required options or parameters, and commands whose declarations use anything this lane does not
 * read (an element it does not know, a list option, an argument group). QuickLaneTest runs both lanes on the
 * same lines.
 */
final class PlainLine {
    /**
     * What a command or mixin that holds a {@code @Spec} for its streams extends: the streams the quick lane
     * gives, null under the parser (whose streams are in the spec).
     */
    abstract static class Streams {
        private PrintWriter out;
        private PrintWriter err;

        final void streams(PrintWriter out, PrintWriter err) {
            this.out = out;
            this.err = err;
        }

        /** The quick lane's standard output, or null under the parser. */
        final PrintWriter givenOut() {
            return out;
        }

        /** The quick lane's standard error, or null under the parser. */
        final PrintWriter givenErr() {
            return err;
        }
    }

    /** A command read from a plain line, its fields set; {@code debug} the inherited {@code --debug} flag. */
    record Parsed(Callable<?> command, boolean debug) {
    }

    private static final String OPTION = CommandLine.Option.class.getName();
    private static final String PARAMETERS = CommandLine.Parameters.class.getName();
    private static final String MIXIN = CommandLine.Mixin.class.getName();
    private static final String SPEC = CommandLine.Spec.class.getName();
    private static final String COMMAND = CommandLine.Command.class.getName();
    /** Elements read (names, converter, defaultValue, required, scope) or of help only. */
    private static final Set<String> OPTION_ELEMENTS = Set.of("names", "paramLabel", "description", "defaultValue",
            "converter", "completionCandidates", "required", "scope");
    private static final Set<String> PARAMETER_ELEMENTS = Set.of("index", "paramLabel", "description");
    private static final Set<String> COMMAND_ELEMENTS = Set.of("name", "mixinStandardHelpOptions", "sortOptions",
            "description", "versionProvider");

    /** An option or positional parameter: the field it sets on the object it belongs to. */
    private record Slot(Object target, Field field, Map<String, Object> elements) {
    }

    private final Map<String, Slot> options = new HashMap<>();
    private final Map<Integer, Slot> parameters = new HashMap<>();
    private final List<Object> targets = new ArrayList<>();

    private PlainLine() {
    }

    /**
     * The command {@code args} name, its fields set as the parser would set them and its streams given, or null
     * when the line is not plain. {@code top} is the top-level command, whose inherited options (those with
     * {@code scope = INHERIT}) are taken after the command's name; {@code commands} the sub-commands.
     */
    static Parsed read(String[] args, Class<?> top, List<Class<?>> commands, PrintWriter out, PrintWriter err) {
        if (args.length == 0 || args[0].startsWith("-")) {
            return null;
        }
        try {
            for (Class<?> c : commands) {
                DeclaredAnnotations.OfClass declared = DeclaredAnnotations.of(c);
                Annotation command = declared == null ? null : find(declared.annotations(), COMMAND);
                if (command != null && args[0].equals(command.elements().get("name"))) {
                    if (!COMMAND_ELEMENTS.containsAll(command.elements().keySet())) {
                        return null;
                    }
                    return new PlainLine().parse(args, top, c, out, err);
                }
            }
            return null;
        } catch (ReflectiveOperationException | RuntimeException e) {
            return null; // a declaration this lane cannot follow, or a value a converter refuses: the parser says
        }
    }

    private Parsed parse(String[] args, Class<?> top, Class<?> commandClass, PrintWriter out, PrintWriter err)
            throws ReflectiveOperationException {
        Object topCommand = newInstance(top);
        Set<String> inherited = new HashSet<>();
        if (!declare(topCommand, top, true, inherited)) {
            return null;
        }
        Object command = newInstance(commandClass);
        if (!declare(command, commandClass, false, null)) {
            return null;
        }
        Set<Slot> given = new HashSet<>();
        int position = 0;
        for (int i = 1; i < args.length; i++) {
            String a = args[i];
            if (a.isEmpty() || a.startsWith("@") || a.equals("--")) {
                return null;
            }
            if (a.startsWith("-") && !a.equals("-")) {
                String name = a;
                String value = null;
                int eq = a.indexOf('=');
                if (a.startsWith("--") && eq > 0) {
                    name = a.substring(0, eq);
                    value = a.substring(eq + 1);
                }
                Slot slot = options.get(name);
                if (slot == null || !given.add(slot)) {
                    return null;
                }
                if (isFlag(slot)) {
                    if (value != null) {
                        return null;
                    }
                    slot.field().set(slot.target(), true);
                    continue;
                }
                if (value == null) {
                    if (i + 1 >= args.length || args[i + 1].startsWith("@")
                            || args[i + 1].startsWith("-") && !args[i + 1].equals("-")) {
                        return null;
                    }
                    value = args[++i];
                }
                slot.field().set(slot.target(), convert(slot, value));
            } else {
                Slot slot = parameters.get(position++);
                if (slot == null) {
                    return null;
                }
                slot.field().set(slot.target(), convert(slot, a));
            }
        }
        if (position != parameters.size()) {
            return null;
        }
        for (Slot slot : new HashSet<>(options.values())) {
            if (given.contains(slot)) {
                continue;
            }
            if (Boolean.TRUE.equals(slot.elements().get("required"))) {
                return null;
            }
            Object defaultValue = slot.elements().get("defaultValue");
            if (defaultValue instanceof String d && d.contains("${")) {
                return null; // the parser interpolates variables in a default
            }
            if (defaultValue != null) {
                slot.field().set(slot.target(), convert(slot, (String) defaultValue));
            }
        }
        for (Object t : targets) {
            if (t instanceof Streams s) {
                s.streams(out, err);
            }
        }
        Slot debug = options.get("--debug");
        return new Parsed((Callable<?>) command, debug != null && given.contains(debug));
    }

    /**
     * Records the options and parameters of {@code target} and of its mixins (made and set here); false when a
     * declaration uses anything this lane does not read. On the top-level command only inherited options count.
     */
    private boolean declare(Object target, Class<?> c, boolean top, Set<String> inherited)
            throws ReflectiveOperationException {
        DeclaredAnnotations.OfClass declared = DeclaredAnnotations.of(c);
        if (declared == null) {
            return false;
        }
        targets.add(target);
        for (FieldAnnotations fa : declared.fields()) {
            for (Annotation a : fa.annotations()) {
                if (!a.type().startsWith("picocli.")) {
                    continue;
                }
                Field field = c.getDeclaredField(fa.name());
                Map<String, Object> e = a.elements();
                if (a.type().equals(OPTION)) {
                    if (!OPTION_ELEMENTS.containsAll(e.keySet()) || !readable(field, e)) {
                        return false;
                    }
                    if (top && !"INHERIT".equals(e.get("scope"))) {
                        continue; // the top-level command's own options come before a command's name
                    }
                    if (!top && e.containsKey("scope")) {
                        return false;
                    }
                    for (Object name : names(e.get("names"))) {
                        if (options.put((String) name, new Slot(target, field, e)) != null) {
                            return false;
                        }
                        if (top) {
                            inherited.add((String) name);
                        }
                    }
                } else if (a.type().equals(PARAMETERS) && !top) {
                    Object index = e.get("index");
                    if (!PARAMETER_ELEMENTS.containsAll(e.keySet()) || !(index instanceof String s)
                            || !s.matches("[0-9]") || !readable(field, e)
                            || parameters.put(Integer.parseInt(s), new Slot(target, field, e)) != null) {
                        return false;
                    }
                } else if (a.type().equals(MIXIN) && e.isEmpty() && !top) {
                    Object mixin = newInstance(field.getType());
                    field.set(target, mixin);
                    if (!declare(mixin, field.getType(), false, null)) {
                        return false;
                    }
                } else if (a.type().equals(SPEC)) {
                    if (!(target instanceof Streams) && !top) {
                        return false;
                    }
                } else {
                    return false;
                }
            }
        }
        return true;
    }

    private static List<?> names(Object names) {
        return names instanceof List<?> l ? l : List.of(names);
    }

    /** A field this lane can set: a flag, a string, a path, or any type with a converter named. */
    private static boolean readable(Field field, Map<String, Object> elements) {
        Class<?> t = field.getType();
        return elements.containsKey("converter") || t == boolean.class || t == String.class || t == Path.class;
    }

    private static boolean isFlag(Slot slot) {
        return slot.field().getType() == boolean.class && !slot.elements().containsKey("converter");
    }

    /** The value as the parser converts it: the named converter, else the string itself or {@link ArgumentPath}. */
    private static Object convert(Slot slot, String text) throws ReflectiveOperationException {
        Object converter = slot.elements().get("converter");
        if (converter != null) {
            List<?> names = names(converter);
            if (names.size() != 1) {
                throw new IllegalArgumentException("one converter");
            }
            CommandLine.ITypeConverter<?> c = (CommandLine.ITypeConverter<?>) newInstance(
                    Class.forName((String) names.get(0), false, PlainLine.class.getClassLoader()));
            try {
                return c.convert(text);
            } catch (Exception e) {
                throw new IllegalArgumentException(e); // the parser says what is wrong with it
            }
        }
        if (slot.field().getType() == Path.class) {
            return ArgumentPath.of(text);
        }
        if (slot.field().getType() == String.class) {
            return text;
        }
        throw new IllegalArgumentException("not a type this lane reads");
    }

    private static Object newInstance(Class<?> c) throws ReflectiveOperationException {
        var constructor = c.getDeclaredConstructor();
        constructor.setAccessible(true);
        return constructor.newInstance();
    }

    private static Annotation find(List<Annotation> annotations, String type) {
        for (Annotation a : annotations) {
            if (a.type().equals(type)) {
                return a;
            }
        }
        return null;
    }
}
