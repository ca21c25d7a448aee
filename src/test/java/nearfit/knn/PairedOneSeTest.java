package nearfit.knn;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Random;

import org.junit.jupiter.api.Test;

/**
 * The one-SE rule over blocks compares each k with the best on the same blocks. Checked against the rule
 * written out here from brute-force fits outside each block (per-block sums of squared errors, the cluster-
 * robust SE of their paired difference), and shown to differ from the unpaired rule when some blocks are
 * far noisier than others for every k (common practice for comparing models on the same folds; the paired
 * comparison of Nadeau &amp; Bengio 2003, cited from memory).
 */
class PairedOneSeTest {

    @Test
    void theOneSeKComesFromThePairedDifferenceOverTheSameBlocks() {
        int n = 600;
        int groupsCount = 20;
        Random r = new Random(7);
        double[] x = new double[n];
        double[] y = new double[n];
        int[] group = new int[n];
        for (int i = 0; i < n; i++) {
            x[i] = i * 0.01 + r.nextDouble() * 0.001; // distinct distances: no ties decide anything here
            group[i] = i % groupsCount;
            // a curved response, so large k is biased; every fifth group is thirty times noisier for every k
            double noise = group[i] % 5 == 0 ? 30 : 1;
            y[i] = 50 * Math.sin(x[i]) + noise * r.nextGaussian();
        }
        ReferenceData data = ReferenceData.numeric(new String[] {"x"}, new double[][] {x}, "y", y, null);
        KnnModel m = KnnModel.fit(data, KnnSettings.defaults().withScaling(Scaling.NONE).withK(1));
        int[] ids = m.data().rowIds();
        int[] g = new int[n];
        for (int i = 0; i < n; i++) {
            g[i] = group[ids == null ? i : ids[i]];
        }
        HeldOutBlocks blocks = HeldOutBlocks.of(new HeldOutScheme.ByGroup(), n, g, null);
        int kmax = 120;
        TuningTable t = Tuning.heldOut(m, kmax, blocks, -1, 1, Progress.NONE);
        assertTrue(t.seOverBlocks());

        // The rule written out: per-block SSE for every k from brute-force fits outside the block.
        double[][] sse = new double[blocks.count()][kmax];
        long[] rows = new long[blocks.count()];
        double[] total = new double[kmax];
        for (int i = 0; i < n; i++) {
            int b = blocks.blockOf()[i];
            rows[b]++;
            for (int k = 1; k <= kmax; k++) {
                double e = m.data().response()[i]
                        - TuningTest.naiveFitOutside(m, i, blocks.blockOf(), k, Weighting.UNIFORM);
                sse[b][k - 1] += e * e;
                total[k - 1] += e * e;
            }
        }
        int best = 0;
        for (int k = 1; k < kmax; k++) {
            if (total[k] < total[best]) {
                best = k;
            }
        }
        assertEquals(best + 1, t.bestK());
        int paired = best;
        for (int k = kmax - 1; k > best; k--) {
            double diff = (total[k] - total[best]) / n;
            double acc = 0;
            for (int b = 0; b < rows.length; b++) {
                double dev = (sse[b][k] - sse[b][best]) - rows[b] * diff;
                acc += dev * dev;
            }
            double se = Math.sqrt(rows.length / (rows.length - 1.0) * acc) / n;
            if (diff <= se) {
                paired = k;
                break;
            }
        }
        assertEquals(paired + 1, t.oneSeK(), "the paired one-SE k");
        // The unpaired rule (best RMSE plus the best's own blocked SE) accepts a larger k on these data: the
        // noisy groups' spread is shared by every k and hides the bias of large k.
        int unpaired = best;
        for (int k = kmax - 1; k > best; k--) {
            if (t.rmse()[k] <= t.rmse()[best] + t.rmseSe()[best]) {
                unpaired = k;
                break;
            }
        }
        assertTrue(unpaired > paired, "unpaired " + (unpaired + 1) + " against paired " + (paired + 1));
    }
}
