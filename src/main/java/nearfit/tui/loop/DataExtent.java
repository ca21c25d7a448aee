package nearfit.tui.loop;

import java.util.HashMap;
import java.util.Map;

import nearfit.tui.bench.Workbench;

/**
 * Quantiles of the table's columns as the explorer needs them for a curve request (the display input's
 * extent, the held values): asked of the core once per column, row condition and level, then kept. Used
 * from the explorer's thread only.
 */
final class DataExtent {
    private record Key(String column, String condition, double q) {
    }

    private final Workbench workbench;
    private final Map<Key, Double> quantiles = new HashMap<>();

    DataExtent(Workbench workbench) {
        this.workbench = workbench;
    }

    /** The {@code q}-quantile (0 to 1) of a column over the rows of a condition. */
    double quantile(String column, String condition, double q) {
        return quantiles.computeIfAbsent(new Key(column, condition, q),
                k -> workbench.quantile(k.column(), k.condition(), k.q()));
    }
}
