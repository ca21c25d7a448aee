package nearfit.cli;

import java.util.concurrent.Callable;

import nearfit.table.NearfitException;
import picocli.CommandLine.Command;

/** Placeholder until the command lands; fails with a clear message rather than pretending. */
@Command(name = "tune", mixinStandardHelpOptions = true, description = "Not built yet.")
final class TuneCommand implements Callable<Integer> {
    @Override
    public Integer call() {
        throw new NearfitException("the tune command is not built yet");
    }
}
