package nearfit.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.junit.jupiter.api.Test;
import picocli.CommandLine.TypeConversionException;

/** The number options' converters: what each accepts, and the one line a bad value gives. */
class OptionNumbersTest {
    @Test
    void kIsAutoOrAPositiveWholeNumber() {
        assertEquals(OptionNumbers.K_AUTO, new OptionNumbers.KOrAuto().convert("AUTO"));
        assertEquals(25, new OptionNumbers.KOrAuto().convert(" 25 "));
        assertEquals("\"0\" is not a whole number of at least 1 or auto",
                assertThrows(TypeConversionException.class, () -> new OptionNumbers.KOrAuto().convert("0")).getMessage());
        assertThrows(TypeConversionException.class, () -> new OptionNumbers.KOrAuto().convert("2.5"));
    }

    @Test
    void aPercentMayCarryASignAndBecomesAFraction() {
        assertEquals(0.015, new OptionNumbers.Percent().convert("1.5%"), 1e-15);
        assertEquals(0.01, new OptionNumbers.Percent().convert("1"), 1e-15);
        assertThrows(TypeConversionException.class, () -> new OptionNumbers.Percent().convert("101"));
        assertThrows(TypeConversionException.class, () -> new OptionNumbers.Percent().convert("-1"));
    }

    @Test
    void aThresholdIsAPositiveFiniteNumber() {
        assertEquals(2.5, new OptionNumbers.Positive().convert("2.5"));
        assertThrows(TypeConversionException.class, () -> new OptionNumbers.Positive().convert("0"));
        assertThrows(TypeConversionException.class, () -> new OptionNumbers.Positive().convert("Infinity"));
        assertThrows(TypeConversionException.class, () -> new OptionNumbers.Positive().convert("NaN"));
    }

    @Test
    void aSizeIsWidthByHeight() {
        assertEquals(new OptionNumbers.PlotSize(100, 30), new OptionNumbers.Size().convert("100X30"));
        assertThrows(TypeConversionException.class, () -> new OptionNumbers.Size().convert("100"));
        assertThrows(TypeConversionException.class, () -> new OptionNumbers.Size().convert("0x30"));
    }

    @Test
    void aBadNumberIsOneLineNamingTheOptionInEveryCommand() {
        String[][] lines = {
            {"fit", "f.csv", "-x", "a", "-y", "b", "-o", "m.nfm", "--k", "abc"},
            {"tune", "f.csv", "-x", "a", "-y", "b", "--kmax", "0"},
            {"check", "m.nfm", "f.csv", "--limit", "lots"},
            {"check", "m.nfm", "f.csv", "--min-rows", "-3"},
            {"fit", "f.csv", "-x", "a", "-y", "b", "-o", "m.nfm", "--threshold", "-1"},
            {"plot", "f.csv", "-x", "a", "-y", "b", "--size", "wide"},
            {"predict", "m.nfm", "f.csv", "--threads", "many"},
        };
        String[] expected = {
            "nearfit: Invalid value for option '--k': \"abc\" is not a whole number of at least 1 or auto",
            "nearfit: Invalid value for option '--kmax': \"0\" is not a whole number of at least 1",
            "nearfit: Invalid value for option '--limit': \"lots\" is not a percentage from 0 to 100",
            "nearfit: Invalid value for option '--min-rows': \"-3\" is not a whole number of at least 1",
            "nearfit: Invalid value for option '--threshold': \"-1\" is not a positive number",
            "nearfit: Invalid value for option '--size': \"wide\" is not WIDTHxHEIGHT",
            "nearfit: Invalid value for option '--threads': \"many\" is not a whole number of at least 1",
        };
        for (int i = 0; i < lines.length; i++) {
            CliRun.Result r = CliRun.inProcess(lines[i]);
            assertEquals(2, r.status(), r.toString());
            assertEquals(expected[i], r.err().lines().findFirst().orElse(""), r.toString());
        }
    }

    @Test
    void aSizeOutsideTheModesRangeIsRefusedBeforeAnyFileIsRead() {
        CliRun.Result text = CliRun.inProcess("plot", "no-such.csv", "-x", "a", "-y", "b", "--size", "5x30");
        assertEquals(2, text.status(), text.toString());
        assertEquals("nearfit: --size: \"5x30\" is not WIDTHxHEIGHT with each from 20 to 1000", text.err().strip());
    }
}
