package nearfit.model;

import java.util.List;

/**
 * The columns a model uses, by name, with the dictionaries of its category columns.
 *
 * <p>Invariants: at least one input; names distinct; {@code responseLabels} is empty exactly when the
 * response is a number; {@code group} is {@code null} exactly when there is no group column, and then
 * {@code groupLabels} is empty.
 *
 * @param inputs         the input columns, in the order the model's input arrays are stored
 * @param response       the response column
 * @param responseLabels the class labels of a category response (code i is label i), or empty
 * @param group          the group column, or {@code null}
 * @param groupLabels    the group labels (code i is label i), or empty
 */
public record ModelColumns(List<String> inputs, String response, List<String> responseLabels,
                           String group, List<String> groupLabels) {
    /** Copies the lists and checks the invariants. */
    public ModelColumns {
        inputs = List.copyOf(inputs);
        responseLabels = List.copyOf(responseLabels);
        groupLabels = List.copyOf(groupLabels);
        if (inputs.isEmpty()) {
            throw new IllegalArgumentException("a model needs at least one input");
        }
        if (response == null || inputs.contains(response)) {
            throw new IllegalArgumentException("the response must be named and must not be an input");
        }
        if (inputs.stream().distinct().count() != inputs.size()) {
            throw new IllegalArgumentException("inputs must be distinct");
        }
        if (group == null && !groupLabels.isEmpty()) {
            throw new IllegalArgumentException("group labels without a group column");
        }
    }

    /** Whether the response is a category (classes with vote shares) rather than a number. */
    public boolean categoryResponse() {
        return !responseLabels.isEmpty();
    }
}
