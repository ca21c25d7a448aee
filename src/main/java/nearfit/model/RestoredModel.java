package nearfit.model;

import nearfit.knn.FlagScale;
import nearfit.knn.InputTransform;
import nearfit.knn.KnnModel;
import nearfit.knn.KnnSettings;
import nearfit.knn.ReferenceData;
import nearfit.knn.ZBasis;

/**
 * A model file's contents with the engine model rebuilt from its stored rows, scaling and settings,
 * ready to estimate at new rows. The engine's row ids are positions in the stored rows, so
 * {@code stored.rows().sourceLines()[engine.data().rowIds()[i]]} is the line of engine row i.
 *
 * @param stored the model file's contents
 * @param engine the engine model
 */
public record RestoredModel(ReferenceModel stored, KnnModel engine) {
    /**
     * As {@link #of(ReferenceModel, int)}, then with other settings: a change of k, weights, band or
     * z scale keeps the index; a change of metric or scaling refits them on the stored rows.
     */
    public static RestoredModel of(ReferenceModel stored, KnnSettings settings, int threads) {
        RestoredModel r = of(stored, threads);
        KnnSettings wanted = settings.withThreads(threads);
        if (wanted.equals(r.engine().settings())) {
            return r;
        }
        return new RestoredModel(stored, r.engine().withSettings(wanted));
    }

    /**
     * What divides a scored row's residual under the settings in effect: the neighbours' spread for
     * {@code local}; for {@code reference} the neighbours' held-out residuals when the file stores them
     * ({@link ZBasis.NeighbourResiduals}, mapped to the engine's positions), else the one reference-wide
     * scale of older files ({@link ZBasis.ReferenceResiduals}).
     */
    public ZBasis zBasis() {
        if (settings().flagScale() == FlagScale.LOCAL_SD) {
            return new ZBasis.LocalSpread();
        }
        ReferenceModel.ResidualScale scale = stored.residualScale();
        double[] heldOut = scale.heldOut();
        if (heldOut == null) {
            return new ZBasis.ReferenceResiduals(scale.median(), scale.scale());
        }
        int[] ids = engine.data().rowIds();
        double[] byPosition = new double[ids.length];
        for (int p = 0; p < ids.length; p++) {
            byPosition[p] = heldOut[ids[p]];
        }
        return new ZBasis.NeighbourResiduals(byPosition, scale.median(), scale.scale());
    }

    /** The settings in effect. */
    public KnnSettings settings() {
        return engine.settings();
    }

    /** Rebuilds the index from the stored rows, with the stored scaling (not refitted). */
    public static RestoredModel of(ReferenceModel stored, int threads) {
        ReferenceRows rows = stored.rows();
        String[] names = stored.columns().inputs().toArray(new String[0]);
        int[] positions = new int[rows.size()];
        for (int i = 0; i < positions.length; i++) {
            positions[i] = i;
        }
        ReferenceData data = rows.response() != null
                ? ReferenceData.numeric(names, rows.inputs(), stored.columns().response(), rows.response(), positions)
                : ReferenceData.category(names, rows.inputs(), stored.columns().response(), rows.responseCodes(),
                        stored.columns().responseLabels().size(), positions);
        InputTransform transform = new InputTransform(stored.settings().scaling(), stored.scaleCenter(),
                stored.scaleSpread(), stored.whitening());
        KnnModel engine = KnnModel.restore(data, stored.settings().withThreads(threads), transform);
        return new RestoredModel(stored, engine);
    }
}
