package nearfit.knn;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/**
 * The reference z scale that follows the curve ({@link ZBasis.NeighbourResiduals}, {@link Flags#curveZ}) against
 * scikit-learn 1.2.1, numpy 1.24.2 and scipy 1.10.1 (fixture zscale.txt, written by
 * scripts/reference/make-zscale-fixture.py): held-out residuals by LeaveOneGroupOut with KNeighborsRegressor
 * (brute, uniform weights, k 7) on a synthetic heteroscedastic curve with a flat stretch, then per query the
 * neighbours' residual median (numpy.median) and 1.4826·MAD (scipy.stats.median_abs_deviation) and z; the
 * same for the leave-one-out flags. Conditional residual scale by local smoothing of residuals: Fan &amp; Yao
 * (1998), Biometrika 85: 645-660.
 */
class NeighbourResidualScaleTest {
    private static final Fixture F = Fixture.load("zscale.txt");
    private static final int K = 7;

    private static KnnModel model() {
        double[][] x = F.columns("x");
        double[] y = F.vector("y");
        return KnnModel.fit(ReferenceData.numeric(new String[] {"x0", "x1"}, x, "y", y, Tuning.allRows(y.length)),
                KnnSettings.defaults().withScaling(Scaling.NONE).withK(K).withFlags(3.5, FlagScale.GLOBAL_MAD));
    }

    /** Held-out residuals under the fixture's groups, by reference position (canonical order). */
    private static double[] heldOut(KnnModel m) {
        double[] split = F.vector("groups");
        int[] ids = m.data().rowIds();
        int[] g = new int[ids.length];
        for (int i = 0; i < ids.length; i++) {
            g[i] = (int) split[ids[i]];
        }
        HeldOutBlocks blocks = HeldOutBlocks.of(new HeldOutScheme.ByGroup(), ids.length, g, null);
        return Tuning.heldOutResiduals(m, blocks, Progress.NONE);
    }

    @Test
    void heldOutResidualsAndTheirGlobalScaleEqualScikitLearnAndNumpy() {
        KnnModel m = model();
        double[] res = heldOut(m);
        double[] expected = F.vector("heldout_residual");
        int[] ids = m.data().rowIds();
        for (int p = 0; p < res.length; p++) {
            assertEquals(expected[ids[p]], res[p], 1e-9, "row " + ids[p]);
        }
        double[] global = F.vector("global");
        ZBasis.ReferenceResiduals g = Tuning.residualScale(res);
        assertEquals(global[0], g.median(), 1e-9);
        assertEquals(global[1], g.scale(), 1e-9);
        assertEquals(global[2], new ZBasis.NeighbourResiduals(res, g.median(), g.scale()).floor(), 1e-9);
    }

    @Test
    void scoredRowsAreCentredAndScaledByTheirNeighboursHeldOutResiduals() {
        KnnModel m = model();
        double[] res = heldOut(m);
        ZBasis.ReferenceResiduals g = Tuning.residualScale(res);
        double[][] q = F.columns("query_x");
        double[] y = F.vector("query_y");
        ScoredBlock s = Scoring.score(m, q, y, new ZBasis.NeighbourResiduals(res, g.median(), g.scale()), 3.5,
                Progress.NONE);
        double[][] expected = F.table("scored");
        int floored = 0;
        for (int i = 0; i < y.length; i++) {
            assertEquals(expected[i][0], s.fit()[i], 1e-9, "fit " + i);
            assertEquals(expected[i][3], s.z()[i], 1e-9, "z " + i);
            assertEquals(Math.abs(expected[i][3]) > 3.5, s.flagged()[i], "flag " + i);
            floored += expected[i][2] < F.vector("global")[2] ? 1 : 0;
        }
        // the fixture reaches both sides of the floor: flat-stretch queries (MAD 0) and the slope
        assertTrue(floored >= 12 && floored < y.length, "queries on the floor: " + floored);
    }

    @Test
    void leaveOneOutFlagsUseTheSameRuleOverTheNeighboursHeldOutResiduals() {
        KnnModel m = model();
        double[] res = heldOut(m);
        FlagResult f = Flags.leaveOneOut(m, res, Progress.NONE);
        double[][] expected = F.table("loo_flags");
        int[] ids = f.rowIds();
        for (int p = 0; p < ids.length; p++) {
            assertEquals(expected[ids[p]][0], f.looFit()[p], 1e-9, "fit row " + ids[p]);
            assertEquals(expected[ids[p]][3], f.z()[p], 1e-9, "z row " + ids[p]);
        }
    }

    @Test
    void aQueryAnsweredByALongTiedRunTakesTheRunsResiduals() {
        // 300 rows, 100 of them at exactly x = 5 (a run the fit answers from its totals, TiedRuns): the spread is
        // taken over those 100 rows' values, found by a second search
        int n = 300;
        double[] x = new double[n];
        double[] y = new double[n];
        double[] values = new double[n];
        java.util.Random r = new java.util.Random(2);
        for (int i = 0; i < n; i++) {
            x[i] = i < 100 ? 5.0 : (i < 200 ? 1 + 3 * r.nextDouble() : 6 + 3 * r.nextDouble());
            y[i] = 10 * x[i] + r.nextGaussian();
        }
        KnnModel m = KnnModel.fit(ReferenceData.numeric(new String[] {"x"}, new double[][] {x}, "y", y,
                Tuning.allRows(n)), KnnSettings.defaults().withK(30));
        int[] ids = m.data().rowIds();
        double[] run = new double[100];
        for (int p = 0, c = 0; p < n; p++) {
            values[p] = ids[p] % 7 - 3 + 0.1 * ids[p]; // any values; by reference position
            if (ids[p] < 100) {
                run[c++] = values[p];
            }
        }
        double[] centre = new double[1];
        double[] spread = new double[1];
        m.estimateAll(new double[][] {{5.0}}, values, centre, spread, Progress.NONE);
        java.util.Arrays.sort(run);
        double median = (run[49] + run[50]) / 2;
        double[] dev = new double[100];
        for (int i = 0; i < 100; i++) {
            dev[i] = Math.abs(run[i] - median);
        }
        java.util.Arrays.sort(dev);
        assertEquals(median, centre[0], 1e-12);
        assertEquals(1.4826 * (dev[49] + dev[50]) / 2, spread[0], 1e-12);
    }

    @Test
    void theFloorDividesOnAFlatStretchWhereEveryNeighbourResidualIsZero() {
        // 200 rows: y = 0 exactly for x < 5 (below cut-in), a noisy slope above; held-out residuals 0 on the flat
        int n = 200;
        double[] x = new double[n];
        double[] y = new double[n];
        java.util.Random r = new java.util.Random(11);
        for (int i = 0; i < n; i++) {
            x[i] = 10.0 * i / n + 0.001 * r.nextDouble();
            y[i] = x[i] < 5 ? 0 : 100 * (x[i] - 5) + 10 * r.nextGaussian();
        }
        KnnModel m = KnnModel.fit(ReferenceData.numeric(new String[] {"x"}, new double[][] {x}, "y", y,
                Tuning.allRows(n)), KnnSettings.defaults().withK(10));
        double[] res = Tuning.heldOutResiduals(m, HeldOutBlocks.of(new HeldOutScheme.LeaveOneOut(), n, null, null),
                Progress.NONE);
        ZBasis.NeighbourResiduals basis = new ZBasis.NeighbourResiduals(res, 0, 8.0);
        assertEquals(8.0 * Flags.SPREAD_FLOOR_SHARE, basis.floor(), 0.0);
        ScoredBlock s = Scoring.score(m, new double[][] {{1.0, 2.0, 3.0}}, new double[] {0.0, 1.0, -3.0}, basis, 3.5,
                Progress.NONE);
        assertEquals(0.0, s.z()[0], 0.0); // a zero residual on a zero spread is 0, not NaN
        assertEquals(1.0 / basis.floor(), s.z()[1], 1e-12);
        assertEquals(-3.0 / basis.floor(), s.z()[2], 1e-12);
        // without the floor the spread of 0 would make both infinite
        assertEquals(Double.POSITIVE_INFINITY, Flags.curveZ(1.0, 0, 0, 0));
    }
}
