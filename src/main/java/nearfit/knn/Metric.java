package nearfit.knn;

/**
 * The distance between two points of scaled inputs.
 *
 * <p>Internally each index compares a <em>key</em> that is monotone in the distance: the squared
 * distance for {@link #EUCLIDEAN} and {@link #MAHALANOBIS}, the distance itself otherwise. Ties are
 * decided on keys, so every index and the brute-force scan agree exactly.
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
