package nearfit.cli;

import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;
import java.util.Locale;
import java.util.function.Function;

import nearfit.knn.Band;
import nearfit.knn.ChoiceWord;
import nearfit.knn.EstimateKind;
import nearfit.knn.FlagScale;
import nearfit.knn.Metric;
import nearfit.knn.Scaling;
import nearfit.knn.Weighting;
import picocli.CommandLine;

/**
 * The choice options of every command as picocli typed options: a converter per choice, which is also
 * the option's completion candidates. The settings options convert straight to the knn package's
 * enums, whose words ({@link ChoiceWord#word}) are the words of the help, the README, the model file and
 * the explorer; the output formats are this package's own enums, a constant's word its name in lower
 * case.
 *
 * <p>Words are matched without case and surrounding spaces; a word not allowed is a usage error in
 * one line naming the option and the words allowed, e.g.
 * {@code Invalid value for option '--metric': "taxi" is not one of euclidean, manhattan, chebyshev, mahalanobis}.
 */
final class OptionChoices {
    private OptionChoices() {
    }

    /** {@code describe --format}. */
    enum DescribeFormat { TABLE, JSON }

    /** {@code tune --format}. */
    enum TuneFormat { TABLE, CSV, JSON }

    /** {@code check --format}. */
    enum CheckFormat { TEXT, JSON }

    /** The word of an output format: its name in lower case. */
    static String word(Enum<?> format) {
        return format.name().toLowerCase(Locale.ROOT);
    }

    /** Converts a word to one of the choices; iterates their words, for completion and help. */
    abstract static class Words<E> implements CommandLine.ITypeConverter<E>, Iterable<String> {
        private final E[] choices;
        private final Function<E, String> word;

        Words(E[] choices, Function<E, String> word) {
            this.choices = choices;
            this.word = word;
        }

        @Override
        public E convert(String text) {
            String given = text.trim().toLowerCase(Locale.ROOT);
            for (E choice : choices) {
                if (word.apply(choice).equals(given)) {
                    return choice;
                }
            }
            throw new CommandLine.TypeConversionException("\"" + text + "\" is not one of " + String.join(", ", this));
        }

        @Override
        public Iterator<String> iterator() {
            List<String> words = new ArrayList<>();
            for (E choice : choices) {
                words.add(word.apply(choice));
            }
            return words.iterator();
        }
    }

    /** Converter and candidates of {@link Metric}. */
    static final class MetricWords extends Words<Metric> {
        public MetricWords() {
            super(Metric.values(), ChoiceWord::word);
        }
    }

    /** Converter and candidates of {@link Weighting}. */
    static final class WeightsWords extends Words<Weighting> {
        public WeightsWords() {
            super(Weighting.values(), ChoiceWord::word);
        }
    }

    /** Converter and candidates of {@link Scaling}. */
    static final class ScaleWords extends Words<Scaling> {
        public ScaleWords() {
            super(Scaling.values(), ChoiceWord::word);
        }
    }

    /** Converter and candidates of {@link Band}. */
    static final class BandWords extends Words<Band> {
        public BandWords() {
            super(Band.values(), ChoiceWord::word);
        }
    }

    /** Converter and candidates of {@link EstimateKind}. */
    static final class EstimateWords extends Words<EstimateKind> {
        public EstimateWords() {
            super(EstimateKind.values(), ChoiceWord::word);
        }
    }

    /** Converter and candidates of {@link FlagScale} (those a model file can store). */
    static final class ZScaleWords extends Words<FlagScale> {
        public ZScaleWords() {
            super(FlagScale.offered(), ChoiceWord::word);
        }
    }

    /** Converter and candidates of {@link DescribeFormat}. */
    static final class DescribeFormatWords extends Words<DescribeFormat> {
        public DescribeFormatWords() {
            super(DescribeFormat.values(), OptionChoices::word);
        }
    }

    /** Converter and candidates of {@link TuneFormat}. */
    static final class TuneFormatWords extends Words<TuneFormat> {
        public TuneFormatWords() {
            super(TuneFormat.values(), OptionChoices::word);
        }
    }

    /** Converter and candidates of {@link CheckFormat}. */
    static final class CheckFormatWords extends Words<CheckFormat> {
        public CheckFormatWords() {
            super(CheckFormat.values(), OptionChoices::word);
        }
    }
}
