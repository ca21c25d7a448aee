package nearfit.model;

import java.time.Instant;
import java.util.Arrays;

import nearfit.knn.FlagScale;
import nearfit.knn.KnnSettings;

/**
 * Everything a model file holds: where the reference came from, its columns and settings, the
 * scaling and residual scale fitted on it, the tuning table when k was tuned, and the reference rows.
 *
 * <p>The stored rows are the full reference, so {@code predict} and {@code check} rebuild the index
 * from them and get exactly the estimates of the model that was saved; the scaling parameters and the
 * residual scale are stored too so that they need not be recomputed and can be read by people.
 *
 * @param toolVersion   the nearfit version that wrote the file
 * @param created       when the model was fitted (written in ISO 8601, UTC)
 * @param source        the source file and the row condition
 * @param columns       input, response and group columns
 * @param settings      metric, weights, scaling, k, band, estimate, flag threshold and z scale (one of
 *                      {@link FlagScale#offered}); the thread count is not stored (a model read back has 1)
 * @param scaleCenter   per input, the value subtracted before scaling (input units)
 * @param scaleSpread   per input, the divisor after centring (input units); 1 for no scaling
 * @param whitening     for the Mahalanobis metric, the d×d row-major lower-triangular matrix applied
 *                      to the scaled inputs; {@code null} for the other metrics
 * @param residualScale the reference's held-out residuals (centre, scale, per row) for the reference z scale
 * @param tuning        the tuning table when k was tuned, or {@code null}
 * @param rows          the reference rows
 */
public record ReferenceModel(String toolVersion, Instant created, SourceInfo source, ModelColumns columns,
                             KnnSettings settings, double[] scaleCenter, double[] scaleSpread,
                             double[] whitening,
                             ResidualScale residualScale, TuningSummary tuning, ReferenceRows rows) {
    /** Checks that the parts agree with each other. */
    public ReferenceModel {
        int inputs = columns.inputs().size();
        if (rows.inputs().length != inputs || scaleCenter.length != inputs || scaleSpread.length != inputs) {
            throw new IllegalArgumentException("the model has " + inputs
                    + " inputs but the rows or the scaling disagree");
        }
        if (whitening != null && whitening.length != inputs * inputs) {
            throw new IllegalArgumentException("the whitening matrix needs " + inputs * inputs + " values");
        }
        if (columns.categoryResponse() != (rows.responseCodes() != null)) {
            throw new IllegalArgumentException("the response kind of the columns and of the rows differ");
        }
        if ((columns.group() == null) != (rows.groupCodes() == null)) {
            throw new IllegalArgumentException("a group column needs group codes, and only then");
        }
        if (!Arrays.asList(FlagScale.offered()).contains(settings.flagScale())) {
            throw new IllegalArgumentException("a model file cannot store the z scale " + settings.flagScale().word());
        }
        if (residualScale.heldOut() != null && residualScale.heldOut().length != rows.size()) {
            throw new IllegalArgumentException("the held-out residuals have " + residualScale.heldOut().length
                    + " values for " + rows.size() + " rows");
        }
        if (settings.k() > rows.size()) {
            throw new IllegalArgumentException("k = " + settings.k() + " is more than the "
                    + rows.size() + " reference rows");
        }
    }

    /** This model with another tuning table (say, one that records its held-out scheme). */
    public ReferenceModel withTuning(TuningSummary table) {
        return new ReferenceModel(toolVersion, created, source, columns, settings, scaleCenter, scaleSpread, whitening,
                residualScale, table, rows);
    }

    /** This model with another residual scale (say, with the per-row residuals read from its file). */
    public ReferenceModel withResidualScale(ResidualScale scale) {
        return new ReferenceModel(toolVersion, created, source, columns, settings, scaleCenter, scaleSpread, whitening,
                scale, tuning, rows);
    }

    /**
     * The reference's held-out residuals: their median and 1.4826·MAD (the MAD scaled to estimate a normal
     * distribution's standard deviation; Iglewicz and Hoaglin 1993), and, in files that store them, each
     * row's own residual and the scheme that held it out, from which {@code --z-scale reference} takes the
     * median and MAD of a scored row's neighbours. For a category response the numbers are NaN.
     *
     * @param median  the median held-out residual (response units)
     * @param scale   1.4826 times the median absolute deviation (response units)
     * @param heldOut each stored row's held-out residual (stored-row order), or {@code null} in files
     *                written before they were stored (and for a category response)
     * @param scheme  the held-out scheme's {@code --cv} words ({@code block:1d}, {@code loo}), or {@code null}
     *                exactly when {@code heldOut} is
     */
    public record ResidualScale(double median, double scale, double[] heldOut, String scheme) {
        /** Checks that residuals and scheme come together. */
        public ResidualScale {
            if ((heldOut == null) != (scheme == null)) {
                throw new IllegalArgumentException("held-out residuals need their scheme, and only then");
            }
        }

        /** One scale for the whole reference, with no per-row residuals (older files, category responses). */
        public ResidualScale(double median, double scale) {
            this(median, scale, null, null);
        }
    }
}
