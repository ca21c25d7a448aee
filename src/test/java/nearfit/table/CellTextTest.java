package nearfit.table;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;

import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.DoubleRange;

import org.junit.jupiter.api.Test;

class CellTextTest {
    private static double parse(String s, boolean comma) {
        byte[] b = s.getBytes(StandardCharsets.UTF_8);
        return CellText.parseNumber(b, 0, b.length, comma, new byte[b.length]);
    }

    // Oracle: java.lang.Double.parseDouble, which is correctly rounded (JLS / Double.valueOf Javadoc).
    @Property(tries = 2000)
    void plainDecimalsParseExactlyAsTheJdkDoes(@ForAll @DoubleRange(min = -1e7, max = 1e7) double x,
            @ForAll("decimals") int places) {
        String s = String.format(java.util.Locale.ROOT, "%." + places + "f", x);
        assertEquals(Double.parseDouble(s), parse(s, false), s);
    }

    @net.jqwik.api.Provide
    net.jqwik.api.Arbitrary<Integer> decimals() {
        return net.jqwik.api.Arbitraries.integers().between(0, 12);
    }

    @Property(tries = 1000)
    void anyJavaDoubleTextParsesToItself(@ForAll double x) {
        if (!Double.isNaN(x)) {
            assertEquals(x, parse(Double.toString(x), false), Double.toString(x));
        }
    }

    @Test
    void decimalCommaIsTheSeparatorOnlyWhenAsked() {
        assertEquals(12.5, parse("12,5", true));
        assertTrue(Double.isNaN(parse("12,5", false)));
        assertEquals(-0.25, parse("-0,25", true));
        assertEquals(1.5e3, parse("1,5e3", true));
    }

    @Test
    void javaOnlySyntaxIsNotANumber() {
        assertTrue(Double.isNaN(parse("1.0d", false)));
        assertTrue(Double.isNaN(parse("0x1p3", false)));
        assertTrue(Double.isNaN(parse("12x5", false)));
        assertTrue(Double.isNaN(parse("1.2.3", false)));
    }
}
