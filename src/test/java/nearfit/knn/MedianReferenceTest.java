package nearfit.knn;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * External checks of {@link EstimateKind#MEDIAN} against numpy 1.24 (fixtures from
 * scripts/reference/make-median-fixture.py: 1 and 2 inputs, z scaling, Euclidean, continuous data
 * with a tenth of the rows at half the response). Uniform weights: numpy.median of the k
 * neighbours (definition 7 at 0.5). Inverse weights: the band's plotting-position rule written
 * independently in numpy (numpy.interp over p_i).
 */
class MedianReferenceTest {
    private static final double TOL = 1e-12;

    private static KnnModel model(Fixture f, int k, Weighting w) {
        double[][] x = f.columns("X");
        String[] names = new String[x.length];
        for (int j = 0; j < names.length; j++) {
            names[j] = "x" + j;
        }
        return KnnModel.fit(ReferenceData.numeric(names, x, "y", f.vector("y"), null),
                KnnSettings.defaults().withK(k).withWeighting(w).withScaling(Scaling.Z)
                        .withEstimate(EstimateKind.MEDIAN).withThreads(2));
    }

    private static void assertNear(double expected, double actual, String what) {
        assertEquals(expected, actual, TOL * Math.max(1, Math.abs(expected)), what);
    }

    @ParameterizedTest
    @ValueSource(strings = {"median-1d.txt", "median-2d.txt"})
    void uniformMedianFitMatchesNumpyMedianOfTheNeighbours(String file) {
        Fixture f = Fixture.load(file);
        double[][] q = f.table("Q");
        for (double kk : f.vector("k")) {
            int k = (int) kk;
            KnnModel m = model(f, k, Weighting.UNIFORM);
            double[] expected = f.vector("med_uniform_k" + k);
            for (int i = 0; i < q.length; i++) {
                assertNear(expected[i], m.estimate(q[i]).fit(), file + " k=" + k + " query " + i);
            }
        }
    }

    @ParameterizedTest
    @ValueSource(strings = {"median-1d.txt", "median-2d.txt"})
    void inverseDistanceMedianFitMatchesTheRuleComputedInNumpy(String file) {
        Fixture f = Fixture.load(file);
        double[][] q = f.table("Q");
        for (double kk : f.vector("k")) {
            int k = (int) kk;
            KnnModel m = model(f, k, Weighting.INVERSE);
            double[] expected = f.vector("med_inverse_k" + k);
            for (int i = 0; i < q.length; i++) {
                assertNear(expected[i], m.estimate(q[i]).fit(), file + " k=" + k + " query " + i);
            }
        }
    }

    @ParameterizedTest
    @ValueSource(strings = {"median-1d.txt", "median-2d.txt"})
    void leaveOneOutMediansMatchNumpyWithTheRowDropped(String file) {
        Fixture f = Fixture.load(file);
        for (double kk : f.vector("k")) {
            int k = (int) kk;
            FlagResult r = Flags.leaveOneOut(model(f, k, Weighting.UNIFORM), Progress.NONE);
            double[] expected = f.vector("loo_median_k" + k);
            for (int p = 0; p < r.rowIds().length; p++) {
                int row = r.rowIds()[p];
                assertNear(expected[row], r.looFit()[p], file + " k=" + k + " row " + row);
            }
        }
    }

    @ParameterizedTest
    @ValueSource(strings = {"median-1d.txt", "median-2d.txt"})
    void tuningUnderTheMedianMatchesNumpyLeaveOneOutRmseForEveryK(String file) {
        Fixture f = Fixture.load(file);
        int kmax = (int) f.vector("kmax")[0];
        TuningTable t = Tuning.leaveOneOut(model(f, 1, Weighting.UNIFORM), kmax, Progress.NONE);
        double[] expected = f.vector("loo_rmse_median");
        for (int k = 1; k <= kmax; k++) {
            assertNear(expected[k - 1], t.rmse()[k - 1], file + " k=" + k);
        }
    }
}
