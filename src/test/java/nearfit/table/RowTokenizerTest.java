package nearfit.table;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.IOException;
import java.io.StringReader;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;

import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVRecord;
import org.junit.jupiter.api.Test;

import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;

class RowTokenizerTest {
    /** Tokenizes a whole input, blank lines included, as the loader's threads do. */
    static List<List<String>> tokenize(String text, char delimiter) {
        byte[] b = text.getBytes(StandardCharsets.UTF_8);
        RowTokenizer tok = new RowTokenizer(delimiter);
        List<List<String>> rows = new ArrayList<>();
        int p = 0;
        while (true) {
            int next = tok.next(b, p, b.length, true);
            if (next < 0) {
                assertEquals(RowTokenizer.END, next);
                return rows;
            }
            List<String> row = new ArrayList<>();
            for (int i = 0; i < tok.fields(); i++) {
                row.add(tok.text(b, i));
            }
            rows.add(row);
            p = next;
        }
    }

    /** The same input read by Apache Commons CSV, the external oracle (RFC 4180 format). */
    static List<List<String>> oracle(String text, char delimiter) throws IOException {
        List<List<String>> rows = new ArrayList<>();
        CSVFormat f = CSVFormat.RFC4180.builder().setDelimiter(delimiter).setIgnoreEmptyLines(false).get();
        for (CSVRecord r : f.parse(new StringReader(text))) {
            rows.add(r.toList());
        }
        return rows;
    }

    // RFC 4180 section 2, rules 1-2: records on separate lines ended by CRLF, the last one optionally not.
    @Test
    void rfc4180RecordsEndWithCrlfAndTheLastLineBreakIsOptional() throws IOException {
        String text = "aaa,bbb,ccc\r\nzzz,yyy,xxx";
        assertEquals(List.of(List.of("aaa", "bbb", "ccc"), List.of("zzz", "yyy", "xxx")), tokenize(text, ','));
        assertEquals(oracle(text, ','), tokenize(text, ','));
    }

    // RFC 4180 section 2, rule 5: fields may be enclosed in double quotes.
    @Test
    void rfc4180QuotedFieldsLoseTheirQuotes() throws IOException {
        String text = "\"aaa\",\"bbb\",\"ccc\"\r\nzzz,yyy,xxx\r\n";
        assertEquals(List.of("aaa", "bbb", "ccc"), tokenize(text, ',').get(0));
        assertEquals(oracle(text, ','), tokenize(text, ','));
    }

    // RFC 4180 section 2, rule 6: quoted fields may hold line breaks and commas.
    @Test
    void rfc4180QuotedFieldsHoldLineBreaksAndDelimiters() throws IOException {
        String text = "\"aaa\",\"b\r\nbb\",\"c,cc\"\r\nzzz,yyy,xxx\r\n";
        assertEquals(List.of("aaa", "b\r\nbb", "c,cc"), tokenize(text, ',').get(0));
        assertEquals(oracle(text, ','), tokenize(text, ','));
    }

    // RFC 4180 section 2, rule 7: a double quote inside a quoted field is written twice.
    @Test
    void rfc4180DoubledQuotesStandForOneQuote() throws IOException {
        String text = "\"aaa\",\"b\"\"bb\",\"ccc\"\r\n";
        assertEquals(List.of("aaa", "b\"bb", "ccc"), tokenize(text, ',').get(0));
        assertEquals(oracle(text, ','), tokenize(text, ','));
    }

    @Test
    void emptyFieldsAndEmptyQuotedFieldsAreEmpty() throws IOException {
        String text = "a,,\"\",b\n,\n";
        assertEquals(List.of(List.of("a", "", "", "b"), List.of("", "")), tokenize(text, ','));
        assertEquals(oracle(text, ','), tokenize(text, ','));
    }

    @Test
    void incompleteInputAsksForMore() {
        byte[] b = "a,\"b\nc".getBytes(StandardCharsets.UTF_8);
        RowTokenizer tok = new RowTokenizer(',');
        assertEquals(RowTokenizer.NEED_MORE, tok.next(b, 0, b.length, false));
        assertEquals(RowTokenizer.UNCLOSED_QUOTE, tok.next(b, 0, b.length, true));
    }

    @Property(tries = 300)
    void givesTheSameFieldsAsCommonsCsv(@ForAll("csvTexts") String text, @ForAll("delimiters") char d)
            throws IOException {
        String csv = text.replace(',', d == ',' ? ',' : d);
        assertEquals(oracle(csv, d), tokenize(csv, d));
    }

    @Provide
    Arbitrary<Character> delimiters() {
        return Arbitraries.of(',', ';', '\t', '|');
    }

    /** Valid CSV texts: random fields with quotes, delimiters and line breaks, quoted when they need it. */
    @Provide
    Arbitrary<String> csvTexts() {
        Arbitrary<String> field = Arbitraries.strings().withChars("ab1,\"\n é;|\t").ofMaxLength(8)
                .map(s -> s.isEmpty() || s.matches("[ab1 é]+") ? s : "\"" + s.replace("\"", "\"\"") + "\"");
        Arbitrary<String> row = field.list().ofMinSize(2).ofMaxSize(5).map(f -> String.join(",", f));
        return Arbitraries.oneOf(Arbitraries.just("\n"), Arbitraries.just("\r\n")).flatMap(eol ->
                row.list().ofMinSize(1).ofMaxSize(6).map(rows -> String.join(eol, rows) + eol));
    }
}
