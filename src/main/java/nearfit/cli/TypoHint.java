package nearfit.cli;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

import picocli.CommandLine;

/**
 * The second line of a usage error when a command or option name is mistyped: {@code nearfit: did you mean
 * --group?}. The candidates are the names the command knows (its options for something that looks like an
 * option, its sub-commands otherwise); those at the smallest optimal-string-alignment distance (Damerau 1964:
 * insertions, deletions, substitutions and swaps of neighbours) are offered, when it is at most 2 and less than
 * half the name. picocli's own suggestions were tried first: they rank by shared letter pairs, offered
 * {@code --weights} for {@code --wehre} and something for almost any word, which is noise on a one-line error.
 */
final class TypoHint {
    /** At most this many names are offered; more would not help the reader. */
    private static final int MOST = 3;
    /** The largest edit distance still called a typo. */
    private static final int MAX_EDITS = 2;

    private TypoHint() {
    }

    /** The hint for a usage error, or empty when it is not an unmatched name or nothing is close. */
    static Optional<String> of(CommandLine.ParameterException ex) {
        if (!(ex instanceof CommandLine.UnmatchedArgumentException u) || u.getUnmatched().isEmpty()) {
            return Optional.empty();
        }
        String typed = u.getUnmatched().get(0);
        int eq = typed.indexOf('=');
        if (u.isUnknownOption() && eq > 0) {
            typed = typed.substring(0, eq);
        }
        CommandLine.Model.CommandSpec spec = u.getCommandLine().getCommandSpec();
        List<String> known = new ArrayList<>();
        if (u.isUnknownOption()) {
            for (CommandLine.Model.OptionSpec o : spec.options()) {
                known.addAll(List.of(o.names()));
            }
        } else {
            known.addAll(spec.subcommands().keySet());
        }
        List<String> closest = closest(typed, known);
        if (closest.isEmpty()) {
            return Optional.empty();
        }
        return Optional.of("nearfit: did you mean " + String.join(" or ", closest.subList(0, Math.min(MOST,
                closest.size()))) + "?");
    }

    /** The names of {@code known} at the smallest distance from {@code typed}, if it is small enough. */
    static List<String> closest(String typed, List<String> known) {
        int best = Math.min(MAX_EDITS, (typed.replaceFirst("^-+", "").length() - 1) / 2);
        List<String> out = new ArrayList<>();
        for (String name : known) {
            int d = distance(typed, name);
            if (d < best) {
                best = d;
                out.clear();
            }
            if (d == best && !out.contains(name)) {
                out.add(name);
            }
        }
        return out;
    }

    /** Optimal string alignment distance between a and b. */
    static int distance(String a, String b) {
        int[][] d = new int[a.length() + 1][b.length() + 1];
        for (int i = 0; i <= a.length(); i++) {
            d[i][0] = i;
        }
        for (int j = 0; j <= b.length(); j++) {
            d[0][j] = j;
        }
        for (int i = 1; i <= a.length(); i++) {
            for (int j = 1; j <= b.length(); j++) {
                int cost = a.charAt(i - 1) == b.charAt(j - 1) ? 0 : 1;
                d[i][j] = Math.min(Math.min(d[i - 1][j] + 1, d[i][j - 1] + 1), d[i - 1][j - 1] + cost);
                if (i > 1 && j > 1 && a.charAt(i - 1) == b.charAt(j - 2) && a.charAt(i - 2) == b.charAt(j - 1)) {
                    d[i][j] = Math.min(d[i][j], d[i - 2][j - 2] + 1);
                }
            }
        }
        return d[a.length()][b.length()];
    }
}
