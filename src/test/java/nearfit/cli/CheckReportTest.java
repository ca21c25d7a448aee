package nearfit.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.time.Instant;
import java.util.List;
import java.util.Map;

import nearfit.knn.Band;
import nearfit.knn.Estimates;
import nearfit.knn.FlagScale;
import nearfit.knn.KnnSettings;
import nearfit.knn.Metric;
import nearfit.knn.Scaling;
import nearfit.knn.ScoredBlock;
import nearfit.knn.Weighting;
import nearfit.model.JsonTrees;
import org.junit.jupiter.api.Test;

class CheckReportTest {
    private static final double NaN = Double.NaN;

    static final CheckReport.About ABOUT = new CheckReport.About("spring.nfm", "ab12", "site.csv", null,
            new KnnSettings(30, Metric.EUCLIDEAN, Weighting.UNIFORM, Scaling.Z, Band.Q05_Q95,
                    KnnSettings.DEFAULT_FLAG_THRESHOLD, FlagScale.LOCAL_SD, 1), "given at fit, not tuned", 0.5, 20.0, "dev",
            Instant.parse("2026-12-02T12:00:00Z"), List.of("wind_ms"), "power_kw", "turbine", "time");

    private static CheckReport sample(double limit) {
        double[] z = {0.1, -4.0, NaN, 5.5, 0.3, -0.2};
        double[] y = {100, 200, NaN, 300, 400, 500};
        double[] fit = {101, 260, 150, 220, 399, 501};
        long[] lines = {2, 3, 4, 5, 6, 7};
        int[] groups = {0, 0, 1, 1, 1, -1};
        double[] wind = {5, 6, 7, 8, 9, 10};
        double[] times = {0, 600_000, 1_200_000, 1_800_000, NaN, 3_000_000};
        double[] none = new double[6];
        Estimates est = new Estimates(fit, none, none, none, none, new int[6]);
        double[] resid = new double[6];
        boolean[] flagged = new boolean[6];
        for (int i = 0; i < 6; i++) {
            resid[i] = y[i] - fit[i];
            flagged[i] = Math.abs(z[i]) > 3.5;
        }
        ScoredRows.Block b = new ScoredRows.Block(0, lines, times, groups, new double[][] {wind}, y, null,
                new ScoredBlock(est, resid, z, flagged), null);
        CheckReport.Tally t = new CheckReport.Tally(ABOUT, List.of("T01", "T02"), 3.5, null, 2);
        t.add(b);
        return t.report(limit, NaN);
    }

    @Test
    void countsRowsScoredRowsAndFlagsOverAllAndPerGroup() {
        CheckReport r = sample(0.01);
        assertEquals(6, r.rows());
        assertEquals(5, r.scored());
        assertEquals(2, r.flagged());
        assertEquals(0.4, r.flaggedFraction(), 1e-15);
        assertEquals(List.of(new CheckReport.GroupCount("T01", 2, 2, 1, 0), new CheckReport.GroupCount("T02", 3, 2, 1, 0)),
                r.groups());
    }

    @Test
    void theWorstRowsAreTheLargestAbsoluteZFirst() {
        List<CheckReport.WorstRow> worst = sample(0.01).worst();
        assertEquals(2, worst.size());
        assertEquals(5, worst.get(0).line());
        assertEquals(3, worst.get(1).line());
        assertEquals("T01", worst.get(1).group());
        assertEquals(200 - 260, worst.get(1).residual());
        assertEquals(6.0, worst.get(1).inputs()[0]);
        assertEquals(600_000.0, worst.get(1).time());
    }

    @Test
    void passesExactlyWhenTheFlaggedShareIsWithinTheLimit() {
        assertFalse(sample(0.39).passed());
        assertTrue(sample(0.40).passed());
    }

    @Test
    void jsonCarriesTheDocumentedFieldsAndTheCaution() {
        Map<?, ?> m = (Map<?, ?>) JsonTrees.parse(sample(0.01).toJson());
        assertEquals(List.of("checked", "rows", "scored", "flagged", "flagged_fraction", "limit", "passed", "threshold",
                "beyond_reference", "by_group", "worst", "caution"), List.copyOf(m.keySet()));
        assertEquals(Boolean.FALSE, m.get("passed"));
        assertEquals(Cautions.TEXT, m.get("caution"));
        Map<?, ?> checked = (Map<?, ?>) m.get("checked");
        assertEquals(List.of("model", "model_sha256", "data", "row_condition", "inputs", "response", "group",
                "time_column", "k", "k_chosen_by", "metric", "weights", "scaling", "band", "threshold", "z_scale",
                "residual_median", "residual_scale", "z_basis", "residual_scheme", "z_floor", "tool_version", "run_at"),
                List.copyOf(checked.keySet()));
        assertEquals("neighbour_spread", checked.get("z_basis"));
        Map<?, ?> worst = (Map<?, ?>) ((List<?>) m.get("worst")).get(0);
        assertEquals(List.of("line", "time", "group", "inputs", "response", "fit", "band_lo", "band_hi", "resid", "z",
                "beyond_reference"), List.copyOf(worst.keySet()));
        assertEquals("1970-01-01T00:30:00Z", worst.get("time"));
    }

    @Test
    void theTextReportNamesWhatWasCheckedThenTheVerdictAndEndsWithTheCautions() {
        StringWriter s = new StringWriter();
        sample(0.5).writeText(new PrintWriter(s));
        String text = s.toString();
        assertTrue(text.startsWith("model: spring.nfm (sha256 ab12)\ndata: site.csv\n"
                + "settings: k 30 (given at fit, not tuned), metric euclidean, weights uniform, scaling z, band q05-q95\n"
                + "flags: |z| > 3.5, z scale local: the neighbours' spread of responses (reference residuals: median 0.5, 1.4826 MAD 20)\n"
                + "run: nearfit dev at 2026-12-02T12:00:00Z\n"), text);
        assertTrue(text.contains("\nrows 6, scored 5, flagged 2 (40.00 %, |z| > 3.5), limit 50.00 %: PASSED\n"), text);
        assertTrue(text.contains("line time                 turbine           wind_ms     power_kw          fit"), text);
        assertTrue(text.contains("5 1970-01-01T00:30:00Z T02                     8          300          220"), text);
        assertTrue(text.strip().endsWith("qualified personnel."), text);
    }
}
