package nearfit.knn;

import java.util.ArrayList;
import java.util.List;

/**
 * A settings choice with its one word: what the command line accepts and its help shows, what the
 * model file's manifest stores and what the explorer's header and notes say. The word is the
 * constant's name in lower case with {@code _} as {@code -} unless the enum says otherwise
 * ({@link FlagScale}). The words are part of the model file format: renaming a constant changes
 * one, which ChoiceOptionsTest and ReleasedModelFileTest catch.
 */
public interface ChoiceWord {
    /** The constant's name (every enum has it). */
    String name();

    /** The word, lower case, e.g. {@code q05-q95} for {@code Q05_Q95}. */
    default String word() {
        return name().toLowerCase(java.util.Locale.ROOT).replace('_', '-');
    }

    /** The choice among {@code choices} whose word is {@code word} exactly, or {@code null}. */
    static <E extends ChoiceWord> E find(E[] choices, String word) {
        for (E c : choices) {
            if (c.word().equals(word)) {
                return c;
            }
        }
        return null;
    }

    /** The words of {@code choices}, in order. */
    static List<String> words(ChoiceWord[] choices) {
        List<String> out = new ArrayList<>(choices.length);
        for (ChoiceWord c : choices) {
            out.add(c.word());
        }
        return out;
    }
}
