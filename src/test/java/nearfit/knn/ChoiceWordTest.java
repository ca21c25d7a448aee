package nearfit.knn;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertSame;

import java.util.HashSet;
import java.util.List;

import org.junit.jupiter.api.Test;

/**
 * Each settings choice has one word, distinct within its kind, and finding a word gives its constant
 * back: the command line, the model file and the explorer rely on the round trip.
 */
class ChoiceWordTest {
    private static final List<ChoiceWord[]> KINDS = List.of(Metric.values(), Weighting.values(), Scaling.values(),
            Band.values(), EstimateKind.values(), FlagScale.values());

    @Test
    void everyWordIsDistinctInItsKindAndFindsItsConstant() {
        for (ChoiceWord[] kind : KINDS) {
            List<String> words = ChoiceWord.words(kind);
            assertEquals(kind.length, new HashSet<>(words).size(), words.toString());
            for (ChoiceWord c : kind) {
                assertSame(c, ChoiceWord.find(kind, c.word()));
                assertEquals(c.word().strip().toLowerCase(java.util.Locale.ROOT), c.word(), "lower case, no spaces");
            }
        }
    }

    @Test
    void anUnknownWordOrAScaleNotOfferedIsNotFound() {
        assertNull(ChoiceWord.find(Metric.values(), "taxi"));
        assertNull(ChoiceWord.find(Band.values(), "Q05-Q95"), "exact: the command line folds case before");
        assertNull(ChoiceWord.find(FlagScale.offered(), FlagScale.LOCAL_MAD.word()));
        assertEquals(List.of("local", "reference"), ChoiceWord.words(FlagScale.offered()));
    }
}
