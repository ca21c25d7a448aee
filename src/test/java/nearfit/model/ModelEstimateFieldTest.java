package nearfit.model;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import nearfit.knn.EstimateKind;
import nearfit.knn.KnnSettings;
import nearfit.table.NearfitException;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The manifest's {@code estimate} field: stored, read back, and absent in older files, which mean the mean. */
class ModelEstimateFieldTest {
    @TempDir
    Path dir;

    private static ReferenceModel withSettings(ReferenceModel m, KnnSettings s) {
        return new ReferenceModel(m.toolVersion(), m.created(), m.source(), m.columns(), s, m.scaleCenter(),
                m.scaleSpread(), m.whitening(), m.residualScale(), m.tuning(), m.rows());
    }

    private Path write(Map<String, Object> manifest, ReferenceModel m, String name) {
        Path p = dir.resolve(name);
        Map<String, Object> arrays = new LinkedHashMap<>();
        arrays.put("input.0", m.rows().inputs()[0]);
        arrays.put("input.1", m.rows().inputs()[1]);
        arrays.put("response", m.rows().response());
        arrays.put("source_line", m.rows().sourceLines());
        ModelArchive.write(p, false, List.of(), manifest, arrays);
        return p;
    }

    @Test
    void theMedianEstimateIsStoredAndReadBack() {
        ReferenceModel sample = ModelFileTest.sample(false);
        ReferenceModel m = withSettings(sample, sample.settings().withEstimate(EstimateKind.MEDIAN));
        Map<String, Object> manifest = JsonText.fieldsOf(ModelFile.manifestOf(m));
        assertEquals("median", manifest.get("estimate"));
        ReferenceModel back = ModelFile.read(write(manifest, m, "median.nfm"));
        assertEquals(EstimateKind.MEDIAN, back.settings().estimate());
    }

    @Test
    void aManifestWrittenBeforeTheFieldReadsAsTheMean() {
        ReferenceModel m = ModelFileTest.sample(false);
        Map<String, Object> manifest = JsonText.fieldsOf(ModelFile.manifestOf(m));
        manifest.remove("estimate");
        ReferenceModel back = ModelFile.read(write(manifest, m, "old.nfm"));
        assertEquals(EstimateKind.MEAN, back.settings().estimate());
    }

    @Test
    void anUnknownEstimateIsADamagedModelNamingTheField() {
        ReferenceModel m = ModelFileTest.sample(false);
        Map<String, Object> manifest = JsonText.fieldsOf(ModelFile.manifestOf(m));
        manifest.put("estimate", "mode");
        Path p = write(manifest, m, "mode.nfm");
        NearfitException e = assertThrows(NearfitException.class, () -> ModelFile.read(p));
        assertTrue(e.getMessage().contains("mode.nfm: manifest field \"estimate\" is \"mode\"; it must be one of mean, median"),
                e.getMessage());
    }
}
