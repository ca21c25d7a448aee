package nearfit.table;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.List;

import org.junit.jupiter.api.Test;

class LoadReportTest {
    private static LoadReport withDelimiter(char d) {
        return new LoadReport("log.csv", 3, 100, d, true, false, 0, 0, List.of(), 0, List.of(), 1_000_000);
    }

    @Test
    void theDetectedDelimitersAreNamedInWords() {
        assertEquals("comma", withDelimiter(',').delimiterName());
        assertEquals("semicolon", withDelimiter(';').delimiterName());
        assertEquals("tab", withDelimiter('\t').delimiterName());
        assertEquals("bar", withDelimiter('|').delimiterName());
    }

    @Test
    void anyOtherDelimiterIsQuoted() {
        assertEquals("':'", withDelimiter(':').delimiterName());
    }

    @Test
    void aLoadOfASemicolonFileIsReportedAsSemicolon() {
        Table t = CsvLoader.load(new java.io.ByteArrayInputStream(
                "wind_ms;power_kw\n3.5;120\n7.25;900\n".getBytes(java.nio.charset.StandardCharsets.UTF_8)),
                "semi.csv", LoadOptions.builder().build());
        assertEquals("semicolon", t.report().delimiterName());
    }
}
