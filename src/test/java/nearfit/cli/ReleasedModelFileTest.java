package nearfit.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * A model file written by release 0.1.0 (src/test/resources/model/README.md says how and from which
 * commit) still loads, and predict gives exactly what that release printed for the same query rows.
 */
class ReleasedModelFileTest {
    @TempDir
    Path dir;

    @Test
    void aModelWrittenByRelease010PredictsWhatThatReleasePrinted() throws IOException {
        Path model = copy("tiny-v0.1.0.nfm");
        Path query = copy("tiny-query.csv");
        List<String> expected = resource("tiny-v0.1.0-predict.csv").lines().toList();

        CliRun.Result predict = CliRun.inProcess("predict", "--quiet", model.toString(), query.toString());

        assertEquals(0, predict.status(), predict.toString());
        List<String> rows = predict.out().lines().toList();
        assertEquals(expected.get(0), rows.get(0));
        assertEquals(expected.size(), rows.size(), predict.toString());
        for (int i = 1; i < expected.size(); i++) {
            String[] want = expected.get(i).split(",", -1);
            String[] got = rows.get(i).split(",", -1);
            assertEquals(want.length, got.length, "row " + i);
            for (int c = 0; c < want.length; c++) {
                if (c >= 6 && !want[c].isEmpty()) {
                    // fit, band_lo, band_hi, resid, z: the same doubles, to the last bit
                    assertEquals(Double.parseDouble(want[c]), Double.parseDouble(got[c]), 0.0,
                            "row " + i + " column " + expected.get(0).split(",")[c]);
                } else {
                    assertEquals(want[c], got[c], "row " + i + " column " + c);
                }
            }
        }
    }

    @Test
    void aModelWrittenByRelease010KeepsItsTuningTableAndSettings() throws IOException {
        Path model = copy("tiny-v0.1.0.nfm");

        nearfit.model.ReferenceModel m = nearfit.model.ModelFile.read(model);

        assertEquals(4, m.settings().k());
        assertEquals("mahalanobis", m.settings().metric().word());
        assertEquals("inverse", m.settings().weighting().word());
        assertEquals(List.of("wind_ms", "air_temp_c"), m.columns().inputs());
        assertEquals(List.of("T01", "T02"), m.columns().groupLabels());
        assertEquals(10, m.tuning().k().length);
        assertEquals(92.37406014112146, m.tuning().rmse()[3], 0.0);
        assertEquals("leave-one-out", m.tuning().scheme());
        assertEquals(40, m.rows().size());
    }

    private Path copy(String name) throws IOException {
        Path target = dir.resolve(name);
        try (InputStream in = ReleasedModelFileTest.class.getResourceAsStream("/model/" + name)) {
            Files.copy(in, target);
        }
        return target;
    }

    private static String resource(String name) throws IOException {
        try (InputStream in = ReleasedModelFileTest.class.getResourceAsStream("/model/" + name)) {
            return new String(in.readAllBytes(), StandardCharsets.UTF_8);
        }
    }
}
