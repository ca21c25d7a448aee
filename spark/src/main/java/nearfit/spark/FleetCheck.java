package nearfit.spark;

import java.io.PrintWriter;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.concurrent.Callable;

import nearfit.cli.CheckReport;
import nearfit.knn.ReferenceReach;
import nearfit.model.ModelColumns;
import nearfit.knn.KnnSettings;
import nearfit.table.NearfitException;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

/**
 * The fleet {@code check}: the single-machine check's counts, verdict and report (the same text and JSON, built
 * by {@link CheckReport}), over every row of many files; flagged rows go to {@code -o DIR} as Parquet.
 */
@Command(name = "check", mixinStandardHelpOptions = true, sortOptions = false,
        description = "Score the rows of the INPUTs against a reference model on Spark and report as nearfit check "
                + "does; worst rows are named by file and row index. Exit status 0 when the flagged share is within "
                + "--limit (and the share beyond the reference within --max-outside), 1 when it is not, 2 for an "
                + "error, including fewer than --min-rows rows scored.")
final class FleetCheck implements Callable<Integer> {
    /** Worst rows listed in the report, as single-machine. */
    static final int WORST_ROWS = 10;

    @Mixin
    FleetOptions options;

    @Option(names = "--limit", paramLabel = "PCT", defaultValue = "1",
            description = "Largest flagged share that passes, in percent (default: ${DEFAULT-VALUE}).")
    double limit;

    @Option(names = "--max-outside", paramLabel = "PCT",
            description = "Largest share of scored rows beyond the reference that passes, in percent (default: no limit).")
    Double maxOutside;

    @Option(names = "--min-rows", paramLabel = "N", defaultValue = "1",
            description = "Fewest rows scored for a check to be judged (default: ${DEFAULT-VALUE}).")
    long minRows;

    @Option(names = "--format", paramLabel = "text|json", defaultValue = "text", description = "Report format (default: text).")
    String format;

    @Option(names = "-o", paramLabel = "DIR", description = "Also write the flagged rows to this folder as Parquet.")
    String flaggedOutput;

    @Spec
    CommandSpec spec;

    @Override
    public Integer call() {
        if (!"text".equals(format) && !"json".equals(format)) {
            throw new NearfitException("--format: must be text or json, not \"" + format + "\"");
        }
        percent("--limit", limit);
        if (maxOutside != null) {
            percent("--max-outside", maxOutside);
        }
        FleetRun run = FleetRun.start(options, "check", true, flaggedOutput == null ? ScoringPlan.Emit.NONE
                : ScoringPlan.Emit.FLAGGED, WORST_ROWS);
        FleetTally tally = run.execute(flaggedOutput, options.force);
        PrintWriter err = spec.commandLine().getErr();
        notes(tally, err);
        if (tally.scored < minRows) {
            throw NearfitException.inFile(String.join(" ", options.inputs), tooFew(tally));
        }
        CheckReport report = report(run, tally);
        PrintWriter out = spec.commandLine().getOut();
        if ("json".equals(format)) {
            out.println(report.toJson());
        } else {
            report.writeText(out);
        }
        out.flush();
        return report.passed() ? 0 : FleetMain.EXIT_CHECK_FAILED;
    }

    private static void percent(String option, double v) {
        if (!(v >= 0 && v <= 100)) {
            throw new NearfitException(option + ": must be a percentage from 0 to 100, not " + v);
        }
    }

    /** Bad cells and malformed lines, on standard error, as the single-machine loader notes them. */
    static void notes(FleetTally tally, PrintWriter err) {
        if (tally.badCells > 0) {
            err.println("nearfit-spark: note: " + tally.badCells + " cells of the model's columns are not numbers "
                    + "(or times); read as missing");
        }
        if (tally.malformed > 0) {
            err.println("nearfit-spark: note: " + tally.malformed + " lines with the wrong number of cells skipped");
        }
        err.flush();
    }

    private String tooFew(FleetTally t) {
        StringBuilder sb = new StringBuilder(t.scored == 0 ? "no row scored"
                : "only " + t.scored + (t.scored == 1 ? " row" : " rows") + " scored");
        sb.append(" (--min-rows ").append(minRows).append("): ").append(t.rows)
                .append(options.where == null ? (t.rows == 1 ? " row" : " rows") + " read"
                        : " rows meet --where \"" + options.where.trim() + "\"");
        return sb.toString();
    }

    private CheckReport report(FleetRun run, FleetTally t) {
        ModelColumns c = run.stored.columns();
        KnnSettings s = WorkerModel.withZScale(run.stored.settings(), WorkerModel.flagScale(run.zScale));
        String where = options.where == null || options.where.isBlank() ? null : options.where.trim();
        CheckReport.About about = new CheckReport.About(options.modelFile, run.modelSha256,
                String.join(" ", options.inputs), where, s, CheckReport.scheme(run.stored.tuning()),
                run.stored.residualScale().median(),
                run.stored.residualScale().scale(), FleetMain.toolVersion(),
                Instant.now().truncatedTo(ChronoUnit.SECONDS), c.inputs(), c.response(), run.input.groupColumn,
                run.input.timeColumn)
                .withBasis(CheckReport.Basis.of(run.driverModel.basis, run.stored.residualScale().scheme()));
        ReferenceReach reach = run.driverModel.reach;
        int d = c.inputs().size();
        double[] min = new double[d];
        double[] max = new double[d];
        for (int j = 0; j < d; j++) {
            min[j] = reach.min(j);
            max[j] = reach.max(j);
        }
        CheckReport.Beyond beyond = new CheckReport.Beyond(min, max, t.below.clone(), t.above.clone(), t.far,
                reach.farWidth(), t.beyond, maxOutside == null ? Double.NaN : maxOutside / 100.0);
        List<CheckReport.GroupCount> groups = new ArrayList<>();
        for (Map.Entry<String, long[]> e : t.groups.entrySet()) {
            long[] g = e.getValue();
            groups.add(new CheckReport.GroupCount(e.getKey(), g[0], g[1], g[2], g[3]));
        }
        List<CheckReport.WorstRow> worst = new ArrayList<>();
        for (FleetTally.Worst w : t.worst()) {
            worst.add(new CheckReport.WorstRow(w.row(), w.time(), w.group(), w.inputs(), w.response(), w.fit(),
                    w.bandLow(), w.bandHigh(), w.z(), w.beyond(), w.file()));
        }
        return new CheckReport(about, t.rows, t.scored, t.flagged, limit / 100.0, run.threshold, beyond, groups,
                worst);
    }
}
