package nearfit.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.zip.ZipFile;

import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * {@code --estimate median} through the commands: fit stores it in the model file, predict and check use
 * the stored estimate, tune evaluates it. A reference of y = 10 x with one far row (x = 10, y = 5000):
 * at x = 10.2 the five nearest are x = 10, 11, 9, 12, 8, mean 1080, median 110.
 */
class EstimateOptionTest {
    @TempDir
    static Path dir;
    static Path reference;
    static Path query;

    @BeforeAll
    static void files() throws IOException {
        StringBuilder sb = new StringBuilder("x,y\n");
        for (int x = 1; x <= 20; x++) {
            sb.append(x).append(',').append(x == 10 ? 5000 : 10 * x).append('\n');
        }
        reference = Files.writeString(dir.resolve("ref.csv"), sb.toString());
        query = Files.writeString(dir.resolve("query.csv"), "x,y\n10.2,110\n");
    }

    private static String fit(String name, String... extra) {
        String model = dir.resolve(name).toString();
        List<String> args = new java.util.ArrayList<>(List.of("fit", reference.toString(), "-x", "x", "-y", "y",
                "--k", "5", "--band", "none", "-o", model, "--quiet", "--force"));
        args.addAll(List.of(extra));
        CliRun.Result r = CliRun.inProcess(args.toArray(new String[0]));
        assertEquals(0, r.status(), r.toString());
        return model;
    }

    private static double predicted(String model) {
        CliRun.Result r = CliRun.inProcess("predict", model, query.toString(), "--quiet");
        assertEquals(0, r.status(), r.toString());
        List<String> lines = r.out().lines().toList();
        assertEquals("line,x,y,fit,band_lo,band_hi,resid,z,beyond", lines.get(0));
        return Double.parseDouble(lines.get(1).split(",")[3]);
    }

    @Test
    void fitStoresTheMedianAndPredictUsesIt() throws IOException {
        String median = fit("median.nfm", "--estimate", "median");
        try (ZipFile z = new ZipFile(median)) {
            String manifest = new String(z.getInputStream(z.getEntry("manifest.json")).readAllBytes(),
                    java.nio.charset.StandardCharsets.UTF_8);
            assertTrue(manifest.contains("\"estimate\":\"median\""), manifest);
        }
        assertEquals(110.0, predicted(median));
        assertEquals(1080.0, predicted(fit("mean.nfm")), 1e-9);
    }

    @Test
    void checkScoresAgainstTheStoredEstimate() {
        // The query row is 110: no residual against the median, 970 below the mean.
        CliRun.Result median = CliRun.inProcess("check", fit("check-median.nfm", "--estimate", "median"),
                query.toString(), "--quiet");
        assertEquals(0, median.status(), median.toString());
        CliRun.Result mean = CliRun.inProcess("check", fit("check-mean.nfm"), query.toString(), "--quiet");
        assertNotEquals(median.out(), mean.out());
    }

    @Test
    void tuneEvaluatesTheChosenEstimate() {
        CliRun.Result mean = CliRun.inProcess("tune", reference.toString(), "-x", "x", "-y", "y", "--kmax", "5",
                "--format", "csv", "--quiet");
        CliRun.Result median = CliRun.inProcess("tune", reference.toString(), "-x", "x", "-y", "y", "--kmax", "5",
                "--format", "csv", "--quiet", "--estimate", "median");
        assertEquals(0, median.status(), median.toString());
        List<String> a = mean.out().lines().toList();
        List<String> b = median.out().lines().toList();
        assertTrue(b.get(0).startsWith("k,rmse,rmse_se,mae"), median.out());
        // With one or two neighbours the median is the mean; from three on, the far row no longer enters
        // its neighbours' fits at full weight: the mean absolute error halves (k = 5).
        assertEquals(a.get(1), b.get(1));
        assertEquals(a.get(2), b.get(2));
        double meanMae = Double.parseDouble(a.get(5).split(",")[3]);
        double medianMae = Double.parseDouble(b.get(5).split(",")[3]);
        assertTrue(medianMae < meanMae / 1.5, mean.out() + median.out());
    }

    @Test
    void anUnknownEstimateIsAUsageErrorNamingTheOption() {
        CliRun.Result r = CliRun.inProcess("fit", reference.toString(), "-x", "x", "-y", "y", "--estimate", "mode",
                "-o", dir.resolve("bad.nfm").toString());
        assertEquals(2, r.status(), r.toString());
        assertTrue(r.err().contains("--estimate") && r.err().contains("mean, median"), r.err());
        CliRun.Result view = CliRun.inProcess("view", reference.toString(), "--estimate", "mode");
        assertEquals(2, view.status(), view.toString());
        assertTrue(view.err().contains("--estimate': \"mode\" is not one of mean, median"), view.err());
    }
}
