package nearfit.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;

import nearfit.knn.Band;
import nearfit.knn.Metric;
import org.junit.jupiter.api.Test;
import picocli.CommandLine;

/**
 * Every choice option is a picocli typed option with one converter: the words are those of the model
 * file and the help, matched without case, completed by the shell, and a wrong word is one line naming
 * the option and the words allowed, for every command the same way.
 */
class ChoiceOptionsTest {
    private static final List<String> BANDS = List.of("q10-q90", "q05-q95", "sd2", "none");

    private static List<String> words(Iterable<String> candidates) {
        List<String> out = new ArrayList<>();
        candidates.forEach(out::add);
        return out;
    }

    @Test
    void theWordsAreTheModelFilesWords() {
        // The model file's words (its format; ReleasedModelFileTest reads a file of an earlier release).
        assertEquals(List.of("euclidean", "manhattan", "chebyshev", "mahalanobis"), words(new OptionChoices.MetricWords()));
        assertEquals(List.of("uniform", "inverse", "tricube"), words(new OptionChoices.WeightsWords()));
        assertEquals(List.of("z", "robust", "range", "none"), words(new OptionChoices.ScaleWords()));
        assertEquals(BANDS, words(new OptionChoices.BandWords()));
        assertEquals(List.of("mean", "median"), words(new OptionChoices.EstimateWords()));
        assertEquals(List.of("local", "reference"), words(new OptionChoices.ZScaleWords()));
        assertEquals(List.of("table", "json"), words(new OptionChoices.DescribeFormatWords()));
        assertEquals(List.of("table", "csv", "json"), words(new OptionChoices.TuneFormatWords()));
        assertEquals(List.of("text", "json"), words(new OptionChoices.CheckFormatWords()));
    }

    @Test
    void wordsAreMatchedWithoutCaseOrSurroundingSpaces() throws Exception {
        assertEquals(Band.Q05_Q95, new OptionChoices.BandWords().convert(" Q05-Q95 "));
        assertEquals(Metric.MANHATTAN, new OptionChoices.MetricWords().convert("Manhattan"));
    }

    @Test
    void aWrongWordIsOneLineNamingTheOptionAndTheWordsAllowedInEveryCommand() {
        String[][] lines = {
            {"fit", "f.csv", "-x", "a", "-y", "b", "-o", "m.nfm", "--metric", "taxi"},
            {"tune", "f.csv", "-x", "a", "-y", "b", "--band", "q01-q99"},
            {"tune", "f.csv", "-x", "a", "-y", "b", "--format", "xml"},
            {"describe", "f.csv", "--format", "csv"},
            {"check", "m.nfm", "f.csv", "--format", "html"},
            {"predict", "m.nfm", "f.csv", "--z-scale", "global"},
            {"fit", "f.csv", "-x", "a", "-y", "b", "-o", "m.nfm", "--cv", "1"},
            {"view", "f.csv", "--estimate", "mode"},
        };
        String[] expected = {
            "nearfit: Invalid value for option '--metric': \"taxi\" is not one of euclidean, manhattan, chebyshev, mahalanobis",
            "nearfit: Invalid value for option '--band': \"q01-q99\" is not one of q10-q90, q05-q95, sd2, none",
            "nearfit: Invalid value for option '--format': \"xml\" is not one of table, csv, json",
            "nearfit: Invalid value for option '--format': \"csv\" is not one of table, json",
            "nearfit: Invalid value for option '--format': \"html\" is not one of text, json",
            "nearfit: Invalid value for option '--z-scale': \"global\" is not one of local, reference",
            "nearfit: Invalid value for option '--cv': \"1\" is not auto, loo, folds:N (N at least 2), group, block:PERIOD "
                + "or group+block:PERIOD",
            "nearfit: Invalid value for option '--estimate': \"mode\" is not one of mean, median",
        };
        for (int i = 0; i < lines.length; i++) {
            CliRun.Result r = CliRun.inProcess(lines[i]);
            assertEquals(2, r.status(), r.toString());
            assertEquals(expected[i], r.err().lines().findFirst().orElse(""), r.toString());
        }
    }

    @Test
    void theShellCompletesTheWords() {
        CommandLine cli = Main.commandLine();
        assertEquals(BANDS, words(cli.getSubcommands().get("fit").getCommandSpec()
                .findOption("--band").completionCandidates()));
        assertEquals(List.of("text", "json"), words(cli.getSubcommands().get("check").getCommandSpec()
                .findOption("--format").completionCandidates()));
        assertTrue(words(cli.getSubcommands().get("tune").getCommandSpec().findOption("--cv").completionCandidates())
                .contains("loo"));
    }

    @Test
    void eachChoiceOptionHasItsOwnWordsInTheCompletionScript() {
        CliRun.Result r = CliRun.inProcess("completion", "bash");
        assertEquals(0, r.status(), r.toString());
        // The script keeps an option's words in a variable named after its parameter label: one label
        // for two options in a command would complete the second's words for both.
        for (String function : r.out().split("\\nfunction ")) {
            List<String> names = new ArrayList<>();
            java.util.regex.Matcher m = java.util.regex.Pattern.compile("local (\\w+_option_args)=").matcher(function);
            while (m.find()) {
                assertTrue(!names.contains(m.group(1)), m.group(1) + " twice in " + function.lines().findFirst().orElse(""));
                names.add(m.group(1));
            }
        }
        assertTrue(r.out().contains("(\"uniform\" \"inverse\" \"tricube\") # --weights values"), r.out());
    }
}
