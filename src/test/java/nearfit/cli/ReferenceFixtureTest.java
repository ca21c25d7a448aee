package nearfit.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;

import nearfit.model.JsonTrees;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * fit + predict and tune end to end against scikit-learn 1.2.1 (Debian's python3-sklearn):
 * KNeighborsRegressor fits and leave-one-out errors made by scripts/reference/make-cli-fixture, which
 * records versions and parameters in the fixtures (src/test/resources/cli/).
 */
class ReferenceFixtureTest {
    @TempDir
    static Path dir;
    static Path reference;
    static Path query;

    @BeforeAll
    static void copyFixtures() throws IOException {
        reference = copy("wind-reference.csv");
        query = copy("wind-query.csv");
    }

    @Test
    void predictedFitsMatchScikitLearnForEveryMetricScalingAndK() throws IOException {
        Map<String, List<Double>> expected = new java.util.LinkedHashMap<>();
        for (String line : resourceLines("sklearn-predict.csv")) {
            String[] f = line.split(",");
            expected.computeIfAbsent(f[0] + "," + f[1] + "," + f[2], key -> new ArrayList<>())
                    .add(Double.parseDouble(f[4]));
        }
        assertEquals(18, expected.size());
        for (Map.Entry<String, List<Double>> e : expected.entrySet()) {
            String[] key = e.getKey().split(",");
            String model = dir.resolve(String.join("-", key) + ".nfm").toString();
            CliRun.Result fit = CliRun.inProcess("fit", reference.toString(), "-x", "wind_ms,air_temp_c", "-y",
                    "power_kw", "--metric", key[0], "--scale", key[1], "--k", key[2], "-o", model, "--quiet");
            assertEquals(0, fit.status(), fit.toString());
            CliRun.Result predict = CliRun.inProcess("predict", model, query.toString(), "--quiet");
            assertEquals(0, predict.status(), predict.toString());
            List<String> rows = predict.out().lines().toList();
            assertEquals("line,wind_ms,air_temp_c,fit,band_lo,band_hi,beyond", rows.get(0));
            for (int i = 0; i < e.getValue().size(); i++) {
                double fitted = Double.parseDouble(rows.get(i + 1).split(",")[3]);
                double want = e.getValue().get(i);
                assertEquals(want, fitted, 1e-9 * Math.max(1, Math.abs(want)), e.getKey() + " row " + i);
            }
        }
    }

    @Test
    void leaveOneOutRmseAndMaeMatchScikitLearn() throws IOException {
        CliRun.Result r = CliRun.inProcess("tune", reference.toString(), "-x", "wind_ms,air_temp_c", "-y", "power_kw",
                "--scale", "none", "--kmax", "15", "--format", "json", "--quiet");
        assertEquals(0, r.status(), r.toString());
        Map<?, ?> json = (Map<?, ?>) JsonTrees.parse(r.out().strip());
        List<?> rmse = (List<?>) json.get("rmse");
        List<?> mae = (List<?>) json.get("mae");
        List<String> lines = resourceLines("sklearn-loo.csv");
        assertEquals(15, lines.size());
        for (String line : lines) {
            String[] f = line.split(",");
            int k = Integer.parseInt(f[0]);
            assertEquals(Double.parseDouble(f[1]), (Double) rmse.get(k - 1), 1e-9, "RMSE at k = " + k);
            assertEquals(Double.parseDouble(f[2]), (Double) mae.get(k - 1), 1e-9, "MAE at k = " + k);
        }
    }

    private static Path copy(String name) throws IOException {
        Path p = dir.resolve(name);
        try (InputStream in = ReferenceFixtureTest.class.getResourceAsStream("/cli/" + name)) {
            Files.copy(in, p);
        }
        return p;
    }

    /** The data lines of a fixture: comments and the header line left out. */
    private static List<String> resourceLines(String name) throws IOException {
        try (InputStream in = ReferenceFixtureTest.class.getResourceAsStream("/cli/" + name)) {
            List<String> lines = new ArrayList<>();
            for (String line : new String(in.readAllBytes(), StandardCharsets.UTF_8).split("\n")) {
                if (!line.startsWith("#") && !line.isBlank()) {
                    lines.add(line);
                }
            }
            return lines.subList(1, lines.size());
        }
    }
}
