package nearfit.spark;

import java.util.List;
import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;

import nearfit.knn.KnnModel;
import nearfit.knn.ReferenceReach;
import nearfit.knn.ZBasis;
import nearfit.model.ModelFile;
import nearfit.knn.ChoiceWord;
import nearfit.knn.FlagScale;
import nearfit.knn.KnnSettings;
import nearfit.model.ReferenceModel;
import nearfit.model.RestoredModel;

/**
 * A model restored on an executor, from the broadcast bytes, once per executor and model: tasks of the same
 * job (and the next job on the same model) share it. The engine is immutable and is shared by the tasks'
 * threads; each task scores on its own thread (Spark gives a task a core).
 */
final class WorkerModel {
    /** Restored models of this JVM by model SHA-256 and z scale; a few at most, dropped when over the limit. */
    private static final Map<String, WorkerModel> RESTORED = new ConcurrentHashMap<>();
    private static final int MAX_KEPT = 4;

    final KnnModel engine;
    final ReferenceReach reach;
    final ZBasis basis;
    /** A category response's class labels (code i is label i), empty for a number response. */
    final List<String> classLabels;

    private WorkerModel(KnnModel engine, ReferenceReach reach, ZBasis basis, List<String> classLabels) {
        this.engine = engine;
        this.reach = reach;
        this.basis = basis;
        this.classLabels = classLabels;
    }

    static WorkerModel of(ScoringPlan plan) {
        String key = plan.modelSha256() + "/" + plan.zScale();
        WorkerModel m = RESTORED.get(key);
        if (m != null) {
            return m;
        }
        synchronized (RESTORED) {
            m = RESTORED.get(key);
            if (m == null) {
                if (RESTORED.size() >= MAX_KEPT) {
                    RESTORED.clear();
                }
                m = restore(ModelFile.read(plan.model().value(), plan.modelName()), plan.zScale(), 1);
                RESTORED.put(key, m);
            }
            return m;
        }
    }

    /** The model with the z scale in effect, on {@code threads} threads. */
    static WorkerModel restore(ReferenceModel stored, String zScale, int threads) {
        FlagScale flagScale = flagScale(zScale);
        RestoredModel r = RestoredModel.of(stored, withZScale(stored.settings(), flagScale), threads);
        return new WorkerModel(r.engine(), ReferenceReach.of(r.engine()), r.zBasis(), stored.columns().responseLabels());
    }

    static KnnSettings withZScale(KnnSettings s, FlagScale zScale) {
        return s.withFlags(s.flagThreshold(), zScale);
    }

    /** The z scale a word names (local or reference, the words the model file and the tool use), or null. */
    static FlagScale flagScale(String word) {
        return word == null ? null : ChoiceWord.find(FlagScale.offered(), word);
    }
}
