package nearfit.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.Callable;

import nearfit.knn.HeldOutBlocks;
import nearfit.knn.KnnModel;
import nearfit.knn.ReferenceData;
import nearfit.knn.Tuning;
import nearfit.knn.TuningTable;
import nearfit.knn.ZBasis;
import nearfit.model.ModelFile;
import nearfit.model.ReferenceCapture;
import nearfit.model.ReferenceModel;
import nearfit.model.SafeOutput;
import nearfit.model.SourceInfo;
import nearfit.table.CategoryColumn;
import nearfit.table.NearfitException;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/** {@code nearfit fit}: fits a reference on a file's rows and saves it as a model file. */
@Command(name = "fit", mixinStandardHelpOptions = true, sortOptions = false,
        description = "Fit a reference on the rows of FILE and save it as a model file (.nfm) for predict and check.")
final class FitCommand implements Callable<Integer> {
    @Parameters(index = "0", paramLabel = "FILE", description = "CSV file (plain or gzip), Parquet file, or folder of Parquet files; - for standard input.")
    String file;

    @Mixin
    ColumnOptions columns;

    @Mixin
    KOption k;

    @Option(names = "--threshold", paramLabel = "Z", defaultValue = "3.5", converter = OptionNumbers.Positive.class,
            description = "|z| above which check flags a row (default: ${DEFAULT-VALUE}).")
    double threshold;

    @Option(names = "-o", required = true, paramLabel = "MODEL", description = "The model file to write.")
    Path output;

    @Mixin
    TuningOptions tuning;

    @Mixin
    ModelOptions model;

    @Override
    public Integer call() {
        int chosenK = k.value();
        double z = threshold;
        tuning.validate();
        List<Path> inputs = "-".equals(file) ? List.of() : List.of(ArgumentPath.of(file));
        if (CommandOutput.isStandardOutput(output)) {
            throw new NearfitException("-o -: a model file is read back by name (predict, check) and is no stream; "
                    + "name a file to write");
        }
        SafeOutput.checkTarget(output, model.force, inputs);
        PrintWriter err = model.err();
        ReferenceInput input = ReferenceInput.load(file, columns, model, err, tuning.timeColumn(),
                tuning.wantsFirstTime(), true);
        Source source = new Source(input, model.where);
        HeldOutBlocks blocks = tuning.blocks(source.data, input.source().table(), input.group());
        input = null; // the table goes: at 10M rows it holds more than the fit still needs
        TuningOptions.Fitted fitted = tuning.fit(source.data, blocks, model.settings(1, z), chosenK, err, model.quiet);
        KnnModel engine = fitted.engine();
        TuningOptions.Result tuned = fitted.tuned();
        TuningTable table = tuned == null ? null : tuned.table();
        long sampled = tuned == null ? -1 : tuned.sampled();
        ReferenceModel saved;
        if (source.data.isCategory()) {
            saved = ReferenceCapture.captureHeldOut(ToolVersion.get(), source.info, engine,
                    (ZBasis.ReferenceResiduals) null, table, sampled, source.responseLabels, source.groupName,
                    source.groupLabels, source.facts);
        } else {
            // each row's residual under the held-out scheme at the fitted k, stored: --z-scale reference takes the
            // median and MAD of a scored row's neighbours' residuals, so the scale follows the curve
            TerminalProgress progress = TerminalProgress.of(err, "held-out residuals", model.quiet);
            double[] heldOut = Tuning.heldOutResiduals(engine, blocks, progress);
            progress.done();
            saved = ReferenceCapture.captureHeldOut(ToolVersion.get(), source.info, engine, heldOut,
                    blocks.scheme().word(), table, sampled, source.responseLabels, source.groupName,
                    source.groupLabels, source.facts);
        }
        ModelFile.write(saved, output, model.force, inputs);
        model.out().printf("fitted k = %d on %s; wrote %s%n", saved.settings().k(),
                nearfit.table.VisibleText.of(source.described), nearfit.table.VisibleText.of(output.toString()));
        model.out().printf("held out: %s (%d blocks)%s; scaling fitted once on all reference rows%n",
                blocks.scheme().describe(), blocks.count(), tuning.cv.auto() ? " (--cv auto)" : "");
        String edge = saved.tuning() == null ? null : TuneReport.edgeNote(saved.tuning());
        if (edge != null) {
            model.err().println("nearfit: " + edge); // about the choice, not the output: beside warnings
        }
        model.out().flush();
        return 0;
    }

    /** What the fit keeps of its input once the reference rows are built: no table. */
    private static final class Source {
        final ReferenceData data;
        final SourceInfo info;
        final List<String> responseLabels;
        final String groupName;
        final List<String> groupLabels;
        final ReferenceCapture.RowFacts facts;
        final String described;

        private Source(ReferenceInput input, String where) {
            SourceTable src = input.source();
            CategoryColumn group = input.group();
            this.data = input.data();
            this.info = new SourceInfo(src.name(), src.sizeBytes(), src.sha256(),
                    where == null || where.isBlank() ? null : where.trim(), src.parquetFiles());
            this.responseLabels = input.responseLabels();
            this.groupName = group == null ? null : group.name();
            this.groupLabels = group == null ? List.of() : group.labels();
            this.facts = ReferenceCapture.RowFacts.of(data, group != null, group == null ? row -> -1 : group::code,
                    src.table()::lineOf);
            this.described = input.describe();
        }
    }
}
