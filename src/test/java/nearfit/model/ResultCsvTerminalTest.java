package nearfit.model;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.IOException;
import java.io.StringWriter;
import java.util.List;

import org.junit.jupiter.api.Test;

/** A CSV a person reads on a terminal shows a label's control characters; a file keeps them. */
class ResultCsvTerminalTest {
    /** A label that sets the terminal's title (OSC 2 ... BEL), then a colour sequence, as a file could hold. */
    private static final String LABEL = "T\u001b]2;owned\u0007\u001b[31m01";

    private static String written(ResultCsv csv, StringWriter w) throws IOException {
        csv.header(List.of("turbine", "power_kw"));
        csv.text(LABEL).number(12.5).endRow();
        csv.flush();
        return w.toString();
    }

    @Test
    void onATerminalEveryControlCharacterOfATextCellIsShownAsAnEscape() throws IOException {
        StringWriter w = new StringWriter();
        assertEquals("turbine,power_kw\nT\\e]2;owned\\a\\e[31m01,12.5\n", written(ResultCsv.forTerminal(w), w));
    }

    @Test
    void aFileGetsTheLabelAsTheSourceHeldIt() throws IOException {
        StringWriter w = new StringWriter();
        assertEquals("turbine,power_kw\n" + LABEL + ",12.5\n", written(new ResultCsv(w), w));
    }

    @Test
    void numbersAndTheFormulaGuardAreTheSameEitherWay() throws IOException {
        StringWriter plain = new StringWriter();
        StringWriter shown = new StringWriter();
        for (ResultCsv csv : List.of(new ResultCsv(plain), ResultCsv.forTerminal(shown))) {
            csv.text("=SUM(A1)").number(-3.25).number(Double.NaN).endRow();
            csv.flush();
        }
        assertEquals("'=SUM(A1),-3.25,\n", plain.toString());
        assertEquals(plain.toString(), shown.toString());
    }
}
