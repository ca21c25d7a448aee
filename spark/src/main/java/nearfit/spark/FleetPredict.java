package nearfit.spark;

import java.io.PrintWriter;
import java.util.concurrent.Callable;

import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

/**
 * The fleet {@code predict}: every row meeting the condition with the model's fit and band, and where the
 * inputs carry the response, its residual and z, written as Parquet to {@code -o DIR} with its file and row
 * index in place of the single-machine line number.
 */
@Command(name = "predict", mixinStandardHelpOptions = true, sortOptions = false,
        description = "Write every row of the INPUTs with the model's fit, band_lo and band_hi, and where they have "
                + "the response, resid and z, as Parquet to -o DIR (file and row, the 0-based index in it, trace each row).")
final class FleetPredict implements Callable<Integer> {
    @Mixin
    FleetOptions options;

    @Option(names = "-o", required = true, paramLabel = "DIR", description = "The output folder (Parquet).")
    String output;

    @Spec
    CommandSpec spec;

    @Override
    public Integer call() {
        FleetRun run = FleetRun.start(options, "predict", false, ScoringPlan.Emit.ALL, 0);
        FleetTally tally = run.execute(output, options.force);
        PrintWriter err = spec.commandLine().getErr();
        FleetCheck.notes(tally, err);
        err.println("nearfit-spark: wrote " + tally.written + " rows to " + output);
        err.flush();
        return 0;
    }
}
