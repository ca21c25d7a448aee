package nearfit.table;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.util.List;

import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import org.junit.jupiter.api.Test;

class PlainRowReaderTest {
    private static Layout numbers(int width, char delimiter, boolean comma) {
        int[] fields = new int[width];
        ColumnType[] types = new ColumnType[width];
        String[] names = new String[width];
        for (int f = 0; f < width; f++) {
            fields[f] = f;
            types[f] = ColumnType.NUMBER;
            names[f] = "c" + f;
        }
        return new Layout(delimiter, comma, true, width, List.of(names), fields, types, 0, 2);
    }

    /** The row's end as the reader gives it, with {@code pad} spare bytes after the row in the buffer. */
    private static int read(PlainRowReader r, String row, int pad) {
        byte[] text = row.getBytes(StandardCharsets.UTF_8);
        byte[] b = new byte[text.length + pad];
        System.arraycopy(text, 0, b, 0, text.length);
        return r.read(b, 0, text.length);
    }

    // Oracle: java.lang.Double.parseDouble, correctly rounded (Double.valueOf Javadoc). Texts near the
    // limits of the fast form (18 digits, 2^53) are included so declining is exercised too.
    @Property(tries = 3000)
    void acceptedNumbersEqualTheJdksParseBitForBit(@ForAll("decimalTexts") String a,
            @ForAll("decimalTexts") String b, @ForAll boolean crlf) {
        PlainRowReader r = new PlainRowReader(numbers(2, ',', false));
        String row = a + "," + b + (crlf ? "\r\n" : "\n");
        int end = read(r, row, 0);
        if (end == PlainRowReader.NOT_PLAIN) {
            return; // declined rows go to the general path, tested with the loader
        }
        assertEquals(row.length(), end, row);
        assertEquals(Double.doubleToRawLongBits(Double.parseDouble(a)), Double.doubleToRawLongBits(r.values[0]), a);
        assertEquals(Double.doubleToRawLongBits(Double.parseDouble(b)), Double.doubleToRawLongBits(r.values[1]), b);
    }

    @Property(tries = 1000)
    void plainDecimalsOfUpToFourteenDigitsAreAcceptedWithOrWithoutSpareBytes(
            @ForAll("shortDecimals") String a, @ForAll boolean spare) {
        PlainRowReader r = new PlainRowReader(numbers(1, ';', false));
        String row = a + "\n";
        assertEquals(row.length(), read(r, row, spare ? 32 : 0), row);
        assertEquals(Double.parseDouble(a), r.values[0], a);
    }

    @Provide
    Arbitrary<String> decimalTexts() {
        Arbitrary<String> digits = Arbitraries.strings().numeric().ofMinLength(0).ofMaxLength(20);
        Arbitrary<String> sign = Arbitraries.of("", "-", "+");
        return Combinators.combine(sign, digits, Arbitraries.of("", "."), digits)
                .as((s, i, p, f) -> s + i + p + f)
                .filter(t -> t.chars().anyMatch(Character::isDigit));
    }

    @Provide
    Arbitrary<String> shortDecimals() {
        Arbitrary<String> digits = Arbitraries.strings().numeric().ofMinLength(1).ofMaxLength(7);
        return Combinators.combine(Arbitraries.of("", "-"), digits, digits).as((s, i, f) -> s + i + "." + f);
    }

    @Test
    void theWordAtATimePathTakesTheUsualReadings() {
        PlainRowReader r = new PlainRowReader(numbers(1, ',', false));
        byte[] b = "2345.67,12.345,3.4567,-12.34\n........".getBytes(StandardCharsets.US_ASCII);
        assertEquals(7, r.decimalByWords(b, 0));
        assertEquals(14, r.decimalByWords(b, 8));
        assertEquals(-1, r.decimalByWords("123456789.5,....................".getBytes(StandardCharsets.US_ASCII), 0),
                "eight digits or more are left to the byte loop");
    }

    @Test
    void readsADecimalCommaRowWhenTheLayoutSaysSo() {
        PlainRowReader r = new PlainRowReader(numbers(2, ';', true));
        assertEquals(11, read(r, "12,5;-0,25\n", 0));
        assertEquals(12.5, r.values[0]);
        assertEquals(-0.25, r.values[1]);
    }

    @Test
    void declinesEveryRowTheGeneralPathMustDecide() {
        PlainRowReader r = new PlainRowReader(numbers(2, ',', false));
        for (String row : new String[] {"\"1\",2\n", "1,\n", "1,NA\n", "1\n", "1,2,3\n", "1, 2\n", "1,2e3\n",
            "1,2", "1,2\r", "1,0x10\n", "1,1234567890123456789\n", "1,9007199254740993\n", "\n", ".,1\n"}) {
            assertEquals(PlainRowReader.NOT_PLAIN, read(r, row, 32), row.replace("\n", "\\n"));
        }
    }

    @Test
    void declinesABlankLineOfAOneColumnTextFile() {
        Layout text = new Layout(',', false, true, 1, List.of("note"), new int[] {0},
                new ColumnType[] {ColumnType.TEXT}, 0, 2);
        PlainRowReader r = new PlainRowReader(text);
        assertEquals(PlainRowReader.NOT_PLAIN, read(r, "\r\n", 0));
        assertEquals(4, read(r, "ok\r\n", 0));
        assertTrue(r.ends[0] - r.starts[0] == 2, "the carriage return is not part of the field");
    }
}
