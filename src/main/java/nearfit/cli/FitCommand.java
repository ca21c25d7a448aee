package nearfit.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.Callable;

import nearfit.knn.FlagResult;
import nearfit.knn.Flags;
import nearfit.knn.KnnModel;
import nearfit.knn.TuningTable;
import nearfit.model.ModelFile;
import nearfit.model.ReferenceCapture;
import nearfit.model.ReferenceModel;
import nearfit.model.SafeOutput;
import nearfit.model.SourceInfo;
import nearfit.table.CategoryColumn;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code nearfit fit}: fits a reference on a file's rows and saves it as a model file. */
@Command(name = "fit", mixinStandardHelpOptions = true, sortOptions = false,
        description = "Fit a reference on the rows of FILE and save it as a model file (.nfm) for predict and check.")
final class FitCommand implements Callable<Integer> {
    @Parameters(index = "0", paramLabel = "FILE", description = "CSV file, plain or gzip; - for standard input.")
    String file;

    @Mixin
    ColumnOptions columns;

    @Mixin
    KOption k;

    @Option(names = "--threshold", paramLabel = "Z", defaultValue = "3.5",
            description = "|z| above which check flags a row (default: ${DEFAULT-VALUE}).")
    String threshold;

    @Option(names = "-o", required = true, paramLabel = "MODEL", description = "The model file to write.")
    Path output;

    @Mixin
    TuningOptions tuning;

    @Mixin
    ModelOptions model;

    @Spec
    CommandSpec spec;

    @Override
    public Integer call() {
        int chosenK = k.value();
        double z = OptionValues.positiveNumber("--threshold", threshold);
        tuning.validate();
        List<Path> inputs = "-".equals(file) ? List.of() : List.of(Path.of(file));
        SafeOutput.checkTarget(output, model.force, inputs);
        PrintWriter err = spec.commandLine().getErr();
        ReferenceInput input = ReferenceInput.load(file, columns, model, err);
        TuningOptions.Fitted fitted = tuning.fit(input.data(), model.settings(1, z), chosenK, model.threads(), err,
                model.quiet);
        KnnModel engine = fitted.engine();
        TuningOptions.Result tuned = fitted.tuned();
        FlagResult loo = null;
        if (!input.data().isCategory()) {
            TerminalProgress progress = TerminalProgress.of(err, "leave-one-out", model.quiet);
            loo = Flags.leaveOneOut(engine, progress);
            progress.done();
        }
        ReferenceModel saved = capture(input, engine, loo, tuned);
        ModelFile.write(saved, output, model.force, inputs);
        spec.commandLine().getOut().printf("fitted k = %d on %s; wrote %s%n", saved.settings().k(),
                input.describe(), output);
        spec.commandLine().getOut().flush();
        return 0;
    }

    private ReferenceModel capture(ReferenceInput input, KnnModel engine, FlagResult loo, TuningOptions.Result tuned) {
        SourceTable src = input.source();
        SourceInfo source = new SourceInfo(src.name(), src.sizeBytes(), src.sha256(),
                model.where == null || model.where.isBlank() ? null : model.where.trim());
        CategoryColumn group = input.group();
        TuningTable table = tuned == null ? null : tuned.table();
        return ReferenceCapture.capture(ToolVersion.get(), source, engine, loo, table,
                tuned == null ? -1 : tuned.sampled(), input.responseLabels(),
                group == null ? null : group.name(), group == null ? List.of() : group.labels(),
                group == null ? row -> -1 : group::code, src.table()::lineOf);
    }
}
