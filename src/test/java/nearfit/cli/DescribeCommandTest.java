package nearfit.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;

import nearfit.model.JsonTrees;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class DescribeCommandTest {
    @TempDir
    Path dir;

    record Result(int status, String out, String err) {
    }

    static Result run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int status = Main.run(args, new PrintWriter(out), new PrintWriter(err));
        return new Result(status, out.toString(), err.toString());
    }

    private Path siteLog() throws IOException {
        return Files.writeString(dir.resolve("site.csv"), "time,turbine,wind_ms\n"
                + "2025-03-01T00:00:00Z,T01,4\n2025-03-01T00:10:00Z,T02,6\n"
                + "2025-03-01T00:20:00Z,T01,\n2025-03-01T00:30:00Z,T01,8,extra\n2025-03-01T00:35:00Z,T01,8\n"
                + "2025-03-01T00:40:00Z,T03,1\n".repeat(6) + "2025-03-01T00:50:00Z,T03,fast\n");
    }

    @Test
    void tablePrintsEveryColumnAndTheLoadReport() throws IOException {
        Result r = run("describe", siteLog().toString(), "--quiet");
        assertEquals(0, r.status(), r.err());
        assertEquals("", r.err());
        List<String> lines = r.out().lines().toList();
        assertTrue(lines.get(0).endsWith("site.csv: 11 rows kept, 1 dropped, 3 columns, delimiter comma, header row"), lines.get(0));
        assertTrue(lines.get(1).matches("column +type +count +missing +bad +min +p01 +p25 +median +p75 +p99 +max +mean +sd"), lines.get(1));
        // wind_ms present: 4, 6, 8 and six 1s. Expected from numpy 1.24: percentile([1,25,50,75,99]) =
        // 1, 1, 1, 4, 7.84; mean 2.6666666666666665; std(ddof=1) 2.6925824035672523 (printed to 6 digits).
        assertTrue(lines.get(4).matches("wind_ms +number +9 +2 +1 +1 +1 +1 +1 +4 +7\\.84 +8 +2\\.66667 +2\\.69258"), lines.get(4));
        assertTrue(r.out().contains("  turbine: 3 distinct; most frequent T03 (7) T01 (3) T02 (1)\n"), r.out());
        assertTrue(r.out().contains("ragged rows: 1 dropped (0 short, 1 long; none of their cells is used)\n  line 5: 4 fields, not 3; row dropped\n"), r.out());
        assertTrue(r.out().contains("bad cells: 1 (read as missing)\n  line 13, column wind_ms: \"fast\"\n"), r.out());
        assertTrue(r.out().matches("(?s).*loaded [0-9.]+ MB in [0-9.]+ s \\([0-9]+ MB/s\\)\n"), r.out());
    }

    @Test
    void jsonIsOneObjectWithTheDocumentedFields() throws IOException {
        Result r = run("describe", siteLog().toString(), "--format", "json");
        assertEquals(0, r.status(), r.err());
        assertEquals(1, r.out().strip().lines().count());
        @SuppressWarnings("unchecked")
        Map<String, Object> doc = (Map<String, Object>) JsonTrees.parse(r.out());
        assertEquals(11.0, ((Number) doc.get("rows")).doubleValue());
        assertEquals(1.0, ((Number) doc.get("ragged_rows")).doubleValue());
        assertEquals(1.0, ((Number) doc.get("dropped_rows")).doubleValue());
        @SuppressWarnings("unchecked")
        List<Map<String, Object>> cols = (List<Map<String, Object>>) doc.get("columns");
        assertEquals(List.of("time", "turbine", "wind_ms"), cols.stream().map(c -> c.get("name")).toList());
        assertEquals(List.of("time", "category", "number"), cols.stream().map(c -> c.get("type")).toList());
        Map<String, Object> wind = cols.get(2);
        assertEquals(9.0, ((Number) wind.get("count")).doubleValue());
        assertEquals(1.0, ((Number) wind.get("bad")).doubleValue());
        assertEquals(8.0, ((Number) wind.get("max")).doubleValue());
        assertEquals(2.6666666666666665, ((Number) wind.get("mean")).doubleValue(), 1e-12); // numpy.mean
        assertEquals(2.6925824035672523, ((Number) wind.get("sd")).doubleValue(), 1e-12); // numpy.std(ddof=1)
        assertEquals(null, cols.get(1).get("mean"), "absent statistics are null");
        assertTrue(cols.get(1).containsKey("mean"));
    }

    @Test
    void aMissingFileIsExitStatusTwoWithOneLine() {
        Result r = run("describe", dir.resolve("absent.csv").toString());
        assertEquals(2, r.status());
        assertEquals("nearfit: " + dir.resolve("absent.csv") + ": no such file\n", r.err());
        assertEquals("", r.out());
    }

    @Test
    void numbersKeepTheirExponentAndTheZerosOfAnInteger() {
        // Before: a trailing-zero rule also ate the exponent's and an integer's zeros (1e+2, -1.5e-2, 1).
        assertEquals("1e+20", DescribeCommand.number(1e20));
        assertEquals("-1.5e-20", DescribeCommand.number(-1.5e-20));
        assertEquals("100000", DescribeCommand.number(100000));
        assertEquals("2.5", DescribeCommand.number(2.5));
        assertEquals("20", DescribeCommand.number(20));
        assertEquals("1.03", DescribeCommand.number(1.03));
    }

    /**
     * Checked against Java's own parser (Double.parseDouble) on random doubles of every magnitude: what is
     * printed reads back to the value within half a unit of its sixth significant digit.
     */
    @Test
    void aPrintedNumberReadsBackToTheValueWithinTheShownPrecision() {
        java.util.SplittableRandom random = new java.util.SplittableRandom(15);
        for (int i = 0; i < 200_000; i++) {
            double v = i % 2 == 0 ? Double.longBitsToDouble(random.nextLong())
                    : (random.nextDouble() - 0.5) * Math.pow(10, random.nextInt(-30, 30));
            if (!Double.isFinite(v)) {
                continue;
            }
            String shown = DescribeCommand.number(v);
            double back = Double.parseDouble(shown);
            // Half a unit in the sixth significant digit of the printed value (scaled by the decimal exponent).
            java.math.BigDecimal exact = new java.math.BigDecimal(v);
            java.math.BigDecimal read = new java.math.BigDecimal(shown);
            java.math.BigDecimal unit = v == 0 ? java.math.BigDecimal.ZERO
                    : java.math.BigDecimal.ONE.scaleByPowerOfTen(exact.precision() - exact.scale() - 6);
            assertTrue(exact.subtract(read).abs().compareTo(unit.divide(java.math.BigDecimal.valueOf(2))) <= 0,
                    () -> v + " printed as " + shown);
            assertTrue(back == 0 ? v == 0 || Math.abs(v) < Double.MIN_NORMAL * 1e6 : Math.signum(back) == Math.signum(v),
                    () -> v + " printed as " + shown);
        }
    }

    @Test
    void escapeSequencesInNamesAndLabelsArePrintedVisiblyNotSentToTheTerminal() throws IOException {
        Path p = Files.writeString(dir.resolve("esc.csv"), "wind_ms,\u001b]2;pwned\u0007\u001b[2J\n"
                + "1,T01\u001b[31m\n2,T02\n3,T01\u001b[31m\n");
        Result r = run("describe", p.toString(), "--quiet");
        assertEquals(0, r.status(), r.err());
        assertTrue(r.out().indexOf('\u001b') < 0 && r.out().indexOf('\u0007') < 0, r.out());
        assertTrue(r.out().contains("\\e]2;pwned\\a\\e[2J: 2 distinct; most frequent T01\\e[31m (2) T02 (1)"), r.out());
    }
}
