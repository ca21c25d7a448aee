package nearfit.knn;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Random;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;
import nearfit.table.NearfitException;
import org.junit.jupiter.api.Test;

/** Estimates at points and along curves: the tie rule, facts of the trade, invariances, errors. */
class KnnModelTest {
    private static final String[] ONE = {"wind_speed"};

    private static KnnModel oneInput(double[] x, double[] y, KnnSettings s) {
        return KnnModel.fit(ReferenceData.numeric(ONE, new double[][] {x}, "power_kw", y, null), s);
    }

    @Test
    void tiedRowsAtTheKthDistanceShareTheRemainingPlaces() {
        // Hand-worked: query 0, k = 2; x = 1 (y 10) is closer, x = -2 and 2 (y 0 and 6) tie at D = 2,
        // so (10 + (2 - 1) * mean(0, 6)) / 2 = 6.5.
        KnnModel m = oneInput(new double[] {1, -2, 2, 5}, new double[] {10, 0, 6, 100},
                KnnSettings.defaults().withK(2).withScaling(Scaling.NONE));
        Estimate e = m.estimate(0.0);
        assertEquals(6.5, e.fit(), 0);
        assertEquals(3, e.neighbourCount());
        assertEquals(2.0, e.windowWidth(), 0);
    }

    @Test
    void inverseWeightsGiveRowsAtDistanceZeroAllTheWeight() {
        KnnModel m = oneInput(new double[] {0, 0, 1, 2}, new double[] {4, 8, 100, 100},
                KnnSettings.defaults().withK(3).withScaling(Scaling.NONE).withWeighting(Weighting.INVERSE));
        assertEquals(6.0, m.estimate(0.0).fit(), 0);
    }

    @Test
    void kEqualToAllRowsGivesTheGlobalMeanEverywhere() {
        // common practice
        Random r = new Random(1);
        double[] x = new double[50];
        double[] y = new double[50];
        double mean = 0;
        for (int i = 0; i < 50; i++) {
            x[i] = r.nextDouble() * 20;
            y[i] = r.nextGaussian();
            mean += y[i] / 50;
        }
        KnnModel m = oneInput(x, y, KnnSettings.defaults().withK(50));
        for (double q = -5; q < 25; q += 1.7) {
            assertEquals(mean, m.estimate(q).fit(), 1e-12);
        }
    }

    @Test
    void withKOneTheCurvePassesThroughEveryPointAndStepsHalfwayBetweenInputs() {
        // common practice: 1-NN in one input interpolates and changes value at the midpoints
        double[] x = {1, 2, 4, 7, 11};
        double[] y = {5, -1, 3, 8, 0};
        KnnModel m = oneInput(x, y, KnnSettings.defaults().withK(1).withScaling(Scaling.NONE));
        for (int i = 0; i < x.length; i++) {
            assertEquals(y[i], m.estimate(x[i]).fit(), 0);
        }
        for (int i = 0; i + 1 < x.length; i++) {
            double mid = (x[i] + x[i + 1]) / 2;
            assertEquals(y[i], m.estimate(mid - 1e-9).fit(), 0);
            assertEquals(y[i + 1], m.estimate(mid + 1e-9).fit(), 0);
        }
    }

    @Test
    void uniformCurveInOneInputIsPiecewiseConstant() {
        // common practice: the fit only changes where the neighbour set changes, at most 2n times
        Random r = new Random(2);
        double[] x = new double[40];
        double[] y = new double[40];
        for (int i = 0; i < 40; i++) {
            x[i] = r.nextDouble() * 10;
            y[i] = r.nextDouble();
        }
        KnnModel m = oneInput(x, y, KnnSettings.defaults().withK(5).withBand(Band.NONE));
        double[] grid = new double[4001];
        for (int i = 0; i < grid.length; i++) {
            grid[i] = -1 + 12.0 * i / (grid.length - 1);
        }
        double[] fit = m.curve(0, new double[] {0}, grid, Progress.NONE).estimates().fit();
        int changes = 0;
        for (int i = 1; i < fit.length; i++) {
            changes += fit[i] != fit[i - 1] ? 1 : 0;
        }
        assertTrue(changes > 5 && changes <= 2 * 40, "changes " + changes);
    }

    private static ReferenceData shuffled(ReferenceData d, long seed, int[] order) {
        int n = d.size();
        Random r = new Random(seed);
        for (int i = n - 1; i > 0; i--) {
            int j = r.nextInt(i + 1);
            int t = order[i];
            order[i] = order[j];
            order[j] = t;
        }
        double[][] x = new double[d.dimensions()][n];
        double[] y = new double[n];
        int[] ids = new int[n];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < d.dimensions(); j++) {
                x[j][i] = d.input(j)[order[i]];
            }
            y[i] = d.response()[order[i]];
            ids[i] = d.rowIds()[order[i]];
        }
        return ReferenceData.numeric(d.inputNames(), x, "y", y, ids);
    }

    @Property(tries = 20)
    void shufflingRowsOrChangingThreadsChangesNoResultBitForBit(@ForAll long seed,
                                                                @ForAll @IntRange(min = 1, max = 5) int d) {
        ReferenceData data = TuningTest.coarse(seed, 300, d);
        int[] order = Tuning.allRows(300);
        ReferenceData other = shuffled(data, seed, order);
        Random r = new Random(seed);
        double[][] q = new double[d][30];
        for (int j = 0; j < d; j++) {
            for (int i = 0; i < 30; i++) {
                q[j][i] = r.nextInt(16) * 0.5;
            }
        }
        for (Metric metric : Metric.values()) {
            for (Weighting w : Weighting.values()) {
                KnnSettings s = KnnSettings.defaults().withK(7).withMetric(metric).withWeighting(w);
                Estimates a = KnnModel.fit(data, s.withThreads(1)).estimateAll(q, Progress.NONE);
                Estimates b = KnnModel.fit(other, s.withThreads(2)).estimateAll(q, Progress.NONE);
                assertArrayEquals(a.fit(), b.fit(), metric + " " + w);
                assertArrayEquals(a.bandLow(), b.bandLow());
                assertArrayEquals(a.bandHigh(), b.bandHigh());
                assertArrayEquals(a.localSd(), b.localSd());
                for (double v : a.fit()) {
                    assertFalse(Double.isNaN(v), "NaN for a finite query");
                }
            }
        }
        TuningTable ta = Tuning.leaveOneOut(KnnModel.fit(data, KnnSettings.defaults()), 15, Progress.NONE);
        TuningTable tb = Tuning.leaveOneOut(KnnModel.fit(other, KnnSettings.defaults().withThreads(1)), 15, Progress.NONE);
        assertArrayEquals(ta.rmse(), tb.rmse());
        assertArrayEquals(ta.rmseSe(), tb.rmseSe());
    }

    @Test
    void rowsWithMissingValuesAreLeftOutAndCountedPerColumn() {
        double nan = Double.NaN;
        ReferenceData d = ReferenceData.numeric(new String[] {"a", "b"},
                new double[][] {{1, nan, 3, 4, nan}, {1, 2, nan, 4, nan}}, "y", new double[] {1, 2, 3, nan, 5}, new int[] {10, 11, 12, 13, 14});
        assertEquals(1, d.size());
        assertEquals(10, d.rowIds()[0]);
        assertArrayEquals(new int[] {2, 2, 1}, d.droppedPerColumn());
        assertEquals(4, d.droppedRows());
    }

    @Test
    void kAboveTheUsableRowsIsAnErrorNamingTheCount() {
        NearfitException e = assertThrows(NearfitException.class,
                () -> oneInput(new double[] {1, 2, 3}, new double[] {1, 2, 3}, KnnSettings.defaults().withK(4)));
        assertTrue(e.getMessage().contains("3 usable reference rows"), e.getMessage());
    }

    @Test
    void aConstantInputIsAnErrorNamingTheColumn() {
        NearfitException e = assertThrows(NearfitException.class, () -> KnnModel.fit(ReferenceData.numeric(
                new String[] {"wind_speed", "pitch_deg"}, new double[][] {{1, 2, 3}, {0, 0, 0}}, "y", new double[] {1, 2, 3}, null),
                KnnSettings.defaults().withK(1)));
        assertEquals("pitch_deg", e.column());
    }

    @Test
    void aSingularCovarianceForMahalanobisNamesTheDependentColumns() {
        double[] a = {1, 2, 3, 4, 5, 7};
        double[] b = {2, 1, 0, 3, 1, 2};
        double[] c = new double[6];
        for (int i = 0; i < 6; i++) {
            c[i] = 2 * a[i] - b[i];
        }
        NearfitException e = assertThrows(NearfitException.class, () -> KnnModel.fit(ReferenceData.numeric(
                new String[] {"rotor_rpm", "wind_speed", "tip_speed"}, new double[][] {a, b, c}, "y", new double[6], null),
                KnnSettings.defaults().withK(1).withMetric(Metric.MAHALANOBIS)));
        assertEquals("tip_speed", e.column());
        assertTrue(e.getMessage().contains("rotor_rpm") && e.getMessage().contains("wind_speed"), e.getMessage());
    }

    @Test
    void scalingParametersAreThePopulationMomentsMedianMadAndRange() {
        ReferenceData d = ReferenceData.numeric(ONE, new double[][] {{1, 2, 3, 4, 10}}, "y", new double[5], null);
        InputTransform z = InputTransform.fit(d, Scaling.Z, Metric.EUCLIDEAN);
        assertEquals(4.0, z.center()[0], 1e-15);
        assertEquals(Math.sqrt((9 + 4 + 1 + 0 + 36) / 5.0), z.scale()[0], 1e-15);
        InputTransform rb = InputTransform.fit(d, Scaling.ROBUST, Metric.EUCLIDEAN);
        assertEquals(3.0, rb.center()[0], 0);
        assertEquals(1.4826 * 1.0, rb.scale()[0], 1e-15); // |x - 3| = 2,1,0,1,7 -> MAD 1
        InputTransform rg = InputTransform.fit(d, Scaling.RANGE, Metric.EUCLIDEAN);
        assertEquals(1.0, rg.center()[0], 0);
        assertEquals(9.0, rg.scale()[0], 0);
    }

    @Test
    void changingKKeepsTheIndexAndChangingScalingRebuildsIt() {
        KnnModel m = KnnModel.fit(TuningTest.coarse(1, 500, 2), KnnSettings.defaults());
        assertTrue(m.withSettings(m.settings().withK(3).withWeighting(Weighting.TRICUBE)).index() == m.index());
        assertFalse(m.withSettings(m.settings().withScaling(Scaling.RANGE)).index() == m.index());
    }

    @Test
    void aRestoredModelFromStoredRowsAndScalingGivesTheSameEstimates() {
        KnnModel m = KnnModel.fit(TuningTest.coarse(4, 800, 3), KnnSettings.defaults().withMetric(Metric.MAHALANOBIS));
        ReferenceData d = m.data();
        double[][] x = {d.input(0), d.input(1), d.input(2)};
        ReferenceData stored = ReferenceData.numeric(d.inputNames(), x, d.responseName(), d.response(), d.rowIds());
        KnnModel back = KnnModel.restore(stored, m.settings(), m.transform());
        assertEquals(m.estimate(1, 2, 3), back.estimate(1, 2, 3));
        assertArrayEquals(m.transform().whitening(), KnnModel.fit(stored, m.settings()).transform().whitening());
    }

    @Test
    void bandsAreQuantilesOrTwoSdsAroundTheFit() {
        double[] x = {1, 2, 3, 4, 5};
        double[] y = {1, 2, 3, 4, 10};
        KnnModel m = oneInput(x, y, KnnSettings.defaults().withK(5).withBand(Band.Q10_Q90));
        Estimate e = m.estimate(3.0);
        assertEquals(1.4, e.bandLow(), 1e-12); // numpy.percentile([1,2,3,4,10], 10) = 1.4
        assertEquals(7.6, e.bandHigh(), 1e-12); // numpy.percentile(..., 90) = 7.6
        assertEquals(Math.sqrt((9 + 4 + 1 + 0 + 36) / 5.0), e.localSd(), 1e-12); // population SD of y
        Estimate s = m.withSettings(m.settings().withBand(Band.SD2)).estimate(3.0);
        assertEquals(4 - 2 * e.localSd(), s.bandLow(), 1e-12);
    }

    @Test
    void categoryVotesShareTiesAndBreakClassTiesByTheNearestMember() {
        ReferenceData d = ReferenceData.category(ONE, new double[][] {{0, 1, -1, 3, 4}}, "state", new int[] {2, 0, 1, 1, 0}, 3, null);
        KnnModel m = KnnModel.fit(d, KnnSettings.defaults().withK(3).withScaling(Scaling.NONE));
        ClassVote v = m.vote(0.0);
        // x = 0 (class 2) counts fully; x = 1 and -1 (classes 0 and 1) tie at D = 1 and share 2 places: 1 each.
        assertArrayEquals(new double[] {1 / 3.0, 1 / 3.0, 1 / 3.0}, v.shares(), 1e-15);
        assertEquals(2, v.winner()); // its member is at distance 0
        ClassVote w = m.withSettings(m.settings().withK(2)).vote(0.0);
        assertArrayEquals(new double[] {0.25, 0.25, 0.5}, w.shares(), 1e-15);
        TuningTable t = Tuning.leaveOneOut(m, 4, Progress.NONE);
        assertTrue(t.errorRate()[0] >= 0 && t.errorRate()[0] <= 1);
        assertTrue(Double.isNaN(t.rmse()[0]));
    }

    @Test
    void batchVotesEqualOnePointVotesOnAnyThreadCountAndMarkMissingPoints() {
        Random r = new Random(21);
        int n = 4000;
        double[][] x = new double[2][n];
        int[] state = new int[n];
        for (int i = 0; i < n; i++) {
            x[0][i] = r.nextInt(30);
            x[1][i] = r.nextInt(30);
            state[i] = (x[0][i] + x[1][i] > 30 ? 2 : 0) + (r.nextInt(5) == 0 ? 1 : 0);
        }
        ReferenceData d = ReferenceData.category(new String[] {"a", "b"}, x, "state", state, 4, null);
        KnnModel one = KnnModel.fit(d, KnnSettings.defaults().withK(7).withThreads(1));
        KnnModel two = one.withSettings(one.settings().withThreads(2));
        double[][] q = new double[2][500];
        for (int i = 0; i < 500; i++) {
            q[0][i] = r.nextDouble() * 30;
            q[1][i] = r.nextInt(30);
        }
        q[0][11] = Double.NaN;
        ClassVotes a = one.voteAll(q, Progress.NONE);
        ClassVotes b = two.voteAll(q, Progress.NONE);
        assertArrayEquals(a.winner(), b.winner());
        assertArrayEquals(a.share(), b.share());
        assertEquals(-1, a.winner()[11]);
        for (int i = 0; i < 500; i++) {
            if (i != 11) {
                ClassVote v = one.vote(q[0][i], q[1][i]);
                assertEquals(v.winner(), a.winner()[i], "winner at " + i);
                assertEquals(v.shares()[v.winner()], a.share()[i], "share at " + i);
                assertEquals(v.neighbourCount(), a.neighbourCount()[i], "count at " + i);
            }
        }
    }

    @Test
    void batchNeighboursEqualOnePointSearchesAndMarkMissingPoints() {
        KnnModel m = KnnModel.fit(TuningTest.coarse(12, 3000, 3), KnnSettings.defaults().withK(4));
        Random r = new Random(12);
        int n = 300;
        double[][] q = new double[3][n];
        for (int j = 0; j < 3; j++) {
            for (int i = 0; i < n; i++) {
                q[j][i] = r.nextDouble() * 8;
            }
        }
        q[1][7] = Double.NaN;
        NeighborTable t = m.neighborsAll(q, Progress.NONE);
        Estimates e = m.estimateAll(q, Progress.NONE);
        Searcher s = m.searcher();
        for (int i = 0; i < n; i++) {
            if (i == 7) {
                assertEquals(-1, t.rowIds()[i * 4]);
                assertTrue(Double.isNaN(e.fit()[i]));
                continue;
            }
            NeighborList nl = s.neighbors(new double[] {q[0][i], q[1][i], q[2][i]});
            assertEquals(nl.count(), t.counted()[i]);
            for (int j = 0; j < 4; j++) {
                assertEquals(s.rowId(nl.position(j)), t.rowIds()[i * 4 + j]);
                assertEquals(Math.sqrt(nl.key(j)), t.distances()[i * 4 + j], 0);
            }
            assertEquals(s.estimate(new double[] {q[0][i], q[1][i], q[2][i]}), e.at(i));
        }
    }
}
