package nearfit.model;

import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.List;

/**
 * A tuning table as the {@code tune} command prints it and a model file keeps it: one figure per
 * candidate k, and the two choices.
 *
 * <p>For a number response {@code rmse}, {@code rmseSe}, {@code mae}, {@code press} and
 * {@code r2Pred} are filled and {@code errorRate}, {@code errorRateSe} are {@code null}; for a category
 * response it is the other way round. All filled arrays have the length of {@code k}.
 *
 * @param rows    rows the figures were computed on
 * @param k       the candidate k values, ascending
 * @param sampled rows in the leave-one-out sample, or -1 when every row was used
 * @param scheme  how rows were held out, e.g. {@code leave-one-out} or {@code 5-fold cross-validation}; {@code null}
 *                when not recorded (model files written before it was)
 * @param cv      the scheme as {@code --cv} words ({@code loo}, {@code folds:5}, {@code group}, {@code block:1d},
 *                {@code group+block:1d}); {@code null} in files written before it was recorded
 * @param blocks  blocks holding evaluated rows (the evaluated rows under leave-one-out); -1 when not recorded
 * @param seBasis what the standard errors were taken over, {@code blocks} or {@code rows}; {@code null} when not
 *                recorded
 */
public record TuningSummary(long rows, int[] k, double[] rmse, double[] rmseSe, double[] mae,
                            double[] press, double[] r2Pred, double[] errorRate, double[] errorRateSe,
                            int bestK, int oneSeK, long sampled, String scheme, String cv, long blocks,
                            String seBasis) {
    /** A table without its held-out scheme recorded. */
    public TuningSummary(long rows, int[] k, double[] rmse, double[] rmseSe, double[] mae, double[] press,
                         double[] r2Pred, double[] errorRate, double[] errorRateSe, int bestK, int oneSeK, long sampled) {
        this(rows, k, rmse, rmseSe, mae, press, r2Pred, errorRate, errorRateSe, bestK, oneSeK, sampled, null, null,
                -1, null);
    }

    /** This table with its held-out scheme recorded in words. */
    public TuningSummary withScheme(String heldOut) {
        return new TuningSummary(rows, k, rmse, rmseSe, mae, press, r2Pred, errorRate, errorRateSe, bestK, oneSeK,
                sampled, heldOut, cv, blocks, seBasis);
    }

    /** This table with its scheme's words, blocks and SE basis recorded. */
    public TuningSummary withHeldOut(String heldOut, String cvWords, long blockCount, String basis) {
        return new TuningSummary(rows, k, rmse, rmseSe, mae, press, r2Pred, errorRate, errorRateSe, bestK, oneSeK,
                sampled, heldOut, cvWords, blockCount, basis);
    }

    /** Checks that exactly one family of figures is present and every array matches {@code k}. */
    public TuningSummary {
        boolean regression = rmse != null;
        if (regression == (errorRate != null)) {
            throw new IllegalArgumentException("a tuning table has either regression figures or error rates");
        }
        Object[] filled = regression ? new Object[] {rmse, rmseSe, mae, press, r2Pred}
                : new Object[] {errorRate, errorRateSe};
        for (Object a : filled) {
            if (a == null || ((double[]) a).length != k.length) {
                throw new IllegalArgumentException("every tuning column needs one figure per k");
            }
        }
    }

    /** The largest k tried. */
    public int largestK() {
        return k[k.length - 1];
    }

    /**
     * Whether the one-SE k is the largest k tried while a larger one could have been (below rows - 1): a
     * choice at the edge of the range tried is no choice, since the figures may keep falling beyond it.
     */
    public boolean oneSeAtEdge() {
        return oneSeK == largestK() && largestK() < rows - 1;
    }

    /** As {@link #oneSeAtEdge()}, for the k of the lowest figure. */
    public boolean bestAtEdge() {
        return bestK == largestK() && largestK() < rows - 1;
    }

    /** Whether this table holds error rates of a category response. */
    public boolean forCategories() {
        return errorRate != null;
    }

    /**
     * The JSON object of the {@code tune --format json} output and of a manifest's {@code tuning}, a
     * record the JSON library writes, keys in this order: rows, k, then rmse, rmse_se, mae, press,
     * r2_pred (or error_rate, error_rate_se), best_k, one_se_k, sampled (null when every row was
     * used), and scheme when recorded; then, when recorded (tables of this version), cv, blocks, se_basis,
     * best_at_edge and one_se_at_edge. A file of an older version written again keeps its bytes.
     */
    public Object toJson() {
        List<BigDecimal> ks = new ArrayList<>(k.length);
        for (int v : k) {
            ks.add(BigDecimal.valueOf(v));
        }
        return new ManifestDocument.TuningFields(BigDecimal.valueOf(rows), ks, ManifestDocument.listOf(rmse),
                ManifestDocument.listOf(rmseSe), ManifestDocument.listOf(mae), ManifestDocument.listOf(press),
                ManifestDocument.listOf(r2Pred), ManifestDocument.listOf(errorRate),
                ManifestDocument.listOf(errorRateSe), BigDecimal.valueOf(bestK), BigDecimal.valueOf(oneSeK),
                sampled < 0 ? null : BigDecimal.valueOf(sampled), scheme, cv,
                blocks < 0 ? null : BigDecimal.valueOf(blocks), seBasis,
                seBasis == null ? null : bestAtEdge(), seBasis == null ? null : oneSeAtEdge());
    }

    /**
     * Reads the object {@link #toJson()} writes, as a manifest binds it at {@code path}; throws
     * {@link IllegalArgumentException} naming a bad field.
     */
    static TuningSummary fromManifest(ManifestDocument.TuningFields t, String path) {
        int[] k = ManifestValues.ints(path + ".k", t.k(), 1, Integer.MAX_VALUE);
        boolean categories = t.errorRate() != null;
        long sampled = t.sampled() != null ? ManifestValues.whole(path + ".sampled", t.sampled(), 0, Long.MAX_VALUE >> 11)
                : -1;
        try {
            return new TuningSummary(ManifestValues.whole(path + ".rows", t.rows(), 0, Integer.MAX_VALUE), k,
                    categories ? null : ManifestValues.doubles(path + ".rmse", t.rmse()),
                    categories ? null : ManifestValues.doubles(path + ".rmse_se", t.rmseSe()),
                    categories ? null : ManifestValues.doubles(path + ".mae", t.mae()),
                    categories ? null : ManifestValues.doubles(path + ".press", t.press()),
                    categories ? null : ManifestValues.doubles(path + ".r2_pred", t.r2Pred()),
                    categories ? ManifestValues.doubles(path + ".error_rate", t.errorRate()) : null,
                    categories ? ManifestValues.doubles(path + ".error_rate_se", t.errorRateSe()) : null,
                    ManifestValues.integer(path + ".best_k", t.bestK(), 1, Integer.MAX_VALUE),
                    ManifestValues.integer(path + ".one_se_k", t.oneSeK(), 1, Integer.MAX_VALUE),
                    sampled, t.scheme(), t.cv(),
                    t.blocks() == null ? -1 : ManifestValues.whole(path + ".blocks", t.blocks(), 0, Integer.MAX_VALUE),
                    t.seBasis());
        } catch (IllegalArgumentException e) {
            if (e.getMessage().startsWith("manifest field")) {
                throw e;
            }
            throw new IllegalArgumentException("manifest field \"" + path + "\": " + e.getMessage(), e);
        }
    }
}
