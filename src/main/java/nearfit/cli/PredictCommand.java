package nearfit.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;

import nearfit.knn.ReferenceReach;
import nearfit.model.ModelFile;
import nearfit.model.ReferenceModel;
import nearfit.model.RestoredModel;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/** {@code nearfit predict}: the model's fit and band at every row of a file, as CSV. */
@Command(name = "predict", mixinStandardHelpOptions = true, sortOptions = false,
        description = "Write every row of FILE with the model's fit, band_lo and band_hi, and where FILE has the "
                + "response, resid and z (a category response: the predicted class and its vote share), then beyond "
                + "(1 where the row lies beyond the reference, so its fit is an extrapolation). CSV (or Parquet) "
                + "keeping the source line number.")
final class PredictCommand implements Callable<Integer> {
    @Parameters(index = "0", paramLabel = "MODEL", description = "A model file written by fit.")
    Path modelFile;

    @Parameters(index = "1", paramLabel = "FILE", description = "CSV file (plain or gzip), Parquet file, or folder of Parquet files; - for standard input.")
    String file;

    @Option(names = "-o", paramLabel = "OUT", description = "Write the rows here instead of standard output "
            + "(- is standard output): Parquet when the name ends in .parquet, else CSV.")
    Path output;

    @Option(names = "--loo", description = "FILE is the model's own reference file: write leave-one-out "
            + "predictions of the reference rows instead (band cells empty).")
    boolean loo;

    @Mixin
    ModelOptions model;

    @Override
    public Integer call() {
        model.validate();
        List<Path> inputs = new ArrayList<>(List.of(modelFile));
        if (!"-".equals(file)) {
            inputs.add(ArgumentPath.of(file));
        }
        CommandOutput.check(output, model.force, inputs);
        ReferenceModel stored = ModelFile.read(modelFile);
        RestoredModel restored = RestoredModel.of(stored, model.over(stored.settings()), model.threads());
        PrintWriter out = model.out();
        if (loo) {
            LeaveOneOutCsv.write(restored, file, output, model.force, inputs, out);
        } else {
            ScoredRows scored = ScoredRows.open(restored, file, model, restored.settings().flagThreshold(),
                    model.err());
            ReferenceReach reach = ReferenceReach.of(restored.engine());
            PredictionCsv.write(scored, restored.stored().columns().response(),
                    restored.stored().columns().responseLabels(), reach, output, model.force, inputs, out,
                    (b, i) -> true);
        }
        out.flush();
        return 0;
    }
}
