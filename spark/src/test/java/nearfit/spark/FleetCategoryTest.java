package nearfit.spark;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

import org.apache.spark.sql.Dataset;
import org.apache.spark.sql.Row;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * A model of a category response (which turbine a reading comes from, by wind speed and power: a vote among
 * eight classes with many close calls) on the fleet: predict gives the class and its vote share of the core's
 * class votes, equal to the single-machine predict's row by row (the outside reference is the tool's own
 * single-machine path, whose votes the core's tests check against scikit-learn); check refuses such a model
 * with the single-machine check's line and exit status 2.
 */
class FleetCategoryTest {
    private static final String WHERE = "time >= 2025-12-20";
    private static Path dir;
    private static String model;

    @BeforeAll
    static void fitACategoryModel() throws Exception {
        dir = Files.createTempDirectory("nearfit-spark-category");
        model = dir.resolve("which-turbine.nfm").toString();
        FleetTestData.Result r = FleetTestData.single("fit", FleetTestData.DEMO_LOG.toString(), "-x",
                "wind_ms,power_kw", "-y", "turbine", "--k", "15", "--where", "time < 2025-01-15", "-o", model,
                "--quiet");
        assertEquals(0, r.status(), r.toString());
        FleetTestData.spark();
    }

    @Test
    void predictGivesTheSingleMachineClassesAndShares() throws Exception {
        Path csv = dir.resolve("single.csv");
        FleetTestData.Result single = FleetTestData.single("predict", model, FleetTestData.DEMO_LOG.toString(),
                "--where", WHERE, "-o", csv.toString(), "--quiet");
        assertEquals(0, single.status(), single.toString());
        List<String> lines = Files.readAllLines(csv);
        List<String> header = List.of(lines.get(0).split(","));
        assertEquals(List.of("line", "time", "wind_ms", "power_kw", "turbine", "class", "share", "beyond"), header);
        Map<Long, String[]> byLine = new HashMap<>();
        for (String l : lines.subList(1, lines.size())) {
            String[] c = l.split(",", -1);
            byLine.put(Long.parseLong(c[0]), c);
        }

        Path out = dir.resolve("predicted");
        FleetTestData.Result fleet = FleetTestData.fleet("predict", model, FleetTestData.DEMO_LOG.toString(),
                "--where", WHERE, "-o", out.toString());
        assertEquals(0, fleet.status(), fleet.toString());
        Dataset<Row> rows = FleetTestData.spark().read().parquet(out.toString());
        List<String> expected = new ArrayList<>(List.of("file", "row"));
        expected.addAll(header.subList(1, header.size()));
        assertEquals(expected, List.of(rows.columns()), "the single-machine columns, file and row for line");
        List<Row> all = rows.collectAsList();
        assertEquals(byLine.size(), all.size(), "rows written");
        int differentClass = 0;
        int split = 0;
        for (Row r : all) {
            String[] c = byLine.get(r.getLong(1) + 2);
            assertTrue(c != null, "no single-machine row for " + r);
            assertEquals(c[1], r.isNullAt(2) ? "" : r.getTimestamp(2).toInstant().toString(), r.toString());
            assertEquals(c[4], r.isNullAt(5) ? "" : r.getString(5), "actual class " + r);
            assertEquals(c[5], r.isNullAt(6) ? "" : r.getString(6), "voted class " + r);
            double share = r.isNullAt(7) ? Double.NaN : r.getDouble(7);
            if (c[6].isEmpty() || Double.isNaN(share)) {
                assertEquals(c[6].isEmpty(), Double.isNaN(share), r.toString());
            } else {
                assertEquals(Double.parseDouble(c[6]), share, 1e-12, r.toString());
                split += share < 1 ? 1 : 0;
            }
            assertEquals(c[7], r.isNullAt(8) ? "" : Long.toString(r.getLong(8)), "beyond " + r);
            differentClass += c[5].equals(c[4]) ? 0 : 1;
        }
        assertTrue(split > 100 && differentClass > 100, "votes are close calls here: " + split + " split, "
                + differentClass + " not the reading's turbine");
    }

    @Test
    void checkRefusesACategoryModelAsTheSingleMachineCheckDoes() {
        String log = FleetTestData.DEMO_LOG.toString();
        FleetTestData.Result single = FleetTestData.single("check", model, log, "--quiet");
        FleetTestData.Result fleet = FleetTestData.fleet("check", model, log);
        assertEquals(2, single.status(), single.toString());
        assertEquals(single.status(), fleet.status(), fleet.toString());
        assertEquals(1, fleet.err().strip().lines().count(), fleet.err());
        String line = single.err().strip();
        assertTrue(line.startsWith("nearfit: ") && line.contains("is a category"), line);
        assertEquals(line.substring("nearfit: ".length()), fleet.err().strip().substring("nearfit-spark: ".length()));
    }
}
