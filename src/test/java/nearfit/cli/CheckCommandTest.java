package nearfit.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Map;

import nearfit.model.JsonTrees;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * {@code check} as a cron job and a ticket use it: it never passes on nothing, says when rows lie beyond the
 * reference, names what it checked, and can be re-run over its own output with {@code --force}.
 */
class CheckCommandTest {
    @TempDir
    static Path dir;
    static Path healthy;
    static String model;

    @BeforeAll
    static void fitAReference() throws IOException {
        healthy = WindSiteCsv.write(dir.resolve("healthy.csv"), 3, 300, 11, 0, 0, 0);
        model = dir.resolve("ref.nfm").toString();
        CliRun.Result r = CliRun.inProcess("fit", healthy.toString(), "-x", "wind_ms", "-y", "power_kw",
                "--k", "15", "--group", "turbine", "-o", model, "--quiet");
        assertEquals(0, r.status(), r.toString());
    }

    @Test
    void aRowConditionThatMatchesNothingIsAnErrorNotAPass() {
        // A lower-case typo: the turbines are T01..T03. Before, this printed "rows 0, scored 0 ... PASSED", exit 0.
        CliRun.Result r = CliRun.inProcess("check", model, healthy.toString(), "--quiet", "--where", "turbine = t01");
        assertEquals(2, r.status(), r.toString());
        assertEquals("", r.out());
        assertEquals("nearfit: " + healthy + ": no row scored (--min-rows 1): 0 of 900 rows meet --where "
                + "\"turbine = t01\"\n", r.err());
    }

    @Test
    void rowsLeftOutForMissingValuesAreCountedInTheMessage() throws IOException {
        Path blank = dir.resolve("no-power.csv");
        Files.writeString(blank, "time,turbine,wind_ms,power_kw\n2026-02-01T00:00:00Z,T01,7.5,\n"
                + "2026-02-01T00:10:00Z,T01,,800\n", StandardCharsets.UTF_8);
        CliRun.Result r = CliRun.inProcess("check", model, blank.toString(), "--quiet");
        assertEquals(2, r.status(), r.toString());
        assertEquals("nearfit: " + blank + ": no row scored (--min-rows 1): the file has 2 rows; 2 left out for "
                + "missing values (wind_ms missing in 1, power_kw missing in 1)\n", r.err());
    }

    @Test
    void fewerRowsScoredThanMinRowsIsAnErrorAndWritesNoFlaggedFile() {
        Path flagged = dir.resolve("too-few.csv");
        CliRun.Result r = CliRun.inProcess("check", model, healthy.toString(), "--quiet", "--min-rows", "1000",
                "-o", flagged.toString());
        assertEquals(2, r.status(), r.toString());
        assertTrue(r.err().startsWith("nearfit: " + healthy + ": only 900 rows scored (--min-rows 1000): the file has "
                + "900 rows\n"), r.err());
        assertFalse(Files.exists(flagged), "no flagged file from a check that was not judged");
        assertEquals(0, CliRun.inProcess("check", model, healthy.toString(), "--quiet", "--min-rows", "900").status());
    }

    @Test
    void aRaggedRowIsNotScoredAndTheLoadLineSaysItWasDropped() throws IOException {
        Path ragged = dir.resolve("ragged.csv");
        Files.writeString(ragged, "time,turbine,wind_ms,power_kw\n2026-02-01T00:00:00Z,T01,7.5,800\n"
                + "2026-02-01T00:10:00Z,T01,7,5,800\n2026-02-01T00:20:00Z,T01,8.5,1100\n", StandardCharsets.UTF_8);
        CliRun.Result r = CliRun.inProcess("check", model, ragged.toString(), "--limit", "100", "--format", "json");
        assertEquals(0, r.status(), r.toString());
        assertEquals(2.0, ((Map<?, ?>) JsonTrees.parse(r.out())).get("rows"), "the line with a decimal comma is not a row");
        assertTrue(r.err().contains(" in ") && r.err().contains("; 1 ragged rows dropped (another number of fields "
                + "than the header; describe lists their lines)\n"), r.err());
    }

    @Test
    void windSpeedsInKilometresPerHourAreReportedBeyondTheReference() throws IOException {
        // The same site's readings with wind in km/h against a reference in m/s: most rows lie above the
        // reference's largest wind speed, where a k-NN curve is flat.
        Path kmh = dir.resolve("kmh.csv");
        StringBuilder sb = new StringBuilder();
        for (String line : Files.readAllLines(healthy)) {
            String[] f = line.split(",");
            if (!f[0].equals("time")) {
                f[2] = String.format(Locale.ROOT, "%.3f", Double.parseDouble(f[2]) * 3.6);
            }
            sb.append(String.join(",", f)).append('\n');
        }
        Files.writeString(kmh, sb.toString(), StandardCharsets.UTF_8);
        CliRun.Result r = CliRun.inProcess("check", model, kmh.toString(), "--quiet", "--limit", "100",
                "--format", "json");
        assertEquals(0, r.status(), "with no --max-outside the rows beyond are reported, not judged: " + r);
        Map<?, ?> beyond = (Map<?, ?>) ((Map<?, ?>) JsonTrees.parse(r.out())).get("beyond_reference");
        double share = (Double) beyond.get("fraction");
        // Winds of 2..16 m/s become 7.2..57.6 km/h: every row above 16 km/h lies above the reference's range.
        assertTrue(share > 0.7, beyond.toString());
        Map<?, ?> wind = (Map<?, ?>) ((Map<?, ?>) beyond.get("by_input")).get("wind_ms");
        assertEquals((Double) beyond.get("rows"), (Double) wind.get("above"), beyond.toString());
        CliRun.Result text = CliRun.inProcess("check", model, kmh.toString(), "--quiet", "--limit", "100");
        assertTrue(text.out().matches("(?s).*\nbeyond the reference: \\d+ of 900 scored rows \\(\\d\\d\\.\\d\\d %\\), "
                + "no limit \\(--max-outside\\)\n  wind_ms: 0 below 2\\.\\d+, \\d+ above 15\\.\\d+ \\(the reference's range\\)\n.*"),
                text.out());
        CliRun.Result limited = CliRun.inProcess("check", model, kmh.toString(), "--quiet", "--limit", "100",
                "--max-outside", "10");
        assertEquals(Main.EXIT_CHECK_FAILED, limited.status(), limited.toString());
        assertTrue(limited.out().contains("--max-outside 10.00 %: EXCEEDED"), limited.out());
        assertTrue(limited.out().contains(": FAILED\n"), limited.out());
    }

    @Test
    void aRowInAHoleOfTheReferenceIsFarThoughInsideEveryInputsRange() throws IOException {
        // Reference on a ring in (x1, x2); new rows at its centre lie inside both ranges but far from every row.
        StringBuilder ref = new StringBuilder("x1,x2,y\n");
        for (int i = 0; i < 400; i++) {
            double a = 2 * Math.PI * i / 400;
            ref.append(String.format(Locale.ROOT, "%.5f,%.5f,%.3f%n", 10 * Math.cos(a), 10 * Math.sin(a), i % 7 * 0.1));
        }
        Path ring = Files.writeString(dir.resolve("ring.csv"), ref.toString(), StandardCharsets.UTF_8);
        String ringModel = dir.resolve("ring.nfm").toString();
        assertEquals(0, CliRun.inProcess("fit", ring.toString(), "-x", "x1,x2", "-y", "y", "--k", "5", "-o", ringModel,
                "--quiet").status());
        Path centre = Files.writeString(dir.resolve("centre.csv"), "x1,x2,y\n0,0,0.3\n0.5,-0.5,0.3\n9.9,1.3,0.3\n",
                StandardCharsets.UTF_8);
        CliRun.Result r = CliRun.inProcess("check", ringModel, centre.toString(), "--quiet", "--limit", "100",
                "--format", "json");
        assertEquals(0, r.status(), r.toString());
        Map<?, ?> beyond = (Map<?, ?>) ((Map<?, ?>) JsonTrees.parse(r.out())).get("beyond_reference");
        assertEquals(2.0, beyond.get("far"), beyond.toString());
        assertEquals(2.0, beyond.get("rows"), beyond.toString());
        for (Object input : ((Map<?, ?>) beyond.get("by_input")).values()) {
            assertEquals(0.0, ((Map<?, ?>) input).get("below"));
            assertEquals(0.0, ((Map<?, ?>) input).get("above"));
        }
    }

    @Test
    void theReportNamesTheModelByItsSha256AndEverySettingItUsed() throws Exception {
        CliRun.Result r = CliRun.inProcess("check", model, healthy.toString(), "--quiet", "--where", "wind_ms > 3",
                "--format", "json");
        assertEquals(0, r.status(), r.toString());
        Map<?, ?> checked = (Map<?, ?>) ((Map<?, ?>) JsonTrees.parse(r.out())).get("checked");
        java.security.MessageDigest sha = java.security.MessageDigest.getInstance("SHA-256");
        String expected = java.util.HexFormat.of().formatHex(sha.digest(Files.readAllBytes(Path.of(model))));
        assertEquals(expected, checked.get("model_sha256"));
        assertEquals(model, checked.get("model"));
        assertEquals(healthy.toString(), checked.get("data"));
        assertEquals("wind_ms > 3", checked.get("row_condition"));
        assertEquals(15.0, checked.get("k"));
        assertEquals("given at fit, not tuned", checked.get("k_chosen_by"));
        assertEquals("euclidean", checked.get("metric"));
        assertEquals(3.5, checked.get("threshold"));
        assertEquals("local", checked.get("z_scale"));
        assertTrue(checked.get("residual_scale") instanceof Double, checked.toString());
        assertEquals("time", checked.get("time_column"));
        assertTrue(((String) checked.get("run_at")).matches("\\d{4}-\\d\\d-\\d\\dT\\d\\d:\\d\\d:\\d\\dZ"), checked.toString());
        CliRun.Result text = CliRun.inProcess("check", model, healthy.toString(), "--quiet");
        List<String> lines = text.out().lines().toList();
        assertEquals("model: " + model + " (sha256 " + expected + ")", lines.get(0));
        assertEquals("data: " + healthy, lines.get(1));
        assertEquals("settings: k 15 (given at fit, not tuned), metric euclidean, weights uniform, scaling z, "
                + "band q05-q95", lines.get(2));
        assertTrue(lines.get(3).startsWith("flags: |z| > 3.5, z scale local: the neighbours' spread of responses "
                + "(reference residuals: median "), lines.get(3));
        assertTrue(lines.get(4).matches("run: nearfit \\S+ at \\d{4}-.*Z"), lines.get(4));
    }

    @Test
    void theReferenceScaleNamesTheNeighboursHeldOutResidualsAndItsFloor() {
        CliRun.Result r = CliRun.inProcess("check", model, healthy.toString(), "--quiet", "--z-scale", "reference",
                "--format", "json");
        Map<?, ?> checked = (Map<?, ?>) ((Map<?, ?>) JsonTrees.parse(r.out())).get("checked");
        assertEquals("neighbour_residuals", checked.get("z_basis"), checked.toString());
        assertEquals("loo", checked.get("residual_scheme")); // 50 hours of rows: --cv auto holds one row out
        assertEquals(0.25 * (Double) checked.get("residual_scale"), (Double) checked.get("z_floor"), 1e-12);
        CliRun.Result text = CliRun.inProcess("check", model, healthy.toString(), "--quiet", "--z-scale", "reference");
        assertTrue(text.out().contains("z scale reference: the median and 1.4826 MAD of the neighbours' held-out "
                + "residuals (loo), at least "), text.out());
    }

    @Test
    void aTunedModelNamesTheSchemeKWasChosenBy() {
        String tuned = dir.resolve("tuned.nfm").toString();
        assertEquals(0, CliRun.inProcess("fit", healthy.toString(), "-x", "wind_ms", "-y", "power_kw", "--kmax", "20",
                "--cv", "5", "-o", tuned, "--quiet").status());
        CliRun.Result r = CliRun.inProcess("check", tuned, healthy.toString(), "--quiet");
        assertTrue(r.out().lines().toList().get(2).matches("settings: k \\d+ \\(one-SE k by 5-fold cross-validation\\), .*"),
                r.out());
    }

    @Test
    void reRunningWithTheSameFlaggedFileNeedsForceAndTheMessageSaysSo() {
        Path flagged = dir.resolve("cron-flagged.csv");
        String[] args = {"check", model, healthy.toString(), "--quiet", "-o", flagged.toString()};
        assertEquals(0, CliRun.inProcess(args).status());
        CliRun.Result again = CliRun.inProcess(args);
        assertEquals(2, again.status());
        assertEquals("nearfit: " + flagged + ": exists already; add --force to replace it\n", again.err());
        String[] forced = java.util.Arrays.copyOf(args, args.length + 1);
        forced[args.length] = "--force";
        assertEquals(0, CliRun.inProcess(forced).status());
        CliRun.Result help = CliRun.inProcess("check", "--help");
        assertTrue(help.out().replaceAll("\\s+", " ").contains("add --force when a cron job writes the same file every run"),
                help.out());
    }
}
