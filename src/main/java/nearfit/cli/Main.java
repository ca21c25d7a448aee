package nearfit.cli;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.io.OutputStreamWriter;
import java.nio.charset.StandardCharsets;
import java.util.List;

import nearfit.table.NearfitException;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

/**
 * The {@code nearfit} command line: one entry point with a sub-command per job.
 *
 * <p>Exit statuses: 0 success; 1 only from {@code check} when the check fails; 2 for a usage or input
 * error, printed as one line {@code nearfit: ...} on standard error (with the stack trace only under
 * {@code --debug}).
 */
@Command(name = "nearfit",
        mixinStandardHelpOptions = true,
        versionProvider = Main.Version.class,
        description = "k-nearest-neighbour reference curves for equipment logs, in the terminal.")
public final class Main implements Runnable {
    /**
     * The sub-commands, in the order help lists them. Not in {@code @Command(subcommands = ...)}: building the
     * model of every command by reflection took about 200 ms of a cold start (two thirds of a small
     * {@code describe}), so a command line that names one command builds only that one ({@link #commandLine}),
     * and a plain line none ({@link PlainLine}).
     */
    private static final class Commands {
        static final List<Class<?>> ALL = List.of(ViewCommand.class, DescribeCommand.class,
                PlotCommand.class, TuneCommand.class, FitCommand.class, PredictCommand.class, CheckCommand.class,
                CompletionCommand.class);
    }

    /** Exit status for a usage or input error. */
    public static final int EXIT_USAGE = 2;
    /** Exit status of {@code check} when the flagged share is over the limit. */
    public static final int EXIT_CHECK_FAILED = 1;

    @Option(names = "--debug", scope = CommandLine.ScopeType.INHERIT,
            description = "Print stack traces of failures.")
    boolean debug;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Override
    public void run() {
        throw new CommandLine.ParameterException(spec.commandLine(), "name a command; see nearfit --help");
    }

    public static void main(String[] args) {
        System.exit(runOnStandardStreams(args));
    }

    /**
     * Runs on the process's own streams. Standard output is checked after the last write: a failed
     * write (a full disk, a closed descriptor) ends with status 2 and one line; a reader that went away
     * (a closed pipe) is no error ({@link StandardOutput}).
     */
    static int runOnStandardStreams(String[] args) {
        StandardOutput stdout = new StandardOutput(new java.io.FileOutputStream(java.io.FileDescriptor.out));
        PrintWriter out = new StandardOutputWriter(stdout);
        PrintWriter err = new PrintWriter(new OutputStreamWriter(System.err, StandardCharsets.UTF_8), true);
        int status = run(args, out, err);
        out.flush();
        return stdout.status(status, err);
    }

    /**
     * Runs one command line in-process, writing to the given streams; the tests' entry point.
     *
     * @return the exit status
     */
    public static int run(String[] args, PrintWriter out, PrintWriter err) {
        PlainLine.Parsed plain = plainLine(args, out, err);
        if (plain == null) {
            return run(args, out, err, CommandLine.defaultFactory());
        }
        // The quick lane: no parser model is built (PlainLine); failures end as the parser's lane ends them.
        int status;
        try {
            Object result = plain.command().call();
            status = result instanceof Integer i ? i : 0;
        } catch (OutOfMemoryError ex) {
            err.println(outOfMemory());
            status = EXIT_USAGE;
        } catch (Exception ex) {
            status = failed(ex, err, plain.debug());
        }
        out.flush();
        err.flush();
        return status;
    }

    /** The command a plain line names, ready to run, or null when the line is for the parser ({@link PlainLine}). */
    static PlainLine.Parsed plainLine(String[] args, PrintWriter out, PrintWriter err) {
        return PlainLine.read(args, Main.class, Commands.ALL, out, err);
    }

    /** As {@link #run(String[], PrintWriter, PrintWriter)} through the option parser always, with commands and
     * mixins made by {@code factory}. */
    static int run(String[] args, PrintWriter out, PrintWriter err, CommandLine.IFactory factory) {
        CommandLine cli = commandLine(factory, args);
        cli.setOut(out);
        cli.setErr(err);
        boolean debug = java.util.Arrays.asList(args).contains("--debug");
        cli.setParameterExceptionHandler((ex, a) -> {
            err.println("nearfit: " + ex.getMessage());
            TypoHint.of(ex).ifPresent(err::println);
            err.flush();
            return EXIT_USAGE;
        });
        cli.setExecutionExceptionHandler((ex, c, parsed) -> failed(ex, err, debug));
        int status;
        try {
            status = cli.execute(args);
        } catch (OutOfMemoryError ex) {
            // The heap is the user's to raise; a stack trace would hide that. The input is unreachable by now.
            err.println(outOfMemory());
            status = EXIT_USAGE;
        }
        out.flush();
        err.flush();
        return status;
    }

    /** A command's failure as one line (and its stack trace under {@code --debug}); the exit status. */
    private static int failed(Exception ex, PrintWriter err, boolean debug) {
        if (ex instanceof NearfitException) {
            err.println(errorLine(ex));
        } else if (rootCause(ex) instanceof OutOfMemoryError) {
            err.println(outOfMemory()); // from a worker thread, wrapped
        } else {
            err.println("nearfit: internal error: " + nearfit.table.VisibleText.of(ex.toString()));
        }
        if (debug) {
            StringWriter sw = new StringWriter();
            ex.printStackTrace(new PrintWriter(sw));
            err.print(sw);
        }
        err.flush();
        return EXIT_USAGE;
    }

    /**
     * The one line for a failure: its message with control characters made visible, since it may quote
     * a column name, a label or a file name taken from a file.
     */
    private static String errorLine(Exception ex) {
        return "nearfit: " + nearfit.table.VisibleText.of(ex.getMessage());
    }

    /** Worded like the loader's own out-of-memory message. */
    private static String outOfMemory() {
        return "nearfit: out of memory after loading (heap " + (Runtime.getRuntime().maxMemory() >> 20)
                + " MB); give Java more heap (for example NEARFIT_JAVA_OPTS=-Xmx16g)";
    }

    private static Throwable rootCause(Throwable t) {
        Throwable c = t;
        while (c.getCause() != null && c.getCause() != c) {
            c = c.getCause();
        }
        return c;
    }

    /** A fresh command line with every sub-command; used by completion too. */
    static CommandLine commandLine() {
        return commandLine(CommandLine.defaultFactory(), new String[0]);
    }

    /**
     * The command line for {@code args}: with only the sub-command they name when the first word that is not an
     * option is a command's name, else with every sub-command (for help, the version, a mistyped command
     * and its suggestion). The commands' names come from their own annotations.
     */
    static CommandLine commandLine(CommandLine.IFactory factory, String[] args) {
        CommandLine cli = new CommandLine(new Main(), factory);
        String named = null;
        for (String a : args) {
            if (!a.startsWith("-")) {
                named = a;
                break;
            }
        }
        boolean known = false;
        for (Class<?> c : Commands.ALL) {
            known |= c.getAnnotation(Command.class).name().equals(named);
        }
        for (Class<?> c : Commands.ALL) {
            String name = c.getAnnotation(Command.class).name();
            if (!known || name.equals(named)) {
                cli.addSubcommand(name, c);
            }
        }
        cli.setCaseInsensitiveEnumValuesAllowed(true);
        registerPathConverter(cli);
        return cli;
    }

    /** File options and parameters are read with {@link ArgumentPath}, so a name the locale cannot spell still opens. */
    private static void registerPathConverter(CommandLine cli) {
        cli.registerConverter(java.nio.file.Path.class, arg -> {
            try {
                return ArgumentPath.of(arg);
            } catch (NearfitException e) {
                throw new CommandLine.TypeConversionException(e.getMessage());
            }
        });
    }

    /** The version written into the jar's manifest by the build. */
    static final class Version implements CommandLine.IVersionProvider {
        @Override
        public String[] getVersion() {
            return new String[] {"nearfit " + ToolVersion.get(), ToolVersion.runtime()};
        }
    }
}
