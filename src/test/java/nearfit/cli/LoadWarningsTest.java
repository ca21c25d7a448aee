package nearfit.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.util.List;

import nearfit.table.LoadReport;
import org.junit.jupiter.api.Test;

/** A load report's warnings (see table.LoaderRobustnessTest for when the loader gives one) as the commands show them. */
class LoadWarningsTest {
    static final String GREW = "log.csv: grew from 100 to 130 bytes while it was read; only the first 100 bytes were read";

    private static LoadReport reportWith(List<String> warnings) {
        return new LoadReport("log.csv", 3, 100, ',', true, false, 0, 0, List.of(), 0, List.of(), 1_000_000, warnings);
    }

    @Test
    void eachWarningIsOneLineOnStandardErrorWithTheToolsPrefix() {
        StringWriter err = new StringWriter();
        SourceTable.printWarnings(reportWith(List.of(GREW, "second")), new PrintWriter(err));
        assertEquals("nearfit: warning: " + GREW + "\nnearfit: warning: second\n", err.toString().replace(System.lineSeparator(), "\n"));
    }

    @Test
    void aReportWithoutWarningsPrintsNothing() {
        StringWriter err = new StringWriter();
        SourceTable.printWarnings(reportWith(List.of()), new PrintWriter(err));
        assertEquals("", err.toString());
    }

    @Test
    void describeEndsItsReportWithTheWarningsInTextAndJson() {
        String text = DescribeCommand.text(reportWith(List.of(GREW)), List.of());
        assertTrue(text.endsWith("\nwarning: " + GREW + "\n"), text);
        String json = DescribeCommand.json(reportWith(List.of(GREW)), List.of());
        assertTrue(json.contains("\"warnings\":[\"" + GREW + "\"]"), json);
    }
}
