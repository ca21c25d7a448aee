package nearfit.knn;

/**
 * The distance between two points of scaled inputs.
 *
 * <p>Internally each index compares a <em>key</em> that is monotone in the distance: the squared
 * distance for {@link #EUCLIDEAN} and {@link #MAHALANOBIS}, the distance itself otherwise. Ties are
 * decided on keys, so every index and the brute-force scan agree exactly.
 *
 * <p>A key <em>ties</em> the k-th key D when its distance is within a relative {@link #TIE_TOLERANCE}
 * of D's distance: {@code tieLow(D) <= key <= tieHigh(D)}. On squared keys the matching bounds are
 * {@code D (1 - 1e-12)^2} and {@code D (1 + 1e-12)^2}, since {@code |r - R| <= 1e-12 R} is
 * {@code R^2 (1 - 1e-12)^2 <= r^2 <= R^2 (1 + 1e-12)^2}. The factors are rounded once (relative
 * error 1e-16, far inside the tolerance) and applied by one rounded multiplication, which is monotone,
 * so a larger D never gives a smaller bound. Why 1e-12: two distances equal in exact arithmetic come
 * out of scaling and summing a few ulps apart (about 1e-15 relative) when the values are not much
 * larger than their spacing; see the package guide for the limit.
 */
public enum Metric implements ChoiceWord {
    /** Square root of the sum of squared differences. */
    EUCLIDEAN,
    /** Sum of absolute differences. */
    MANHATTAN,
    /** Largest absolute difference. */
    CHEBYSHEV,
    /**
     * Euclidean after whitening the scaled inputs with the inverse Cholesky factor of their
     * covariance (so the distance is {@code sqrt((x-y)' S^-1 (x-y))}).
     */
    MAHALANOBIS;

    /** Relative tolerance on distances within which a row ties the k-th distance. */
    static final double TIE_TOLERANCE = 1e-12;
    private static final double TIE_HIGH = 1 + TIE_TOLERANCE;
    private static final double TIE_LOW = 1 - TIE_TOLERANCE;
    private static final double TIE_HIGH_SQUARED = TIE_HIGH * TIE_HIGH;
    private static final double TIE_LOW_SQUARED = TIE_LOW * TIE_LOW;

    /** The largest key that ties {@code key} (the k-th key): see the class comment. */
    double tieHigh(double key) {
        return key * (base() == EUCLIDEAN ? TIE_HIGH_SQUARED : TIE_HIGH);
    }

    /** The smallest key that ties {@code key}; keys below it are closer than the k-th. */
    double tieLow(double key) {
        return key * (base() == EUCLIDEAN ? TIE_LOW_SQUARED : TIE_LOW);
    }

    /** The metric the index applies to the (possibly whitened) coordinates. */
    Metric base() {
        return this == MAHALANOBIS ? EUCLIDEAN : this;
    }

    /** Turns a key into a distance in scaled units. */
    double distanceOfKey(double key) {
        return base() == EUCLIDEAN ? Math.sqrt(key) : key;
    }

    /** The key between point {@code row} of packed {@code coords} and {@code q}; d dimensions. */
    static double key(Metric base, double[] coords, int row, double[] q, int d) {
        int off = row * d;
        switch (base) {
            case MANHATTAN: {
                double s = 0;
                for (int j = 0; j < d; j++) {
                    s += Math.abs(coords[off + j] - q[j]);
                }
                return s;
            }
            case CHEBYSHEV: {
                double m = 0;
                for (int j = 0; j < d; j++) {
                    double a = Math.abs(coords[off + j] - q[j]);
                    if (a > m) {
                        m = a;
                    }
                }
                return m;
            }
            default: {
                double s = 0;
                for (int j = 0; j < d; j++) {
                    double t = coords[off + j] - q[j];
                    s += t * t;
                }
                return s;
            }
        }
    }

    /**
     * A lower bound on the key from {@code q} to any point of the box stored at offset
     * {@code off} as (min, max) pairs per dimension. Computed with the same operations in the same order as {@link #key}, so
     * by monotone rounding it never exceeds the key of a point inside.
     */
    static double boxKey(Metric base, double[] box, int off, double[] q, int d) {
        double s = 0;
        for (int j = 0; j < d; j++) {
            double g;
            double qj = q[j];
            double lo = box[off + 2 * j];
            double hi = box[off + 2 * j + 1];
            if (qj < lo) {
                g = lo - qj;
            } else if (qj > hi) {
                g = qj - hi;
            } else {
                continue;
            }
            switch (base) {
                case MANHATTAN: s += g; break;
                case CHEBYSHEV: if (g > s) { s = g; } break;
                default: s += g * g;
            }
        }
        return s;
    }
}
