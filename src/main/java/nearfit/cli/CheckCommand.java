package nearfit.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;

import nearfit.knn.ReferenceReach;
import nearfit.model.ModelColumns;
import nearfit.model.ModelFile;
import nearfit.model.ReferenceModel;
import nearfit.model.RestoredModel;
import nearfit.table.CategoryColumn;
import nearfit.table.NearfitException;
import nearfit.table.VisibleText;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/**
 * {@code nearfit check}: scores new readings against a reference; exit 0 when the flagged share is
 * within the limit, 1 when it is not, 2 for a usage or input error.
 */
@Command(name = "check", mixinStandardHelpOptions = true, sortOptions = false,
        description = "Score the rows of FILE against a reference model. The report names what was checked (model "
                + "file and its SHA-256, data file, row condition, k and how it was chosen, metric, threshold, z scale, "
                + "tool version, time of the run), then gives rows, rows scored, rows flagged (|z| above the "
                + "threshold) and their share, the rows beyond the reference (outside an input's range, or far from "
                + "every reference row: the fit there is an extrapolation), counts per group, and the worst rows with "
                + "their line, time, group and inputs. "
                + "Exit status 0 when the flagged share is within --limit (and the share beyond the reference within "
                + "--max-outside, when given), 1 when it is not, 2 for an error, including fewer than --min-rows "
                + "rows scored (an empty batch or a row condition that matches nothing never passes).")
final class CheckCommand implements Callable<Integer> {
    /** Worst rows listed in the report. */
    static final int WORST_ROWS = 10;

    @Parameters(index = "0", paramLabel = "MODEL", description = "A model file written by fit.")
    Path modelFile;

    @Parameters(index = "1", paramLabel = "FILE", description = "CSV file (plain or gzip), Parquet file, or folder of Parquet files; - for standard input.")
    String file;

    @Option(names = "--limit", converter = OptionNumbers.Percent.class, paramLabel = "PCT", defaultValue = "1",
            description = "Largest flagged share that passes, in percent (default: ${DEFAULT-VALUE}).")
    double limit;

    @Option(names = "--max-outside", converter = OptionNumbers.Percent.class, paramLabel = "PCT",
            description = "Largest share of scored rows beyond the reference that passes, in percent "
                    + "(default: no limit; the share is always reported).")
    Double maxOutside;

    @Option(names = "--min-rows", converter = OptionNumbers.Count.class, paramLabel = "N", defaultValue = "1",
            description = "Fewest rows scored for a check to be judged; fewer is an error, exit status 2 "
                    + "(default: ${DEFAULT-VALUE}).")
    int minRows;

    @Option(names = "--threshold", converter = OptionNumbers.Positive.class, paramLabel = "Z",
            description = "|z| above which a row is flagged (default: the model's, normally 3.5).")
    Double threshold;

    @Option(names = "--format", paramLabel = "text|json", defaultValue = "text",
            converter = OptionChoices.CheckFormatWords.class, completionCandidates = OptionChoices.CheckFormatWords.class,
            description = "Report format (default: text).")
    OptionChoices.CheckFormat format;

    @Option(names = "-o", paramLabel = "FLAGGED",
            description = "Also write the flagged rows here as CSV, or Parquet when the name ends in .parquet (line, time, group, inputs, response, fit, band_lo, "
                    + "band_hi, resid, z); - writes them to standard output and the report to standard error. An "
                    + "existing file is kept unless --force is given: add --force when a cron job writes the same "
                    + "file every run.")
    Path flaggedOutput;

    @Mixin
    ModelOptions model;

    @Override
    public Integer call() {
        double limitFraction = limit;
        double maxOutsideFraction = maxOutside == null ? Double.NaN : maxOutside;
        int leastRows = minRows;
        Double z = threshold;
        boolean json = format == OptionChoices.CheckFormat.JSON;
        model.validate();
        List<Path> inputs = new ArrayList<>(List.of(modelFile));
        if (!"-".equals(file)) {
            inputs.add(ArgumentPath.of(file));
        }
        CommandOutput.check(flaggedOutput, model.force, inputs);
        ReferenceModel stored = ModelFile.read(modelFile);
        ModelColumns columns = stored.columns();
        if (columns.categoryResponse()) {
            throw new NearfitException("check: needs a model of a number response; " + columns.response()
                    + " is a category (use predict for class votes)");
        }
        String modelSha = SourceTable.sha256Of(modelFile, modelFile.toString());
        RestoredModel restored = RestoredModel.of(stored, model.over(stored.settings()), model.threads());
        double cut = z == null ? stored.settings().flagThreshold() : z;
        ScoredRows scored = ScoredRows.open(restored, file, model, cut, model.err());
        if (!scored.hasResponse()) {
            throw NearfitException.inFile(file, "has no column \"" + columns.response()
                    + "\", the model's response, so nothing can be checked");
        }
        CategoryColumn g = scored.group();
        CheckReport.About about = about(stored, restored, modelSha, scored, cut);
        ReferenceReach reach = ReferenceReach.of(restored.engine());
        CheckReport.Tally tally = new CheckReport.Tally(about, g == null ? List.of() : g.labels(), cut, reach,
                WORST_ROWS);
        PrintWriter out = model.out();
        if (flaggedOutput == null) {
            scored.forEachBlock(tally::add);
            requireRows(tally, scored, leastRows);
        } else {
            // Flagged rows are written as they are found, so none is kept in memory; too few rows scored
            // fails inside the write, so no file is left behind.
            PredictionCsv.Body flaggedRows = csv -> {
                scored.forEachBlock(b -> {
                    tally.add(b);
                    csv.rows(b, (block, i) -> block.scores().flagged()[i]);
                });
                requireRows(tally, scored, leastRows);
            };
            PredictionCsv.open(flaggedOutput, model.force, inputs, out, scored, columns.response(), List.of(), reach,
                    flaggedRows);
        }
        CheckReport report = tally.report(limitFraction, maxOutsideFraction);
        if (CommandOutput.isStandardOutput(flaggedOutput)) {
            // Standard output holds the flagged rows' CSV; the report must not land in the middle of it.
            out = model.err();
        }
        if (json) {
            out.println(report.toJson());
            out.flush();
        } else {
            report.writeText(out);
        }
        return report.passed() ? 0 : Main.EXIT_CHECK_FAILED;
    }

    /** What the check runs on, for the report's header. */
    private CheckReport.About about(ReferenceModel stored, RestoredModel restored, String modelSha, ScoredRows scored,
                                    double cut) {
        String where = model.where == null || model.where.isBlank() ? null : model.where.trim();
        ModelColumns c = stored.columns();
        return new CheckReport.About(modelFile.toString(), modelSha, file, where, restored.settings(),
                CheckReport.scheme(stored.tuning()), stored.residualScale().median(),
                stored.residualScale().scale(), ToolVersion.get(), Instant.now().truncatedTo(ChronoUnit.SECONDS),
                c.inputs(), c.response(), scored.group() == null ? null : scored.group().name(),
                scored.time() == null ? null : scored.time().name(), scored.rowSource())
                .withBasis(CheckReport.Basis.of(scored.zBasis(), stored.residualScale().scheme()));
    }

    /**
     * Fails with exit status 2 when fewer than {@code least} rows were scored, saying in one line what
     * matched nothing: the file's rows, those meeting the row condition, those left out for missing values.
     */
    private void requireRows(CheckReport.Tally tally, ScoredRows scored, int least) {
        if (tally.scored() >= least) {
            return;
        }
        StringBuilder sb = new StringBuilder(tally.scored() == 0 ? "no row scored"
                : "only " + tally.scored() + (tally.scored() == 1 ? " row" : " rows") + " scored");
        sb.append(" (--min-rows ").append(least).append("): ");
        boolean where = model.where != null && !model.where.isBlank();
        if (where) {
            sb.append(tally.rows()).append(" of ").append(scored.fileRows()).append(" rows meet --where \"")
                    .append(VisibleText.of(model.where.trim())).append('"');
        } else {
            sb.append("the file has ").append(tally.rows()).append(tally.rows() == 1 ? " row" : " rows");
        }
        long left = tally.rows() - tally.scored();
        if (left > 0) {
            sb.append("; ").append(left).append(" left out for missing values (").append(tally.missingValues())
                    .append(')');
        }
        throw NearfitException.inFile(file, sb.toString());
    }
}
