package nearfit.cli;

import java.util.concurrent.Callable;

import nearfit.table.NearfitException;
import picocli.CommandLine.Command;

/** Placeholder until the command lands; fails with a clear message rather than pretending. */
@Command(name = "plot", mixinStandardHelpOptions = true, description = "Not built yet.")
final class PlotCommand implements Callable<Integer> {
    @Override
    public Integer call() {
        throw new NearfitException("the plot command is not built yet");
    }
}
