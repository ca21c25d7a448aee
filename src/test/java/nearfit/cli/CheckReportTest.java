package nearfit.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.util.List;
import java.util.Map;

import nearfit.model.Json;
import org.junit.jupiter.api.Test;

class CheckReportTest {
    private static final double NaN = Double.NaN;

    private static CheckReport sample(double limit) {
        double[] z = {0.1, -4.0, NaN, 5.5, 0.3, -0.2};
        double[] y = {100, 200, NaN, 300, 400, 500};
        double[] fit = {101, 260, 150, 220, 399, 501};
        long[] lines = {2, 3, 4, 5, 6, 7};
        int[] groups = {0, 0, 1, 1, 1, -1};
        return CheckReport.tally(z, y, fit, lines, groups, List.of("T01", "T02"), 3.5, limit, 2);
    }

    @Test
    void countsRowsScoredRowsAndFlagsOverAllAndPerGroup() {
        CheckReport r = sample(0.01);
        assertEquals(6, r.rows());
        assertEquals(5, r.scored());
        assertEquals(2, r.flagged());
        assertEquals(0.4, r.flaggedFraction(), 1e-15);
        assertEquals(List.of(new CheckReport.GroupCount("T01", 2, 2, 1), new CheckReport.GroupCount("T02", 3, 2, 1)),
                r.groups());
    }

    @Test
    void theWorstRowsAreTheLargestAbsoluteZFirst() {
        List<CheckReport.WorstRow> worst = sample(0.01).worst();
        assertEquals(2, worst.size());
        assertEquals(5, worst.get(0).line());
        assertEquals(3, worst.get(1).line());
        assertEquals("T01", worst.get(1).group());
    }

    @Test
    void passesExactlyWhenTheFlaggedShareIsWithinTheLimit() {
        assertFalse(sample(0.39).passed());
        assertTrue(sample(0.40).passed());
    }

    @Test
    void jsonCarriesTheDocumentedFieldsAndTheCaution() {
        Map<?, ?> m = (Map<?, ?>) Json.parse(sample(0.01).toJson());
        assertEquals(List.of("rows", "scored", "flagged", "flagged_fraction", "limit", "passed", "threshold",
                "by_group", "worst", "caution"), List.copyOf(m.keySet()));
        assertEquals(Boolean.FALSE, m.get("passed"));
        assertEquals(Cautions.TEXT, m.get("caution"));
    }

    @Test
    void theTextReportEndsWithTheCautions() {
        StringWriter s = new StringWriter();
        sample(0.5).writeText(new PrintWriter(s), "power_kw", "turbine");
        String text = s.toString();
        assertTrue(text.startsWith("rows 6, scored 5, flagged 2 (40.00 %, |z| > 3.5), limit 50.00 %: PASSED"), text);
        assertTrue(text.strip().endsWith("qualified personnel."), text);
    }
}
