package nearfit.table;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

class NearfitExceptionTest {
    @Test
    void messageNamesFileLineAndColumn() {
        NearfitException e = new NearfitException("site-log.csv", 1043, "power_kw", "\"12,5,3\" is not a number", null);
        assertEquals("site-log.csv:1043: column power_kw: \"12,5,3\" is not a number", e.getMessage());
        assertEquals("\"12,5,3\" is not a number", e.detail());
    }

    @Test
    void messageWithoutPositionIsTheDetailAlone() {
        assertEquals("k must be at least 1", new NearfitException("k must be at least 1").getMessage());
    }

    @Test
    void fileWithoutLine() {
        assertEquals("a.csv: the file is empty", NearfitException.inFile("a.csv", "the file is empty").getMessage());
    }
}
