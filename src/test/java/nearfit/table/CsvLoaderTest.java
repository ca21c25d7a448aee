package nearfit.table;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.time.Instant;
import java.util.List;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class CsvLoaderTest {
    @TempDir
    Path dir;

    @Test
    void readsHeaderNumbersAndCategories() {
        Table t = CsvFiles.load(dir, "turbine,wind_ms,power_kw\nT01,5.5,120\nT02,7.25,400\nT01,,-\n");
        assertEquals(3, t.rowCount());
        assertEquals(List.of("turbine", "wind_ms", "power_kw"), t.names());
        CategoryColumn turbine = assertInstanceOf(CategoryColumn.class, t.column("turbine"));
        assertEquals(List.of("T01", "T02"), turbine.labels());
        assertEquals(0, turbine.code(2));
        DecimalColumn wind = assertInstanceOf(DecimalColumn.class, t.column("wind_ms"));
        assertEquals(7.25, wind.get(1));
        assertTrue(Double.isNaN(wind.get(2)));
        assertEquals(1, wind.missingCount());
        assertEquals(1, t.column("power_kw").missingCount(), "- is a missing value");
        assertEquals(0, t.report().badCells());
    }

    @Test
    void everyMissingTokenIsMissingWhateverItsCase() {
        Table t = CsvFiles.load(dir, "x,y\n1,NA\n2,nan\n3,NULL\n4,N/A\n5,-\n6,\n7,8\n");
        assertEquals(6, t.column("y").missingCount());
        assertEquals(0, t.column("y").badCount());
    }

    @Test
    void generatesNamesWhenThereIsNoHeaderAndMakesDuplicatesUnique() {
        Table t = CsvFiles.load(dir, "1,2\n3,4\n");
        assertEquals(List.of("col1", "col2"), t.names());
        assertEquals(2, t.rowCount());
        Table u = CsvFiles.load(dir, "a,a,,a\n1,2,3,4\n");
        assertEquals(List.of("a", "a_2", "col3", "a_3"), u.names());
    }

    @Test
    void headerOptionOverridesDetection() {
        Table t = CsvFiles.load(dir, "a,b\nc,d\n", LoadOptions.builder().header(HeaderMode.ABSENT).build());
        assertEquals(2, t.rowCount());
        assertEquals(List.of("col1", "col2"), t.names());
        Table u = CsvFiles.load(dir, "1,2\n3,4\n", LoadOptions.builder().header(HeaderMode.PRESENT).build());
        assertEquals(List.of("1", "2"), u.names());
        assertEquals(1, u.rowCount());
    }

    @Test
    void sniffsSemicolonTabAndBarAndReadsTheDecimalComma() {
        Table semi = CsvFiles.load(dir, "a;b\n1,5;2\n3;4,25\n");
        assertEquals(';', semi.report().delimiter());
        assertEquals(1.5, ((DecimalColumn) semi.column("a")).get(0));
        assertEquals(4.25, ((DecimalColumn) semi.column("b")).get(1));
        assertEquals('\t', CsvFiles.load(dir, "a\tb\n1\t2\n").report().delimiter());
        assertEquals('|', CsvFiles.load(dir, "a|b|c\n1|2|3\n").report().delimiter());
    }

    @Test
    void delimiterOptionOverridesSniffing() {
        Table t = CsvFiles.load(dir, "a;b,c\n1;2,3\n", LoadOptions.builder().delimiter(',').build());
        assertEquals(List.of("a;b", "c"), t.names());
    }

    @Test
    void readsUtf8WithByteOrderMarkAndCrlf() {
        byte[] bom = {(byte) 0xEF, (byte) 0xBB, (byte) 0xBF};
        byte[] body = "größe,wert\r\nÄ,1\r\nB,2\r\n".getBytes(StandardCharsets.UTF_8);
        byte[] all = new byte[bom.length + body.length];
        System.arraycopy(bom, 0, all, 0, 3);
        System.arraycopy(body, 0, all, 3, body.length);
        Table t = CsvLoader.load(CsvFiles.write(dir, "bom.csv", all), "bom.csv", LoadOptions.DEFAULT);
        assertEquals(List.of("größe", "wert"), t.names());
        assertEquals(List.of("Ä", "B"), ((CategoryColumn) t.column("größe")).labels());
        assertEquals(2.0, ((DecimalColumn) t.column("wert")).get(1), "CR is not part of the last field");
    }

    @Test
    void timesWithAndWithoutOffsetAreEpochMillisecondsUtcByDefault() {
        Table t = CsvFiles.load(dir, "time,v\n2025-03-01T10:20:00Z,1\n2025-03-01T10:20:00+01:00,2\n"
                + "2025-03-01 10:20:00,3\n2025-03-01,4\n2025-03-01T10:20:00.250-05:30,5\n");
        TimeColumn time = assertInstanceOf(TimeColumn.class, t.column("time"));
        // Expected values from java.time (an independent implementation of ISO 8601).
        assertEquals(Instant.parse("2025-03-01T10:20:00Z").toEpochMilli(), time.epochMillis(0));
        assertEquals(Instant.parse("2025-03-01T09:20:00Z").toEpochMilli(), time.epochMillis(1));
        assertEquals(Instant.parse("2025-03-01T10:20:00Z").toEpochMilli(), time.epochMillis(2));
        assertEquals(Instant.parse("2025-03-01T00:00:00Z").toEpochMilli(), time.epochMillis(3));
        assertEquals(Instant.parse("2025-03-01T15:50:00.250Z").toEpochMilli(), time.epochMillis(4));
        assertEquals((double) time.epochMillis(0), time.asDouble(0));
    }

    @Test
    void badCellsBecomeMissingAndAreReportedWithLineColumnAndText() {
        // Up to one cell in ten that does not fit is bad; the column keeps its type.
        Table t = CsvFiles.load(dir, "time,power_kw\n2025-03-01,1\n2025-13-01,2\n2025-03-02,12x5\n"
                + "2025-03-03,1\n".repeat(8));
        assertEquals(1, t.column("time").badCount());
        assertEquals(1, t.column("power_kw").badCount());
        assertEquals(2, t.report().badCells());
        assertEquals(List.of(new BadCell(3, "time", "2025-13-01"), new BadCell(4, "power_kw", "12x5")),
                t.report().badExamples());
        assertTrue(((DecimalColumn) t.column("power_kw")).isMissing(2));
    }

    @Test
    void raggedRowsAreDroppedWholeCountedAndReportedByLine() {
        Table t = CsvFiles.load(dir, "a,b,c\n1,2,3\n4,5\n6,7,8,9\n10,11,12\n");
        assertEquals(2, t.rowCount(), "the short and the long row are not used");
        assertEquals(1, t.report().shortRows());
        assertEquals(1, t.report().longRows());
        assertEquals(2, t.report().droppedRows());
        assertEquals(4, t.report().rowsRead());
        assertEquals(2, t.lineOf(0));
        assertEquals(5, t.lineOf(1), "the row after the dropped ones keeps its own line");
        assertEquals(12.0, ((DecimalColumn) t.column("c")).get(1));
        assertEquals(3, t.report().raggedExamples().get(0).line());
        assertEquals("2 fields, not 3; row dropped", t.report().raggedExamples().get(0).text());
        assertEquals(4, t.report().raggedExamples().get(1).line());
        assertEquals("4 fields, not 3; row dropped", t.report().raggedExamples().get(1).text());
    }

    @Test
    void aNumberSplitByADecimalCommaNeverShiftsItsNeighboursIntoOtherColumns() {
        // The demo log's line 88849 has this shape: one field too many, so the values after the split
        // number would land one column to the left; before the fix rotor_rpm read 45.5 (an oil temperature).
        Table t = CsvFiles.load(dir, "time,wind_ms,rotor_rpm,gearbox_oil_c\n"
                + "2025-01-01T00:00:00Z,7.5,14.2,55.0\n"
                + "2025-01-01T00:10:00Z,7,6,14.1,55.5\n"
                + "2025-01-01T00:20:00Z,7.4,14.0\n"
                + "2025-01-01T00:30:00Z,7.3,13.9,54.5\n");
        DecimalColumn rpm = (DecimalColumn) t.column("rotor_rpm");
        DecimalColumn oil = (DecimalColumn) t.column("gearbox_oil_c");
        assertEquals(2, t.rowCount());
        assertEquals(List.of(14.2, 13.9), List.of(rpm.get(0), rpm.get(1)));
        assertEquals(List.of(55.0, 54.5), List.of(oil.get(0), oil.get(1)));
        assertEquals(0, t.report().badCells(), "a dropped row's cells are not typed, so none is a bad cell");
        assertEquals(2, t.lineOf(0));
        assertEquals(5, t.lineOf(1));
    }

    @Test
    void aFileOfOnlyRaggedRowsSaysSoInsteadOfHeaderOnly() {
        NearfitException e = assertThrows(NearfitException.class, () -> CsvFiles.load(dir, "a,b,c\n1,2\n3,4\n"));
        assertTrue(e.getMessage().contains("no data rows: all 2 rows have another number of fields than the header (3)"),
                e.getMessage());
    }

    @Test
    void lineNumbersFollowQuotedLineBreaksAndBlankLines() {
        Table t = CsvFiles.load(dir, "note,v\n\"two\nlines\",1\n\nplain,2\n");
        assertEquals(2, t.rowCount());
        assertEquals(2, t.lineOf(0));
        assertEquals(5, t.lineOf(1), "row 1 starts on line 5: the quoted break and the blank line count");
    }

    @Test
    void keepsOnlyTheNamedColumns() {
        Table t = CsvFiles.load(dir, "a,b,c\n1,2,3\n", LoadOptions.builder().keepColumns(List.of("c", "a")).build());
        assertEquals(List.of("a", "c"), t.names());
        assertEquals(3.0, ((DecimalColumn) t.column("c")).get(0));
    }

    @Test
    void columnsKeptIfPresentAreSkippedWhenTheFileLacksThem() {
        LoadOptions o = LoadOptions.builder().keepColumns(List.of("c")).keepIfPresent(List.of("a", "zz", "c")).build();
        Table t = CsvFiles.load(dir, "a,b,c\n1,2,3\n", o);
        assertEquals(List.of("a", "c"), t.names());
        assertEquals(1.0, ((DecimalColumn) t.column("a")).get(0));
    }

    @Test
    void aRequiredColumnTheFileLacksFailsNamingItAndListingTheColumns() {
        LoadOptions o = LoadOptions.builder().keepColumns(List.of("zz")).keepIfPresent(List.of("a")).build();
        NearfitException e = org.junit.jupiter.api.Assertions.assertThrows(NearfitException.class,
                () -> CsvFiles.load(dir, "a,b,c\n1,2,3\n", o));
        assertEquals("zz", e.column());
        assertTrue(e.detail().endsWith("the columns are a, b, c"), e.detail());
    }

    @Test
    void aColumnLeftOutIsNeitherTypedNorCountedForBadCells() {
        // Column junk is typed as numbers (at most 1 cell in 10 is not one), so its text cells are bad cells.
        StringBuilder b = new StringBuilder("wind_ms,junk,power_kw\n");
        for (int i = 0; i < 20; i++) {
            b.append(i).append(',').append(i == 7 ? "x?" : i == 9 ? "\"a,b\"" : "1.5").append(',').append(i * 10).append('\n');
        }
        String csv = b.toString();
        Table all = CsvFiles.load(dir, csv);
        Table kept = CsvFiles.load(dir, csv, LoadOptions.builder().keepColumns(List.of("wind_ms", "power_kw")).build());
        assertEquals(2, all.report().badCells(), "the whole file has the two bad cells");
        assertEquals(0, kept.report().badCells());
        assertEquals(List.of("wind_ms", "power_kw"), kept.names());
        assertEquals(20, kept.rowCount());
        assertEquals(190.0, ((DecimalColumn) kept.column("power_kw")).get(19));
        assertEquals(all.lineOf(19), kept.lineOf(19));
    }

    @Test
    void aRepeatedKeptNameKeepsTheColumnOnce() {
        Table t = CsvFiles.load(dir, "a,b\n1,2\n", LoadOptions.builder().keepColumns(List.of("b", "b"))
                .keepIfPresent(List.of("b")).build());
        assertEquals(List.of("b"), t.names());
    }

    @Test
    void gzipIsRecognisedByItsBytesNotItsName() {
        byte[] gz = CsvFiles.gzip("a,b\n1,2\n3,4\n".getBytes(StandardCharsets.UTF_8));
        Table t = CsvLoader.load(CsvFiles.write(dir, "plain-name.csv", gz), "plain-name.csv", LoadOptions.DEFAULT);
        assertEquals(2, t.rowCount());
        assertEquals(4.0, ((DecimalColumn) t.column("b")).get(1));
    }

    @Test
    void readsAStreamLikeStandardInput() {
        Table t = CsvLoader.load(new java.io.ByteArrayInputStream("a\n1\n2\n".getBytes(StandardCharsets.UTF_8)),
                "-", LoadOptions.DEFAULT);
        assertEquals(2, t.rowCount());
        assertEquals("-", t.report().source());
    }

    @Test
    void manyDistinctLabelsMakeATextColumn() {
        StringBuilder sb = new StringBuilder("id,v\n");
        for (int i = 0; i < 3000; i++) {
            sb.append("note number ").append(i).append(",1\n");
        }
        Table t = CsvFiles.load(dir, sb.toString());
        assertEquals(ColumnType.TEXT, t.column("id").type());
        assertFalse(t.column("id").isMissing(0));
    }

    @Test
    void progressIsReportedAndReachesTheRowCount() {
        long[] last = new long[2];
        LoadOptions o = LoadOptions.builder().progress((bytes, total, rows) -> {
            last[0] = bytes;
            last[1] = rows;
        }).build();
        Table t = CsvFiles.load(dir, "a\n1\n2\n3\n", o);
        assertEquals(t.rowCount(), last[1]);
        assertTrue(last[0] > 0);
    }

    @Test
    void aCancelledLoadThrowsItsOwnType() {
        LoadOptions o = LoadOptions.builder().cancelSignal(() -> true).build();
        org.junit.jupiter.api.Assertions.assertThrows(LoadCancelledException.class,
                () -> CsvFiles.load(dir, "a\n1\n", o));
    }
}
