package nearfit.tui;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/** The flagged-rows table as text lines: a heading, then one line per flagged row in the results' order. */
final class FlagTable {
    private FlagTable() {
    }

    static List<String> lines(ViewState s, Results r, FrameInput in) {
        List<String> out = new ArrayList<>();
        StringBuilder head = new StringBuilder(String.format(Locale.ROOT, "%9s  %-20s  %-8s", "line", "time", "group"));
        for (String input : s.inputs()) {
            head.append(String.format(Locale.ROOT, "  %10s", cut(input)));
        }
        head.append(String.format(Locale.ROOT, "  %10s  %10s  %10s  %7s", cut(s.response()), "fit", "residual", "z"));
        out.add(head.toString());
        if (r.flags() == null) {
            return out;
        }
        for (FlaggedRow f : r.flags().rows()) {
            StringBuilder sb = new StringBuilder(String.format(Locale.ROOT, "%9d  %-20s  %-8s", f.line(),
                    cut(f.time(), 20), cut(f.group(), 8)));
            for (double v : f.inputs()) {
                sb.append(String.format(Locale.ROOT, "  %10s", Figures.value(v)));
            }
            sb.append(String.format(Locale.ROOT, "  %10s  %10s  %10s  %7s", Figures.value(f.response()),
                    Figures.value(f.fit()), Figures.value(f.residual()), Figures.value(f.z())));
            out.add(sb.toString());
        }
        return out;
    }

    private static String cut(String s) {
        return cut(s, 10);
    }

    private static String cut(String s, int n) {
        return s.length() <= n ? s : s.substring(0, n);
    }
}
