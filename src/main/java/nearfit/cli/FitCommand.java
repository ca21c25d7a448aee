package nearfit.cli;

import java.util.concurrent.Callable;

import nearfit.table.NearfitException;
import picocli.CommandLine.Command;

/** Placeholder until the command lands; fails with a clear message rather than pretending. */
@Command(name = "fit", mixinStandardHelpOptions = true, description = "Not built yet.")
final class FitCommand implements Callable<Integer> {
    @Override
    public Integer call() {
        throw new NearfitException("the fit command is not built yet");
    }
}
