package nearfit.table;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.nio.file.Path;

import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class RowConditionTest {
    @TempDir
    Path dir;
    Table t;

    @BeforeEach
    void load() {
        t = CsvFiles.load(dir, "time,turbine,wind_ms,\"rotor speed\"\n"
                + "2025-02-28T23:50:00Z,T01,3.5,10\n"
                + "2025-03-01T00:00:00Z,T02,7,11\n"
                + "2025-03-01T00:10:00Z,T01,,12\n"
                + "2025-03-02T00:00:00Z,T03,12.5,13\n");
    }

    @Test
    void numberComparisonsSkipMissingValues() {
        assertEquals(RowSet.of(1, 3), t.where("wind_ms >= 7"));
        assertEquals(RowSet.of(0), t.where("wind_ms < 7"));
        assertEquals(RowSet.of(0, 1, 3), t.where("wind_ms != 100"), "missing meets no clause, not even !=");
        assertEquals(RowSet.of(1), t.where("wind_ms = 7.0"));
    }

    @Test
    void categoryLabelsBareOrQuotedWithEqualsAndNotEquals() {
        assertEquals(RowSet.of(0, 2), t.where("turbine = T01"));
        assertEquals(RowSet.of(0, 2), t.where("turbine = 'T01'"));
        assertEquals(RowSet.of(1, 3), t.where("turbine != \"T01\""));
        assertEquals(RowSet.of(), t.where("turbine = T99"));
    }

    @Test
    void timesCompareWithIsoDatesAndDateTimes() {
        assertEquals(RowSet.of(1, 2, 3), t.where("time >= 2025-03-01"));
        assertEquals(RowSet.of(0, 1), t.where("time <= 2025-03-01T01:00:00+01:00"));
        assertEquals(RowSet.of(2), t.where("time > '2025-03-01 00:00:00' and time < 2025-03-02"));
    }

    @Test
    void clausesJoinWithAndAndQuotedColumnNames() {
        assertEquals(RowSet.of(2), t.where("turbine = T01 AND \"rotor speed\" > 11"));
    }

    @Test
    void errorsNameTheColumnOrThePosition() {
        assertEquals("column power: no such column in the row condition (position 1); the columns are "
                + "time, turbine, wind_ms, rotor speed",
                assertThrows(NearfitException.class, () -> t.where("power > 3")).getMessage());
        assertEquals("row condition, position 9: expected one of = != < <= > >= in \"wind_ms ~ 3\"",
                assertThrows(NearfitException.class, () -> t.where("wind_ms ~ 3")).getMessage());
        assertEquals("column wind_ms: \"fast\" is not a number",
                assertThrows(NearfitException.class, () -> t.where("wind_ms > fast")).getMessage());
        assertEquals("column turbine: a category column takes only = and !=, not <",
                assertThrows(NearfitException.class, () -> t.where("turbine < T02")).getMessage());
        assertEquals("row condition, position 13: expected 'and' or the end of the condition in \"wind_ms > 3 or x\"",
                assertThrows(NearfitException.class, () -> t.where("wind_ms > 3 or x")).getMessage());
        assertEquals("column time: \"March\" is not an ISO 8601 date or date-time such as 2025-03-01T10:20:00Z",
                assertThrows(NearfitException.class, () -> t.where("time > March")).getMessage());
    }

    @Test
    void theColumnsNamedAreListedOnceInOrderWithoutATable() {
        assertEquals(java.util.List.of("turbine", "rotor speed", "time"), RowCondition.columnsNamed(
                "turbine = 'T 01' and \"rotor speed\" > 11 AND turbine != T02 and time < \"2025-03-01 10:00\""));
    }

    @Test
    void theClausesAreGivenAsWrittenWithoutATableForAnotherReaderToEvaluate() {
        assertEquals(java.util.List.of(new RowCondition.Clause("turbine", RowCondition.Op.NE, "T 01"),
                        new RowCondition.Clause("wind_ms", RowCondition.Op.GE, "3.5")),
                RowCondition.clausesOf("turbine != 'T 01' and wind_ms >= 3.5"));
        assertThrows(NearfitException.class, () -> RowCondition.clausesOf("wind_ms ~ 3"));
    }

    @Test
    void listingTheColumnsNamedChecksTheSyntaxAsParsingDoes() {
        assertEquals("row condition, position 9: expected one of = != < <= > >= in \"wind_ms ~ 3\"",
                assertThrows(NearfitException.class, () -> RowCondition.columnsNamed("wind_ms ~ 3")).getMessage());
        assertEquals("row condition, position 13: expected 'and' or the end of the condition in \"wind_ms > 3 or x\"",
                assertThrows(NearfitException.class, () -> RowCondition.columnsNamed("wind_ms > 3 or x")).getMessage());
    }

    @Test
    void rowSetsIntersectAndCopyNothing() {
        RowSet a = t.where("wind_ms > 3");
        RowSet b = t.where("turbine = T01");
        assertEquals(RowSet.of(0), a.and(b));
        double[] wind = t.numeric("wind_ms").copyValues(a);
        assertEquals(3, wind.length);
        assertEquals(12.5, wind[2]);
        assertThrows(IllegalArgumentException.class, () -> RowSet.of(2, 1));
    }
}
