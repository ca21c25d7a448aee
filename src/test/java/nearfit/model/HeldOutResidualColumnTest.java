package nearfit.model;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;

import nearfit.knn.FlagScale;
import nearfit.knn.HeldOutBlocks;
import nearfit.knn.HeldOutScheme;
import nearfit.knn.KnnModel;
import nearfit.knn.KnnSettings;
import nearfit.knn.Progress;
import nearfit.knn.ReferenceData;
import nearfit.knn.Tuning;
import nearfit.knn.ZBasis;
import nearfit.table.NearfitException;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The per-row held-out residuals a model file stores for the reference z scale (entry heldout_residual,
 * manifest field flags.residual_scheme): written and read back bit for bit, checked like every stored column
 * (SHA-256, finite values, and their median and MAD against the manifest's), and absent in older files, which
 * then score on one reference-wide scale.
 */
class HeldOutResidualColumnTest {
    @TempDir
    static Path dir;
    static byte[] file;
    static double[] heldOut;

    @BeforeAll
    static void fit() throws IOException {
        SplittableRandom r = new SplittableRandom(5);
        int n = 150;
        double[] wind = new double[n];
        double[] power = new double[n];
        for (int i = 0; i < n; i++) {
            wind[i] = 2 + 14 * r.nextDouble();
            power[i] = 2000 / (1 + Math.exp(-0.9 * (wind[i] - 8))) + 40 * (r.nextDouble() - 0.5);
        }
        KnnModel engine = KnnModel.fit(ReferenceData.numeric(new String[] {"wind_ms"}, new double[][] {wind},
                "power_kw", power, null), KnnSettings.defaults().withK(9).withFlags(3.5, FlagScale.GLOBAL_MAD));
        heldOut = Tuning.heldOutResiduals(engine, HeldOutBlocks.of(new HeldOutScheme.Folds(5, 3), n, null, null),
                Progress.NONE);
        ReferenceModel m = ReferenceCapture.captureHeldOut("test", new SourceInfo("site-log.csv", 10, null, null),
                engine, heldOut, "folds:5", null, -1, List.of(), null, List.of(),
                ReferenceCapture.RowFacts.of(engine.data(), false, row -> -1, row -> row + 2L));
        Path p = dir.resolve("ref.nfm");
        ModelFile.write(m, p, false, List.of());
        file = Files.readAllBytes(p);
    }

    private static Path write(String name, byte[] b) throws IOException {
        Path p = dir.resolve(name);
        Files.write(p, b);
        return p;
    }

    private static String refusal(Path p) {
        NearfitException e = assertThrows(NearfitException.class, () -> ModelFile.read(p));
        assertTrue(e.getMessage().startsWith(p + ": "), e.getMessage());
        return e.getMessage().substring(p.toString().length() + 2);
    }

    private static byte[] bytesOf(double[] d) {
        ByteBuffer b = ByteBuffer.allocate(d.length * 8).order(ByteOrder.LITTLE_ENDIAN);
        b.asDoubleBuffer().put(d);
        return b.array();
    }

    @Test
    void theResidualsAndTheirSchemeComeBackBitForBitAndScoreOnTheNeighbours() throws IOException {
        ReferenceModel back = ModelFile.read(write("back.nfm", file));
        assertArrayEquals(heldOut, back.residualScale().heldOut());
        assertEquals("folds:5", back.residualScale().scheme());
        assertEquals("folds:5", ((Map<?, ?>) ModelEdits.manifest(file).get("flags")).get("residual_scheme"));
        ZBasis z = RestoredModel.of(back, 1).zBasis();
        ZBasis.NeighbourResiduals nr = assertInstanceOf(ZBasis.NeighbourResiduals.class, z);
        assertEquals(back.residualScale().scale(), nr.scale());
    }

    @Test
    void aResidualByteChangedWithItsCrcFixedUpFailsItsSha256() throws IOException {
        byte[] b = ModelEdits.entries(file).get("data/heldout_residual.f64").clone();
        b[16] ^= 0x01;
        Path p = write("sha.nfm", ModelEdits.withArrayBytes(file, "heldout_residual", b, false));
        assertEquals("is damaged: entry heldout_residual fails its SHA-256 check", refusal(p));
    }

    @Test
    void aResidualThatIsNotFiniteIsRefusedNamingItsRow() throws IOException {
        double[] d = heldOut.clone();
        d[7] = Double.POSITIVE_INFINITY;
        Path p = write("inf.nfm", ModelEdits.withArrayBytes(file, "heldout_residual", bytesOf(d)));
        assertEquals("entry heldout_residual holds Infinity at stored row 8; a held-out residual is finite", refusal(p));
    }

    @Test
    void residualsThatDisagreeWithTheManifestsMedianAndScaleAreRefused() throws IOException {
        double[] d = heldOut.clone();
        for (int i = 0; i < d.length; i++) {
            d[i] *= 2; // digests recomputed: only the consistency check can see it
        }
        Path p = write("scaled.nfm", ModelEdits.withArrayBytes(file, "heldout_residual", bytesOf(d)));
        assertTrue(refusal(p).startsWith("entry heldout_residual gives a median of "), refusal(p));
    }

    @Test
    void aFileWithoutTheResidualsLoadsWithOneReferenceWideScale() throws IOException {
        Map<String, byte[]> entries = ModelEdits.entries(file);
        entries.remove("data/heldout_residual.f64");
        byte[] without = ModelEdits.withManifest(ModelEdits.stored(entries), m -> {
            ((Map<?, ?>) m.get("flags")).remove("residual_scheme");
            ((List<?>) m.get("entries")).removeIf(e -> "heldout_residual".equals(((Map<?, ?>) e).get("name")));
        });
        ReferenceModel back = ModelFile.read(write("old.nfm", without));
        assertNull(back.residualScale().heldOut());
        ZBasis z = RestoredModel.of(back, 1).zBasis();
        ZBasis.ReferenceResiduals rr = assertInstanceOf(ZBasis.ReferenceResiduals.class, z);
        assertEquals(ModelFile.read(write("new.nfm", file)).residualScale().scale(), rr.scale());
    }

    @Test
    void aSchemeWithoutItsResidualEntryIsRefused() throws IOException {
        Map<String, byte[]> entries = ModelEdits.entries(file);
        entries.remove("data/heldout_residual.f64");
        byte[] without = ModelEdits.withManifest(ModelEdits.stored(entries),
                m -> ((List<?>) m.get("entries")).removeIf(e -> "heldout_residual".equals(((Map<?, ?>) e).get("name"))));
        assertEquals("is damaged: its manifest lists no entry heldout_residual", refusal(write("half.nfm", without)));
    }
}
