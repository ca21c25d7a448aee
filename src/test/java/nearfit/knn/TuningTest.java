package nearfit.knn;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Random;
import java.util.concurrent.atomic.AtomicInteger;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;
import nearfit.table.NearfitException;
import org.junit.jupiter.api.Test;

/** The one-pass all-k cross-validation against a naive recomputation, and its choices of k. */
class TuningTest {

    static ReferenceData coarse(long seed, int n, int d) {
        Random r = new Random(seed);
        double[][] x = new double[d][n];
        double[] y = new double[n];
        String[] names = new String[d];
        for (int j = 0; j < d; j++) {
            names[j] = "x" + j;
        }
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < d; j++) {
                x[j][i] = r.nextInt(8);
            }
            y[i] = x[0][i] * 0.5 + r.nextInt(3);
        }
        return ReferenceData.numeric(names, x, "y", y, null);
    }

    /** The tie-rule fit written out directly from a brute-force neighbour list (independent of LocalEstimator). */
    static double naiveFit(KnnModel m, int row, int k, Weighting w) {
        return naiveFitOutside(m, row, allRows(m.data().size()), k, w); // each row its own block
    }

    private static int[] allRows(int n) {
        int[] r = new int[n];
        for (int i = 0; i < n; i++) {
            r[i] = i;
        }
        return r;
    }

    /** The tie-rule fit of row {@code row} from the rows outside its block, written out from a brute-force list. */
    static double naiveFitOutside(KnnModel m, int row, int[] blockOf, int k, Weighting w) {
        int d = m.data().dimensions();
        int n = m.data().size();
        double[] q = java.util.Arrays.copyOfRange(m.coords(), row * d, row * d + d);
        Metric base = m.settings().metric().base();
        double[] key = new double[n];
        for (int i = 0; i < n; i++) {
            key[i] = blockOf[i] == blockOf[row] ? Double.POSITIVE_INFINITY : Metric.key(base, m.coords(), i, q, d);
        }
        double[] sorted = key.clone();
        java.util.Arrays.sort(sorted);
        double kth = sorted[k - 1];
        double high = base.tieHigh(kth); // rows within a relative 1e-12 of the k-th distance tie it
        double low = base.tieLow(kth);
        double beyond = Double.NaN;
        for (double v : sorted) {
            if (v > high && v != Double.POSITIVE_INFINITY) {
                beyond = v;
                break;
            }
        }
        int closer = 0;
        int tied = 0;
        boolean zero = false;
        for (int i = 0; i < n; i++) {
            closer += key[i] < low ? 1 : 0;
            tied += key[i] >= low && key[i] <= high ? 1 : 0;
            zero |= key[i] == 0;
        }
        double num = 0;
        double den = 0;
        for (int i = 0; i < n; i++) {
            if (key[i] > high) {
                continue;
            }
            double share = key[i] < low ? 1 : (double) (k - closer) / tied;
            double dist = m.settings().metric().distanceOfKey(key[i]);
            double wt;
            if (w == Weighting.UNIFORM) {
                wt = 1;
            } else if (w == Weighting.INVERSE) {
                wt = zero ? (key[i] == 0 ? 1 : 0) : 1 / dist;
            } else {
                double h = m.settings().metric().distanceOfKey(beyond);
                double farthestCounted = sorted[closer + tied - 1];
                boolean degenerate = Double.isNaN(beyond) || !(h > m.settings().metric().distanceOfKey(farthestCounted));
                wt = degenerate ? 1 : Math.pow(1 - Math.pow(dist / h, 3), 3);
            }
            num += share * wt * m.data().response()[i];
            den += share * wt;
        }
        return num / den;
    }

    @Property(tries = 25)
    void allKLeaveOneOutEqualsNaiveRecomputationForEachK(@ForAll long seed, @ForAll @IntRange(min = 1, max = 4) int d,
                                                          @ForAll @IntRange(min = 20, max = 150) int n) {
        for (Weighting w : Weighting.values()) {
            KnnModel m = KnnModel.fit(coarse(seed, n, d), KnnSettings.defaults().withWeighting(w).withK(1));
            int kmax = Math.min(12, n - 1);
            TuningTable t = Tuning.leaveOneOut(m, kmax, Progress.NONE);
            for (int k = 1; k <= kmax; k++) {
                double ss = 0;
                double sa = 0;
                for (int i = 0; i < n; i++) {
                    double e = m.data().response()[i] - naiveFit(m, i, k, w);
                    ss += e * e;
                    sa += Math.abs(e);
                }
                assertTrue(Double.isFinite(t.rmse()[k - 1]), w + " finite rmse k=" + k);
                assertEquals(Math.sqrt(ss / n), t.rmse()[k - 1], 1e-9, w + " rmse k=" + k);
                assertEquals(sa / n, t.mae()[k - 1], 1e-9, w + " mae k=" + k);
                assertEquals(ss, t.press()[k - 1], 1e-7 * Math.max(1, ss), w + " press k=" + k);
            }
        }
    }

    @Test
    void leaveOneOutFlagFitsEqualTheTuningPassAtTheSameK() {
        KnnModel m = KnnModel.fit(coarse(3, 200, 2), KnnSettings.defaults().withK(6));
        FlagResult f = Flags.leaveOneOut(m, Progress.NONE);
        double ss = 0;
        for (double e : f.residual()) {
            ss += e * e;
        }
        TuningTable t = Tuning.leaveOneOut(m, 6, Progress.NONE);
        assertEquals(ss, t.press()[5], 1e-9 * ss);
    }

    @Test
    void tableIsTheSameOnOneAndTwoThreads() {
        ReferenceData data = coarse(9, 5000, 3);
        TuningTable one = Tuning.leaveOneOut(KnnModel.fit(data, KnnSettings.defaults().withThreads(1)), 20, Progress.NONE);
        TuningTable two = Tuning.leaveOneOut(KnnModel.fit(data, KnnSettings.defaults().withThreads(2)), 20, Progress.NONE);
        assertArrayEquals(one.rmse(), two.rmse());
        assertArrayEquals(one.maeSe(), two.maeSe());
    }

    @Test
    void standardErrorsFollowTheDeltaMethodAndOneSeKIsTheLargestWithinOneSe() {
        KnnModel m = KnnModel.fit(coarse(5, 400, 1), KnnSettings.defaults());
        TuningTable t = Tuning.leaveOneOut(m, 40, Progress.NONE);
        int best = t.bestK();
        for (int k = 1; k <= 40; k++) {
            assertTrue(t.rmse()[best - 1] <= t.rmse()[k - 1]);
        }
        double limit = t.rmse()[best - 1] + t.rmseSe()[best - 1];
        assertTrue(t.rmse()[t.oneSeK() - 1] <= limit);
        for (int k = t.oneSeK() + 1; k <= 40; k++) {
            assertTrue(t.rmse()[k - 1] > limit, "k=" + k + " is within one SE but above the one-SE k");
        }
        // SE(RMSE) = SE(MSE) / (2 RMSE), SE(MSE) = sd(e^2)/sqrt(n): recomputed from the flag residuals at k = 10.
        FlagResult f = Flags.leaveOneOut(m.withSettings(m.settings().withK(10)), Progress.NONE);
        int n = f.residual().length;
        double mean = 0;
        for (double e : f.residual()) {
            mean += e * e / n;
        }
        double var = 0;
        for (double e : f.residual()) {
            var += (e * e - mean) * (e * e - mean) / (n - 1);
        }
        assertEquals(Math.sqrt(var / n) / (2 * Math.sqrt(mean)), t.rmseSe()[9], 1e-9);
        assertEquals(1 - t.press()[9] / totalSumOfSquares(m.data().response()), t.predictedR2()[9], 1e-12);
    }

    private static double totalSumOfSquares(double[] y) {
        double mean = 0;
        for (double v : y) {
            mean += v / y.length;
        }
        double s = 0;
        for (double v : y) {
            s += (v - mean) * (v - mean);
        }
        return s;
    }

    @Test
    void sampledLeaveOneOutEvaluatesMRowsAndKFoldEvaluatesAll() {
        KnnModel m = KnnModel.fit(coarse(6, 3000, 2), KnnSettings.defaults());
        TuningTable s = Tuning.leaveOneOut(m, 10, 500, 42, Progress.NONE);
        assertEquals("sampled leave-one-out", s.method());
        assertEquals(500, s.evaluatedRows());
        assertEquals(3000, s.referenceRows());
        TuningTable f = Tuning.kFold(m, 10, 5, 42, Progress.NONE);
        assertEquals(3000, f.evaluatedRows());
        TuningTable full = Tuning.leaveOneOut(m, 10, Progress.NONE);
        // Five folds train on 80% of rows: their error is at least comparable; all finite.
        for (int k = 0; k < 10; k++) {
            assertTrue(Double.isFinite(f.rmse()[k]) && Double.isFinite(s.rmse()[k]) && Double.isFinite(full.rmse()[k]));
            assertEquals(full.rmse()[k], s.rmse()[k], 6 * s.rmseSe()[k] + 1e-12, "sample within 6 SE of full, k=" + (k + 1));
        }
    }

    @Test
    void progressIsReportedAndCancellationThrowsItsOwnType() {
        KnnModel m = KnnModel.fit(coarse(7, 20_000, 2), KnnSettings.defaults());
        AtomicInteger calls = new AtomicInteger();
        Progress cancelAfterTwo = new Progress() {
            @Override
            public void report(long done, long total) {
                calls.incrementAndGet();
            }

            @Override
            public boolean isCancelled() {
                return calls.get() >= 2;
            }
        };
        assertThrows(CancelledException.class, () -> Tuning.leaveOneOut(m, 10, cancelAfterTwo));
        assertTrue(calls.get() >= 2);
    }

    @Test
    void kmaxBeyondTheUsableRowsIsAnError() {
        KnnModel m = KnnModel.fit(coarse(8, 30, 1), KnnSettings.defaults());
        NearfitException e = assertThrows(NearfitException.class, () -> Tuning.leaveOneOut(m, 30, Progress.NONE));
        assertTrue(e.getMessage().contains("between 1 and 29"), e.getMessage());
    }
}
