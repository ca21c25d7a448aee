package nearfit.cli;

import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.concurrent.Callable;

import nearfit.knn.EstimateKind;
import nearfit.table.NearfitException;
import nearfit.tui.CoreWorkbench;
import nearfit.tui.Look;
import nearfit.tui.StartSettings;
import nearfit.tui.TerminalSession;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

/** {@code nearfit view}: the terminal explorer, on a file or on the bundled demo site log. */
@Command(name = "view", mixinStandardHelpOptions = true,
        description = {"Explore a k-nearest-neighbour curve in the terminal.",
            "Without FILE, opens the demo site log (power_kw against wind_ms). Press ? for the keys."})
final class ViewCommand implements Callable<Integer> {
    /** The demo log under NEARFIT_HOME, or under the working folder. */
    static final String DEMO = "data-demo/site-log.csv.gz";

    @Parameters(index = "0", arity = "0..1", paramLabel = "FILE", description = "CSV file, optionally .gz.")
    Path file;

    @Option(names = "-x", split = ",", paramLabel = "COL", description = "Input columns; the first is displayed.")
    List<String> inputs = new ArrayList<>();

    @Option(names = "-y", paramLabel = "COL", description = "Response column.")
    String response;

    @Option(names = "--k", paramLabel = "K", description = "Neighbours per estimate (default 20).")
    int k;

    @Option(names = "--estimate", paramLabel = "mean|median", converter = OptionChoices.EstimateWords.class,
            completionCandidates = OptionChoices.EstimateWords.class,
            description = "The curve: the neighbours' weighted mean or weighted median "
                    + "(default: mean; the c key switches).")
    EstimateKind estimate;

    @Option(names = "--ascii", description = "Draw with plain ASCII instead of braille and box lines.")
    boolean ascii;

    @Spec
    CommandSpec spec;

    @Override
    public Integer call() throws Exception {
        if (k < 0) {
            throw new NearfitException("option --k: k must be at least 1, not " + k);
        }
        EstimateKind curve = estimate == null ? EstimateKind.MEAN : estimate;
        Path target = file;
        List<String> x = inputs;
        String y = response;
        if (target == null) {
            target = demoLog(System.getenv());
            if (x.isEmpty() && y == null) {
                x = List.of("wind_ms");
                y = "power_kw";
            }
        }
        if (!Files.isReadable(target)) {
            throw NearfitException.inFile(target.toString(), Files.exists(target) ? "cannot be read"
                    : file == null ? "the demo site log is missing; run scripts/nearfit once to generate it"
                    : "no such file");
        }
        PrintWriter err = spec.commandLine().getErr();
        if (System.console() == null) {
            err.println("nearfit: view needs an interactive terminal; for a plot on standard output or in a "
                    + "file use: nearfit plot " + target);
            err.flush();
            return Main.EXIT_USAGE;
        }
        return TerminalSession.run(TerminalSession.systemScreen(), target, target.toString(), CoreWorkbench::open,
                new StartSettings(x, y, k, curve), Look.of(ascii, System.getenv()), err);
    }

    static Path demoLog(Map<String, String> env) {
        String home = env.get("NEARFIT_HOME");
        if (home != null && !home.isEmpty()) {
            return Path.of(home).resolve(DEMO);
        }
        return Path.of(DEMO);
    }
}
