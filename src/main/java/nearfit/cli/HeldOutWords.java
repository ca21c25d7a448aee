package nearfit.cli;

import java.time.Duration;
import java.time.format.DateTimeParseException;
import java.util.Iterator;
import java.util.List;
import java.util.Locale;

import nearfit.knn.HeldOutScheme;
import nearfit.knn.Tuning;
import picocli.CommandLine;

/**
 * The {@code --cv} converter: {@code loo}, {@code folds:N} (or a bare N), {@code group}, {@code block:PERIOD},
 * {@code group+block:PERIOD} and {@code auto}; PERIOD is a whole number with s, m, h, d or w ({@code 1d},
 * {@code 12h}, {@code 7d}) or an ISO 8601 duration ({@code PT12H}, {@code P7D}). Also the shell's candidates.
 */
final class HeldOutWords implements CommandLine.ITypeConverter<HeldOutWords.Choice>, Iterable<String> {

    /** A {@code --cv} value: a scheme, or {@code auto} (null) resolved once the rows are known. */
    record Choice(HeldOutScheme scheme) {
        boolean auto() {
            return scheme == null;
        }

        String word() {
            return scheme == null ? "auto" : scheme.word();
        }
    }

    @Override
    public Choice convert(String text) {
        String t = text.trim().toLowerCase(Locale.ROOT);
        if (t.equals("auto")) {
            return new Choice(null);
        }
        if (t.equals("loo")) {
            return new Choice(new HeldOutScheme.LeaveOneOut());
        }
        if (t.equals("group")) {
            return new Choice(new HeldOutScheme.ByGroup());
        }
        if (t.startsWith("block:")) {
            return new Choice(new HeldOutScheme.ByBlock(period(text, t.substring(6))));
        }
        if (t.startsWith("group+block:")) {
            return new Choice(new HeldOutScheme.GroupAndBlock(period(text, t.substring(12))));
        }
        String folds = t.startsWith("folds:") ? t.substring(6) : t;
        try {
            int n = Integer.parseInt(folds.trim());
            if (n >= 2) {
                return new Choice(new HeldOutScheme.Folds(n, Tuning.DEFAULT_SEED));
            }
        } catch (NumberFormatException e) {
            // reported below
        }
        throw new CommandLine.TypeConversionException("\"" + text
                + "\" is not auto, loo, folds:N (N at least 2), group, block:PERIOD or group+block:PERIOD");
    }

    /** A period: a whole number and s, m, h, d or w, or an ISO 8601 duration; at least one second. */
    static Duration period(String text, String p) {
        String s = p.trim();
        Duration d = null;
        if (s.matches("[0-9]{1,9}[smhdw]")) {
            long v = Long.parseLong(s.substring(0, s.length() - 1));
            d = switch (s.charAt(s.length() - 1)) {
                case 's' -> Duration.ofSeconds(v);
                case 'm' -> Duration.ofMinutes(v);
                case 'h' -> Duration.ofHours(v);
                case 'd' -> Duration.ofDays(v);
                default -> Duration.ofDays(7 * v);
            };
        } else if (s.startsWith("p")) {
            try {
                d = Duration.parse(s.toUpperCase(Locale.ROOT));
            } catch (DateTimeParseException e) {
                d = null;
            }
        }
        if (d == null || d.getSeconds() < 1) {
            throw new CommandLine.TypeConversionException("\"" + text + "\": the period \"" + p.trim()
                    + "\" is not a span of at least a second such as 1d, 12h, 7d or PT12H");
        }
        return d;
    }

    @Override
    public Iterator<String> iterator() {
        return List.of("auto", "loo", "folds:5", "folds:10", "group", "block:1d", "block:7d", "group+block:1d").iterator();
    }
}
