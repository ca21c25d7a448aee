package nearfit.spark;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HashMap;
import java.util.Iterator;
import java.util.List;
import java.util.Map;

import com.fasterxml.jackson.databind.JsonNode;
import org.apache.spark.sql.Row;
import org.apache.spark.sql.SparkSession;
import org.apache.spark.sql.types.DataTypes;
import org.apache.spark.sql.types.StructType;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * The fleet jobs on the demo log as Parquet written by an outside writer (Apache Spark 4.2.0's own Parquet
 * writer, from the CSV with its three malformed lines dropped, in file order), and predict on CSV and Parquet,
 * agree with the single-machine check and predict on the CSV: counts over all and per turbine, the worst
 * rows (by time and turbine), and every prediction to 1e-12.
 */
class FleetParquetParityTest {
    private static final String PREDICT_WHERE = "time >= 2025-11-01 and turbine != T03";
    private static final String[] COLUMNS = {"time", "turbine", "wind_ms", "wind_dir_deg", "air_temp_c",
        "air_density", "power_kw", "rotor_rpm", "gearbox_oil_c"};
    private static Path dir;
    private static String parquet;

    @BeforeAll
    static void writeTheDemoLogAsParquet() throws Exception {
        FleetTestData.model();
        dir = Files.createTempDirectory("nearfit-spark-parquet");
        parquet = dir.resolve("site-log.parquet").toString();
        SparkSession spark = FleetTestData.spark();
        // Every column read as text and typed by try_cast, so cells that are not numbers stay rows with a
        // missing value, as the single-machine loader keeps them; the three lines with a wrong cell count go.
        StructType text = new StructType();
        for (String c : COLUMNS) {
            text = text.add(c, DataTypes.StringType);
        }
        spark.read().schema(text).option("header", "true").option("mode", "DROPMALFORMED")
                .csv(FleetTestData.DEMO_LOG.toString())
                .selectExpr("try_cast(time AS TIMESTAMP) AS time", "turbine", "try_cast(wind_ms AS DOUBLE) AS wind_ms",
                        "try_cast(wind_dir_deg AS DOUBLE) AS wind_dir_deg", "try_cast(air_temp_c AS DOUBLE) AS air_temp_c",
                        "try_cast(air_density AS DOUBLE) AS air_density", "try_cast(power_kw AS DOUBLE) AS power_kw",
                        "try_cast(rotor_rpm AS DOUBLE) AS rotor_rpm", "try_cast(gearbox_oil_c AS DOUBLE) AS gearbox_oil_c")
                .coalesce(1).write().parquet(parquet);
    }

    @Test
    void parquetCheckEqualsTheSingleMachineCheckOfTheCsv() throws Exception {
        String model = FleetTestData.model().toString();
        FleetTestData.Result single = FleetTestData.single("check", model, FleetTestData.DEMO_LOG.toString(),
                "--format", "json", "--quiet");
        FleetTestData.Result fleet = FleetTestData.fleet("check", model, parquet, "--format", "json");
        assertEquals(single.status(), fleet.status(), fleet.toString());
        JsonNode s = single.json();
        JsonNode f = fleet.json();
        for (String field : new String[] {"rows", "scored", "flagged", "passed", "beyond_reference"}) {
            assertEquals(s.get(field), f.get(field), field);
        }
        for (Iterator<Map.Entry<String, JsonNode>> it = s.get("by_group").fields(); it.hasNext(); ) {
            Map.Entry<String, JsonNode> g = it.next();
            assertEquals(g.getValue(), f.get("by_group").get(g.getKey()), "group " + g.getKey());
        }
        assertEquals(s.get("by_group").size(), f.get("by_group").size());
        JsonNode sw = s.get("worst");
        JsonNode fw = f.get("worst");
        assertEquals(sw.size(), fw.size());
        for (int i = 0; i < sw.size(); i++) {
            for (String field : new String[] {"time", "group", "inputs", "response", "fit", "z"}) {
                assertEquals(sw.get(i).get(field), fw.get(i).get(field), "worst row " + i + " " + field);
            }
            assertTrue(fw.get(i).get("file").asText().endsWith(".parquet"), fw.get(i).toString());
        }
    }

    @Test
    void checkWithAConditionAgreesOnCsvAndParquet() throws Exception {
        String model = FleetTestData.model().toString();
        FleetTestData.Result single = FleetTestData.single("check", model, FleetTestData.DEMO_LOG.toString(),
                "--format", "json", "--quiet", "--where", "turbine = T05 and time >= 2025-11-01", "--threshold", "3",
                "--z-scale", "reference", "--limit", "5");
        FleetTestData.Result fleet = FleetTestData.fleet("check", model, parquet, "--format", "json",
                "--where", "turbine = T05 and time >= 2025-11-01", "--threshold", "3", "--z-scale", "reference",
                "--limit", "5");
        assertEquals(1, single.status(), single.toString());
        assertEquals(single.status(), fleet.status(), fleet.toString());
        for (String field : new String[] {"rows", "scored", "flagged", "by_group"}) {
            assertEquals(single.json().get(field), fleet.json().get(field), field);
        }
    }

    @Test
    void predictOnCsvAndParquetEqualsTheSingleMachinePredict() throws Exception {
        String model = FleetTestData.model().toString();
        Path csv = dir.resolve("single.csv");
        FleetTestData.Result single = FleetTestData.single("predict", model, FleetTestData.DEMO_LOG.toString(),
                "--where", PREDICT_WHERE, "-o", csv.toString(), "--quiet");
        assertEquals(0, single.status(), single.toString());
        List<String> lines = Files.readAllLines(csv);
        assertEquals("line,time,turbine,wind_ms,air_density,power_kw,fit,band_lo,band_hi,resid,z,beyond", lines.get(0));
        Map<Long, String[]> byLine = new HashMap<>();
        Map<String, String[]> byTimeAndTurbine = new HashMap<>();
        for (String l : lines.subList(1, lines.size())) {
            String[] c = l.split(",", -1);
            byLine.put(Long.parseLong(c[0]), c);
            byTimeAndTurbine.put(c[1] + " " + c[2], c);
        }
        for (boolean fromParquet : new boolean[] {false, true}) {
            String out = dir.resolve(fromParquet ? "predicted-parquet" : "predicted-csv").toString();
            FleetTestData.Result fleet = FleetTestData.fleet("predict", model,
                    fromParquet ? parquet : FleetTestData.DEMO_LOG.toString(), "--where", PREDICT_WHERE, "-o", out);
            assertEquals(0, fleet.status(), fleet.toString());
            List<Row> rows = FleetTestData.spark().read().parquet(out).collectAsList();
            assertEquals(byLine.size(), rows.size(), "rows written");
            for (Row r : rows) {
                String[] c = fromParquet
                        ? byTimeAndTurbine.get(r.getTimestamp(2).toInstant().toString() + " " + r.getString(3))
                        : byLine.get(r.getLong(1) + 2);
                assertTrue(c != null, "no single-machine row for " + r);
                for (int k = 0; k < 8; k++) {
                    // wind_ms, air_density, power_kw, fit, band_lo, band_hi, resid, z
                    assertClose(c[3 + k], r.isNullAt(4 + k) ? Double.NaN : r.getDouble(4 + k), r.toString());
                }
                // beyond: the reference's one per-row rule, empty (null) where there is no fit
                assertEquals(c[11], r.isNullAt(12) ? "" : Long.toString(r.getLong(12)), r.toString());
            }
        }
    }

    private static void assertClose(String expected, double actual, String row) {
        double e = expected.isEmpty() ? Double.NaN : Double.parseDouble(expected);
        if (Double.isNaN(e) || Double.isNaN(actual)) {
            assertEquals(Double.isNaN(e), Double.isNaN(actual), row);
            return;
        }
        assertTrue(Math.abs(e - actual) <= 1e-12 * Math.max(1.0, Math.abs(e)), e + " against " + actual + " in " + row);
    }
}
