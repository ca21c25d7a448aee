package nearfit.knn;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.Duration;
import java.util.Random;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;
import nearfit.table.NearfitException;
import org.junit.jupiter.api.Test;

/** Held-out schemes (folds, groups, spans of time): exact against a brute-force form of the rule, and common practice. */
class HeldOutTuningTest {

    static long[] times(int n, long step) {
        long[] t = new long[n];
        for (int i = 0; i < n; i++) {
            t[i] = i * step;
        }
        return t;
    }

    @Property(tries = 20)
    void everyKEqualsTheBruteForceRuleOutsideTheBlock(@ForAll long seed, @ForAll @IntRange(min = 1, max = 3) int d,
                                                      @ForAll @IntRange(min = 40, max = 160) int n,
                                                      @ForAll @IntRange(min = 2, max = 70) int blockCount) {
        // integer-grid inputs: many rows tie with the k-th; random blocks: above 32 the filtered search, else one index a block
        Random r = new Random(seed);
        int[] groups = new int[n];
        for (int i = 0; i < n; i++) {
            groups[i] = r.nextInt(blockCount);
        }
        for (Weighting w : Weighting.values()) {
            KnnModel m = KnnModel.fit(TuningTest.coarse(seed, n, d), KnnSettings.defaults().withWeighting(w).withK(1));
            int[] g = new int[n];
            int[] ids = m.data().rowIds();
            for (int i = 0; i < n; i++) {
                g[i] = groups[ids == null ? i : ids[i]];
            }
            HeldOutBlocks blocks = HeldOutBlocks.of(new HeldOutScheme.ByGroup(), n, g, null);
            int kmax = Math.min(10, n - blocks.largest());
            if (kmax < 1) {
                continue;
            }
            TuningTable t = Tuning.heldOut(m, kmax, blocks, -1, 1, Progress.NONE);
            for (int k = 1; k <= kmax; k++) {
                double ss = 0;
                for (int i = 0; i < n; i++) {
                    double e = m.data().response()[i] - TuningTest.naiveFitOutside(m, i, blocks.blockOf(), k, w);
                    ss += e * e;
                }
                assertEquals(Math.sqrt(ss / n), t.rmse()[k - 1], 1e-9, w + " rmse k=" + k + " blocks " + blocks.count());
            }
        }
    }

    @Test
    void oneBlockPerRowEqualsLeaveOneOut() { // common practice, no source
        int n = 400;
        KnnModel m = KnnModel.fit(TuningTest.coarse(7, n, 2), KnnSettings.defaults().withK(1));
        TuningTable loo = Tuning.leaveOneOut(m, 20, Progress.NONE);
        HeldOutBlocks blocks = HeldOutBlocks.of(new HeldOutScheme.ByBlock(Duration.ofMinutes(10)), n, null,
                times(n, 600_000));
        assertEquals(n, blocks.count());
        TuningTable b = Tuning.heldOut(m, 20, blocks, -1, 1, Progress.NONE);
        for (int k = 0; k < 20; k++) {
            assertEquals(loo.rmse()[k], b.rmse()[k], 1e-12 * loo.rmse()[k], "rmse k=" + (k + 1));
            assertEquals(loo.mae()[k], b.mae()[k], 1e-12 * loo.mae()[k], "mae k=" + (k + 1));
            // blocks of one row: the blocked SE is the SE over rows
            assertEquals(loo.rmseSe()[k], b.rmseSe()[k], 1e-9 * loo.rmseSe()[k], "rmse se k=" + (k + 1));
            assertEquals(loo.maeSe()[k], b.maeSe()[k], 1e-9 * loo.maeSe()[k], "mae se k=" + (k + 1));
        }
        assertEquals(loo.bestK(), b.bestK());
        assertEquals(n, b.blocks());
        assertTrue(b.seOverBlocks());
    }

    @Test
    void twoGroupsArePredictedEachFromTheOtherOnly() { // common practice, no source
        // group 0 answers 0, group 1 answers 10, at interleaved inputs: any neighbour of the own group would pull the error below 10
        int n = 200;
        double[] x = new double[n];
        double[] y = new double[n];
        int[] group = new int[n];
        for (int i = 0; i < n; i++) {
            x[i] = i;
            group[i] = i % 2;
            y[i] = 10 * group[i];
        }
        KnnModel m = KnnModel.fit(ReferenceData.numeric(new String[] {"x"}, new double[][] {x}, "y", y, null),
                KnnSettings.defaults().withK(1));
        int[] g = new int[n];
        for (int i = 0; i < n; i++) {
            g[i] = group[m.data().rowIds() == null ? i : m.data().rowIds()[i]];
        }
        TuningTable t = Tuning.heldOut(m, 30, HeldOutBlocks.of(new HeldOutScheme.ByGroup(), n, g, null), -1, 1,
                Progress.NONE);
        for (int k = 0; k < 30; k++) {
            assertEquals(10, t.rmse()[k], 1e-12, "k=" + (k + 1));
        }
        assertEquals(2, t.blocks());
        assertTrue(Tuning.leaveOneOut(m, 30, Progress.NONE).rmse()[29] < 10);
    }

    @Test
    void blockedSeEqualsTheSpreadOfEqualBlocksMeansAndIgnoresTheThreadCount() {
        int n = 3000;
        ReferenceData data = TuningTest.coarse(11, n, 2);
        HeldOutBlocks blocks = HeldOutBlocks.of(new HeldOutScheme.ByBlock(Duration.ofHours(1)), n, null,
                times(n, 60_000)); // 60 rows an hour, 50 blocks: the filtered search
        TuningTable one = Tuning.heldOut(KnnModel.fit(data, KnnSettings.defaults().withThreads(1)), 15, blocks, -1, 1,
                Progress.NONE);
        TuningTable two = Tuning.heldOut(KnnModel.fit(data, KnnSettings.defaults().withThreads(2)), 15, blocks, -1, 1,
                Progress.NONE);
        assertArrayEquals(one.rmse(), two.rmse());
        assertArrayEquals(one.rmseSe(), two.rmseSe());
        assertArrayEquals(one.maeSe(), two.maeSe());
        assertEquals(50, one.blocks());
        // equal blocks: SE(MAE) is the SD of the 50 per-block MAEs over sqrt(50)
        KnnModel m = KnnModel.fit(data, KnnSettings.defaults().withK(7));
        double[] res = Tuning.heldOutResiduals(m, blocks, Progress.NONE);
        double[] blockMae = new double[50];
        for (int i = 0; i < n; i++) {
            blockMae[blocks.blockOf()[i]] += Math.abs(res[i]) / 60;
        }
        double mean = 0;
        for (double v : blockMae) {
            mean += v / 50;
        }
        double ss = 0;
        for (double v : blockMae) {
            ss += (v - mean) * (v - mean);
        }
        assertEquals(mean, one.mae()[6], 1e-12);
        assertEquals(Math.sqrt(ss / 49) / Math.sqrt(50), one.maeSe()[6], 1e-12);
    }

    @Test
    void groupsAndSpansCombineAndMissingValuesStandAlone() {
        int[] g = {0, 0, 1, 1, -1, 0};
        long[] t = {0, 86_400_000L, 0, 10, 0, HeldOutBlocks.NO_TIME};
        HeldOutBlocks b = HeldOutBlocks.of(new HeldOutScheme.GroupAndBlock(Duration.ofDays(1)), 6, g, t);
        int[] id = b.blockOf();
        assertEquals(id[2], id[3]); // group 1, day 0
        assertTrue(id[0] != id[1]); // group 0, days 0 and 1
        assertTrue(id[0] != id[2]); // day 0, groups 0 and 1
        assertTrue(id[4] != id[0] && id[4] != id[2] && id[5] != id[0] && id[5] != id[1] && id[4] != id[5]);
        assertEquals(6 - 1, b.count());
        assertThrows(NearfitException.class, () -> HeldOutBlocks.of(new HeldOutScheme.ByGroup(), 3, null, null));
    }

    @Test
    void autoHoldsDaysOutFromTenDaysOfTimes() {
        long day = 86_400_000L;
        assertEquals(new HeldOutScheme.ByBlock(Duration.ofDays(1)), HeldOutScheme.auto(true, 0, 10 * day));
        assertEquals(new HeldOutScheme.LeaveOneOut(), HeldOutScheme.auto(true, 0, 10 * day - 1));
        assertEquals(new HeldOutScheme.LeaveOneOut(), HeldOutScheme.auto(false, 0, 0));
    }

    @Test
    void categoryErrorRatesUnderGroupsCountMissesFromOtherGroupsOnly() {
        // runs of ten rows alternate the class, and class = group: from the other group only, every row is missed
        int n = 120;
        double[] x = new double[n];
        int[] cls = new int[n];
        for (int i = 0; i < n; i++) {
            x[i] = i;
            cls[i] = (i / 10) % 2;
        }
        KnnModel m = KnnModel.fit(ReferenceData.category(new String[] {"x"}, new double[][] {x}, "c", cls, 2, null),
                KnnSettings.defaults().withK(1));
        int[] g = new int[n];
        for (int i = 0; i < n; i++) {
            g[i] = m.data().classes()[i];
        }
        TuningTable t = Tuning.heldOut(m, 9, HeldOutBlocks.of(new HeldOutScheme.ByGroup(), n, g, null), -1, 1,
                Progress.NONE);
        for (int k = 0; k < 9; k++) {
            assertEquals(1.0, t.errorRate()[k], 0, "k=" + (k + 1));
        }
        assertTrue(Tuning.leaveOneOut(m, 9, Progress.NONE).errorRate()[0] < 1);
    }
}
