package nearfit.knn;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import java.util.Random;

import nearfit.table.NearfitException;
import org.junit.jupiter.api.Test;

/**
 * The scoring call for new rows: fit and band as the model estimates them, residual, z by the rule of
 * {@link Flags} (local spread, or the modified z-score of Iglewicz and Hoaglin 1993 on the reference's
 * residual scale), and flags at |z| above the threshold. The commands' output through it is held by the
 * committed expected files of BlockScoringTest (the values the commands wrote before this call existed).
 */
class ScoringTest {
    /** A power curve with noise; below 4 m/s every response is 0, so the local spread there is 0. */
    private static KnnModel powerCurve() {
        Random r = new Random(11);
        int n = 600;
        double[] x = new double[n];
        double[] y = new double[n];
        int[] ids = new int[n];
        for (int i = 0; i < n; i++) {
            x[i] = 25.0 * i / n;
            y[i] = x[i] < 4 ? 0 : Math.min(2000, 2 * x[i] * x[i] * x[i]) + r.nextGaussian() * 20;
            ids[i] = i;
        }
        return KnnModel.fit(ReferenceData.numeric(new String[] {"wind_ms"}, new double[][] {x}, "power_kw", y, ids),
                KnnSettings.defaults().withK(10));
    }

    private static double[] newWind() {
        return new double[] {1.0, 2.0, 6.5, 8.25, 10.0, 12.5, 15.0, 20.0};
    }

    private static double[] newPower() {
        return new double[] {0.0, 35.0, 540.0, 700.0, 2000.0, 1990.0, 2000.0, 1200.0};
    }

    @Test
    void localZIsTheResidualOverTheNeighboursSdAtTheRow() {
        KnnModel m = powerCurve();
        double[] x = newWind();
        double[] y = newPower();
        ScoredBlock s = Scoring.score(m, new double[][] {x}, y, new ZBasis.LocalSpread(), 3.5, Progress.NONE);
        for (int i = 0; i < x.length; i++) {
            Estimate e = m.estimate(x[i]);
            assertEquals(e.fit(), s.fit()[i], 0.0, "fit at " + x[i]);
            assertEquals(e.bandLow(), s.bandLow()[i], 0.0);
            assertEquals(e.bandHigh(), s.bandHigh()[i], 0.0);
            assertEquals(y[i] - e.fit(), s.residual()[i], 0.0);
            if (e.localSd() > 0) {
                assertEquals((y[i] - e.fit()) / e.localSd(), s.z()[i], 1e-12, "z at " + x[i]);
            }
            assertEquals(Math.abs(s.z()[i]) > 3.5, s.flagged()[i], "flag at " + x[i]);
        }
        assertTrue(s.flagged()[7], "1200 kW at 20 m/s lies far under the curve: z " + s.z()[7]);
        assertFalse(s.flagged()[2], "540 kW at 6.5 m/s is on the curve (549 kW): z " + s.z()[2]);
        assertTrue(s.flagged()[1], "35 kW below cut-in, where every neighbour gives 0: z " + s.z()[1]);
    }

    @Test
    void referenceZIsTheModifiedZScoreOnTheReferencesLeaveOneOutResiduals() {
        KnnModel m = powerCurve();
        FlagResult loo = Flags.leaveOneOut(m, Progress.NONE);
        double[] x = newWind();
        double[] y = newPower();
        ScoredBlock s = Scoring.score(m, new double[][] {x}, y, new ZBasis.ReferenceResiduals(loo.median(), loo.mad()),
                3.5, Progress.NONE);
        for (int i = 0; i < x.length; i++) {
            double e = y[i] - m.estimate(x[i]).fit();
            assertEquals((e - loo.median()) / loo.mad(), s.z()[i], 1e-12, "z at " + x[i]);
            assertEquals(Math.abs(s.z()[i]) > 3.5, s.flagged()[i]);
        }
    }

    @Test
    void aZeroScaleGivesZeroForAZeroResidualAndAnInfinityOfItsSignOtherwiseNeverNaN() {
        KnnModel m = powerCurve();
        double[][] x = {{1.0, 1.5, 2.0}};
        double[] y = {0.0, 5.0, -5.0};
        ScoredBlock local = Scoring.score(m, x, y, new ZBasis.LocalSpread(), 3.5, Progress.NONE);
        assertEquals(0.0, m.estimate(1.5).localSd(), "every neighbour below cut-in gives 0 kW");
        assertArrayEquals(new double[] {0, Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY}, local.z());
        assertArrayEquals(new boolean[] {false, true, true}, local.flagged());
        ScoredBlock reference = Scoring.score(m, x, y, new ZBasis.ReferenceResiduals(0, 0), 3.5, Progress.NONE);
        assertArrayEquals(new double[] {0, Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY}, reference.z());
    }

    @Test
    void aMissingResponseOrInputGivesNaNAndNoFlagAndNoResponseAtAllGivesNaNEverywhere() {
        KnnModel m = powerCurve();
        double[][] x = {{8.0, Double.NaN, 9.0}};
        ScoredBlock s = Scoring.score(m, x, new double[] {Double.NaN, 500, 100}, new ZBasis.LocalSpread(), 3.5,
                Progress.NONE);
        assertTrue(Double.isNaN(s.residual()[0]) && Double.isNaN(s.z()[0]) && !s.flagged()[0], "missing response");
        assertTrue(Double.isNaN(s.z()[1]) && !s.flagged()[1], "missing input: z " + s.z()[1]);
        assertTrue(s.flagged()[2], "100 kW at 9 m/s is far under the curve");
        ScoredBlock none = Scoring.score(m, x, null, new ZBasis.ReferenceResiduals(0, 0), 3.5, Progress.NONE);
        assertEquals(m.estimate(8.0).fit(), none.fit()[0], 0.0);
        for (int i = 0; i < 3; i++) {
            assertTrue(Double.isNaN(none.residual()[i]) && Double.isNaN(none.z()[i]) && !none.flagged()[i]);
        }
    }

    @Test
    void zAndFlagsAreFlagsOwnRuleRowByRow() {
        KnnModel m = powerCurve();
        double[] x = newWind();
        double[] y = newPower();
        ScoredBlock s = Scoring.score(m, new double[][] {x}, y, new ZBasis.ReferenceResiduals(3, 40), 2.0,
                Progress.NONE);
        for (int i = 0; i < x.length; i++) {
            assertEquals(Flags.zScore(s.residual()[i] - 3, 40), s.z()[i], 0.0);
            assertEquals(Flags.isFlagged(s.z()[i], 2.0), s.flagged()[i]);
        }
        // The rule itself, NaN guard included (a NaN residual over a zero scale was an infinity in flags).
        assertEquals(2.5, Flags.zScore(5, 2));
        assertEquals(0.0, Flags.zScore(0, 0));
        assertEquals(Double.NEGATIVE_INFINITY, Flags.zScore(-1e-300, 0));
        assertEquals(Double.POSITIVE_INFINITY, Flags.zScore(7, Double.NaN));
        assertTrue(Double.isNaN(Flags.zScore(Double.NaN, 0)));
        assertTrue(Double.isNaN(Flags.zScore(Double.NaN, 3)));
        assertFalse(Flags.isFlagged(Double.NaN, 3.5));
        assertFalse(Flags.isFlagged(3.5, 3.5), "the threshold itself is not above the threshold");
        assertTrue(Flags.isFlagged(Double.NEGATIVE_INFINITY, 3.5));
    }

    @Test
    void aBlockScoredInPiecesGivesTheSameResultsAsWhole() {
        KnnModel m = powerCurve();
        double[] x = newWind();
        double[] y = newPower();
        ScoredBlock whole = Scoring.score(m, new double[][] {x}, y, new ZBasis.LocalSpread(), 3.5, Progress.NONE);
        for (int cut = 1; cut < x.length; cut += 3) {
            ScoredBlock a = Scoring.score(m, new double[][] {Arrays.copyOf(x, cut)}, Arrays.copyOf(y, cut),
                    new ZBasis.LocalSpread(), 3.5, Progress.NONE);
            ScoredBlock b = Scoring.score(m, new double[][] {Arrays.copyOfRange(x, cut, x.length)},
                    Arrays.copyOfRange(y, cut, y.length), new ZBasis.LocalSpread(), 3.5, Progress.NONE);
            for (int i = 0; i < x.length; i++) {
                ScoredBlock p = i < cut ? a : b;
                int j = i < cut ? i : i - cut;
                assertEquals(whole.z()[i], p.z()[j], 0.0);
                assertEquals(whole.fit()[i], p.fit()[j], 0.0);
            }
        }
    }

    @Test
    void aCategoryResponseOrMismatchedLengthsAreRefused() {
        double[] x = {1, 2, 3, 4, 5, 6};
        KnnModel votes = KnnModel.fit(ReferenceData.category(new String[] {"x"}, new double[][] {x}, "state",
                new int[] {0, 0, 0, 1, 1, 1}, 2, new int[] {0, 1, 2, 3, 4, 5}), KnnSettings.defaults().withK(3));
        assertThrows(NearfitException.class, () -> Scoring.score(votes, new double[][] {{2.5}}, new double[] {1},
                new ZBasis.LocalSpread(), 3.5, Progress.NONE));
        assertThrows(NearfitException.class, () -> Scoring.score(powerCurve(), new double[][] {{2.5, 3}},
                new double[] {1}, new ZBasis.LocalSpread(), 3.5, Progress.NONE));
    }
}
