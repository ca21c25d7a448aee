package nearfit.tui.paint;

import java.util.Map;
import java.util.TreeMap;

import nearfit.tui.keys.PlotMode;
import nearfit.tui.keys.ViewState;
import nearfit.tui.results.ColumnKind;
import nearfit.tui.results.Figures;
import nearfit.tui.results.FrameInput;
import nearfit.tui.results.Results;

/**
 * The two header lines: the file, rows, row condition and job states; then the model and the estimator's
 * settings. Narrow windows shorten the file path to its name, the condition, the held values and the
 * settings before anything else, so k, the one-SE k, the band and the flag progress stay visible.
 */
final class Header {
    private Header() {
    }

    /** The first line: what is loaded and used, then the tuning and flag states. */
    static String first(ViewState s, Results r, FrameInput in, int width, boolean ascii) {
        HeaderLine line = new HeaderLine();
        int name = line.part("nearfit  ", "");
        // The name after the last slash; not java.nio.file.Path, which refuses some names a user may give.
        // The file's name is the user's, but it may hold control characters: they are made visible.
        String path = nearfit.table.VisibleText.of(in.source());
        String file = path.substring(path.lastIndexOf('/') + 1);
        int source = line.part(path, file, "");
        String used = Figures.count(r.rowsUsed());
        String total = Figures.count(in.totalRows());
        boolean narrowed = !s.condition().isEmpty() && !s.conditionNarrowsReference();
        String shown = narrowed ? " shown" : "";
        int rows = line.part("  rows " + used + shown + " of " + total, "  rows " + used + "/" + total, "");
        String c = s.condition();
        String[] clauses = whereSpellings(c, ascii);
        int where = line.part(clauses);
        // Whether the condition narrows the reference too is said whenever there is a condition (R switches).
        int reference = line.part(c.isEmpty() ? new String[] {""} : s.conditionNarrowsReference()
                ? new String[] {"  reference: condition", "  ref: condition", "  ref cond"}
                : new String[] {"  reference: all rows", "  ref: all rows", "  ref all"});
        int n = in.notes().count();
        int notes = line.part(n == 0 ? new String[] {""} : new String[] {
            "  (" + n + (n == 1 ? " load note, L)" : " load notes, L)"), "  (" + n + " notes, L)", "  (" + n + " notes)",
            ""});
        // Where the best and one-SE k come from stays, in shorter words before the reference gives way.
        int tuning = line.part(ScreenPainter.tuningSpellings(r));
        if (!Double.isNaN(r.flagsProgress())) {
            line.part("  |  flags " + Math.round(100 * r.flagsProgress()) + " %");
        }
        if (!Double.isNaN(in.loading())) {
            line.part("  loading " + Math.round(100 * in.loading()) + " %");
        }
        // The condition and whether it narrows the reference are kept longest after k and the job states.
        line.thenShorten(source).thenShorten(name).thenShorten(tuning).thenShorten(notes).thenShorten(notes).thenShorten(reference)
                .thenShorten(rows).thenShorten(reference);
        // The condition gives way a whole clause at a time, so a date or a number in it is never cut; the file
        // name, the notes and the row counts go before its first clause does.
        for (int i = 0; i < clauses.length - 3; i++) {
            line.thenShorten(where);
        }
        line.thenShorten(source).thenShorten(notes).thenShorten(rows).thenShorten(where).thenShorten(where);
        return line.fit(width, ascii);
    }

    /** The condition in full, then with fewer of its {@code and} clauses, then as a marker, then nothing. */
    static String[] whereSpellings(String c, boolean ascii) {
        if (c.isEmpty()) {
            return new String[] {""};
        }
        String more = ascii ? "..." : "…";
        String[] parts = c.split("(?i) and ");
        java.util.List<String> out = new java.util.ArrayList<>();
        out.add("  where " + c);
        for (int n = parts.length - 1; n >= 1; n--) {
            out.add("  where " + String.join(" and ", java.util.Arrays.copyOf(parts, n)) + " and " + more);
        }
        out.add("  where " + more);
        out.add("");
        return out.toArray(new String[0]);
    }

    /** The model line: what is fitted, k and the band first, then where it is held and the other settings. */
    static String second(ViewState s, FrameInput in, int width, boolean ascii) {
        HeaderLine line = new HeaderLine();
        String f = nearfit.table.VisibleText.of(s.response() + " ~ " + String.join(" + ", s.inputs()));
        int formula = line.part(f, Figures.fit(f, 32, ascii), Figures.fit(f, 24, ascii), Figures.fit(f, 16, ascii),
                Figures.fit(f, 12, ascii));
        if (!in.classLabels().isEmpty()) {
            line.part("  share of " + ScreenPainter.label(in.classLabels(), s.responseClass()));
        }
        line.part("  k=" + s.k());
        int held = line.part(held(s, in, true), held(s, in, false), "");
        int near = line.part(s.nearHeldOnly() ? new String[] {"  near held only", "  near held"} : new String[] {""});
        int group = line.part(group(s, in, "  group "), group(s, in, "  "), groupShort(s, in));
        int mode = line.part(s.mode() == PlotMode.RESPONSE ? new String[] {""} : s.mode() == PlotMode.RESIDUALS
                ? new String[] {"  residuals", "  resid"} : new String[] {"  residuals over time", "  resid/time"});
        // The estimator's settings are never left out, since m, w, s and b change them and the results with
        // them; they use the batch commands' option names and values.
        String metric = s.metric().word();
        String weights = s.weighting().word();
        String scale = s.scaling().word();
        String band = s.band().word();
        // The mean is the default and is not named, so the line keeps its room; the median always is (c, --estimate).
        String estimate = s.meanEstimate() ? "" : " " + s.estimate().word();
        int settings = line.part(
                "  metric " + metric + ", weights " + weights + ", scale " + scale + ", band " + band + estimate,
                "  " + metric + ", " + weights + ", scale " + scale + ", band " + band + estimate,
                "  " + metric + " " + weights + " scale " + scale + " band " + band + estimate,
                "  " + metric + " " + weights + " " + scale + " " + band + estimate);
        line.thenShorten(settings).thenShorten(held).thenShorten(near).thenShorten(group).thenShorten(formula)
                .thenShorten(formula).thenShorten(held).thenShorten(formula).thenShorten(mode).thenShorten(group)
                .thenShorten(settings).thenShorten(formula).thenShorten(settings);
        return line.fit(width, ascii);
    }

    private static String held(ViewState s, FrameInput in, boolean quantiles) {
        StringBuilder sb = new StringBuilder();
        for (Map.Entry<String, Double> e : new TreeMap<>(in.heldValues()).entrySet()) {
            boolean moving = e.getKey().equals(s.heldInput());
            boolean time = ScreenPainter.kindOf(in, e.getKey()) == ColumnKind.TIME;
            sb.append(moving ? "  [" : "  ").append(nearfit.table.VisibleText.of(e.getKey())).append('=')
                    .append(time ? Figures.time(e.getValue()) : Figures.value(e.getValue()));
            if (quantiles) {
                sb.append(" q").append(Math.round(100 * s.heldQuantile().getOrDefault(e.getKey(), 0.5)));
            }
            sb.append(moving ? "]" : "");
        }
        return sb.toString();
    }

    /** The highlighted group alone, without its column: "  T05 vs others". */
    private static String groupShort(ViewState s, FrameInput in) {
        if (s.groupColumn() == null) {
            return "";
        }
        return s.group() < 0 ? "  all groups" : "  " + nearfit.table.VisibleText.of(ScreenPainter.label(in.groupLabels(),
                s.group())) + (s.compare() ? " vs others" : "");
    }

    private static String group(ViewState s, FrameInput in, String lead) {
        if (s.groupColumn() == null) {
            return "";
        }
        return lead + nearfit.table.VisibleText.of(s.groupColumn()) + ' '
                + (s.group() < 0 ? "all" : nearfit.table.VisibleText.of(ScreenPainter.label(in.groupLabels(), s.group())))
                + (s.compare() ? " vs others" : "");
    }
}
