package nearfit.model;

import java.time.Instant;
import java.util.List;
import java.util.function.IntToLongFunction;
import java.util.function.IntUnaryOperator;

import nearfit.knn.FlagResult;
import nearfit.knn.InputTransform;
import nearfit.knn.KnnModel;
import nearfit.knn.ReferenceData;
import nearfit.knn.TuningTable;
import nearfit.knn.ZBasis;

/**
 * Turns a fitted engine model into the {@link ReferenceModel} a model file stores: the engine's kept
 * reference rows in its canonical order, with each row's source line and group code looked up by its
 * table row id.
 */
public final class ReferenceCapture {
    private ReferenceCapture() {
    }

    /**
     * @param engine         the fitted model
     * @param loo            its leave-one-out flags (for the residual scale), or {@code null} for a
     *                       category response
     * @param tuning         the tuning table when k was tuned, or {@code null}
     * @param sampled        rows in a sampled leave-one-out, or -1
     * @param responseLabels the class labels of a category response, or empty
     * @param group          the group column name, or {@code null}
     * @param groupLabels    its labels, or empty
     * @param groupOfRow     table row id to group code (-1 missing); unused without a group
     * @param lineOfRow      table row id to 1-based source line
     */
    public static ReferenceModel capture(String toolVersion, SourceInfo source, KnnModel engine, FlagResult loo,
                                         TuningTable tuning, long sampled, List<String> responseLabels,
                                         String group, List<String> groupLabels, IntUnaryOperator groupOfRow,
                                         IntToLongFunction lineOfRow) {
        RowFacts facts = RowFacts.of(engine.data(), group != null, groupOfRow, lineOfRow);
        return capture(toolVersion, source, engine, loo, tuning, sampled, responseLabels, group, groupLabels, facts);
    }

    /**
     * The source line and group code of each reference row, in the engine's canonical order: taken
     * before the fit's heavy work, so the table they come from can be let go (at 10M rows the
     * table holds more than the model).
     *
     * @param lines  the 1-based source line of each kept row
     * @param groups the group code of each kept row, or {@code null} without a group
     */
    public record RowFacts(long[] lines, int[] groups) {

        /** Looks the facts up by each kept row's table row id. */
        public static RowFacts of(ReferenceData data, boolean grouped, IntUnaryOperator groupOfRow,
                                  IntToLongFunction lineOfRow) {
            int n = data.size();
            int[] ids = data.rowIds();
            long[] lines = new long[n];
            int[] groups = grouped ? new int[n] : null;
            for (int i = 0; i < n; i++) {
                lines[i] = lineOfRow.applyAsLong(ids[i]);
                if (groups != null) {
                    groups[i] = groupOfRow.applyAsInt(ids[i]);
                }
            }
            return new RowFacts(lines, groups);
        }
    }

    /** As {@link #capture(String, SourceInfo, KnnModel, FlagResult, TuningTable, long, List, String, List,
     * IntUnaryOperator, IntToLongFunction)}, with the rows' lines and groups already taken. */
    public static ReferenceModel capture(String toolVersion, SourceInfo source, KnnModel engine, FlagResult loo,
                                         TuningTable tuning, long sampled, List<String> responseLabels,
                                         String group, List<String> groupLabels, RowFacts facts) {
        return captureHeldOut(toolVersion, source, engine,
                loo == null ? null : new ZBasis.ReferenceResiduals(loo.median(), loo.mad()), tuning, sampled,
                responseLabels, group, groupLabels, facts);
    }

    /**
     * As {@link #capture(String, SourceInfo, KnnModel, FlagResult, TuningTable, long, List, String, List, RowFacts)},
     * with the residual scale given ({@code Tuning.residualScale} under the held-out scheme; null for a category
     * response); a tuning table's held-out scheme is recorded with it.
     */
    public static ReferenceModel captureHeldOut(String toolVersion, SourceInfo source, KnnModel engine,
                                                ZBasis.ReferenceResiduals scale, TuningTable tuning, long sampled,
                                                List<String> responseLabels, String group, List<String> groupLabels,
                                                RowFacts facts) {
        return captureHeldOut(toolVersion, source, engine, scale == null ? null
                : new ReferenceModel.ResidualScale(scale.median(), scale.scale()), tuning, sampled, responseLabels,
                group, groupLabels, facts);
    }

    /**
     * As {@link #captureHeldOut(String, SourceInfo, KnnModel, ZBasis.ReferenceResiduals, TuningTable, long, List,
     * String, List, RowFacts)}, with each reference row's held-out residual (canonical order, as
     * {@code Tuning.heldOutResiduals} gives them) and the scheme's {@code --cv} words stored beside the rows, so
     * {@code --z-scale reference} can take the residuals of a scored row's neighbours.
     */
    public static ReferenceModel captureHeldOut(String toolVersion, SourceInfo source, KnnModel engine,
                                                double[] heldOut, String scheme, TuningTable tuning, long sampled,
                                                List<String> responseLabels, String group, List<String> groupLabels,
                                                RowFacts facts) {
        ZBasis.ReferenceResiduals s = nearfit.knn.Tuning.residualScale(heldOut);
        return captureHeldOut(toolVersion, source, engine,
                new ReferenceModel.ResidualScale(s.median(), s.scale(), heldOut, scheme), tuning, sampled,
                responseLabels, group, groupLabels, facts);
    }

    private static ReferenceModel captureHeldOut(String toolVersion, SourceInfo source, KnnModel engine,
                                                 ReferenceModel.ResidualScale scale, TuningTable tuning, long sampled,
                                                 List<String> responseLabels, String group, List<String> groupLabels,
                                                 RowFacts facts) {
        ReferenceData data = engine.data();
        long[] lines = facts.lines();
        int[] groups = group == null ? null : facts.groups();
        double[][] inputs = new double[data.dimensions()][];
        for (int j = 0; j < inputs.length; j++) {
            inputs[j] = data.input(j);
        }
        ReferenceRows rows = new ReferenceRows(inputs, data.isCategory() ? null : data.response(),
                data.isCategory() ? data.classes() : null, groups, lines);
        ModelColumns columns = new ModelColumns(List.of(data.inputNames()), data.responseName(), responseLabels,
                group, groupLabels);
        InputTransform t = engine.transform();
        ReferenceModel.ResidualScale residual = scale == null
                ? new ReferenceModel.ResidualScale(Double.NaN, Double.NaN) : scale;
        return new ReferenceModel(toolVersion, Instant.now(), source, columns, engine.settings(),
                t.center(), t.scale(), t.whitening(), residual,
                tuning == null ? null : summary(tuning, sampled), rows);
    }

    /**
     * The tune command's table of an engine tuning result, with its held-out scheme (words, {@code --cv}
     * words, blocks, SE basis); k runs from 1 to kmax.
     */
    public static TuningSummary summary(TuningTable t, long sampled) {
        int[] k = new int[t.kmax()];
        for (int i = 0; i < k.length; i++) {
            k[i] = i + 1;
        }
        boolean categories = !Double.isNaN(t.errorRate()[0]);
        return new TuningSummary(t.referenceRows(), k,
                categories ? null : t.rmse(), categories ? null : t.rmseSe(), categories ? null : t.mae(),
                categories ? null : t.press(), categories ? null : t.predictedR2(),
                categories ? t.errorRate() : null, categories ? t.errorRateSe() : null,
                t.bestK(), t.oneSeK(), sampled).withHeldOut(t.method(), t.scheme().word(), t.blocks(), t.seBasis());
    }
}
