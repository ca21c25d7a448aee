package nearfit.knn;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Random;

import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import nearfit.table.CategoryColumn;
import nearfit.table.CsvLoader;
import nearfit.table.LoadOptions;
import nearfit.table.NearfitException;
import nearfit.table.RowSet;
import nearfit.table.Table;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The engine's promise: a query with finite inputs against a reference with at least k usable rows gets
 * a finite fit and window width, whatever the settings, duplicates, constant inputs or scales.
 */
class KnnRobustnessTest {

    /** A reference drawn from a seed: n rows, d inputs, some with heavy duplication or a constant column. */
    record Case(long seed, int n, int d, int k, int shape, KnnSettings settings) {
        double[][] inputs() {
            Random r = new Random(seed);
            double[][] x = new double[d][n];
            for (int j = 0; j < d; j++) {
                double scale = Math.pow(10, r.nextInt(9) - 3); // 1e-3 .. 1e5: units from m/s to Pa
                for (int i = 0; i < n; i++) {
                    x[j][i] = switch ((shape + j) % 4) {
                        case 0 -> r.nextGaussian() * scale;
                        case 1 -> Math.floor(r.nextDouble() * 3) * scale; // three distinct values: many ties
                        case 2 -> j == 0 ? scale : r.nextDouble() * scale; // first input constant
                        default -> i % 2 == 0 ? 0.0 : r.nextDouble() * scale;
                    };
                }
            }
            return x;
        }

        double[] response() {
            Random r = new Random(~seed);
            double[] y = new double[n];
            for (int i = 0; i < n; i++) {
                y[i] = shape == 3 ? 42.0 : r.nextGaussian() * 500 + 1000;
            }
            return y;
        }
    }

    @Provide
    Arbitrary<Case> cases() {
        Arbitrary<KnnSettings> settings = Combinators.combine(Arbitraries.of(Metric.class),
                Arbitraries.of(Weighting.class), Arbitraries.of(Scaling.class), Arbitraries.of(Band.class))
                .as((m, w, s, b) -> KnnSettings.defaults().withMetric(m).withWeighting(w).withScaling(s).withBand(b)
                        .withThreads(1));
        return Combinators.combine(Arbitraries.longs(), Arbitraries.integers().between(1, 120),
                Arbitraries.integers().between(1, 3), Arbitraries.integers().between(1, 30),
                Arbitraries.integers().between(0, 3), settings)
                .as((seed, extra, d, k, shape, s) -> new Case(seed, k + extra - 1, d, k, shape, s.withK(k)));
    }

    private static String[] names(int d) {
        String[] n = new String[d];
        for (int j = 0; j < d; j++) {
            n[j] = "input_" + j;
        }
        return n;
    }

    /**
     * A fit may refuse inputs it cannot scale (a constant input, a MAD of 0, a singular covariance), but
     * only with a message naming the input, never by returning NaN; {@code null} after such a refusal.
     */
    private static KnnModel fitOrNull(ReferenceData data, KnnSettings settings) {
        try {
            return KnnModel.fit(data, settings);
        } catch (NearfitException refused) {
            assertTrue(refused.getMessage().contains("input_"), refused.getMessage());
            return null;
        }
    }

    @Property(tries = 300)
    void aFiniteQueryWithAtLeastKRowsGetsAFiniteFit(@ForAll("cases") Case c) {
        ReferenceData data = ReferenceData.numeric(names(c.d()), c.inputs(), "response", c.response(), null);
        KnnModel model = fitOrNull(data, c.settings());
        if (model == null) {
            return;
        }
        Random r = new Random(c.seed() + 1);
        double[][] x = c.inputs();
        for (int q = 0; q < 8; q++) {
            double[] point = new double[c.d()];
            for (int j = 0; j < c.d(); j++) {
                // At a reference value, between values, and far outside the reference's range.
                double v = x[j][r.nextInt(c.n())];
                point[j] = q % 3 == 0 ? v : q % 3 == 1 ? v * (1 + r.nextGaussian()) : v * 1e4 + 1e4;
            }
            Estimate e = model.estimate(point);
            assertTrue(Double.isFinite(e.fit()), () -> "fit " + e + " at " + java.util.Arrays.toString(point));
            assertTrue(Double.isFinite(e.windowWidth()), () -> "window " + e);
            assertTrue(e.neighbourCount() >= c.k(), () -> "neighbours " + e);
        }
    }

    @Property(tries = 60)
    void leaveOneOutFitsAreFiniteWhenEveryRowHasKOthers(@ForAll("cases") Case c) {
        ReferenceData data = ReferenceData.numeric(names(c.d()), c.inputs(), "response", c.response(), null);
        if (c.n() <= c.k() || c.settings().metric() == Metric.MAHALANOBIS) {
            return; // leave-one-out needs k other rows; Mahalanobis refusals are covered above
        }
        KnnModel model = fitOrNull(data, c.settings());
        if (model == null) {
            return;
        }
        FlagResult f = Flags.leaveOneOut(model, Progress.NONE);
        for (int i = 0; i < f.looFit().length; i++) {
            assertTrue(Double.isFinite(f.looFit()[i]), "leave-one-out fit of row " + f.rowIds()[i]);
        }
    }

    @Test
    void anInfiniteInputIsDroppedLikeAMissingOneAndLeavesTheOtherFitsFinite() {
        // An input of 1e999 or "Infinity" in a file: the row cannot be placed, so it is not a neighbour.
        double[] x = {1, 2, 3, 4, Double.POSITIVE_INFINITY, 6, 7, 8};
        double[] y = {10, 20, 30, 40, 50, 60, 70, 80};
        ReferenceData data = ReferenceData.numeric(new String[] {"wind_ms"}, new double[][] {x}, "power_kw", y, null);
        assertEquals(7, data.size());
        assertEquals(1, data.droppedPerColumn()[0]);
        KnnModel m = KnnModel.fit(data, KnnSettings.defaults().withK(2).withThreads(1));
        assertEquals(15.0, m.estimate(1.5).fit(), 1e-12);
    }

    @Test
    void anInfiniteResponseIsDroppedLikeAMissingOne() {
        double[] x = {1, 2, 3, 4, 5};
        double[] y = {10, 20, Double.NEGATIVE_INFINITY, 40, 50};
        ReferenceData data = ReferenceData.numeric(new String[] {"wind_ms"}, new double[][] {x}, "power_kw", y, null);
        assertEquals(4, data.size());
        assertEquals(1, data.droppedPerColumn()[1]);
        KnnModel m = KnnModel.fit(data, KnnSettings.defaults().withK(2).withThreads(1));
        assertTrue(Double.isFinite(m.estimate(3.0).fit()));
    }

    @Test
    void aReferenceWithNoUsableRowSaysWhichColumnIsMissing() {
        // Before the fix: "k = 1 is more than the 0 usable reference rows; choose k <= 0".
        double nan = Double.NaN;
        ReferenceData data = ReferenceData.numeric(new String[] {"wind_ms"}, new double[][] {{3, 5, nan}},
                "power_kw", new double[] {nan, nan, nan}, null);
        NearfitException ex = org.junit.jupiter.api.Assertions.assertThrows(NearfitException.class,
                () -> KnnModel.fit(data, KnnSettings.defaults().withK(1)));
        assertEquals("no usable reference rows: wind_ms is missing in 1 of 3 rows; power_kw is missing in all 3 rows",
                ex.getMessage());
    }

    @TempDir
    java.nio.file.Path dir;

    /** A wind-site log with repeated readings (ties), blank cells and a turbine running low. */
    private static java.util.List<String> siteRows(int n) {
        Random r = new Random(11);
        java.util.List<String> rows = new java.util.ArrayList<>();
        for (int i = 0; i < n; i++) {
            String turbine = "T0" + (1 + i % 8);
            double wind = Math.round((3 + r.nextDouble() * 12) * 10) / 10.0; // one decimal: many ties
            double temp = Math.round(r.nextGaussian() * 50) / 10.0;
            double power = Math.min(2000, 1.1 * wind * wind * wind) * (turbine.equals("T05") ? 0.9 : 1)
                    + Math.round(r.nextGaussian() * 300) / 10.0;
            rows.add(java.time.Instant.ofEpochSecond(1_735_689_600L + 600L * (i / 8)) + "," + turbine + ","
                    + (i % 97 == 0 ? "" : Double.toString(wind)) + "," + temp + "," + power);
        }
        return rows;
    }

    private Table load(String name, java.util.List<String> rows) throws java.io.IOException {
        java.nio.file.Path p = dir.resolve(name);
        java.nio.file.Files.write(p, (String.join("\n", rows) + "\n").getBytes(java.nio.charset.StandardCharsets.UTF_8));
        return CsvLoader.load(p, name, LoadOptions.DEFAULT);
    }

    private static KnnModel fit(Table t) {
        RowSet all = t.allRows();
        double[][] x = new double[2][t.rowCount()];
        double[] y = new double[t.rowCount()];
        t.numeric("wind_ms").copyValues(all, x[0], 0);
        t.numeric("air_temp_c").copyValues(all, x[1], 0);
        t.numeric("power_kw").copyValues(all, y, 0);
        return KnnModel.fit(ReferenceData.numeric(new String[] {"wind_ms", "air_temp_c"}, x, "power_kw", y, null),
                KnnSettings.defaults().withK(15).withWeighting(Weighting.TRICUBE).withThreads(2));
    }

    /** Each row's identity in the source: its time and turbine, unique in the log. */
    private static String key(Table t, int row) {
        return (long) t.numeric("time").asDouble(row) + "/" + ((CategoryColumn) t.column("turbine")).label(row);
    }

    @Test
    void aShuffledCopyOfAFileGivesTheSameFlagsAndPredictionsRowByRow() throws java.io.IOException {
        java.util.List<String> rows = siteRows(3000);
        java.util.List<String> shuffled = new java.util.ArrayList<>(rows);
        java.util.Collections.shuffle(shuffled, new Random(5));
        String header = "time,turbine,wind_ms,air_temp_c,power_kw";
        rows.add(0, header);
        shuffled.add(0, header);
        Table a = load("site.csv", rows);
        Table b = load("shuffled.csv", shuffled);
        KnnModel ma = fit(a);
        KnnModel mb = fit(b);
        FlagResult fa = Flags.leaveOneOut(ma, Progress.NONE);
        FlagResult fb = Flags.leaveOneOut(mb, Progress.NONE);
        java.util.Map<String, Integer> inB = new java.util.HashMap<>();
        for (int i = 0; i < fb.rowIds().length; i++) {
            inB.put(key(b, fb.rowIds()[i]), i);
        }
        assertEquals(fa.rowIds().length, inB.size());
        assertTrue(fa.flaggedCount() > 0, "the low turbine gives some flags to compare");
        assertEquals(fa.flaggedCount(), fb.flaggedCount());
        for (int i = 0; i < fa.rowIds().length; i++) {
            String k = key(a, fa.rowIds()[i]);
            int j = inB.get(k);
            assertEquals(fa.looFit()[i], fb.looFit()[j], 0, k);
            assertEquals(fa.z()[i], fb.z()[j], 0, k);
            assertEquals(fa.flagged()[i], fb.flagged()[j], k);
        }
        for (double w = 2; w < 17; w += 0.37) {
            Estimate ea = ma.estimate(w, 4.0);
            Estimate eb = mb.estimate(w, 4.0);
            assertEquals(ea, eb, "at wind " + w);
        }
    }
}
