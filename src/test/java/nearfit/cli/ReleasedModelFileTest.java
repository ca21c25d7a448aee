package nearfit.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

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
        // Since then predict ends each row with beyond (0 or 1); every column that release printed is unchanged.
        assertEquals(expected.get(0) + ",beyond", rows.get(0));
        assertEquals(expected.size(), rows.size(), predict.toString());
        for (int i = 1; i < expected.size(); i++) {
            String[] want = expected.get(i).split(",", -1);
            String[] got = rows.get(i).split(",", -1);
            assertEquals(want.length + 1, got.length, "row " + i);
            assertTrue(got[want.length].matches("[01]?"), rows.get(i));
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

    @Test
    void aModelWrittenByRelease010ChecksOnOneReferenceWideScaleAndSaysSo() throws IOException {
        // release 0.1.0 stored no per-row held-out residuals: --z-scale reference falls back to the stored
        // median and 1.4826 MAD, and the report says so in one note line
        Path model = copy("tiny-v0.1.0.nfm");
        Path query = copy("tiny-query.csv");

        CliRun.Result check = CliRun.inProcess("check", "--quiet", "--z-scale", "reference", "--limit", "100",
                model.toString(), query.toString());

        assertEquals(0, check.status(), check.toString());
        List<String> lines = check.out().lines().toList();
        assertEquals("flags: |z| > 3.5, z scale reference: one reference-wide scale (reference residuals: median "
                + "-8.9353, 1.4826 MAD 71.159)", lines.get(3));
        assertEquals("note: the model file stores no per-row held-out residuals (written before they were), so z "
                + "divides by one scale for the whole reference; fit again to have it follow the curve", lines.get(4));
        CliRun.Result json = CliRun.inProcess("check", "--quiet", "--z-scale", "reference", "--limit", "100",
                "--format", "json", model.toString(), query.toString());
        assertEquals(true, json.out().contains("\"z_basis\":\"reference_wide\""), json.out());
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
