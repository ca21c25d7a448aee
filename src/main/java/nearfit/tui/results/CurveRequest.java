package nearfit.tui.results;

import java.util.Map;

/**
 * Where to evaluate the curve: along the display input, with the other inputs at their held values.
 *
 * @param displayInput  the input on the horizontal axis
 * @param held          the held value of every other input, in that input's units
 * @param from          the first point of the curve, in display-input units
 * @param to            the last point, at least {@code from}
 * @param steps         the number of points, at least 2 (one per plot column is enough)
 * @param groupColumn   the group column, or {@code null}
 * @param group         the highlighted group's code, or -1 for none
 * @param compare       whether the curve is fitted on the rows of the other groups only
 * @param responseClass for a category response, the class whose vote share is the curve; -1 otherwise
 */
public record CurveRequest(String displayInput, Map<String, Double> held, double from, double to, int steps,
        String groupColumn, int group, boolean compare, int responseClass) {
    /** Copies the held values so that the record stays immutable. */
    public CurveRequest {
        held = Map.copyOf(held);
        if (steps < 2 || !(to >= from)) {
            throw new IllegalArgumentException("curve from " + from + " to " + to + " in " + steps + " steps");
        }
    }

    /** The display-input value of point {@code i}, evenly spaced from {@code from} to {@code to}. */
    public double at(int i) {
        return from + (to - from) * i / (steps - 1);
    }
}
