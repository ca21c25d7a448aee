package nearfit.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

import nearfit.model.JsonTrees;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * {@code describe} on the demo log shows no value outside its column's physical range. The ranges come from
 * data-demo/README.md and scripts/make-demo-log (rotor speed 9..16 rpm running, at most 2.5 idling, 0.5 parked;
 * heater keeps the gearbox oil at 12 °C or more; power 0..2000 kW; cut-out 25 m/s), widened by the bounded
 * measurement noise (3 SD). Before ragged rows were dropped, line 30739 (rotor_rpm missing) put an oil
 * temperature of 45.5 into rotor_rpm and line 88849 (a decimal comma) a rotor speed of 10 into gearbox_oil_c.
 */
class DemoLogRangesTest {
    @TempDir
    Path dir;

    /** Plausible bounds per column: lowest and highest value a healthy or faulty record can hold. */
    private static final Map<String, double[]> PHYSICAL = Map.of(
            "wind_ms", new double[] {0, 40},
            "wind_dir_deg", new double[] {0, 359},
            "air_temp_c", new double[] {-30, 45},
            "air_density", new double[] {1.0, 1.4},
            "power_kw", new double[] {-10, 2100},     // noise 1 % + 2 kW, bounded at 3 SD
            "rotor_rpm", new double[] {0, 17},        // 16 rpm at most, noise 0.1 rpm
            "gearbox_oil_c", new double[] {11, 90});  // heater: 12 °C or more, noise 0.3 °C

    @Test
    void describeOfTheDemoLogShowsEveryColumnWithinItsPhysicalRange() throws Exception {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int status = Main.run(new String[] {"describe", demoLog().toString(), "--format", "json", "--quiet"},
                new PrintWriter(out), new PrintWriter(err));
        assertEquals(0, status, err.toString());
        Map<?, ?> doc = (Map<?, ?>) JsonTrees.parse(out.toString());
        Map<String, Map<?, ?>> byName = new HashMap<>();
        for (Object c : (List<?>) doc.get("columns")) {
            Map<?, ?> column = (Map<?, ?>) c;
            byName.put((String) column.get("name"), column);
        }
        for (Map.Entry<String, double[]> e : PHYSICAL.entrySet()) {
            Map<?, ?> column = byName.get(e.getKey());
            double min = ((Number) column.get("min")).doubleValue();
            double max = ((Number) column.get("max")).doubleValue();
            assertTrue(min >= e.getValue()[0] && max <= e.getValue()[1],
                    e.getKey() + " spans " + min + " .. " + max + ", outside " + e.getValue()[0] + " .. " + e.getValue()[1]);
        }
        // data-demo/README.md: 420 480 records, of which lines 30739, 88849 and 221216 have the wrong field count.
        assertEquals(420_480 - 3, ((Number) doc.get("rows")).longValue());
        assertEquals(3, ((Number) doc.get("dropped_rows")).longValue());
    }

    /** The demo log of the build (scripts/test makes it), or one generated here with the same script. */
    private Path demoLog() throws Exception {
        Path built = Path.of("data-demo", "site-log.csv.gz");
        if (Files.isRegularFile(built)) {
            return built;
        }
        Path out = dir.resolve("site-log.csv.gz");
        Process p = new ProcessBuilder(Path.of(System.getProperty("java.home"), "bin", "java").toString(),
                "--source", "17", "scripts/make-demo-log", "--out", out.toString()).inheritIO().start();
        assertEquals(0, p.waitFor());
        return out;
    }
}
