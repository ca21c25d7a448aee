package nearfit.tui.bench;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import nearfit.knn.Band;
import nearfit.knn.KnnSettings;
import nearfit.knn.Metric;
import nearfit.knn.Scaling;
import nearfit.knn.Weighting;
import nearfit.table.CsvLoader;
import nearfit.table.LoadOptions;
import nearfit.tui.keys.FitKey;
import nearfit.tui.results.ComparedResiduals;
import nearfit.tui.results.CurveRequest;
import nearfit.tui.results.CurveResult;

/** A compared group's residuals come with the curve job, against the other groups' rows only. */
class ComparedResidualsTest {
    @Test
    void theCurveJobGivesTheGroupsResidualsAgainstTheOtherGroupsNeighbours(@TempDir Path dir) throws Exception {
        // Group A's rows at 1.2 and 3.4; the other groups' rows at 0..5 with distinct distances to both.
        String csv = "unit,wind,power\n"
                + "B,0,10\nC,1,20\nB,2,40\nC,3,70\nB,4,110\nC,5,160\n"
                + "A,1.2,30\nA,3.4,100\n";
        Path file = Files.writeString(dir.resolve("site.csv"), csv, StandardCharsets.UTF_8);
        Workbench wb = CoreWorkbench.of(CsvLoader.load(file, file.toString(), LoadOptions.DEFAULT), "site.csv");
        FitKey m = new FitKey("", "power", List.of("wind"), KnnSettings.defaults().withK(2)
                .withMetric(Metric.EUCLIDEAN).withWeighting(Weighting.UNIFORM).withScaling(Scaling.NONE)
                .withBand(Band.NONE));
        int groupA = wb.labels("unit").indexOf("A");
        CurveRequest compared = new CurveRequest("wind", Map.of(), 0, 5, 6, "unit", groupA, true, -1);
        ComparedResiduals r = wb.curve(m, compared, JobControl.NONE).compared();
        // Worked by hand from the other groups' rows alone, k = 2 with uniform weights and no ties:
        // row 6 (wind 1.2): nearest 1 (20) and 2 (40), fit 30, residual 30 - 30 = 0;
        // row 7 (wind 3.4): nearest 3 (70) and 4 (110), fit 90, residual 100 - 90 = 10.
        assertArrayEquals(new int[] {6, 7}, r.rows());
        assertArrayEquals(new double[] {0, 10}, r.residuals(), 1e-12);
        // Without a comparison the curve carries none.
        CurveResult plain = wb.curve(m, new CurveRequest("wind", Map.of(), 0, 5, 6, "unit", groupA, false, -1),
                JobControl.NONE);
        assertNull(plain.compared());
        assertEquals(6, plain.size());
    }
}
