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
        // k = 30: the reference scale is the MAD of the k neighbours' residuals, too noisy from 10 of them (at
        // k = 10 this data flags 20 of 500 rows under it, 5 under the local SD; DEVELOPERS.md, the z scale)
        FlagResult f = Flags.leaveOneOut(plantedOutlier(KnnSettings.defaults().withK(30)), Progress.NONE);
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
    void theReferenceScaleIsTheNeighboursResidualMedianAndMadAndTheGlobalOnesAreReported() {
        KnnModel m = plantedOutlier(KnnSettings.defaults().withK(10));
        FlagResult f = Flags.leaveOneOut(m, Progress.NONE);
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
        // Without held-out residuals the neighbours' values are the leave-one-out residuals themselves; rows of
        // x 0.05 apart, so row i's 10 neighbours are i-5..i+5 without i (x increases with the canonical order).
        for (int i = 5; i < n - 5; i += 37) {
            double[] nb = new double[10];
            int c = 0;
            for (int j = i - 5; j <= i + 5; j++) {
                if (j != i) {
                    nb[c++] = f.residual()[j];
                }
            }
            Arrays.sort(nb);
            double mid = (nb[4] + nb[5]) / 2;
            double[] d = new double[10];
            for (int j = 0; j < 10; j++) {
                d[j] = Math.abs(nb[j] - mid);
            }
            Arrays.sort(d);
            double s = 1.4826 * (d[4] + d[5]) / 2;
            assertEquals((f.residual()[i] - mid) / Math.max(s, Flags.SPREAD_FLOOR_SHARE * mad), f.z()[i], 1e-9, "row " + i);
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
