package nearfit.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.List;

import nearfit.table.NearfitException;
import org.junit.jupiter.api.Test;

class OptionValuesTest {
    @Test
    void kIsAutoOrAPositiveWholeNumber() {
        assertEquals(OptionValues.K_AUTO, OptionValues.k("--k", "AUTO"));
        assertEquals(25, OptionValues.k("--k", "25"));
        assertEquals("--k: \"0\" is not a whole number or auto",
                assertThrows(NearfitException.class, () -> OptionValues.k("--k", "0")).getMessage());
        assertThrows(NearfitException.class, () -> OptionValues.k("--k", "2.5"));
    }

    @Test
    void aPercentMayCarryASignAndBecomesAFraction() {
        assertEquals(0.015, OptionValues.percent("--limit", "1.5%"), 1e-15);
        assertEquals(0.01, OptionValues.percent("--limit", "1"), 1e-15);
        assertThrows(NearfitException.class, () -> OptionValues.percent("--limit", "101"));
        assertThrows(NearfitException.class, () -> OptionValues.percent("--limit", "-1"));
    }

    @Test
    void aColumnListRefusesEmptyAndRepeatedNames() {
        assertEquals(List.of("wind_ms", "air_temp_c"), OptionValues.columnList("-x", "wind_ms, air_temp_c"));
        assertThrows(NearfitException.class, () -> OptionValues.columnList("-x", "wind_ms,,air_temp_c"));
        assertThrows(NearfitException.class, () -> OptionValues.columnList("-x", "wind_ms,wind_ms"));
    }

    @Test
    void aSizeIsWidthByHeightWithinBounds() {
        assertArrayEquals(new int[] {100, 30}, OptionValues.size("--size", "100x30", 10, 4000));
        assertThrows(NearfitException.class, () -> OptionValues.size("--size", "100", 10, 4000));
        assertThrows(NearfitException.class, () -> OptionValues.size("--size", "5x30", 10, 4000));
    }
}
