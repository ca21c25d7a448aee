package nearfit.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Map;

import nearfit.model.JsonTrees;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** A category response (a pump's operating state by flow and head): tune, fit, predict and check. */
class CategoryResponseTest {
    @TempDir
    static Path dir;
    static Path log;
    static String model;

    @BeforeAll
    static void writeAndFit() throws IOException {
        StringBuilder sb = new StringBuilder("flow_m3h,head_m,state\n");
        for (int i = 0; i < 120; i++) {
            double flow = 10 + i * 0.75;
            double head = 40 - 0.1 * flow + (i % 7) * 0.3;
            sb.append(String.format(Locale.ROOT, "%.2f,%.2f,%s%n", flow, head, flow < 55 ? "normal" : "=overload"));
        }
        log = Files.writeString(dir.resolve("pump.csv"), sb.toString());
        model = dir.resolve("pump.nfm").toString();
        CliRun.Result r = CliRun.inProcess("fit", log.toString(), "-x", "flow_m3h,head_m", "-y", "state", "--k", "5",
                "-o", model, "--quiet");
        assertEquals(0, r.status(), r.toString());
    }

    @Test
    void predictGivesTheClassAndItsVoteShareWithFormulaCellsNeutralised() throws IOException {
        Path query = Files.writeString(dir.resolve("q.csv"), "flow_m3h,head_m\n12,38.8\n90,31\n140,27\n,30\n");
        CliRun.Result r = CliRun.inProcess("predict", model, query.toString(), "--quiet");
        assertEquals(0, r.status(), r.toString());
        List<String> lines = r.out().lines().toList();
        assertEquals("line,flow_m3h,head_m,class,share,beyond", lines.get(0));
        assertEquals("2,12,38.8,normal,1,0", lines.get(1));
        // OWASP CSV injection: a label starting with = gets a leading quote.
        assertEquals("3,90,31,'=overload,1,0", lines.get(2));
        // The reference's flows end at 99.25 m3/h: a vote at 140 is an extrapolation; no vote, no mark.
        assertEquals("4,140,27,'=overload,1,1", lines.get(3));
        assertEquals("5,,30,,,", lines.get(4));
    }

    @Test
    void tuneReportsErrorRatesInPlaceOfRegressionFigures() {
        CliRun.Result r = CliRun.inProcess("tune", log.toString(), "-x", "flow_m3h,head_m", "-y", "state",
                "--kmax", "9", "--format", "json", "--quiet");
        assertEquals(0, r.status(), r.toString());
        Map<?, ?> json = (Map<?, ?>) JsonTrees.parse(r.out().strip());
        assertEquals(List.of("rows", "k", "error_rate", "error_rate_se", "best_k", "one_se_k", "sampled", "scheme",
                "cv", "blocks", "se_basis", "best_at_edge", "one_se_at_edge"), List.copyOf(json.keySet()));
        assertTrue((Double) ((List<?>) json.get("error_rate")).get(0) < 0.05, r.out());
    }

    @Test
    void checkRefusesACategoryModelAsAnInputError() {
        CliRun.Result r = CliRun.inProcess("check", model, log.toString(), "--quiet");
        assertEquals(2, r.status());
        assertTrue(r.err().contains("is a category"), r.err());
    }
}
