package nearfit.cli;

import picocli.CommandLine.Option;

/** The {@code --k K|auto} option shared by the commands that fit a curve ({@code fit}, {@code plot}). */
final class KOption {
    @Option(names = "--k", paramLabel = "K|auto", defaultValue = "auto", converter = OptionNumbers.KOrAuto.class,
            description = "Neighbours per estimate, or auto for the one-SE k of tuning (default: ${DEFAULT-VALUE}).")
    int k;

    /** The k asked for, or {@link OptionNumbers#K_AUTO} for auto. */
    int value() {
        return k;
    }
}
