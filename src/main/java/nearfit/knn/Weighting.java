package nearfit.knn;

/**
 * How the neighbours of a point are weighted. The tie rule's shares multiply these weights.
 */
public enum Weighting implements ChoiceWord {
    /** Every counted neighbour weighs the same. */
    UNIFORM,
    /**
     * {@code 1/d}. When some counted neighbours are at distance 0 they share all the weight
     * equally and the others get none.
     */
    INVERSE,
    /**
     * Tricube {@code (1 - (d/h)^3)^3} (Cleveland 1979), with h the distance to the first
     * neighbour beyond the k-th distance. When no row lies beyond (k covers every row), or when h
     * equals the k-th distance once keys are turned into distances (two squared distances one unit
     * in the last place apart share a square root), the weights are uniform. Since h is strictly greater than the k-th distance, every counted weight is
     * positive; when all counted rows are at one distance the weights are equal, i.e. uniform.
     */
    TRICUBE
}
