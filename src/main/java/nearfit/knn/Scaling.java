package nearfit.knn;

/** How each input is scaled before distances are taken; fitted on the reference rows. */
public enum Scaling implements ChoiceWord {
    /** {@code (x - mean) / SD}, population SD. */
    Z,
    /** {@code (x - median) / (1.4826 MAD)}; 1.4826 makes the MAD consistent with the SD of a normal. */
    ROBUST,
    /** {@code (x - min) / (max - min)}. */
    RANGE,
    /** The raw values. */
    NONE
}
