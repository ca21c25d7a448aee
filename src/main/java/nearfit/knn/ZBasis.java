package nearfit.knn;

/**
 * What divides the residual of a new row to make its z ({@link Scoring}): the spread of the reference where
 * the row lies, or one scale for the whole reference.
 */
public sealed interface ZBasis {
    /**
     * {@code z = (y - fit) / s}, with s the weighted SD of the k neighbours' responses at the row: a row is
     * judged by the spread of the reference where it lies.
     */
    record LocalSpread() implements ZBasis {
    }

    /**
     * {@code z = (y - fit - median) / scale}, with the median and 1.4826·MAD of the reference's leave-one-out
     * residuals (the modified z-score of Iglewicz and Hoaglin 1993, on the reference's scale); a fitted
     * model's {@link FlagResult#median()} and {@link FlagResult#mad()}.
     *
     * @param median the residuals' median, response units
     * @param scale  1.4826 times their MAD, response units, at least 0
     */
    record ReferenceResiduals(double median, double scale) implements ZBasis {
    }
}
