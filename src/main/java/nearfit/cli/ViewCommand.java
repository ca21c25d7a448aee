package nearfit.cli;

import java.util.concurrent.Callable;

import nearfit.table.NearfitException;
import picocli.CommandLine.Command;

/** Placeholder until the command lands; fails with a clear message rather than pretending. */
@Command(name = "view", mixinStandardHelpOptions = true, description = "Not built yet.")
final class ViewCommand implements Callable<Integer> {
    @Override
    public Integer call() {
        throw new NearfitException("the view command is not built yet");
    }
}
