package nearfit.tui;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

import com.googlecode.lanterna.input.KeyStroke;
import com.googlecode.lanterna.input.KeyType;

import nearfit.knn.Band;
import nearfit.knn.EstimateKind;
import nearfit.knn.Metric;
import nearfit.knn.Scaling;
import nearfit.knn.TuningTable;
import nearfit.knn.Weighting;

/**
 * The explorer's key map as a pure function: a state, a key and what the key may consult give the next state
 * and any effect. Nothing here computes statistics or touches the terminal.
 */
public final class KeyPress {
    /** Crosshair step of the left and right arrows, as a fraction of the view's width. */
    static final double FINE_STEP = 0.01;
    /** Crosshair step of the up and down arrows. */
    static final double COARSE_STEP = 0.1;
    /** Quantile step of {@code <} and {@code >}. */
    static final double HELD_STEP = 0.05;

    private KeyPress() {
    }

    /** The step for one key press. */
    public static Step next(ViewState s, KeyStroke key, KeyContext cx) {
        if (key.getKeyType() == KeyType.Character && key.isCtrlDown()
                && Character.toLowerCase(key.getCharacter()) == 'c') {
            return new Step(s, new Effect.Interrupt());
        }
        if (key.getKeyType() == KeyType.EOF) {
            return Step.of(s.edit().quit(true).build());
        }
        ViewState fresh = s.message().isEmpty() ? s : s.edit().message("").build();
        return switch (s.overlay()) {
            case NONE -> plain(fresh, key, cx);
            case HELP -> key.getKeyType() == KeyType.Character && key.getCharacter() == '?'
                    ? Step.of(fresh.edit().close().build()) : panel(fresh, key, cx, KeyBinding.values().length);
            case PICKER -> picker(fresh, key, cx);
            case TUNING -> tuning(fresh, key, cx);
            case FLAGS -> flagTable(fresh, key, cx);
            case LOAD -> key.getKeyType() == KeyType.Character && key.getCharacter() == 'L'
                    ? Step.of(fresh.edit().close().build()) : panel(fresh, key, cx, cx.loadLines());
            case EXPORT -> exportMenu(fresh, key, cx);
            case PROMPT -> Prompts.next(fresh, key);
            case CONFIRM -> confirm(fresh, key);
        };
    }

    /** Keys common to panels with a list: Esc, up, down, page keys; anything else acts as on the plot. */
    private static Step panel(ViewState s, KeyStroke key, KeyContext cx, int lines) {
        int page = 10;
        switch (key.getKeyType()) {
            case Escape:
                return Step.of(s.edit().close().build());
            case ArrowUp:
                return Step.of(s.edit().cursor(Math.max(0, s.cursor() - 1)).build());
            case ArrowDown:
                return Step.of(s.edit().cursor(Math.max(0, Math.min(lines - 1, s.cursor() + 1))).build());
            case PageUp:
                return Step.of(s.edit().cursor(Math.max(0, s.cursor() - page)).build());
            case PageDown:
                return Step.of(s.edit().cursor(Math.max(0, Math.min(lines - 1, s.cursor() + page))).build());
            default:
                return plain(s, key, cx);
        }
    }

    private static Step plain(ViewState s, KeyStroke key, KeyContext cx) {
        switch (key.getKeyType()) {
            case ArrowLeft: return Step.of(moveCrosshair(s, -FINE_STEP));
            case ArrowRight: return Step.of(moveCrosshair(s, FINE_STEP));
            case ArrowDown: return Step.of(moveCrosshair(s, -COARSE_STEP));
            case ArrowUp: return Step.of(moveCrosshair(s, COARSE_STEP));
            case Escape: return Step.of(s.edit().close().build());
            case Character: return character(s, key.getCharacter(), cx);
            default: return Step.of(s);
        }
    }

    private static Step character(ViewState s, char c, KeyContext cx) {
        ViewState.Builder b = s.edit();
        switch (c) {
            case '?': return Step.of(b.open(Overlay.HELP, Ask.NOTHING).build());
            case 'q': return Step.of(b.quit(true).build());
            case 'x': return Step.of(openPicker(s, Ask.DISPLAY_INPUT, cx));
            case 'y': return Step.of(openPicker(s, Ask.RESPONSE, cx));
            case 'i': return Step.of(openPicker(s, Ask.INPUTS, cx));
            case 'g': return Step.of(openPicker(s, Ask.GROUP, cx));
            case 'v': return s.inputs().size() > 1 ? Step.of(openPicker(s, Ask.HELD_INPUT, cx))
                    : Step.of(b.warning("only one input: nothing is held").build());
            case '+': return Step.of(b.k(KLadder.up(s.k(), Math.max(1, cx.results().rowsUsed() - 1))).build());
            case '-': return Step.of(b.k(KLadder.down(s.k())).build());
            case 'k': return Step.of(b.open(Overlay.PROMPT, Ask.K).build());
            case '/': return Step.of(b.open(Overlay.PROMPT, Ask.CONDITION).typed(s.condition()).build());
            case 't': return Step.of(b.open(Overlay.TUNING, Ask.NOTHING).cursor(tuningCursor(s, cx)).build());
            case 'F': return Step.of(b.open(Overlay.FLAGS, Ask.NOTHING).build());
            case 'L': return Step.of(b.open(Overlay.LOAD, Ask.NOTHING).build());
            case 'e': return Step.of(b.open(Overlay.EXPORT, Ask.NOTHING).build());
            case 'm': {
                Metric m = cycle(Metric.values(), s.metric());
                return Step.of(b.metric(m).message("metric " + m.word()).build());
            }
            case 'w': {
                Weighting w = cycle(Weighting.values(), s.weighting());
                return Step.of(b.weighting(w).message("weights " + w.word()).build());
            }
            case 's': {
                Scaling sc = cycle(Scaling.values(), s.scaling());
                return Step.of(b.scaling(sc).message("scale " + sc.word()).build());
            }
            case 'b': {
                Band band = cycle(Band.values(), s.band());
                return Step.of(b.band(band).message("band " + band.word()).build());
            }
            case 'R': {
                boolean narrows = !s.conditionNarrowsReference();
                return Step.of(b.conditionNarrowsReference(narrows).markedRow(-1).message(narrows
                        ? "the row condition now narrows the reference too (R: all rows)"
                        : "the reference is all rows; the row condition narrows what is shown (R: condition)").build());
            }
            case 'c': {
                EstimateKind e = cycle(EstimateKind.values(), s.estimate());
                return Step.of(b.estimate(e).message("estimate " + e.word()).build());
            }
            case 'f': return Step.of(b.flagMarks(!s.flagMarks()).build());
            case 'r': return Step.of(b.mode(s.mode() == PlotMode.RESIDUALS ? PlotMode.RESPONSE : PlotMode.RESIDUALS)
                    .build());
            case 'T': return cx.hasTime() ? Step.of(b.mode(s.mode() == PlotMode.RESIDUALS_OVER_TIME
                    ? PlotMode.RESPONSE : PlotMode.RESIDUALS_OVER_TIME).build())
                    : Step.of(b.warning("no time column in this file").build());
            case 'n': return Step.of(stepGroup(s, cx, 1));
            case 'p': return Step.of(stepGroup(s, cx, -1));
            case 'a': return Step.of(b.group(-1).compare(false).build());
            case 'o': return s.group() < 0 ? Step.of(b.warning("highlight a group first: g, then n or p").build())
                    : Step.of(b.compare(!s.compare()).build());
            case ']': return Step.of(zoom(s, cx, 0.5));
            case '[': return Step.of(s.wholeRange() ? b.warning("already showing the whole data").build()
                    : zoom(s, cx, 2.0));
            case '0': return Step.of(s.wholeRange() ? b.warning("already showing the whole data").build()
                    : b.zoom(Double.NaN, Double.NaN).build());
            case '<': return Step.of(moveHeld(s, -HELD_STEP));
            case '>': return Step.of(moveHeld(s, HELD_STEP));
            case 'h': return s.inputs().size() > 1 ? Step.of(b.nearHeldOnly(!s.nearHeldOnly()).build())
                    : Step.of(b.warning("only one input: nothing is held").build());
            default: return Step.of(s);
        }
    }

    static <E extends Enum<E>> E cycle(E[] values, E current) {
        return values[(current.ordinal() + 1) % values.length];
    }

    private static ViewState moveCrosshair(ViewState s, double by) {
        return s.edit().crosshair(Math.max(0, Math.min(1, s.crosshair() + by))).build();
    }

    private static ViewState moveHeld(ViewState s, double by) {
        if (s.heldInput() == null) {
            return s.edit().warning("only one input: nothing is held").build();
        }
        Map<String, Double> held = new HashMap<>(s.heldQuantile());
        double q = held.getOrDefault(s.heldInput(), 0.5) + by;
        // Round to the 5 % grid so repeated steps do not drift by floating-point error.
        held.put(s.heldInput(), Math.max(0, Math.min(1, Math.round(q * 20) / 20.0)));
        return s.edit().heldQuantile(held).build();
    }

    private static ViewState stepGroup(ViewState s, KeyContext cx, int by) {
        if (s.groupColumn() != null && cx.groupCount() > 0) {
            int n = cx.groupCount();
            int g = s.group() < 0 ? (by > 0 ? 0 : n - 1) : Math.floorMod(s.group() + by, n);
            return s.edit().group(g).build();
        }
        if (cx.classCount() > 0) {
            return s.edit().responseClass(Math.floorMod(s.responseClass() + by, cx.classCount())).build();
        }
        return s.edit().warning("no group column: choose one with g").build();
    }

    /** Halves or doubles the view's width keeping the crosshair's value at the same place on screen. */
    private static ViewState zoom(ViewState s, KeyContext cx, double factor) {
        double from = s.wholeRange() ? cx.dataFrom() : s.zoomFrom();
        double to = s.wholeRange() ? cx.dataTo() : s.zoomTo();
        double whole = cx.dataTo() - cx.dataFrom();
        if (!(to > from) || !(whole > 0)) {
            return s;
        }
        double x = from + s.crosshair() * (to - from);
        double span = (to - from) * factor;
        if (span >= whole) {
            return s.edit().zoom(Double.NaN, Double.NaN).crosshair((x - cx.dataFrom()) / whole).build();
        }
        double newFrom = x - s.crosshair() * span;
        return s.edit().zoom(newFrom, newFrom + span).build();
    }

    private static int tuningCursor(ViewState s, KeyContext cx) {
        TuningTable t = cx.results().tuning();
        return t == null ? 0 : TuningCriterion.line(t, s.k());
    }

    /** Opens a picker with its cursor on the current choice. */
    private static ViewState openPicker(ViewState s, Ask ask, KeyContext cx) {
        ViewState opened = s.edit().open(Overlay.PICKER, ask).build();
        int at = Pickers.options(ask, opened, cx.columns()).indexOf(Pickers.current(opened));
        return at > 0 ? opened.edit().cursor(at).build() : opened;
    }

    /**
     * Keys in a picker: Enter (and Space) choose, arrows and page keys move, a letter or digit jumps to the
     * next choice that starts with it, Esc closes. Nothing typed here reaches the plot.
     */
    private static Step picker(ViewState s, KeyStroke key, KeyContext cx) {
        List<String> options = Pickers.options(s.ask(), s, cx.columns());
        boolean enter = key.getKeyType() == KeyType.Enter;
        if (key.getKeyType() == KeyType.Character && key.getCharacter() != ' ') {
            int to = Pickers.nextStartingWith(options, s.cursor(), key.getCharacter());
            return Step.of(to < 0 ? s : s.edit().cursor(to).build());
        }
        if (enter && s.ask() == Ask.INPUTS) {
            // Space toggles inputs one by one; Enter only closes, keeping what was chosen.
            return Step.of(s.edit().close().build());
        }
        boolean choose = enter || (key.getKeyType() == KeyType.Character && key.getCharacter() == ' ');
        if (!choose) {
            return switch (key.getKeyType()) {
                case Escape, ArrowUp, ArrowDown, PageUp, PageDown -> panel(s, key, cx, options.size());
                case Home -> Step.of(s.edit().cursor(0).build());
                case End -> Step.of(s.edit().cursor(Math.max(0, options.size() - 1)).build());
                default -> Step.of(s);
            };
        }
        if (options.isEmpty()) {
            return Step.of(s.edit().close().warning("nothing to choose").build());
        }
        String chosen = options.get(Math.min(s.cursor(), options.size() - 1));
        return Step.of(ColumnChoice.apply(s, s.ask(), chosen, cx));
    }

    private static Step tuning(ViewState s, KeyStroke key, KeyContext cx) {
        TuningTable t = cx.results().tuning();
        int lines = t == null ? 0 : t.kmax();
        if (t != null && lines > 0 && key.getKeyType() == KeyType.Enter) {
            return Step.of(s.edit().k(Math.min(s.cursor(), lines - 1) + 1).build());
        }
        if (t != null && key.getKeyType() == KeyType.Character && key.getCharacter() == '*') {
            return Step.of(s.edit().k(t.bestK()).cursor(TuningCriterion.line(t, t.bestK())).build());
        }
        if (t != null && key.getKeyType() == KeyType.Character && key.getCharacter() == '1') {
            return Step.of(s.edit().k(t.oneSeK()).cursor(TuningCriterion.line(t, t.oneSeK())).build());
        }
        if (key.getKeyType() == KeyType.Character && key.getCharacter() == 't') {
            return Step.of(s.edit().close().build());
        }
        return panel(s, key, cx, lines);
    }

    private static Step flagTable(ViewState s, KeyStroke key, KeyContext cx) {
        FlaggedRows f = cx.results().flags();
        int lines = f == null ? 0 : f.rows().size();
        if (f != null && lines > 0 && key.getKeyType() == KeyType.Enter) {
            FlaggedRow row = f.rows().get(Math.min(s.cursor(), lines - 1));
            return Step.of(markRow(s, cx, row));
        }
        if (key.getKeyType() == KeyType.Character && key.getCharacter() == 'F') {
            return Step.of(s.edit().close().build());
        }
        return panel(s, key, cx, lines);
    }

    /**
     * Marks a flagged row on the plot and puts the crosshair on it, keeping the zoom: a zoomed view that does
     * not hold the row moves over to it with the same width.
     */
    private static ViewState markRow(ViewState s, KeyContext cx, FlaggedRow row) {
        ViewState.Builder b = s.edit().close().markedRow(row.row());
        double x = row.inputs().get(s.inputs().indexOf(s.displayInput()));
        double from = s.wholeRange() ? cx.dataFrom() : s.zoomFrom();
        double to = s.wholeRange() ? cx.dataTo() : s.zoomTo();
        if (!s.wholeRange() && !(x >= from && x <= to)) {
            double span = to - from;
            from = x - span / 2;
            to = x + span / 2;
            b.zoom(from, to);
        }
        double at = to > from ? (x - from) / (to - from) : 0.5;
        String mark = "line " + row.line() + " marked on the plot";
        return b.crosshair(Math.max(0, Math.min(1, at))).message(mark).build();
    }

    private static Step exportMenu(ViewState s, KeyStroke key, KeyContext cx) {
        ExportKind[] kinds = ExportKind.values();
        int chosen = -1;
        if (key.getKeyType() == KeyType.Enter) {
            chosen = Math.min(s.cursor(), kinds.length - 1);
        } else if (key.getKeyType() == KeyType.Character && key.getCharacter() >= '1'
                && key.getCharacter() < '1' + kinds.length) {
            chosen = key.getCharacter() - '1';
        }
        if (chosen < 0) {
            return panel(s, key, cx, kinds.length);
        }
        ExportKind kind = kinds[chosen];
        return Step.of(s.edit().open(Overlay.PROMPT, Ask.FILE).export(kind).typed(kind.defaultFile()).build());
    }

    private static Step confirm(ViewState s, KeyStroke key) {
        if (key.getKeyType() == KeyType.Character && key.getCharacter() == 'y' && s.export() != null) {
            return new Step(s.edit().close().build(), new Effect.Export(s.export(), s.typed(), true));
        }
        return Step.of(s.edit().close().warning("not written").build());
    }

    /** The inputs with one added or removed; never empty. */
    static List<String> toggle(List<String> inputs, String column) {
        List<String> out = new ArrayList<>(inputs);
        if (out.contains(column)) {
            if (out.size() > 1) {
                out.remove(column);
            }
        } else {
            out.add(column);
        }
        return out;
    }
}
