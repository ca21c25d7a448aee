package nearfit.knn;

/**
 * Estimates along the display input, the other inputs held at given values.
 *
 * @param displayInput the input that varies
 * @param held         the point's other coordinates (raw units; the display slot is ignored)
 * @param x            the grid of display-input values (raw units)
 * @param estimates    one estimate per grid value
 */
public record Curve(int displayInput, double[] held, double[] x, Estimates estimates) {
}
