package nearfit.tui;

import java.util.Map;
import java.util.TreeMap;

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
        String file = in.source().substring(in.source().lastIndexOf('/') + 1);
        int source = line.part(in.source(), file);
        String used = Figures.count(r.rowsUsed());
        String total = Figures.count(in.totalRows());
        int rows = line.part("  rows " + used + " of " + total, "  rows " + used + "/" + total);
        String c = s.condition();
        int where = line.part(c.isEmpty() ? new String[] {""} : new String[] {"  where " + c,
            "  where " + Figures.fit(c, 40, ascii), "  where " + Figures.fit(c, 20, ascii),
            "  where " + Figures.fit(c, 10, ascii), "  where " + Figures.fit(c, 1, ascii), ""});
        int n = in.notes().count();
        int notes = line.part(n == 0 ? new String[] {""} : new String[] {
            "  (" + n + (n == 1 ? " load note, L)" : " load notes, L)"), "  (" + n + " notes, L)", "  (" + n + " notes)",
            ""});
        line.part("  |  " + ScreenPainter.tuningState(r));
        if (!Double.isNaN(r.flagsProgress())) {
            line.part("  |  flags " + Math.round(100 * r.flagsProgress()) + " %");
        }
        if (!Double.isNaN(in.loading())) {
            line.part("  loading " + Math.round(100 * in.loading()) + " %");
        }
        line.thenShorten(source).thenShorten(name).thenShorten(notes).thenShorten(where).thenShorten(where)
                .thenShorten(where).thenShorten(notes).thenShorten(where).thenShorten(rows).thenShorten(where)
                .thenShorten(notes);
        return line.fit(width, ascii);
    }

    /** The model line: what is fitted, k and the band first, then where it is held and the other settings. */
    static String second(ViewState s, FrameInput in, int width, boolean ascii) {
        HeaderLine line = new HeaderLine();
        String f = s.response() + " ~ " + String.join(" + ", s.inputs());
        int formula = line.part(f, Figures.fit(f, 32, ascii), Figures.fit(f, 24, ascii), Figures.fit(f, 16, ascii));
        if (!in.classLabels().isEmpty()) {
            line.part("  share of " + ScreenPainter.label(in.classLabels(), s.responseClass()));
        }
        line.part("  k=" + s.k());
        int held = line.part(held(s, in, true), held(s, in, false));
        int near = line.part(s.nearHeldOnly() ? new String[] {"  near held only", "  near held"} : new String[] {""});
        int group = line.part(group(s, in, "  group "), group(s, in, "  "));
        if (s.mode() != PlotMode.RESPONSE) {
            line.part(s.mode() == PlotMode.RESIDUALS ? "  residuals" : "  residuals over time");
        }
        String band = "band " + ChoiceNames.of(s.band()) + ", " + ChoiceNames.of(s.estimate());
        String metric = ChoiceNames.of(s.metric());
        int settings = line.part("  " + metric + ", weights " + ChoiceNames.of(s.weighting()) + ", scaling "
                + ChoiceNames.of(s.scaling()) + ", " + band,
                "  " + metric + ", " + ChoiceNames.of(s.weighting()) + ", " + ChoiceNames.of(s.scaling()) + ", " + band,
                "  " + band);
        line.thenShorten(settings).thenShorten(held).thenShorten(near).thenShorten(group).thenShorten(settings)
                .thenShorten(formula).thenShorten(formula).thenShorten(formula);
        return line.fit(width, ascii);
    }

    private static String held(ViewState s, FrameInput in, boolean quantiles) {
        StringBuilder sb = new StringBuilder();
        for (Map.Entry<String, Double> e : new TreeMap<>(in.heldValues()).entrySet()) {
            boolean moving = e.getKey().equals(s.heldInput());
            boolean time = ScreenPainter.kindOf(in, e.getKey()) == ColumnKind.TIME;
            sb.append(moving ? "  [" : "  ").append(e.getKey()).append('=')
                    .append(time ? Figures.time(e.getValue()) : Figures.value(e.getValue()));
            if (quantiles) {
                sb.append(" q").append(Math.round(100 * s.heldQuantile().getOrDefault(e.getKey(), 0.5)));
            }
            sb.append(moving ? "]" : "");
        }
        return sb.toString();
    }

    private static String group(ViewState s, FrameInput in, String lead) {
        if (s.groupColumn() == null) {
            return "";
        }
        return lead + s.groupColumn() + ' ' + (s.group() < 0 ? "all" : ScreenPainter.label(in.groupLabels(), s.group()))
                + (s.compare() ? " vs others" : "");
    }
}
