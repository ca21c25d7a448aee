package nearfit.knn;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

/**
 * Held-out tuning against scikit-learn 1.2.1 and numpy 1.24.2 (fixture heldout.txt, written by
 * scripts/reference/make-heldout-fixture.py): LeaveOneGroupOut, GroupKFold and KFold with
 * KNeighborsRegressor (algorithm='brute', uniform and distance weights, refitted for each k and fold) on
 * pre-scaled data without ties; the blocked SE against a direct numpy computation over 40 equal blocks.
 */
class HeldOutReferenceTest {
    private static final Fixture F = Fixture.load("heldout.txt");
    private static final int KMAX = 15;

    private static KnnModel model(Weighting w) {
        double[][] x = F.columns("x");
        double[] y = F.vector("y");
        int[] ids = Tuning.allRows(y.length);
        return KnnModel.fit(ReferenceData.numeric(new String[] {"x0", "x1"}, x, "y", y, ids),
                KnnSettings.defaults().withScaling(Scaling.NONE).withWeighting(w).withK(1));
    }

    /** The fixture's split as one block id per reference position (canonical order). */
    private static HeldOutBlocks blocks(KnnModel m, String scheme) {
        double[] split = F.vector("blocks_" + scheme);
        int[] ids = m.data().rowIds();
        int[] g = new int[ids.length];
        for (int i = 0; i < ids.length; i++) {
            g[i] = (int) split[ids[i]];
        }
        return HeldOutBlocks.of(new HeldOutScheme.ByGroup(), ids.length, g, null);
    }

    private static void assertRmseForEveryK(String scheme) {
        for (Weighting w : new Weighting[] {Weighting.UNIFORM, Weighting.INVERSE}) {
            KnnModel m = model(w);
            TuningTable t = Tuning.heldOut(m, KMAX, blocks(m, scheme), -1, 1, Progress.NONE);
            double[] expected = F.vector("rmse_" + scheme + "_" + (w == Weighting.UNIFORM ? "uniform" : "distance"));
            for (int k = 1; k <= KMAX; k++) {
                assertEquals(expected[k - 1], t.rmse()[k - 1], 1e-9, scheme + " " + w + " k=" + k);
            }
        }
    }

    @Test
    void leaveOneGroupOutOverSixGroupsEqualsScikitLearn() {
        assertRmseForEveryK("logo6");
    }

    @Test
    void leaveOneGroupOutOverFortyGroupsEqualsScikitLearn() { // above 32 blocks: the filtered search
        assertRmseForEveryK("logo40");
    }

    @Test
    void groupKFoldEqualsScikitLearn() {
        assertRmseForEveryK("gkf4");
    }

    @Test
    void kFoldEqualsScikitLearn() {
        assertRmseForEveryK("kf5");
    }

    @Test
    void blockedStandardErrorsEqualNumpyOverFortyEqualBlocks() {
        KnnModel m = model(Weighting.UNIFORM);
        TuningTable t = Tuning.heldOut(m, KMAX, blocks(m, "logo40"), -1, 1, Progress.NONE);
        double[][] expected = F.table("blocked_se_logo40_uniform");
        assertEquals(40, t.blocks());
        assertEquals("blocks", t.seBasis());
        for (int k = 1; k <= KMAX; k++) {
            assertEquals(expected[k - 1][0], t.rmse()[k - 1], 1e-9, "rmse k=" + k);
            assertEquals(expected[k - 1][1], t.rmseSe()[k - 1], 1e-9, "se rmse k=" + k);
            assertEquals(expected[k - 1][2], t.mae()[k - 1], 1e-9, "mae k=" + k);
            assertEquals(expected[k - 1][3], t.maeSe()[k - 1], 1e-9, "se mae k=" + k);
        }
    }
}
