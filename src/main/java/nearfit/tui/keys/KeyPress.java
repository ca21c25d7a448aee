package nearfit.tui.keys;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

import com.googlecode.lanterna.input.KeyStroke;
import com.googlecode.lanterna.input.KeyType;

import nearfit.table.VisibleText;
import nearfit.tui.results.FlaggedRow;
import nearfit.tui.results.FlaggedRows;
import nearfit.tui.results.HeldOutChoice;
import nearfit.tui.results.TuningFigures;

/**
 * The explorer's key map as a pure function: a state, a key and what the key may consult give the next state
 * and any effect. The plot's keys are dispatched through {@link KeyTable}; the open panel's own keys (lists,
 * pickers, the tuning and flagged tables, the export menu, prompts) are handled here. Nothing here computes
 * statistics or touches the terminal.
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
                    ? Step.of(fresh.edit().close().build()) : panel(fresh, key, cx, KeyTable.values().length);
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

    /** A key on the plot: the key table's entry for it, if any. */
    private static Step plain(ViewState s, KeyStroke key, KeyContext cx) {
        KeyTable entry = KeyTable.of(key);
        return entry == null ? Step.of(s) : entry.act(s, key, cx);
    }

    static <E extends Enum<E>> E cycle(E[] values, E current) {
        return values[(current.ordinal() + 1) % values.length];
    }

    /** The arrows: left and right a fine step, down and up a coarse one. */
    static Step moveCrosshair(ViewState s, KeyStroke key, KeyContext cx) {
        double by = switch (key.getKeyType()) {
            case ArrowLeft -> -FINE_STEP;
            case ArrowRight -> FINE_STEP;
            case ArrowDown -> -COARSE_STEP;
            case ArrowUp -> COARSE_STEP;
            default -> 0;
        };
        return Step.of(s.edit().crosshair(Math.max(0, Math.min(1, s.crosshair() + by))).build());
    }

    /** {@code <} and {@code >}: the held input's quantile down or up a step. */
    static Step moveHeld(ViewState s, KeyStroke key, KeyContext cx) {
        return Step.of(moveHeld(s, key.getCharacter() == '<' ? -HELD_STEP : HELD_STEP));
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

    static Step stepGroup(ViewState s, KeyContext cx, int by) {
        return Step.of(nextGroup(s, cx, by));
    }

    private static ViewState nextGroup(ViewState s, KeyContext cx, int by) {
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
    static Step zoom(ViewState s, KeyContext cx, double factor) {
        return Step.of(zoomed(s, cx, factor));
    }

    private static ViewState zoomed(ViewState s, KeyContext cx, double factor) {
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

    /** {@code t}: the tuning panel, its cursor on the current k. */
    static Step openTuning(ViewState s, KeyStroke key, KeyContext cx) {
        return Step.of(s.edit().open(Overlay.TUNING, Ask.NOTHING).cursor(tuningCursor(s, cx)).build());
    }

    private static int tuningCursor(ViewState s, KeyContext cx) {
        TuningFigures t = cx.results().tuning();
        return t == null ? 0 : t.line(s.k());
    }

    /** Opens a picker with its cursor on the current choice. */
    static Step picker(ViewState s, Ask ask, KeyContext cx) {
        return Step.of(openPicker(s, ask, cx));
    }

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
        TuningFigures t = cx.results().tuning();
        int lines = t == null ? 0 : t.kmax();
        if (t != null && lines > 0 && key.getKeyType() == KeyType.Enter) {
            return Step.of(s.edit().k(Math.min(s.cursor(), lines - 1) + 1).build());
        }
        if (t != null && key.getKeyType() == KeyType.Character && key.getCharacter() == '*') {
            return Step.of(s.edit().k(t.bestK()).cursor(t.line(t.bestK())).build());
        }
        if (t != null && key.getKeyType() == KeyType.Character && key.getCharacter() == '1') {
            return Step.of(s.edit().k(t.oneSeK()).cursor(t.line(t.oneSeK())).build());
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
            return Step.of(markRow(s, cx, row, f.source().heading() + " " + VisibleText.of(f.origin(row))));
        }
        if (key.getKeyType() == KeyType.Character && key.getCharacter() == 'F') {
            return Step.of(s.edit().close().build());
        }
        return panel(s, key, cx, lines);
    }

    /**
     * The next held-out scheme (key H). Holding out by group needs a group column of at least two groups: with
     * one label, every row is in the held-out group and nothing is left to predict it from, so the scheme is
     * not offered and the message says why.
     */
    static Step nextHeldOut(ViewState s, KeyContext cx) {
        boolean oneGroup = s.groupColumn() != null && cx.groupCount() < 2;
        HeldOutChoice now = s.tuningChoice(cx.hasTime());
        HeldOutChoice next = now.next(cx.hasTime(), s.groupColumn() != null && !oneGroup);
        String why = oneGroup ? "by group needs two groups; " + VisibleText.of(s.groupColumn()) + " has "
                + (cx.groupCount() == 1 ? "one" : "none") : null;
        if (next == now) {
            return Step.of(s.edit().warning(why != null ? "only leave-one-out applies: " + why
                    : "only leave-one-out applies: no time column and no group (g)").build());
        }
        return Step.of(s.edit().heldOut(next).message(next.words() + (why != null ? " (" + why + ")" : "")).build());
    }

    /**
     * Marks a flagged row on the plot ({@code origin}: "line 12", "row 5" or "row set/f.parquet:5") and puts the
     * crosshair on it, keeping the zoom: a zoomed view that does not hold the row moves over to it with the same
     * width.
     */
    private static ViewState markRow(ViewState s, KeyContext cx, FlaggedRow row, String origin) {
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
        String mark = origin + " marked on the plot";
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
