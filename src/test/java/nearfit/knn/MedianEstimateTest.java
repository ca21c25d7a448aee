package nearfit.knn;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.Random;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;
import org.junit.jupiter.api.Test;

/**
 * The median estimate: the band's weighted quantile rule at 0.5 under the tie rule, used by curves,
 * leave-one-out flags and the all-k tuning pass alike; a category response votes either way.
 */
class MedianEstimateTest {

    private static KnnModel oneInput(double[] x, double[] y, KnnSettings s) {
        return KnnModel.fit(ReferenceData.numeric(new String[] {"x"}, new double[][] {x}, "y", y, null), s);
    }

    @Test
    void oneFarResponseMovesTheMeanButNotTheMedian() {
        double[] x = {0, 1, 2, 3, 4, 10, 11};
        double[] y = {10, 11, 12, 13, 1000, 50, 50};
        KnnSettings s = KnnSettings.defaults().withK(5).withScaling(Scaling.NONE).withBand(Band.NONE);
        assertEquals(209.2, oneInput(x, y, s).estimate(2.0).fit(), 1e-12);
        assertEquals(12.0, oneInput(x, y, s.withEstimate(EstimateKind.MEDIAN)).estimate(2.0).fit());
    }

    @Test
    void anEvenCountGivesTheMeanOfTheMiddleTwoAsDefinition7Does() {
        double[] x = {0, 1, 2, 3, 9};
        double[] y = {4, 1, 3, 100, 7};
        KnnSettings s = KnnSettings.defaults().withK(4).withScaling(Scaling.NONE).withEstimate(EstimateKind.MEDIAN);
        assertEquals(3.5, oneInput(x, y, s).estimate(1.5).fit()); // neighbours 4, 1, 3, 100
    }

    @Test
    void rowsTiedWithTheKthShareTheirPlaceInTheMedianAsInTheBand() {
        // k = 2 at 0: one row at distance 0 (y 0), two at distance 1 (y 10 and 20) share one place, weight 1/2
        // each. Sorted (0, 1), (10, 1/2), (20, 1/2): W = 2, W - (w_1 + w_n)/2 = 1.25, positions 0,
        // (1.5 - 0.75)/1.25 = 0.6 and 1, so p = 0.5 lies 5/6 of the way from 0 to 10.
        double[] x = {0, -1, 1, 5};
        double[] y = {0, 10, 20, 30};
        KnnModel m = oneInput(x, y, KnnSettings.defaults().withK(2).withScaling(Scaling.NONE)
                .withEstimate(EstimateKind.MEDIAN).withBand(Band.NONE));
        Estimate e = m.estimate(0.0);
        assertEquals(3, e.neighbourCount());
        assertEquals(25.0 / 3, e.fit(), 1e-12);
    }

    @Test
    void theSd2BandIsCentredOnTheMedianWithTheSpreadAboutTheMean() {
        double[] x = {0, 1, 2, 3, 4};
        double[] y = {1, 2, 3, 4, 20};
        KnnSettings s = KnnSettings.defaults().withK(5).withScaling(Scaling.NONE).withBand(Band.SD2);
        Estimate mean = oneInput(x, y, s).estimate(2.0);
        Estimate median = oneInput(x, y, s.withEstimate(EstimateKind.MEDIAN)).estimate(2.0);
        assertEquals(3.0, median.fit());
        assertEquals(mean.localSd(), median.localSd());
        assertEquals(3.0 - 2 * mean.localSd(), median.bandLow(), 1e-12);
        assertEquals(3.0 + 2 * mean.localSd(), median.bandHigh(), 1e-12);
    }

    @Test
    void aCategoryResponseVotesWhateverTheEstimate() {
        Random r = new Random(4);
        int n = 300;
        double[] x = new double[n];
        int[] c = new int[n];
        for (int i = 0; i < n; i++) {
            x[i] = r.nextInt(40) * 0.25;
            c[i] = x[i] > 5 ? (r.nextInt(5) == 0 ? 0 : 1) : r.nextInt(3);
        }
        ReferenceData data = ReferenceData.category(new String[] {"x"}, new double[][] {x}, "c", c, 3, null);
        KnnModel mean = KnnModel.fit(data, KnnSettings.defaults().withK(9));
        KnnModel median = KnnModel.fit(data, KnnSettings.defaults().withK(9).withEstimate(EstimateKind.MEDIAN));
        double[][] grid = {new double[41]};
        for (int i = 0; i <= 40; i++) {
            grid[0][i] = i * 0.26;
        }
        ClassVotes a = mean.voteAll(grid, Progress.NONE);
        ClassVotes b = median.voteAll(grid, Progress.NONE);
        assertArrayEquals(a.winner(), b.winner());
        assertArrayEquals(a.share(), b.share());
        assertArrayEquals(Tuning.leaveOneOut(mean, 12, Progress.NONE).errorRate(),
                Tuning.leaveOneOut(median, 12, Progress.NONE).errorRate());
    }

    @Property(tries = 40)
    void theMedianIsTheBandQuantileRuleAtOneHalf(@ForAll long seed, @ForAll @IntRange(min = 1, max = 3) int d,
                                                 @ForAll @IntRange(min = 1, max = 25) int k) {
        ReferenceData data = TuningTest.coarse(seed, 150, d); // integer grid: tied distances and responses
        Random r = new Random(seed);
        for (Weighting w : Weighting.values()) {
            KnnModel m = KnnModel.fit(data, KnnSettings.defaults().withK(k).withWeighting(w).withThreads(1));
            Searcher s = m.searcher();
            for (int t = 0; t < 20; t++) {
                double[] q = new double[d];
                for (int j = 0; j < d; j++) {
                    q[j] = m.coords()[r.nextInt(150) * d + j] + (r.nextBoolean() ? 0 : r.nextGaussian() * 0.3);
                }
                s.find(q, k, r.nextBoolean() ? r.nextInt(150) : -1);
                LocalEstimator est = s.estimator();
                est.load(s.list(), data.response());
                est.prepare(w, k);
                assertEquals(est.quantile(k, 0.5), est.median(k), w + " k=" + k);
            }
        }
    }

    @Property(tries = 40)
    void theMediansForEveryKInTurnEqualTheMedianAtEachK(@ForAll long seed, @ForAll @IntRange(min = 1, max = 3) int d,
                                                        @ForAll @IntRange(min = 1, max = 30) int kmax) {
        ReferenceData data = TuningTest.coarse(seed, 150, d); // ties at the k-th neighbour are common
        Random r = new Random(seed);
        double[] all = new double[kmax];
        for (Weighting w : Weighting.values()) {
            KnnModel m = KnnModel.fit(data, KnnSettings.defaults().withK(kmax).withWeighting(w).withThreads(1));
            Searcher s = m.searcher();
            for (int t = 0; t < 10; t++) {
                int row = r.nextInt(150);
                double[] q = java.util.Arrays.copyOfRange(m.coords(), row * d, row * d + d);
                s.find(q, kmax, row);
                LocalEstimator est = s.estimator();
                est.load(s.list(), data.response());
                est.medians(w, kmax, all);
                for (int k = 1; k <= kmax; k++) {
                    est.prepare(w, k);
                    assertEquals(est.median(k), all[k - 1], w + " k=" + k);
                }
            }
        }
    }

    @Property(tries = 12)
    void allKTuningUnderTheMedianEqualsLeaveOneOutFlagsAtEachK(@ForAll long seed,
                                                              @ForAll @IntRange(min = 1, max = 3) int d) {
        ReferenceData data = TuningTest.coarse(seed, 180, d);
        int kmax = 9;
        for (Weighting w : Weighting.values()) {
            KnnSettings s = KnnSettings.defaults().withWeighting(w).withEstimate(EstimateKind.MEDIAN).withThreads(2);
            KnnModel m = KnnModel.fit(data, s.withK(1));
            TuningTable t = Tuning.leaveOneOut(m, kmax, Progress.NONE);
            for (int k = 1; k <= kmax; k++) {
                FlagResult f = Flags.leaveOneOut(m.withSettings(s.withK(k)), Progress.NONE);
                double ss = 0;
                for (double e : f.residual()) {
                    ss += e * e;
                }
                assertEquals(Math.sqrt(ss / data.size()), t.rmse()[k - 1], 1e-9, w + " d=" + d + " k=" + k);
            }
        }
    }
}
