package nearfit.knn;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Random;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;
import org.junit.jupiter.api.Test;

/**
 * The totals of long tied runs give the estimates the row-by-row estimator gives, and the
 * leave-one-out figures a naive recomputation gives, on inputs rounded to a coarse grid (a sensor's
 * rounding: common practice in logged data).
 */
class TiedRunsTest {

    /** One input on a grid of {@code values} steps, responses with repeats, n rows. */
    static ReferenceData rounded(long seed, int n, int values) {
        Random r = new Random(seed);
        double[] x = new double[n];
        double[] y = new double[n];
        for (int i = 0; i < n; i++) {
            x[i] = 0.5 * r.nextInt(values);
            y[i] = r.nextInt(4) == 0 ? 7 : x[i] * 3 + r.nextGaussian();
        }
        return ReferenceData.numeric(new String[] {"x"}, new double[][] {x}, "y", y, null);
    }

    private static void assertClose(double expected, double actual, String what) {
        assertEquals(expected, actual, 1e-9 * Math.max(1, Math.abs(expected)), what);
    }

    @Property(tries = 30)
    void runTotalsEqualTheRowByRowEstimator(@ForAll long seed, @ForAll @IntRange(min = 200, max = 3000) int n,
                                            @ForAll @IntRange(min = 2, max = 12) int values,
                                            @ForAll @IntRange(min = 1, max = 80) int k) {
        ReferenceData data = rounded(seed, n, values);
        Band band = Band.Q05_Q95;
        KnnModel m = KnnModel.fit(data, KnnSettings.defaults().withK(k).withBand(band).withThreads(1));
        TiedRuns runs = m.tiedRuns();
        if (runs == null) {
            return; // every run shorter than MIN_LENGTH: nothing to compare
        }
        Random r = new Random(seed ^ 77);
        Searcher rowByRow = m.searcher();
        int hits = 0;
        for (int t = 0; t < 200; t++) {
            int exclude = r.nextBoolean() ? r.nextInt(n) : -1;
            double q = exclude >= 0 ? m.coords()[exclude] : m.coords()[r.nextInt(n)] + (r.nextInt(3) - 1) * r.nextDouble();
            int run = runs.runFor(q, k, exclude);
            if (run < 0) {
                continue;
            }
            hits++;
            rowByRow.find(new double[] {q}, k, exclude, false);
            LocalEstimator est = rowByRow.estimator();
            est.load(rowByRow.list(), data.response());
            est.prepare(Weighting.UNIFORM, k);
            assertEquals(est.closer(k), 0, "no row closer than the run");
            assertEquals(est.counted(k), runs.size(run, exclude), "counted rows");
            assertEquals(est.kthKey(k), runs.key(run, q), "k-th key");
            double fit = est.fit(k);
            assertClose(fit, runs.mean(run, exclude), "fit");
            assertClose(est.sd(k, fit), runs.sd(run, exclude), "local SD");
            assertClose(est.quantile(k, 0.05), runs.quantile(run, exclude, 0.05), "q05");
            assertClose(est.quantile(k, 0.95), runs.quantile(run, exclude, 0.95), "q95");
        }
        if (n / values >= 2 * TiedRuns.MIN_LENGTH && k < TiedRuns.MIN_LENGTH) {
            assertTrue(hits > 0, "the run totals were used at least once");
        }
    }

    @Property(tries = 30)
    void runMedianEqualsTheRowByRowMedianUnderEveryWeighting(@ForAll long seed,
                                                            @ForAll @IntRange(min = 200, max = 3000) int n,
                                                            @ForAll @IntRange(min = 2, max = 12) int values,
                                                            @ForAll @IntRange(min = 1, max = 80) int k) {
        ReferenceData data = rounded(seed, n, values);
        for (Weighting w : Weighting.values()) {
            KnnModel m = KnnModel.fit(data, KnnSettings.defaults().withK(k).withWeighting(w)
                    .withEstimate(EstimateKind.MEDIAN).withThreads(1));
            TiedRuns runs = m.tiedRuns();
            if (runs == null) {
                return; // every run shorter than MIN_LENGTH: nothing to compare
            }
            Random r = new Random(seed ^ 91);
            Searcher rowByRow = m.searcher();
            int hits = 0;
            for (int t = 0; t < 100; t++) {
                int exclude = r.nextBoolean() ? r.nextInt(n) : -1;
                double q = exclude >= 0 ? m.coords()[exclude] : m.coords()[r.nextInt(n)];
                int run = runs.runFor(q, k, exclude);
                if (run < 0) {
                    continue;
                }
                hits++;
                rowByRow.find(new double[] {q}, k, exclude);
                LocalEstimator est = rowByRow.estimator();
                est.load(rowByRow.list(), data.response());
                est.prepare(w, k);
                double median = runs.quantile(run, exclude, 0.5);
                assertEquals(est.median(k), median, w + " k=" + k + " run of " + runs.size(run, exclude));
                if (exclude >= 0) {
                    assertEquals(median, rowByRow.fitLeavingOut(new double[] {q}, k, exclude, FlagScale.GLOBAL_MAD),
                            "leave-one-out takes the run's median");
                }
            }
            if (n / values >= 2 * TiedRuns.MIN_LENGTH && k < TiedRuns.MIN_LENGTH) {
                assertTrue(hits > 0, "the run's median was used at least once");
            }
        }
    }

    @Property(tries = 8)
    void leaveOneOutOverLongRunsEqualsNaiveRecomputation(@ForAll long seed,
                                                          @ForAll @IntRange(min = 260, max = 420) int n) {
        ReferenceData data = rounded(seed, n, 3);
        for (Weighting w : Weighting.values()) {
            KnnModel m = KnnModel.fit(data, KnnSettings.defaults().withWeighting(w).withK(5).withThreads(2));
            assertTrue(m.tiedRuns() != null && m.tiedRuns().count() > 0, "long runs present");
            int kmax = 8;
            TuningTable t = Tuning.leaveOneOut(m, kmax, Progress.NONE);
            for (int k = 1; k <= kmax; k++) {
                double ss = 0;
                for (int i = 0; i < n; i++) {
                    double e = data.response()[i] - TuningTest.naiveFit(m, i, k, w);
                    ss += e * e;
                }
                assertClose(Math.sqrt(ss / n), t.rmse()[k - 1], w + " rmse k=" + k);
            }
            FlagResult f = Flags.leaveOneOut(m, Progress.NONE);
            for (int i = 0; i < n; i++) {
                assertClose(TuningTest.naiveFit(m, i, 5, w), f.looFit()[i], w + " flag fit row " + i);
            }
        }
    }

    @Test
    void aRunOfEqualResponsesHasExactlyThatMeanAndZeroSpread() {
        int n = 300;
        double[] x = new double[n];
        double[] y = new double[n];
        for (int i = 0; i < n; i++) {
            x[i] = i < 200 ? 4.2 : 9.0;
            y[i] = i < 200 ? 0.1 : i; // 0.1 summed 199 times does not divide back to 0.1 exactly
        }
        KnnModel m = KnnModel.fit(ReferenceData.numeric(new String[] {"x"}, new double[][] {x}, "y", y, null),
                KnnSettings.defaults().withK(10).withFlags(3.5, FlagScale.LOCAL_SD));
        Estimate e = m.estimate(4.2);
        assertEquals(0.1, e.fit());
        assertEquals(0.0, e.localSd());
        FlagResult f = Flags.leaveOneOut(m, Progress.NONE);
        for (int i = 0; i < 200; i++) {
            assertEquals(0.0, f.residual()[i], "residual of row " + i);
            assertEquals(0.0, f.z()[i], "z of row " + i);
        }
    }

    @Test
    void distinctInputsEquallyFarFromTheQueryAreNotOneRun() {
        double[] x = new double[200];
        double[] y = new double[200];
        for (int i = 0; i < 200; i++) {
            x[i] = i < 100 ? 1.0 : 3.0;
            y[i] = i < 100 ? 1 : 5;
        }
        KnnModel m = KnnModel.fit(ReferenceData.numeric(new String[] {"x"}, new double[][] {x}, "y", y, null),
                KnnSettings.defaults().withK(10).withScaling(Scaling.NONE));
        // At 2.0 both runs are at distance 1: the tie rule shares the 10 places among all 200 rows.
        assertEquals(3.0, m.estimate(2.0).fit(), 1e-12);
        assertEquals(200, m.estimate(2.0).neighbourCount());
        assertEquals(1.0, m.estimate(1.9).fit());
    }
}
