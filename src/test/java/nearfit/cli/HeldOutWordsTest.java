package nearfit.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.time.Duration;

import nearfit.knn.HeldOutScheme;
import org.junit.jupiter.api.Test;
import picocli.CommandLine;

/** The --cv words: schemes, periods in short words or ISO 8601, and refusals. */
class HeldOutWordsTest {
    private final HeldOutWords words = new HeldOutWords();

    @Test
    void everySchemeWordGivesItsScheme() {
        assertNull(words.convert("auto").scheme());
        assertEquals(new HeldOutScheme.LeaveOneOut(), words.convert(" LOO ").scheme());
        assertEquals(new HeldOutScheme.Folds(5, 1), words.convert("folds:5").scheme());
        assertEquals(new HeldOutScheme.Folds(7, 1), words.convert("7").scheme()); // a bare number keeps working
        assertEquals(new HeldOutScheme.ByGroup(), words.convert("group").scheme());
        assertEquals(new HeldOutScheme.ByBlock(Duration.ofDays(1)), words.convert("block:1d").scheme());
        assertEquals(new HeldOutScheme.ByBlock(Duration.ofHours(12)), words.convert("block:PT12H").scheme());
        assertEquals(new HeldOutScheme.ByBlock(Duration.ofDays(7)), words.convert("block:1w").scheme());
        assertEquals(new HeldOutScheme.GroupAndBlock(Duration.ofDays(1)), words.convert("group+block:P1D").scheme());
    }

    @Test
    void aSchemeWritesTheWordsItWasReadFrom() {
        for (String w : new String[] {"loo", "folds:5", "group", "block:1d", "block:12h", "group+block:7d"}) {
            assertEquals(w, words.convert(w).word());
        }
    }

    @Test
    void aPeriodBelowASecondOrNotATimeIsRefused() {
        assertThrows(CommandLine.TypeConversionException.class, () -> words.convert("block:0d"));
        assertThrows(CommandLine.TypeConversionException.class, () -> words.convert("block:day"));
        assertThrows(CommandLine.TypeConversionException.class, () -> words.convert("block:PT0.5S"));
        assertThrows(CommandLine.TypeConversionException.class, () -> words.convert("folds:1"));
    }
}
