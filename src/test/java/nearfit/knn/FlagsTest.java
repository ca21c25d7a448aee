package nearfit.knn;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import java.util.Random;
import org.junit.jupiter.api.Test;

/** Leave-one-out flags with the modified z-score (Iglewicz & Hoaglin 1993) and its local variants. */
class FlagsTest {

    private static KnnModel plantedOutlier(KnnSettings s) {
        Random r = new Random(3);
        int n = 500;
        double[] x = new double[n];
        double[] y = new double[n];
        int[] ids = new int[n];
        for (int i = 0; i < n; i++) {
            x[i] = 25.0 * i / n;
            y[i] = Math.min(2000, 2 * x[i] * x[i] * x[i]) + r.nextGaussian() * 20;
            ids[i] = 1000 + i;
        }
        y[250] -= 600; // a turbine row far below the power curve
        return KnnModel.fit(ReferenceData.numeric(new String[] {"wind_speed"}, new double[][] {x}, "power_kw", y, ids), s);
    }

    @Test
    void aRowFarFromTheCurveIsFlaggedAndNamedByItsRowId() {
        FlagResult f = Flags.leaveOneOut(plantedOutlier(KnnSettings.defaults().withK(10)), Progress.NONE);
        int p = -1;
        for (int i = 0; i < f.rowIds().length; i++) {
            if (f.rowIds()[i] == 1250) {
                p = i;
            }
        }
        assertTrue(f.flagged()[p]);
        assertTrue(f.z()[p] < -3.5);
        assertTrue(f.flaggedCount() < 10, "only the planted row and a few others: " + f.flaggedCount());
    }

    @Test
    void globalZIsTheResidualMinusTheMedianOverOnePointFourEightTwoSixMads() {
        FlagResult f = Flags.leaveOneOut(plantedOutlier(KnnSettings.defaults().withK(10)), Progress.NONE);
        double[] e = f.residual().clone();
        Arrays.sort(e);
        int n = e.length;
        double med = (e[n / 2 - 1] + e[n / 2]) / 2;
        double[] dev = new double[n];
        for (int i = 0; i < n; i++) {
            dev[i] = Math.abs(f.residual()[i] - med);
        }
        Arrays.sort(dev);
        double mad = 1.4826 * (dev[n / 2 - 1] + dev[n / 2]) / 2;
        assertEquals(med, f.median(), 1e-12);
        assertEquals(mad, f.mad(), 1e-12);
        for (int i = 0; i < n; i += 37) {
            assertEquals((f.residual()[i] - med) / mad, f.z()[i], 1e-12);
        }
    }

    @Test
    void localScalesDivideByTheNeighboursSpread() {
        KnnModel m = plantedOutlier(KnnSettings.defaults().withK(10).withFlags(3.5, FlagScale.LOCAL_SD));
        FlagResult f = Flags.leaveOneOut(m, Progress.NONE);
        FlagResult g = Flags.leaveOneOut(m.withSettings(m.settings().withFlags(3.5, FlagScale.LOCAL_MAD)), Progress.NONE);
        int planted = 250; // canonical order is by x, and x is increasing here
        assertEquals(1250, f.rowIds()[planted]);
        assertTrue(f.flagged()[planted] && g.flagged()[planted]);
        for (double z : f.z()) {
            assertFalse(Double.isNaN(z));
        }
    }
}
