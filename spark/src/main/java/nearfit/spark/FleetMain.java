package nearfit.spark;

import java.io.PrintWriter;
import java.util.function.Consumer;

import nearfit.table.NearfitException;
import picocli.CommandLine;
import picocli.CommandLine.Command;

/**
 * {@code nearfit-spark}: the fleet jobs, {@code check} and {@code predict} of the single-machine tool run on
 * Apache Spark over many files. Exit statuses as there: 0 success, 1 a failed check, 2 usage or input errors
 * (one line from the driver, a stack trace only with {@code --debug}).
 */
@Command(name = "nearfit-spark", mixinStandardHelpOptions = true, versionProvider = FleetMain.Version.class,
        subcommands = {FleetCheck.class, FleetPredict.class},
        description = "Score rows of many files against a nearfit model on Apache Spark.")
public final class FleetMain implements Runnable {
    /** Exit status of usage and input errors. */
    public static final int EXIT_USAGE = 2;
    /** Exit status of a check whose flagged share is above the limit. */
    public static final int EXIT_CHECK_FAILED = 1;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Override
    public void run() {
        throw new CommandLine.ParameterException(spec.commandLine(), "name a job: check or predict");
    }

    /** Runs a job and exits with its status (the process stops Spark on its way out). */
    public static void main(String[] args) {
        PrintWriter out = new PrintWriter(System.out, true);
        PrintWriter err = new PrintWriter(System.err, true);
        int status = run(args, out, err);
        FleetSession.stopIfStarted();
        System.exit(status);
    }

    /** Runs a job with its report on {@code out} and messages on {@code err}; the exit status. */
    public static int run(String[] args, PrintWriter out, PrintWriter err) {
        return run(args, out, err, options -> { });
    }

    /**
     * As {@link #run(String[], PrintWriter, PrintWriter)}, with {@code tweak} applied to the job's options once
     * picocli has made them: how tests in this package set what is no option (block size, {@link TaskProbe}).
     */
    static int run(String[] args, PrintWriter out, PrintWriter err, Consumer<FleetOptions> tweak) {
        CommandLine.IFactory defaults = CommandLine.defaultFactory();
        CommandLine cl = new CommandLine(new FleetMain(), new CommandLine.IFactory() {
            @Override
            public <K> K create(Class<K> type) throws Exception {
                K made = defaults.create(type);
                if (made instanceof FleetOptions o) {
                    tweak.accept(o);
                }
                return made;
            }
        });
        cl.setOut(out);
        cl.setErr(err);
        cl.setExecutionExceptionHandler((ex, line, parsed) -> {
            boolean debug = parsed.hasMatchedOption("--debug") || parsed.subcommand() != null
                    && parsed.subcommand().hasMatchedOption("--debug");
            err.println("nearfit-spark: " + oneLine(ex));
            if (debug) {
                ex.printStackTrace(err);
            }
            err.flush();
            return EXIT_USAGE;
        });
        int status = cl.execute(args);
        out.flush();
        err.flush();
        return status;
    }

    /**
     * The one line to show for a failure: a nearfit error as it is (it may come from a worker, wrapped in
     * Spark's task failure), otherwise the innermost message.
     */
    static String oneLine(Throwable ex) {
        for (Throwable t = ex; t != null; t = t.getCause()) {
            if (t instanceof NearfitException) {
                return t.getMessage();
            }
        }
        Throwable root = ex;
        while (root.getCause() != null && root.getCause() != root) {
            root = root.getCause();
        }
        String m = root.getMessage() == null ? root.getClass().getSimpleName() : root.getMessage();
        int nl = m.indexOf('\n');
        return nl < 0 ? m : m.substring(0, nl);
    }

    /** The version of the nearfit core the jobs run. */
    static final class Version implements CommandLine.IVersionProvider {
        @Override
        public String[] getVersion() {
            return new String[] {"nearfit-spark " + toolVersion()};
        }
    }

    /** The core jar's version, or {@code dev} when run from classes. */
    static String toolVersion() {
        String v = nearfit.cli.Main.class.getPackage().getImplementationVersion();
        return v == null ? "dev" : v;
    }
}
