package nearfit.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;

import nearfit.model.ModelColumns;
import nearfit.model.ModelFile;
import nearfit.model.ReferenceModel;
import nearfit.model.RestoredModel;
import nearfit.model.SafeOutput;
import nearfit.table.CategoryColumn;
import nearfit.table.NearfitException;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/**
 * {@code nearfit check}: scores new readings against a reference; exit 0 when the flagged share is
 * within the limit, 1 when it is not, 2 for a usage or input error.
 */
@Command(name = "check", mixinStandardHelpOptions = true, sortOptions = false,
        description = "Score the rows of FILE against a reference model: rows, rows scored, rows flagged "
                + "(|z| above the threshold) and their share, per group, and the worst rows. "
                + "Exit status 0 when the flagged share is within --limit, 1 when it is not, 2 for an error.")
final class CheckCommand implements Callable<Integer> {
    /** Worst rows listed in the report. */
    static final int WORST_ROWS = 10;

    @Parameters(index = "0", paramLabel = "MODEL", description = "A model file written by fit.")
    Path modelFile;

    @Parameters(index = "1", paramLabel = "FILE", description = "CSV file, plain or gzip; - for standard input.")
    String file;

    @Option(names = "--limit", paramLabel = "PCT", defaultValue = "1",
            description = "Largest flagged share that passes, in percent (default: ${DEFAULT-VALUE}).")
    String limit;

    @Option(names = "--threshold", paramLabel = "Z",
            description = "|z| above which a row is flagged (default: the model's, normally 3.5).")
    String threshold;

    @Option(names = "--format", paramLabel = "text|json", defaultValue = "text",
            description = "Report format (default: ${DEFAULT-VALUE}).")
    String format;

    @Option(names = "-o", paramLabel = "FLAGGED", description = "Also write the flagged rows here as CSV.")
    Path flaggedOutput;

    @Mixin
    ModelOptions model;

    @Spec
    CommandSpec spec;

    @Override
    public Integer call() {
        double limitFraction = OptionValues.percent("--limit", limit);
        Double z = threshold == null ? null : OptionValues.positiveNumber("--threshold", threshold);
        boolean json = "json".equals(OptionValues.oneOf("--format", format, List.of("text", "json")));
        model.validate();
        List<Path> inputs = new ArrayList<>(List.of(modelFile));
        if (!"-".equals(file)) {
            inputs.add(ArgumentPath.of(file));
        }
        if (flaggedOutput != null) {
            SafeOutput.checkTarget(flaggedOutput, model.force, inputs);
        }
        ReferenceModel stored = ModelFile.read(modelFile);
        ModelColumns columns = stored.columns();
        if (columns.categoryResponse()) {
            throw new NearfitException("check: needs a model of a number response; " + columns.response()
                    + " is a category (use predict for class votes)");
        }
        RestoredModel restored = RestoredModel.of(stored, model.over(stored.settings()), model.threads());
        ScoredRows scored = ScoredRows.open(restored, file, model, spec.commandLine().getErr());
        if (!scored.hasResponse()) {
            throw NearfitException.inFile(file, "has no column \"" + columns.response()
                    + "\", the model's response, so nothing can be checked");
        }
        double cut = z == null ? stored.settings().flagThreshold() : z;
        CategoryColumn g = scored.group();
        CheckReport.Tally tally = new CheckReport.Tally(g == null ? List.of() : g.labels(), cut, WORST_ROWS);
        if (flaggedOutput == null) {
            scored.forEachBlock(b -> count(tally, b));
        } else {
            // Flagged rows are written as they are found, so none is kept in memory.
            PredictionCsv.write(flaggedOutput, model.force, inputs, null, w -> {
                PredictionCsv csv = new PredictionCsv(w, scored, columns.response(), List.of());
                scored.forEachBlock(b -> {
                    count(tally, b);
                    csv.rows(b, (block, i) -> Math.abs(block.z()[i]) > cut);
                });
                csv.flush();
            });
        }
        CheckReport report = tally.report(limitFraction);
        PrintWriter out = spec.commandLine().getOut();
        if (json) {
            out.println(report.toJson());
            out.flush();
        } else {
            report.writeText(out, columns.response(), g == null ? null : g.name());
        }
        return report.passed() ? 0 : Main.EXIT_CHECK_FAILED;
    }

    private static void count(CheckReport.Tally tally, ScoredRows.Block b) {
        double[] zs = b.z();
        double[] y = b.response();
        double[] fit = b.estimates().fit();
        int[] groups = b.groups();
        for (int i = 0; i < b.size(); i++) {
            tally.add(zs[i], y[i], fit[i], b.lines()[i], groups == null ? -1 : groups[i]);
        }
    }
}
