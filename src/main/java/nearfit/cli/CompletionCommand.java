package nearfit.cli;

import java.util.concurrent.Callable;

import nearfit.table.NearfitException;
import picocli.AutoComplete;
import picocli.CommandLine.Command;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

/** {@code nearfit completion bash}: prints a bash completion script generated from the command model. */
@Command(name = "completion", mixinStandardHelpOptions = true,
        description = "Print a shell completion script (bash).")
final class CompletionCommand implements Callable<Integer> {
    @Parameters(index = "0", paramLabel = "SHELL", description = "The shell: bash.")
    String shell;

    @Spec
    CommandSpec spec;

    @Override
    public Integer call() {
        if (!"bash".equals(shell)) {
            throw new NearfitException("completion: only bash is supported, not \"" + shell + "\"");
        }
        spec.commandLine().getOut().print(AutoComplete.bash("nearfit", Main.commandLine()));
        spec.commandLine().getOut().flush();
        return 0;
    }
}
