package nearfit.cli;

import java.util.List;

import picocli.CommandLine.Option;

/** {@code -x COL[,COL...] -y COL}: the inputs and the response (a picocli mixin). */
final class ColumnOptions {
    @Option(names = "-x", required = true, paramLabel = "COL[,COL...]",
            description = "Input columns, comma-separated; the first is the display input of plots.")
    String inputs;

    @Option(names = "-y", required = true, paramLabel = "COL", description = "Response column.")
    String response;

    /** The input names, checked: none empty, none repeated, not the response. */
    List<String> inputs() {
        List<String> names = OptionValues.columnList("-x", inputs);
        if (names.contains(response())) {
            throw new nearfit.table.NearfitException("-x: column \"" + response() + "\" is the response (-y)");
        }
        return names;
    }

    String response() {
        return response.trim();
    }
}
