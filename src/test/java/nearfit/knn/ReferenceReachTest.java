package nearfit.knn;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import java.util.Random;

import org.junit.jupiter.api.Test;

/** Where a reference reaches: input ranges and the far rule, against brute force on small data. */
class ReferenceReachTest {
    private static final String[] TWO = {"x1", "x2"};

    private static KnnModel twoInputs(double[] x1, double[] x2, int k, Metric metric) {
        double[] y = new double[x1.length];
        for (int i = 0; i < y.length; i++) {
            y[i] = x1[i] + 2 * x2[i];
        }
        return KnnModel.fit(ReferenceData.numeric(TWO, new double[][] {x1, x2}, "y", y, null),
                KnnSettings.defaults().withK(k).withScaling(Scaling.NONE).withMetric(metric));
    }

    @Test
    void theRangesAreTheReferenceRowsSmallestAndLargestValues() {
        KnnModel m = twoInputs(new double[] {3, -1, 7, 2}, new double[] {10, 40, 20, 30}, 2, Metric.EUCLIDEAN);
        ReferenceReach r = ReferenceReach.of(m);
        assertEquals(-1, r.min(0));
        assertEquals(7, r.max(0));
        assertEquals(10, r.min(1));
        assertEquals(40, r.max(1));
        assertTrue(r.below(0, -1.01) && r.above(0, 7.01) && !r.below(0, -1) && !r.above(0, 7));
        assertFalse(r.below(0, Double.NaN) || r.above(0, Double.NaN), "a missing value is not outside");
    }

    @Test
    void theFarWidthIsThreeTimesThe99thPercentileOfLeaveOneOutKthNeighbourDistances() {
        // Brute force: each row's distance to its k-th nearest other row; their definition-7 quantile at 0.99
        // (Hyndman & Fan 1996, as numpy's default percentile) times 3.
        Random random = new Random(7);
        int n = 500;
        int k = 4;
        double[] x1 = new double[n];
        double[] x2 = new double[n];
        for (int i = 0; i < n; i++) {
            x1[i] = random.nextGaussian();
            x2[i] = 3 * random.nextDouble();
        }
        for (Metric metric : new Metric[] {Metric.EUCLIDEAN, Metric.MANHATTAN, Metric.CHEBYSHEV}) {
            double[] widths = new double[n];
            for (int i = 0; i < n; i++) {
                double[] d = new double[n - 1];
                for (int j = 0, c = 0; j < n; j++) {
                    if (j != i) {
                        double a = Math.abs(x1[i] - x1[j]);
                        double b = Math.abs(x2[i] - x2[j]);
                        d[c++] = switch (metric) {
                            case MANHATTAN -> a + b;
                            case CHEBYSHEV -> Math.max(a, b);
                            default -> Math.sqrt(a * a + b * b);
                        };
                    }
                }
                Arrays.sort(d);
                widths[i] = d[k - 1];
            }
            Arrays.sort(widths);
            double h = (n - 1) * 0.99;
            int lo = (int) Math.floor(h);
            double p99 = widths[lo] + (h - lo) * (widths[lo + 1] - widths[lo]);
            ReferenceReach r = ReferenceReach.of(twoInputs(x1, x2, k, metric));
            assertEquals(p99, r.referenceWidth(), 1e-12 * p99, metric.toString());
            assertEquals(3 * p99, r.farWidth(), 1e-12 * p99, metric.toString());
            assertEquals(n, r.sampledRows());
            assertTrue(r.far(3 * p99 * 1.0001) && !r.far(3 * p99 * 0.9999), metric.toString());
        }
    }

    @Test
    void aPointInAHoleOfTheReferenceIsFarAndItsWindowWidthSaysSo() {
        // A ring of radius 10: the centre is inside both inputs' ranges but 10 from every row.
        int n = 400;
        double[] x1 = new double[n];
        double[] x2 = new double[n];
        for (int i = 0; i < n; i++) {
            x1[i] = 10 * Math.cos(2 * Math.PI * i / n);
            x2[i] = 10 * Math.sin(2 * Math.PI * i / n);
        }
        KnnModel m = twoInputs(x1, x2, 5, Metric.EUCLIDEAN);
        ReferenceReach r = ReferenceReach.of(m);
        double centre = m.estimate(0.0, 0.0).windowWidth();
        double onTheRing = m.estimate(10.0, 0.0).windowWidth();
        assertEquals(10, centre, 1e-9);
        assertTrue(r.far(centre), centre + " against " + r.farWidth());
        assertFalse(r.far(onTheRing), onTheRing + " against " + r.farWidth());
    }

    @Test
    void withKAsLargeAsTheOtherRowsTheFarRuleIsOff() {
        KnnModel m = twoInputs(new double[] {1, 2, 3}, new double[] {1, 2, 4}, 3, Metric.EUCLIDEAN);
        ReferenceReach r = ReferenceReach.of(m);
        assertFalse(r.farRuleOn());
        assertFalse(r.far(1e300));
        assertEquals(0, r.sampledRows());
    }

    @Test
    void heavilyTiedOneInputReferenceGivesTheSameWidthsAsTheRowByRowSearch() {
        // One input with long runs of equal values takes the tied-run totals; the width is the k-th distance
        // leaving the row out either way: 0 inside a run longer than k.
        int n = 3000;
        double[] x = new double[n];
        double[] y = new double[n];
        for (int i = 0; i < n; i++) {
            x[i] = i < n - 1 ? i / 100 : 40; // 30 runs of 100 equal values, 1 apart, the last row alone at 40
            y[i] = i % 13;
        }
        KnnModel m = KnnModel.fit(ReferenceData.numeric(new String[] {"x"}, new double[][] {x}, "y", y, null),
                KnnSettings.defaults().withK(30).withScaling(Scaling.NONE));
        ReferenceReach r = ReferenceReach.of(m);
        // The 99th percentile is 0 (k = 30 equal rows beside all but the last row and its run's neighbours), so the
        // largest width stands in: the lone row's distance to its 30th neighbour, 40 - 29 = 11.
        assertEquals(11.0, r.referenceWidth());
        assertFalse(r.far(0.5), "a width between two steps is not far");
    }
}
