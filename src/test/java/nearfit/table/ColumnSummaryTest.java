package nearfit.table;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.List;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class ColumnSummaryTest {
    @TempDir
    Path dir;

    private static void assertClose(double expected, double actual, String what) {
        if (Double.isNaN(expected)) {
            assertTrue(Double.isNaN(actual), what + ": expected NaN, got " + actual);
            return;
        }
        double tol = 1e-12 * Math.max(1, Math.abs(expected)) ;
        assertEquals(expected, actual, tol, what);
    }

    /**
     * Reference: numpy.percentile (method 'linear', Hyndman and Fan 1996 definition 7), numpy.mean and
     * numpy.std(ddof=1), from src/test/resources/table/quantiles-numpy.txt, written by
     * scripts/reference/make-quantile-fixture.py (numpy version and parameters on its first line).
     */
    @Test
    void statisticsMatchNumpyWithinOnePartInATrillion() throws IOException {
        String[] what = {"min", "p01", "p25", "median", "p75", "p99", "max", "mean", "sd"};
        int cases = 0;
        try (BufferedReader r = new BufferedReader(new InputStreamReader(
                getClass().getResourceAsStream("/table/quantiles-numpy.txt"), StandardCharsets.UTF_8))) {
            assertTrue(r.readLine().startsWith("# numpy "));
            String head;
            while ((head = r.readLine()) != null) {
                String name = head.split(" ")[1];
                String[] values = r.readLine().substring("values ".length()).split(" ");
                String[] stats = r.readLine().substring("stats ".length()).split(" ");
                // Through the loader, so number parsing is checked on numpy's repr() output as well.
                Table t = CsvFiles.load(dir, "x\n" + String.join("\n", values) + "\n");
                ColumnSummary s = ColumnSummary.of(t.column("x"));
                double[] got = {s.min(), s.p01(), s.p25(), s.median(), s.p75(), s.p99(), s.max(), s.mean(), s.sd()};
                assertEquals(values.length, s.count(), name);
                for (int i = 0; i < what.length; i++) {
                    assertClose("nan".equals(stats[i]) ? Double.NaN : Double.parseDouble(stats[i]), got[i], name + " " + what[i]);
                }
                cases++;
            }
        }
        assertEquals(7, cases);
    }

    @Test
    void missingAndBadCellsAreLeftOutOfTheStatistics() {
        Table t = CsvFiles.load(dir, "x\n1\n\n2\nNA\n3\n4\n5\n6\n7\n8\n9\noops\n");
        ColumnSummary s = ColumnSummary.of(t.column("x"));
        assertEquals(9, s.count());
        assertEquals(2, s.missing());
        assertEquals(1, s.bad());
        assertEquals(5.0, s.median());
        assertEquals(5.0, s.mean());
    }

    @Test
    void categoriesGiveDistinctCountAndMostFrequentLabelsFirst() {
        Table t = CsvFiles.load(dir, "turbine,v\nT02,1\nT01,1\nT01,1\nT03,1\n,1\nT01,1\nT02,1\n");
        ColumnSummary s = ColumnSummary.of(t.column("turbine"));
        assertEquals(3, s.distinct());
        assertEquals(6, s.count());
        assertEquals(1, s.missing());
        assertEquals(List.of(new ColumnSummary.LabelCount("T01", 3), new ColumnSummary.LabelCount("T02", 2),
                new ColumnSummary.LabelCount("T03", 1)), s.top());
    }

    @Test
    void timesAreSummarisedInEpochMilliseconds() {
        Table t = CsvFiles.load(dir, "time\n2025-03-01T00:00:00Z\n2025-03-03T00:00:00Z\n");
        ColumnSummary s = ColumnSummary.of(t.column("time"));
        assertEquals(ColumnType.TIME, s.type());
        assertEquals(java.time.Instant.parse("2025-03-02T00:00:00Z").toEpochMilli(), (long) s.median());
    }

    @Test
    void summariesOnSeveralThreadsEqualOneThreadsInColumnOrder() {
        StringBuilder csv = new StringBuilder("a,b,c,d,turbine\n");
        java.util.SplittableRandom r = new java.util.SplittableRandom(7);
        for (int i = 0; i < 5000; i++) {
            csv.append(r.nextDouble()).append(',').append(r.nextInt(100)).append(',').append(i % 7 == 0 ? "" : r.nextGaussian())
                    .append(',').append(-i).append(",T0").append(i % 3).append('\n');
        }
        Table t = CsvFiles.load(dir, csv.toString());
        List<ColumnSummary> one = ColumnSummary.ofAll(t.columns(), 1);
        assertEquals(one, ColumnSummary.ofAll(t.columns(), 4));
        assertEquals(List.of("a", "b", "c", "d", "turbine"), one.stream().map(ColumnSummary::name).toList());
        assertEquals(-4999.0, one.get(3).min());
        assertEquals(-2499.5, one.get(3).median()); // definition 7 on 0..-4999: the middle of -2499 and -2500
    }
}
