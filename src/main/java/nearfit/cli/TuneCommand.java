package nearfit.cli;

import java.io.PrintWriter;
import java.util.concurrent.Callable;

import nearfit.knn.HeldOutBlocks;
import nearfit.knn.KnnModel;
import nearfit.knn.KnnSettings;
import nearfit.model.ReferenceCapture;
import nearfit.model.TuningSummary;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/** {@code nearfit tune}: RMSE and MAE with standard errors for every k, the lowest-RMSE k and the one-SE k. */
@Command(name = "tune", mixinStandardHelpOptions = true, sortOptions = false,
        description = "Choose k by cross-validation: error figures for every k from 1 to --kmax, "
                + "the lowest-RMSE k and the one-SE k (the largest k within one standard error of the best).")
final class TuneCommand implements Callable<Integer> {
    @Parameters(index = "0", paramLabel = "FILE", description = "CSV file (plain or gzip), Parquet file, or folder of Parquet files; - for standard input.")
    String file;

    @Mixin
    ColumnOptions columns;

    @Mixin
    TuningOptions tuning;

    @Option(names = "--format", paramLabel = "table|csv|json", defaultValue = "table",
            converter = OptionChoices.TuneFormatWords.class, completionCandidates = OptionChoices.TuneFormatWords.class,
            description = "Output format (default: table).")
    OptionChoices.TuneFormat format;

    @Mixin
    ModelOptions model;

    @Override
    public Integer call() {
        tuning.validate();
        PrintWriter err = model.err();
        ReferenceInput input = ReferenceInput.load(file, columns, model, err, tuning.timeColumn(),
                tuning.wantsFirstTime(), false);
        HeldOutBlocks blocks = tuning.blocks(input.data(), input.source().table(), input.group());
        KnnModel engine = KnnModel.fit(input.data(), model.settings(1, KnnSettings.DEFAULT_FLAG_THRESHOLD));
        TuningOptions.Result r = tuning.run(engine, blocks, tuning.largestK(),
                TerminalProgress.of(err, "tuning", model.quiet));
        TuningSummary summary = ReferenceCapture.summary(r.table(), r.sampled());
        TuneReport.write(summary, format, model.out());
        return 0;
    }
}
