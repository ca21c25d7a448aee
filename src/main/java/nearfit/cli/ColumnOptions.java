package nearfit.cli;

import java.util.ArrayList;
import java.util.List;

import nearfit.table.NearfitException;

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
        List<String> names = new ArrayList<>();
        for (String part : inputs.split(",", -1)) {
            String name = part.trim();
            if (name.isEmpty()) {
                throw new NearfitException("-x: \"" + inputs + "\" has an empty column name");
            }
            if (names.contains(name)) {
                throw new NearfitException("-x: column \"" + name + "\" is named twice");
            }
            names.add(name);
        }
        if (names.contains(response())) {
            throw new NearfitException("-x: column \"" + response() + "\" is the response (-y)");
        }
        return names;
    }

    String response() {
        return response.trim();
    }
}
