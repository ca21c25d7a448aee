package nearfit.cli;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import nearfit.table.NearfitException;
import nearfit.table.RowCondition;

/**
 * The columns a command reads from its file, so that the loader keeps only those: the required ones,
 * each with the option that asked for it (named in the message when the file lacks it), and optional
 * ones kept when the file has them (a file of new readings may lack the response or the group).
 * Immutable; each {@code with} method returns a new request.
 */
final class ColumnRequest {
    /** Asks for no column. */
    static final ColumnRequest NONE = new ColumnRequest(Map.of(), List.of());

    /** Required column name to the option that asked for it, in the order asked; first asker wins. */
    private final Map<String, String> required;
    private final List<String> optional;

    private ColumnRequest(Map<String, String> required, List<String> optional) {
        this.required = required;
        this.optional = optional;
    }

    /** Also requires {@code names}, asked for by {@code option}; {@code null} names are skipped. */
    ColumnRequest require(String option, List<String> names) {
        Map<String, String> r = new LinkedHashMap<>(required);
        for (String n : names) {
            if (n != null) {
                r.putIfAbsent(n.trim(), option);
            }
        }
        return new ColumnRequest(r, optional);
    }

    /** Also requires one column, unless it is {@code null}. */
    ColumnRequest require(String option, String name) {
        return name == null ? this : require(option, List.of(name));
    }

    /** Also keeps {@code names} when the file has them; {@code null} names are skipped. */
    ColumnRequest allow(String... names) {
        List<String> o = new ArrayList<>(optional);
        for (String n : names) {
            if (n != null) {
                o.add(n.trim());
            }
        }
        return new ColumnRequest(required, List.copyOf(o));
    }

    /** Also requires every column the row condition names (none when it is null or blank), for {@code --where}. */
    ColumnRequest where(String condition) {
        if (condition == null || condition.isBlank()) {
            return this;
        }
        try {
            return require("--where", RowCondition.columnsNamed(condition));
        } catch (NearfitException e) {
            throw new NearfitException("--where: " + e.getMessage());
        }
    }

    List<String> required() {
        return List.copyOf(required.keySet());
    }

    List<String> optional() {
        return optional;
    }

    /** The option that asked for a required column, or "column" for one not asked for. */
    String optionOf(String column) {
        return required.getOrDefault(column, "column");
    }
}
