package nearfit.cli;

import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;
import java.util.Locale;

import picocli.CommandLine;

/**
 * The choice options of every command as picocli typed options: an enum per choice and a converter
 * per enum, which is also the option's completion candidates. A constant's word is its name in lower
 * case with {@code _} as {@code -} ({@code Q05_Q95} is {@code q05-q95}): the words of the help, the
 * README and the model file (ChoiceOptionsTest proves they equal {@code ModelSettings}' lists).
 *
 * <p>Words are matched without case and surrounding spaces; a word not allowed is a usage error in
 * one line naming the option and the words allowed, e.g.
 * {@code Invalid value for option '--metric': "taxi" is not one of euclidean, manhattan, chebyshev, mahalanobis}.
 */
final class OptionChoices {
    private OptionChoices() {
    }

    /** {@code --metric}. */
    enum MetricChoice { EUCLIDEAN, MANHATTAN, CHEBYSHEV, MAHALANOBIS }

    /** {@code --weights}. */
    enum WeightsChoice { UNIFORM, INVERSE, TRICUBE }

    /** {@code --scale}. */
    enum ScaleChoice { Z, ROBUST, RANGE, NONE }

    /** {@code --band}. */
    enum BandChoice { Q10_Q90, Q05_Q95, SD2, NONE }

    /** {@code --estimate}. */
    enum EstimateChoice { MEAN, MEDIAN }

    /** {@code --z-scale}. */
    enum ZScaleChoice { LOCAL, REFERENCE }

    /** {@code describe --format}. */
    enum DescribeFormat { TABLE, JSON }

    /** {@code tune --format}. */
    enum TuneFormat { TABLE, CSV, JSON }

    /** {@code check --format}. */
    enum CheckFormat { TEXT, JSON }

    /** The command-line word of a choice. */
    static String word(Enum<?> choice) {
        return choice.name().toLowerCase(Locale.ROOT).replace('_', '-');
    }

    /** The word of a choice, or null for an option not given. */
    static String wordOrNull(Enum<?> choice) {
        return choice == null ? null : word(choice);
    }

    /** Converts a word to its constant of {@code E}; iterates the words, for completion and help. */
    abstract static class Words<E extends Enum<E>> implements CommandLine.ITypeConverter<E>, Iterable<String> {
        private final Class<E> type;

        Words(Class<E> type) {
            this.type = type;
        }

        @Override
        public E convert(String text) {
            String given = text.trim().toLowerCase(Locale.ROOT);
            for (E choice : type.getEnumConstants()) {
                if (word(choice).equals(given)) {
                    return choice;
                }
            }
            throw new CommandLine.TypeConversionException("\"" + text + "\" is not one of " + String.join(", ", this));
        }

        @Override
        public Iterator<String> iterator() {
            List<String> words = new ArrayList<>();
            for (E choice : type.getEnumConstants()) {
                words.add(word(choice));
            }
            return words.iterator();
        }
    }

    /** Converter and candidates of {@link MetricChoice}. */
    static final class MetricWords extends Words<MetricChoice> {
        public MetricWords() {
            super(MetricChoice.class);
        }
    }

    /** Converter and candidates of {@link WeightsChoice}. */
    static final class WeightsWords extends Words<WeightsChoice> {
        public WeightsWords() {
            super(WeightsChoice.class);
        }
    }

    /** Converter and candidates of {@link ScaleChoice}. */
    static final class ScaleWords extends Words<ScaleChoice> {
        public ScaleWords() {
            super(ScaleChoice.class);
        }
    }

    /** Converter and candidates of {@link BandChoice}. */
    static final class BandWords extends Words<BandChoice> {
        public BandWords() {
            super(BandChoice.class);
        }
    }

    /** Converter and candidates of {@link EstimateChoice}. */
    static final class EstimateWords extends Words<EstimateChoice> {
        public EstimateWords() {
            super(EstimateChoice.class);
        }
    }

    /** Converter and candidates of {@link ZScaleChoice}. */
    static final class ZScaleWords extends Words<ZScaleChoice> {
        public ZScaleWords() {
            super(ZScaleChoice.class);
        }
    }

    /** Converter and candidates of {@link DescribeFormat}. */
    static final class DescribeFormatWords extends Words<DescribeFormat> {
        public DescribeFormatWords() {
            super(DescribeFormat.class);
        }
    }

    /** Converter and candidates of {@link TuneFormat}. */
    static final class TuneFormatWords extends Words<TuneFormat> {
        public TuneFormatWords() {
            super(TuneFormat.class);
        }
    }

    /** Converter and candidates of {@link CheckFormat}. */
    static final class CheckFormatWords extends Words<CheckFormat> {
        public CheckFormatWords() {
            super(CheckFormat.class);
        }
    }
}
