package nearfit.tui;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import nearfit.knn.Band;
import nearfit.knn.FlagScale;
import nearfit.knn.KnnSettings;
import nearfit.knn.Metric;
import nearfit.knn.Scaling;
import nearfit.knn.Weighting;
import nearfit.table.CsvLoader;
import nearfit.table.LoadOptions;

class FlaggedRowsTest {
    @Test
    void theLeaveOneOutRmseIsTheRootMeanSquareOfTheLeftOutResiduals(@TempDir Path dir) throws Exception {
        Path csv = dir.resolve("pump.csv");
        Files.writeString(csv, "flow_m3h,head_m\n0,1\n1,2\n3,5\n7,11\n", StandardCharsets.UTF_8);
        Workbench wb = CoreWorkbench.of(CsvLoader.load(csv, csv.toString(), LoadOptions.DEFAULT), "pump.csv");
        FitKey m = new FitKey("", "head_m", List.of("flow_m3h"), new KnnSettings(1, Metric.EUCLIDEAN,
                Weighting.UNIFORM, Scaling.Z, Band.NONE, KnnSettings.DEFAULT_FLAG_THRESHOLD, FlagScale.LOCAL_SD, 1));
        FlaggedRows f = wb.flags(m, null, "", JobControl.NONE);
        // Worked by hand, k = 1 with no ties: each row's nearest other row gives fits 2, 1, 2, 5, so the
        // residuals are -1, 1, 3, 6 and the RMSE is sqrt((1 + 1 + 9 + 36) / 4).
        assertEquals(Math.sqrt(47.0 / 4), f.looRmse(), 1e-12);
        assertEquals(4, f.examined());
    }
}
