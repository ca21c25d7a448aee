package nearfit.knn;

import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTimeoutPreemptively;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.Duration;
import nearfit.table.NearfitException;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * A restored model never reaches the index with a coordinate that is not finite: a stored scale of 0,
 * a subnormal or a huge one, or a centre far off, is refused in {@link KnnModel#restore} before any
 * search (with NaN or infinite coordinates no key compares equal, and the sorted index's scan used to
 * spin). The bound only catches a spin.
 */
class RestoreGuardTest {
    private static final Duration BOUND = Duration.ofSeconds(30);

    private static ReferenceData rows(int d) {
        double[][] x = new double[d][];
        for (int j = 0; j < d; j++) {
            x[j] = new double[] {1, 2, 3, 4, 5, 6};
        }
        String[] names = d == 1 ? new String[] {"wind_ms"} : new String[] {"wind_ms", "air_temp_c"};
        return ReferenceData.numeric(names, x, "power_kw", new double[] {10, 20, 30, 40, 50, 60}, null);
    }

    // One input uses the sorted index, two the k-d tree; each with each bad scale.
    @ParameterizedTest(name = "d={0} scale={1} centre={2}")
    @CsvSource({"1, 0, 3", "1, 1e-320, 0", "1, 1e-308, 0", "1, NaN, 0", "1, 1, NaN", "2, 0, 3", "2, 1e-320, 0",
            "2, NaN, 0", "2, 1, Infinity"})
    void aScaleOrCentreGivingNonFiniteCoordinatesIsRefusedBeforeAnySearch(int d, double scale, double centre) {
        double[] c = new double[d];
        double[] s = new double[d];
        java.util.Arrays.fill(c, centre);
        java.util.Arrays.fill(s, scale);
        InputTransform t = new InputTransform(Scaling.Z, c, s, null);
        KnnSettings settings = KnnSettings.defaults().withK(2).withScaling(Scaling.Z);
        NearfitException e = assertTimeoutPreemptively(BOUND, () -> assertThrows(NearfitException.class,
                () -> KnnModel.restore(rows(d), settings, t).estimateAll(new double[d][1], Progress.NONE)));
        assertTrue(e.getMessage().contains("the model's scaling is damaged"), e.getMessage());
    }
}
