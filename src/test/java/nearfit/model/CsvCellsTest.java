package nearfit.model;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

class CsvCellsTest {
    // OWASP, CSV Injection: cells beginning with = + - @ (and tab, carriage return) are prefixed with '.
    @Test
    void formulaLikeTextIsNeutralised() {
        assertEquals("'=SUM(A1:A9)", CsvCells.text("=SUM(A1:A9)"));
        assertEquals("'+1", CsvCells.text("+1"));
        assertEquals("'-cmd", CsvCells.text("-cmd"));
        assertEquals("'@x", CsvCells.text("@x"));
        assertEquals("'\tx", CsvCells.text("\tx"));
    }

    @Test
    void ordinaryTextIsKept() {
        assertEquals("T05", CsvCells.text("T05"));
        assertEquals("", CsvCells.text(""));
    }

    @Test
    void numbersStayNumbersAndRoundTrip() {
        assertEquals("-3", CsvCells.number(-3.0));
        assertEquals("", CsvCells.number(Double.NaN));
        double v = 0.1 + 0.2;
        assertEquals(v, Double.parseDouble(CsvCells.number(v)));
        assertEquals("-2.5", CsvCells.number(-2.5));
    }
}
