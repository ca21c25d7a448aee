package nearfit.spark;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import org.apache.spark.sql.SparkSession;

/**
 * What the fleet tests share: one Spark session in local[2,2] (two threads, a failed task tried twice), the demo site log (scripts/test makes it), a model
 * fitted on it by the single-machine tool, and runs of both tools in this process.
 */
final class FleetTestData {
    /** The demo log of the build, made by scripts/make-demo-log (scripts/test makes it when missing). */
    static final Path DEMO_LOG = Path.of("..", "data-demo", "site-log.csv.gz").toAbsolutePath().normalize();
    private static Path model;

    private FleetTestData() {
    }

    record Result(int status, String out, String err) {
        JsonNode json() {
            try {
                return new ObjectMapper().readTree(out);
            } catch (java.io.IOException e) {
                throw new AssertionError("not JSON: " + out + "\n" + err, e);
            }
        }

        @Override
        public String toString() {
            return "status " + status + "\nout:\n" + out + "\nerr:\n" + err;
        }
    }

    static SparkSession spark() {
        return FleetSession.open("local[2,2]", "test");
    }

    /**
     * A model of power against wind speed and air density on the seven healthy turbines' first five months
     * (the single-machine demo check's reference, DemoLogCheckTest), fitted once with the single-machine tool.
     */
    static synchronized Path model() throws Exception {
        if (model == null) {
            assertTrue(Files.isRegularFile(DEMO_LOG), "the demo log is missing: run scripts/test or "
                    + "java --source 17 scripts/make-demo-log --out data-demo/site-log.csv.gz");
            Path dir = Files.createTempDirectory("nearfit-spark-test");
            Path m = dir.resolve("spring.nfm");
            Result r = single("fit", DEMO_LOG.toString(), "-x", "wind_ms,air_density", "-y", "power_kw", "--k",
                    "30", "--where", "turbine != T05 and time < 2025-06-01", "--group", "turbine", "-o",
                    m.toString(), "--quiet");
            assertEquals(0, r.status(), r.toString());
            model = m;
        }
        return model;
    }

    /** The single-machine tool, in this process. */
    static Result single(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int status = nearfit.cli.Main.run(args, new PrintWriter(out), new PrintWriter(err));
        return new Result(status, out.toString(), err.toString());
    }

    /** A fleet job, in this process, on the shared local[2,2] session. */
    static Result fleet(String... args) {
        return fleetWith(options -> { }, args);
    }

    /** A fleet job with what is no option set by {@code tweak} (block size, the tasks' {@link TaskProbe}). */
    static Result fleetWith(java.util.function.Consumer<FleetOptions> tweak, String... args) {
        spark();
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int status = FleetMain.run(args, new PrintWriter(out), new PrintWriter(err), tweak);
        return new Result(status, out.toString(), err.toString());
    }
}
