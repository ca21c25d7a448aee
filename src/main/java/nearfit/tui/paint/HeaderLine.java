package nearfit.tui.paint;

import java.util.ArrayList;
import java.util.List;

import nearfit.tui.results.Figures;

/**
 * One header line made of parts, each with spellings from full to shortest, shortened in a fixed order of
 * importance until the line fits: the least important parts give way first, so the parts never shortened
 * (k, band, tuning and flag progress) stay visible. Each part carries its own leading separator.
 */
final class HeaderLine {
    private final List<String[]> parts = new ArrayList<>();
    private final List<Integer> order = new ArrayList<>();

    /** Adds a part and returns its number; the first spelling is the full one. */
    int part(String... spellings) {
        parts.add(spellings);
        return parts.size() - 1;
    }

    /** The next shortening step: part {@code n} moves to its next spelling. Steps run in the order given. */
    HeaderLine thenShorten(int n) {
        order.add(n);
        return this;
    }

    /**
     * The line at {@code width} columns: the fewest steps that make it fit. Parts give way whole (a spelling
     * never cuts a number); only a line still too long after every step is cut at the end, which the callers'
     * spellings make rare: it takes a window narrower than the explorer's minimum or very long names.
     */
    String fit(int width, boolean ascii) {
        int[] level = new int[parts.size()];
        String line = joined(level);
        for (int i = 0; i < order.size() && line.length() > width; i++) {
            int n = order.get(i);
            level[n] = Math.min(level[n] + 1, parts.get(n).length - 1);
            line = joined(level);
        }
        // A part that led the line may have given way, leaving the next one's separator in front.
        line = line.stripLeading();
        return Figures.fit(line, width, ascii);
    }

    private String joined(int[] level) {
        StringBuilder sb = new StringBuilder();
        for (int i = 0; i < parts.size(); i++) {
            sb.append(parts.get(i)[level[i]]);
        }
        return sb.toString();
    }
}
