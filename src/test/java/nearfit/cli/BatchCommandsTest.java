package nearfit.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;

import nearfit.model.JsonTrees;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** fit, predict, check and tune end to end through {@link Main#run}, on small invented site logs. */
class BatchCommandsTest {
    @TempDir
    static Path dir;
    static Path healthy;
    static Path weak;
    static String model;

    @BeforeAll
    static void fitAReference() throws IOException {
        healthy = WindSiteCsv.write(dir.resolve("healthy.csv"), 3, 300, 11, 0, 0, 0);
        // T02 delivers 25 % less from its 150th row on.
        weak = WindSiteCsv.write(dir.resolve("weak.csv"), 3, 300, 12, 2, 150, 0.25);
        model = dir.resolve("ref.nfm").toString();
        CliRun.Result r = CliRun.inProcess("fit", healthy.toString(), "-x", "wind_ms", "-y", "power_kw",
                "--k", "15", "--group", "turbine", "-o", model, "--quiet");
        assertEquals(0, r.status(), r.toString());
    }

    @Test
    void fitReportsTheKAndTheRowsAndWritesAModelFile() {
        assertTrue(Files.isRegularFile(Path.of(model)));
        CliRun.Result r = CliRun.inProcess("fit", healthy.toString(), "-x", "wind_ms", "-y", "power_kw",
                "--k", "15", "-o", dir.resolve("again.nfm").toString(), "--quiet");
        assertEquals(0, r.status(), r.toString());
        assertTrue(r.out().contains("k = 15 on 900 reference rows"), r.out());
    }

    @Test
    void predictWritesEveryRowWithLineTimeGroupInputsFitBandResidualAndZ() {
        CliRun.Result r = CliRun.inProcess("predict", model, healthy.toString(), "--quiet");
        assertEquals(0, r.status(), r.toString());
        List<String> lines = r.out().lines().toList();
        // The time column is not a model column; it is kept so that each row can be traced by its time too.
        assertEquals("line,time,turbine,wind_ms,power_kw,fit,band_lo,band_hi,resid,z,beyond", lines.get(0));
        assertEquals(901, lines.size());
        String[] first = lines.get(1).split(",");
        assertEquals("2", first[0]);
        assertTrue(first[1].matches("\\d{4}-\\d\\d-\\d\\dT\\d\\d:\\d\\d:\\d\\dZ"), lines.get(1));
        double fit = Double.parseDouble(first[5]);
        double lo = Double.parseDouble(first[6]);
        double hi = Double.parseDouble(first[7]);
        assertTrue(lo <= fit && fit <= hi, lines.get(1));
    }

    @Test
    void predictWithoutTheResponseColumnLeavesOutResidAndZ() throws IOException {
        Path noResponse = dir.resolve("no-power.csv");
        Files.writeString(noResponse, "wind_ms\n3.5\n8.0\n14.0\n");
        CliRun.Result r = CliRun.inProcess("predict", model, noResponse.toString(), "--quiet");
        assertEquals(0, r.status(), r.toString());
        List<String> lines = r.out().lines().toList();
        assertEquals("line,wind_ms,fit,band_lo,band_hi,beyond", lines.get(0));
        double low = Double.parseDouble(lines.get(1).split(",")[2]);
        double high = Double.parseDouble(lines.get(3).split(",")[2]);
        // The invented curve: about 77 kW at 3.5 m/s and 2000 kW at 14 m/s.
        assertTrue(low < 300 && high > 1800, r.out());
    }

    @Test
    void predictNamesAMissingModelInput() throws IOException {
        Path other = dir.resolve("other.csv");
        Files.writeString(other, "speed,power_kw\n3.5,100\n");
        CliRun.Result r = CliRun.inProcess("predict", model, other.toString(), "--quiet");
        assertEquals(2, r.status(), r.toString());
        assertTrue(r.err().contains("no column \"wind_ms\""), r.err());
    }

    @Test
    void checkPassesOnHealthyDataWithStatus0() {
        CliRun.Result r = CliRun.inProcess("check", model, healthy.toString(), "--quiet");
        assertEquals(0, r.status(), r.toString());
        assertTrue(r.out().contains("PASSED"), r.out());
        assertTrue(r.out().strip().endsWith(Cautions.TEXT.substring(Cautions.TEXT.length() - 40)), r.out());
    }

    @Test
    void checkFailsWithStatus1WhenATurbineUnderPerforms() {
        CliRun.Result r = CliRun.inProcess("check", model, weak.toString(), "--quiet", "--format", "json");
        assertEquals(1, r.status(), r.toString());
        Map<?, ?> json = (Map<?, ?>) JsonTrees.parse(r.out().strip());
        assertEquals(900.0, json.get("rows"));
        assertEquals(Boolean.FALSE, json.get("passed"));
        Map<?, ?> byGroup = (Map<?, ?>) json.get("by_group");
        double t02 = (Double) ((Map<?, ?>) byGroup.get("T02")).get("flagged_fraction");
        double t01 = (Double) ((Map<?, ?>) byGroup.get("T01")).get("flagged_fraction");
        assertTrue(t02 > 0.2 && t01 < 0.02, byGroup.toString());
        assertTrue(((String) json.get("caution")).contains("not a protection or safety system"));
    }

    @Test
    void checkOnTheWeakTurbinesEarlyRowsAlonePasses() {
        CliRun.Result r = CliRun.inProcess("check", model, weak.toString(), "--quiet", "--where",
                "time < 2026-01-02T01:00:00Z");
        assertEquals(0, r.status(), r.toString());
    }

    @Test
    void checkWritesTheFlaggedRowsWhenAsked() throws IOException {
        Path flagged = dir.resolve("flagged.csv");
        CliRun.Result r = CliRun.inProcess("check", model, weak.toString(), "--quiet", "-o", flagged.toString());
        assertEquals(1, r.status(), r.toString());
        List<String> lines = Files.readAllLines(flagged);
        assertTrue(lines.size() > 30, "flagged rows: " + lines.size());
        assertTrue(lines.get(0).endsWith(",z,beyond"), lines.get(0));
        for (String line : lines.subList(1, lines.size())) {
            String[] c = line.split(",", -1);
            assertTrue(Math.abs(Double.parseDouble(c[c.length - 2])) > 3.5, line);
        }
    }

    @Test
    void aLimitAboveTheFlaggedShareTurnsTheFailureIntoAPass() {
        CliRun.Result r = CliRun.inProcess("check", model, weak.toString(), "--quiet", "--limit", "60");
        assertEquals(0, r.status(), r.toString());
    }

    @Test
    void tuneJsonHasExactlyTheDocumentedKeys() {
        CliRun.Result r = CliRun.inProcess("tune", healthy.toString(), "-x", "wind_ms", "-y", "power_kw",
                "--kmax", "30", "--format", "json", "--quiet");
        assertEquals(0, r.status(), r.toString());
        Map<?, ?> json = (Map<?, ?>) JsonTrees.parse(r.out().strip());
        assertEquals(List.of("rows", "k", "rmse", "rmse_se", "mae", "press", "r2_pred", "best_k", "one_se_k",
                "sampled", "scheme", "cv", "blocks", "se_basis", "best_at_edge", "one_se_at_edge"),
                List.copyOf(json.keySet()));
        // the healthy log's times span less than ten days: auto is leave-one-out, SEs over rows
        assertEquals("loo", json.get("cv"));
        assertEquals("rows", json.get("se_basis"));
        assertEquals(900.0, json.get("blocks"));
        assertEquals(900.0, json.get("rows"));
        assertEquals(30, ((List<?>) json.get("k")).size());
        assertEquals(null, json.get("sampled"));
        double best = (Double) json.get("best_k");
        double oneSe = (Double) json.get("one_se_k");
        assertTrue(best >= 1 && oneSe >= best && oneSe <= 30, r.out());
    }

    /** A choice at the largest k tried is the range's, not the data's: tune and fit say so (issue #12). */
    @Test
    void aChoiceAtTheLargestKTriedIsSaidOutLoud() {
        CliRun.Result edge = CliRun.inProcess("tune", healthy.toString(), "-x", "wind_ms", "-y", "power_kw",
                "--kmax", "2", "--quiet");
        assertEquals(0, edge.status(), edge.toString());
        assertTrue(edge.out().contains("note: the lowest RMSE and the one-SE k are at the largest k tried (2); "
                + "a larger k may do better: try --kmax 4"), edge.out());
        // fit --k auto widens the range by doubling kmax until the one-SE k lies inside it
        CliRun.Result fit = CliRun.inProcess("fit", healthy.toString(), "-x", "wind_ms", "-y", "power_kw",
                "--kmax", "2", "-o", dir.resolve("edge.nfm").toString(), "--quiet");
        assertEquals(0, fit.status(), fit.toString());
        assertTrue(fit.err().contains("nearfit: the one-SE k is the largest k tried (2); tuning again up to k = 4"),
                fit.err());
        assertFalse(fit.err().contains("note: the lowest RMSE and the one-SE k are at"), fit.err());
        // With the default range the note appears exactly when a choice is the largest k tried.
        CliRun.Result table = CliRun.inProcess("tune", healthy.toString(), "-x", "wind_ms", "-y", "power_kw", "--quiet");
        CliRun.Result json = CliRun.inProcess("tune", healthy.toString(), "-x", "wind_ms", "-y", "power_kw",
                "--format", "json", "--quiet");
        Map<?, ?> j = (Map<?, ?>) JsonTrees.parse(json.out().strip());
        boolean atEdge = (Double) j.get("best_k") == 50 || (Double) j.get("one_se_k") == 50;
        assertEquals(atEdge, table.out().contains("at the largest k tried"), table.out());
        assertEquals((Double) j.get("one_se_k") == 50, j.get("one_se_at_edge"));
        assertEquals((Double) j.get("best_k") == 50, j.get("best_at_edge"));
    }

    @Test
    void fitWithKAutoTakesTheOneSeKOfTune() {
        CliRun.Result fit = CliRun.inProcess("fit", healthy.toString(), "-x", "wind_ms", "-y", "power_kw",
                "-o", dir.resolve("auto.nfm").toString(), "--quiet");
        assertEquals(0, fit.status(), fit.toString());
        // the range fit tuned over last: 50, or the last widening it reported
        java.util.regex.Matcher widened = java.util.regex.Pattern.compile("tuning again up to k = (\\d+)")
                .matcher(fit.err());
        String kmax = "50";
        while (widened.find()) {
            kmax = widened.group(1);
        }
        CliRun.Result tune = CliRun.inProcess("tune", healthy.toString(), "-x", "wind_ms", "-y", "power_kw",
                "--kmax", kmax, "--format", "json", "--quiet");
        long oneSe = Math.round((Double) ((Map<?, ?>) JsonTrees.parse(tune.out().strip())).get("one_se_k"));
        assertTrue(fit.out().contains("k = " + oneSe + " "), fit.out() + " vs one-SE " + oneSe);
    }

    @Test
    void aWordForKIsAUsageErrorNamingTheOption() {
        CliRun.Result r = CliRun.inProcess("fit", healthy.toString(), "-x", "wind_ms", "-y", "power_kw",
                "--k", "abc", "-o", dir.resolve("x.nfm").toString());
        assertEquals(2, r.status());
        assertEquals("nearfit: Invalid value for option '--k': \"abc\" is not a whole number of at least 1 or auto", r.err().strip());
    }

    @Test
    void anUnknownInputColumnIsNamedWithTheColumnsThereAre() {
        CliRun.Result r = CliRun.inProcess("fit", healthy.toString(), "-x", "wind", "-y", "power_kw",
                "-o", dir.resolve("x.nfm").toString(), "--quiet");
        assertEquals(2, r.status());
        assertEquals("nearfit: -x: no column \"wind\" in " + healthy
                + " (columns: time, turbine, wind_ms, temp_c, power_kw)", r.err().strip());
    }

    @Test
    void anExistingModelIsNotReplacedWithoutForce() throws IOException {
        long before = Files.size(Path.of(model));
        CliRun.Result r = CliRun.inProcess("fit", weak.toString(), "-x", "wind_ms", "-y", "power_kw",
                "--k", "5", "-o", model, "--quiet");
        assertEquals(2, r.status());
        assertTrue(r.err().contains("exists already; add --force"), r.err());
        assertEquals(before, Files.size(Path.of(model)));
    }

    @Test
    void aDamagedModelIsAnInputErrorWithStatus2() throws IOException {
        Path broken = dir.resolve("broken.nfm");
        byte[] b = Files.readAllBytes(Path.of(model));
        Files.write(broken, java.util.Arrays.copyOf(b, b.length / 3));
        CliRun.Result r = CliRun.inProcess("check", broken.toString(), healthy.toString(), "--quiet");
        assertEquals(2, r.status());
        assertTrue(r.err().startsWith("nearfit: " + broken + ": "), r.err());
        assertEquals(1, r.err().strip().lines().count(), r.err());
    }

    @Test
    void aMissingDataFileIsAnInputErrorWithStatus2() {
        CliRun.Result r = CliRun.inProcess("check", model, dir.resolve("nope.csv").toString(), "--quiet");
        assertEquals(2, r.status());
        assertTrue(r.err().contains("nope.csv: no such file"), r.err());
    }

    @Test
    void predictLooGivesLeaveOneOutFitsOfTheReferenceRows() {
        CliRun.Result plain = CliRun.inProcess("predict", model, healthy.toString(), "--quiet");
        CliRun.Result loo = CliRun.inProcess("predict", model, healthy.toString(), "--loo", "--quiet");
        assertEquals(0, loo.status(), loo.toString());
        List<String> lines = loo.out().lines().toList();
        assertEquals("line,turbine,wind_ms,power_kw,fit,band_lo,band_hi,resid,z", lines.get(0));
        assertEquals(901, lines.size());
        assertFalse(plain.out().equals(loo.out()), "leave-one-out fits differ from in-sample fits");
    }

    @Test
    void predictLooRefusesAFileThatIsNotTheReference() {
        CliRun.Result r = CliRun.inProcess("predict", model, weak.toString(), "--loo", "--quiet");
        assertEquals(2, r.status());
        assertTrue(r.err().contains("not the model's reference file"), r.err());
    }

    @Test
    void everyCommandHasHelp() {
        for (String command : List.of("plot", "tune", "fit", "predict", "check")) {
            CliRun.Result r = CliRun.inProcess(command, "--help");
            assertEquals(0, r.status(), command);
            assertTrue(r.out().contains("Usage: nearfit " + command), r.out());
        }
    }
}
