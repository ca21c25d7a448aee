package nearfit.knn;

import java.util.Arrays;
import nearfit.table.NearfitException;

/**
 * The scaling (and, for Mahalanobis, whitening) fitted on the reference rows: scaled input j is
 * {@code (x_j - center[j]) / scale[j]}; with a whitening matrix W (d x d, row-major, lower
 * triangular, the inverse of the Cholesky factor of the scaled inputs' population covariance) the
 * coordinates are {@code W * scaled}. These are all the parameters a model file needs to reproduce
 * the coordinates.
 *
 * @param scaling   the scaling method
 * @param center    per input: mean (z), median (robust), min (range) or 0 (none)
 * @param scale     per input: SD (z), 1.4826 MAD (robust), max - min (range) or 1 (none); all &gt; 0
 * @param whitening d*d row-major lower-triangular matrix, or {@code null} unless Mahalanobis
 */
public record InputTransform(Scaling scaling, double[] center, double[] scale, double[] whitening) {

    /** 1.4826 = 1/0.6745 makes the MAD consistent with the SD of a normal distribution. */
    static final double MAD_TO_SD = 1.4826;

    /** A covariance pivot below this fraction of the variance counts as singular. */
    private static final double SINGULAR_RATIO = 1e-12;

    /** Fits the scaling (and whitening for Mahalanobis) on the reference rows. */
    public static InputTransform fit(ReferenceData data, Scaling scaling, Metric metric) {
        int d = data.dimensions();
        String[] names = data.inputNames();
        double[] center = new double[d];
        double[] scale = new double[d];
        for (int j = 0; j < d; j++) {
            fitColumn(data.input(j), names[j], scaling, j, center, scale);
        }
        double[] w = null;
        if (metric == Metric.MAHALANOBIS) {
            w = whitening(data, center, scale, names);
        }
        return new InputTransform(scaling, center, scale, w);
    }

    private static void fitColumn(double[] x, String name, Scaling scaling, int j, double[] center, double[] scale) {
        int n = x.length;
        if (n == 0) {
            throw NearfitException.inColumn(name, "no reference rows with a value");
        }
        double min = x[0];
        double max = x[0];
        double sum = 0;
        for (double v : x) {
            min = Math.min(min, v);
            max = Math.max(max, v);
            sum += v; // canonical row order, so the sum does not depend on the input order
        }
        if (min == max) {
            throw NearfitException.inColumn(name, "is constant (" + min + ") in the reference rows, so it cannot be scaled; leave it out");
        }
        switch (scaling) {
            case Z: {
                double mean = sum / n;
                double ss = 0;
                for (double v : x) {
                    ss += (v - mean) * (v - mean);
                }
                center[j] = mean;
                scale[j] = Math.sqrt(ss / n);
                break;
            }
            case ROBUST: {
                double[] s = x.clone();
                Arrays.sort(s);
                double med = WeightedQuantiles.sortedQuantile(s, s.length, 0.5);
                for (int i = 0; i < n; i++) {
                    s[i] = Math.abs(x[i] - med);
                }
                Arrays.sort(s);
                double mad = WeightedQuantiles.sortedQuantile(s, s.length, 0.5);
                if (mad == 0) {
                    throw NearfitException.inColumn(name, "half or more of its values are equal, so its MAD is 0; use z or range scaling");
                }
                center[j] = med;
                scale[j] = MAD_TO_SD * mad;
                break;
            }
            case RANGE:
                center[j] = min;
                scale[j] = max - min;
                break;
            default:
                center[j] = 0;
                scale[j] = 1;
        }
        if (!(scale[j] > 0) || Double.isInfinite(scale[j])) {
            throw NearfitException.inColumn(name, "cannot be scaled (scale " + scale[j] + ")");
        }
    }

    /** Population covariance of the scaled inputs, Cholesky, inverse; errors name dependent columns. */
    private static double[] whitening(ReferenceData data, double[] center, double[] scale, String[] names) {
        int d = data.dimensions();
        int n = data.size();
        double[] mean = new double[d];
        double[] row = new double[d];
        double[] cov = new double[d * d];
        for (int j = 0; j < d; j++) {
            double s = 0;
            double[] x = data.input(j);
            for (int i = 0; i < n; i++) {
                s += (x[i] - center[j]) / scale[j];
            }
            mean[j] = s / n;
        }
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < d; j++) {
                row[j] = (data.input(j)[i] - center[j]) / scale[j] - mean[j];
            }
            for (int a = 0; a < d; a++) {
                for (int b = 0; b <= a; b++) {
                    cov[a * d + b] += row[a] * row[b];
                }
            }
        }
        for (int a = 0; a < d; a++) {
            for (int b = 0; b <= a; b++) {
                cov[a * d + b] /= n;
                cov[b * d + a] = cov[a * d + b];
            }
        }
        double[] l = cholesky(cov, d, names);
        return invertLower(l, d);
    }

    private static double[] cholesky(double[] a, int d, String[] names) {
        double[] l = new double[d * d];
        for (int j = 0; j < d; j++) {
            double s = a[j * d + j];
            for (int k = 0; k < j; k++) {
                s -= l[j * d + k] * l[j * d + k];
            }
            if (!(s > SINGULAR_RATIO * a[j * d + j])) {
                throw singular(a, d, j, names);
            }
            double ljj = Math.sqrt(s);
            l[j * d + j] = ljj;
            for (int i = j + 1; i < d; i++) {
                double t = a[i * d + j];
                for (int k = 0; k < j; k++) {
                    t -= l[i * d + k] * l[j * d + k];
                }
                l[i * d + j] = t / ljj;
            }
        }
        return l;
    }

    private static NearfitException singular(double[] cov, int d, int j, String[] names) {
        StringBuilder with = new StringBuilder();
        for (int k = 0; k < j; k++) {
            double r = cov[j * d + k] / Math.sqrt(cov[j * d + j] * cov[k * d + k]);
            if (Math.abs(r) > 0.01) {
                with.append(with.length() == 0 ? "" : ", ").append(names[k]);
            }
        }
        return NearfitException.inColumn(names[j], "is (nearly) a linear combination of "
                + (with.length() == 0 ? "the earlier inputs" : with) + ": their covariance is singular, so the Mahalanobis metric cannot be used; leave one out");
    }

    private static double[] invertLower(double[] l, int d) {
        double[] w = new double[d * d];
        for (int c = 0; c < d; c++) {
            w[c * d + c] = 1 / l[c * d + c];
            for (int i = c + 1; i < d; i++) {
                double s = 0;
                for (int k = c; k < i; k++) {
                    s += l[i * d + k] * w[k * d + c];
                }
                w[i * d + c] = -s / l[i * d + i];
            }
        }
        return w;
    }

    /** Number of inputs. */
    public int dimensions() {
        return center.length;
    }

    /** Transforms one raw point into coordinates, in place in {@code out} (length d). */
    public void apply(double[] raw, double[] out) {
        int d = center.length;
        for (int j = 0; j < d; j++) {
            out[j] = (raw[j] - center[j]) / scale[j];
        }
        if (whitening != null) {
            // Bottom-up keeps the inputs each row still needs (row i reads columns 0..i).
            for (int i = d - 1; i >= 0; i--) {
                double s = 0;
                for (int k = 0; k <= i; k++) {
                    s += whitening[i * d + k] * out[k];
                }
                out[i] = s;
            }
        }
    }

    /** The packed row-major coordinates (n*d) of the reference rows. */
    public double[] pack(ReferenceData data) {
        int d = center.length;
        int n = data.size();
        double[] coords = new double[n * d];
        double[] raw = new double[d];
        double[] out = new double[d];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < d; j++) {
                raw[j] = data.input(j)[i];
            }
            apply(raw, out);
            System.arraycopy(out, 0, coords, i * d, d);
        }
        return coords;
    }
}
