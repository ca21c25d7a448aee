package nearfit.knn;

/**
 * What divides the residual of a new row to make its z ({@link Scoring}): the spread of the reference where
 * the row lies, the reference's held-out residuals where the row lies, or one scale for the whole reference
 * (model files written before the per-row residuals were stored).
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

    /**
     * {@code z = (y - fit - m) / max(s, floor)}, with m and s the weighted median and 1.4826·MAD of the held-out
     * residuals of the row's counted neighbours (the rows and share weights its fit used), and the floor
     * {@link Flags#SPREAD_FLOOR_SHARE} times the reference-wide scale ({@link Flags#curveZ}). The residual scale
     * then follows the curve: small where the reference's residuals are small (at zero or rated power), larger
     * on the slope. Estimating a conditional residual scale by local smoothing of residuals: Fan &amp; Yao (1998),
     * "Efficient estimation of conditional variance functions in stochastic regression", Biometrika 85:
     * 645-660; here with the robust median and MAD of the modified z-score (Iglewicz &amp; Hoaglin 1993).
     *
     * @param residuals each reference row's held-out residual, by reference position (canonical order); not
     *                  copied, not changed
     * @param median    the reference-wide median of those residuals (reported)
     * @param scale     their reference-wide 1.4826·MAD, at least 0: the floor's base
     */
    record NeighbourResiduals(double[] residuals, double median, double scale) implements ZBasis {
        /** The smallest divisor: {@link Flags#SPREAD_FLOOR_SHARE} times the reference-wide scale. */
        public double floor() {
            return Flags.spreadFloor(scale);
        }
    }
}
