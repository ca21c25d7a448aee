package nearfit.tui.session;

import java.util.ArrayList;
import java.util.List;

import nearfit.knn.EstimateKind;
import nearfit.table.NearfitException;
import nearfit.tui.keys.ViewState;
import nearfit.tui.results.ColumnInfo;
import nearfit.tui.results.ColumnKind;

/**
 * The command line's choices for the first view, checked against the loaded columns.
 *
 * @param inputs   the inputs asked with {@code -x}, empty to choose
 * @param response the response asked with {@code -y}, {@code null} to choose
 * @param k        the k asked with {@code --k}, 0 to choose
 * @param estimate the curve asked with {@code --estimate}
 */
public record StartSettings(List<String> inputs, String response, int k, EstimateKind estimate) {
    /** k when none is asked: small enough for a small file, smooth enough for a long log (common practice). */
    static final int DEFAULT_K = 20;

    /** The demo site's response and first input: a turbine's power curve. */
    static final String SITE_RESPONSE = "power_kw";
    static final String SITE_INPUT = "wind_ms";

    public StartSettings {
        inputs = List.copyOf(inputs);
    }

    /** The choices with the mean as the curve. */
    public StartSettings(List<String> inputs, String response, int k) {
        this(inputs, response, k, EstimateKind.MEAN);
    }

    /**
     * The first state for these columns. With neither {@code -y} nor {@code -x}, a file with the demo site's
     * columns {@value #SITE_RESPONSE} and {@value #SITE_INPUT} opens on power against wind speed, whatever its
     * name. Otherwise, without {@code -y} the response is the last number column; without {@code -x} the input
     * is the first number column that is not the response.
     *
     * @throws NearfitException naming the option when a column is missing or of the wrong kind
     */
    public ViewState initialState(List<ColumnInfo> columns, int rows) {
        boolean site = response == null && inputs.isEmpty() && isNumber(columns, SITE_RESPONSE)
                && isNumber(columns, SITE_INPUT);
        String y = site ? SITE_RESPONSE : response != null ? response : lastNumber(columns, inputs);
        if (y == null) {
            throw new NearfitException("the file has no number column to use as the response");
        }
        checkColumn(columns, y, "-y", false);
        List<String> x = new ArrayList<>(site ? List.of(SITE_INPUT) : inputs);
        if (x.isEmpty()) {
            for (ColumnInfo c : columns) {
                if (c.kind() == ColumnKind.NUMBER && !c.name().equals(y)) {
                    x.add(c.name());
                    break;
                }
            }
        }
        if (x.isEmpty()) {
            throw new NearfitException("the file has no number column to use as an input besides " + y);
        }
        for (String in : x) {
            checkColumn(columns, in, "-x", true);
            if (in.equals(y)) {
                throw new NearfitException("option -x: " + in + " is also the response (-y)");
            }
        }
        int chosenK = k > 0 ? k : Math.max(1, Math.min(DEFAULT_K, rows - 1));
        return ViewState.initial(y, x, chosenK, estimate);
    }

    private static boolean isNumber(List<ColumnInfo> columns, String name) {
        for (ColumnInfo c : columns) {
            if (c.name().equals(name)) {
                return c.kind() == ColumnKind.NUMBER;
            }
        }
        return false;
    }

    private static String lastNumber(List<ColumnInfo> columns, List<String> inputs) {
        String last = null;
        for (ColumnInfo c : columns) {
            if (c.kind() == ColumnKind.NUMBER && !inputs.contains(c.name())) {
                last = c.name();
            }
        }
        return last;
    }

    private static void checkColumn(List<ColumnInfo> columns, String name, String option, boolean input) {
        for (ColumnInfo c : columns) {
            if (c.name().equals(name)) {
                boolean ok = input ? c.kind().numeric() : c.kind() == ColumnKind.NUMBER || c.kind() == ColumnKind.CATEGORY;
                if (!ok) {
                    throw new NearfitException("option " + option + ": column " + name + " holds "
                            + c.kind().name().toLowerCase(java.util.Locale.ROOT) + " values, which cannot be "
                            + (input ? "an input" : "a response"));
                }
                return;
            }
        }
        throw new NearfitException("option " + option + ": no column named " + name);
    }
}
