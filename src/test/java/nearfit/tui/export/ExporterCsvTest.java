package nearfit.tui.export;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.util.List;

import nearfit.knn.FlagResult;
import nearfit.knn.FlagScale;
import nearfit.model.ResultCsv;
import nearfit.table.RowSource;
import org.junit.jupiter.api.Test;

import nearfit.tui.keys.ViewState;
import nearfit.tui.results.CurveResult;
import nearfit.tui.results.FlaggedRow;
import nearfit.tui.results.FlaggedRows;

/**
 * The explorer's curve and flagged-row exports go through the tool's one CSV writer: predict's column names
 * ({@code band_lo, band_hi, resid}), {@code \n} line ends, RFC 4180 quoting and neutralised text cells.
 */
class ExporterCsvTest {
    private static final FlagResult NO_FLAGS = new FlagResult(new int[0], new double[0], new double[0], new double[0],
            new boolean[0], 0, 0, 1, FlagScale.LOCAL_SD, 3.5);

    @Test
    void flaggedRowsHavePredictsColumnsWithEmptyBandCells() throws IOException {
        ViewState s = ViewState.initial("power_kw", List.of("wind_ms"), 20).edit().groupColumn("turbine").build();
        FlaggedRows f = new FlaggedRows(NO_FLAGS, 10, List.of(
                new FlaggedRow(7, 9, "2025-03-01T00:10:00Z", "=T05", List.of(8.5), 400, 1000, -600, -7.25),
                new FlaggedRow(8, 10, "", "T0,6", List.of(-1.5), 0, 2.5, -2.5, Double.NEGATIVE_INFINITY)));
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        Exporter.flagsCsv(s, new Exporter.TimeInputs("time", new boolean[1]), f, out);
        // The same header predict writes for these columns (BatchCommandsTest).
        assertEquals("line,time,turbine,wind_ms,power_kw,fit,band_lo,band_hi,resid,z\n"
                + "9,2025-03-01T00:10:00Z,'=T05,8.5,400,1000,,,-600,-7.25\n"
                + "10,,\"T0,6\",-1.5,0,2.5,,,-2.5,-inf\n", out.toString(StandardCharsets.UTF_8));
    }

    @Test
    void flaggedRowsOfAParquetDataSetStartWithFileAndRowAsPredictsDo() throws IOException {
        ViewState s = ViewState.initial("power_kw", List.of("wind_ms"), 20);
        RowSource set = RowSource.parquet(List.of("set/unit=T01/a.parquet", "set/unit=T02/b.parquet"));
        long secondFileRow7 = (1L << 40) | 7; // RowSource's packing: file number above bit 40, row index below
        FlaggedRows f = new FlaggedRows(NO_FLAGS, 10, List.of(
                new FlaggedRow(7, secondFileRow7, "", "", List.of(8.5), 400, 1000, -600, -7.25),
                new FlaggedRow(8, 3, "", "", List.of(9.0), 5, 1100, -1095, -9)), 2, 2, set);
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        Exporter.flagsCsv(s, new Exporter.TimeInputs(null, new boolean[1]), f, out);
        List<String> header = ResultCsv.rowColumns(set, null, null, List.of("wind_ms"), "power_kw", false, false);
        assertEquals(String.join(",", header) + "\n"
                + "set/unit=T02/b.parquet,7,8.5,400,1000,,,-600,-7.25\n"
                + "set/unit=T01/a.parquet,3,9,5,1100,,,-1095,-9\n", out.toString(StandardCharsets.UTF_8));
        assertEquals("file,row,wind_ms,power_kw", String.join(",",
                ResultCsv.rowColumns(set, null, null, List.of("wind_ms"), "power_kw", false, false).subList(0, 4)));
    }

    @Test
    void withoutATimeOrGroupColumnThoseColumnsAreLeftOutAndATimeInputIsWrittenAsATime() throws IOException {
        ViewState s = ViewState.initial("power_kw", List.of("time", "wind_ms"), 20);
        FlaggedRows f = new FlaggedRows(NO_FLAGS, 10, List.of(
                new FlaggedRow(1, 3, "2025-03-01T00:00:00Z", "", List.of(1.7407872E12, 6.0), 5, 300, -295, -9)));
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        Exporter.flagsCsv(s, new Exporter.TimeInputs("time", new boolean[] {true, false}), f, out);
        assertEquals(String.join(",",
                ResultCsv.rowColumns(null, null, List.of("time", "wind_ms"), "power_kw", false, false))
                + "\n3,2025-03-01T00:00:00Z,6,5,300,,,-295,-9\n", out.toString(StandardCharsets.UTF_8));
    }

    @Test
    void theCurveHasTheSameBandColumnNames() throws IOException {
        ViewState s = ViewState.initial("power_kw", List.of("wind_ms"), 20);
        CurveResult c = new CurveResult(new double[] {3}, new double[] {50}, new double[] {40}, new double[] {60.5},
                new double[] {0.25}, new int[] {20});
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        Exporter.curveCsv(s, c, out);
        assertEquals("wind_ms,fit,band_lo,band_hi,window_width,neighbours\n3,50,40,60.5,0.25,20\n",
                out.toString(StandardCharsets.UTF_8));
    }
}
