package nearfit.tui.keys;

import java.util.ArrayList;
import java.util.List;

import com.googlecode.lanterna.input.KeyStroke;
import com.googlecode.lanterna.input.KeyType;

import nearfit.knn.Band;
import nearfit.knn.EstimateKind;
import nearfit.knn.Metric;
import nearfit.knn.Scaling;
import nearfit.knn.Weighting;

/**
 * The explorer's keys on the plot, as data: each entry is what the user types, what it does in help, its
 * label on the key bar (empty when it is only in help) and the action. {@link KeyPress} dispatches through
 * this table, the help overlay lists it and the key bar is made from it, so the three cannot disagree.
 * The key bar takes the entries that have a bar label, in this order, leaving out whole entries that no
 * longer fit when the window is narrow. A new key is one more constant (and its action).
 */
public enum KeyTable {
    HELP("?", "help: this list of keys (arrows and PgUp/PgDn scroll it)", "? help",
            (s, k, cx) -> Step.of(s.edit().open(Overlay.HELP, Ask.NOTHING).build())),
    QUIT("q", "quit", "q quit", (s, k, cx) -> Step.of(s.edit().quit(true).build())),
    CLOSE("Esc", "close a panel or prompt", "", on(KeyType.Escape), (s, k, cx) -> Step.of(s.edit().close().build())),
    DISPLAY("x", "choose the display input", "x/y/i columns", (s, k, cx) -> KeyPress.picker(s, Ask.DISPLAY_INPUT, cx)),
    RESPONSE("y", "choose the response", (s, k, cx) -> KeyPress.picker(s, Ask.RESPONSE, cx)),
    INPUTS("i", "add or remove model inputs", (s, k, cx) -> KeyPress.picker(s, Ask.INPUTS, cx)),
    K_UP("+", "k up the ladder 1 2 3 5 7 10 15 20 30 50 70 100 ...", "+/- k",
            (s, k, cx) -> Step.of(s.edit().k(KLadder.up(s.k(), Math.max(1, cx.results().rowsUsed() - 1))).build())),
    K_DOWN("-", "k down the ladder", (s, k, cx) -> Step.of(s.edit().k(KLadder.down(s.k())).build())),
    K_TYPE("k", "type an exact k", (s, k, cx) -> Step.of(s.edit().open(Overlay.PROMPT, Ask.K).build())),
    TUNING("t", "tuning panel: Enter adopts the highlighted k, * the lowest-RMSE k, 1 the one-SE k", "t tuning",
            KeyPress::openTuning),
    HELD_OUT("H", "tuning holds out: each row, a day at a time (time column), a group at a time (g)",
            (s, k, cx) -> KeyPress.nextHeldOut(s, cx)),
    METRIC("m", "next metric", (s, k, cx) -> {
        Metric m = KeyPress.cycle(Metric.values(), s.metric());
        return Step.of(s.edit().metric(m).message("metric " + m.word()).build());
    }),
    WEIGHTS("w", "next neighbour weights", (s, k, cx) -> {
        Weighting w = KeyPress.cycle(Weighting.values(), s.weighting());
        return Step.of(s.edit().weighting(w).message("weights " + w.word()).build());
    }),
    SCALING("s", "next input scaling", (s, k, cx) -> {
        Scaling sc = KeyPress.cycle(Scaling.values(), s.scaling());
        return Step.of(s.edit().scaling(sc).message("scale " + sc.word()).build());
    }),
    BAND("b", "next band", (s, k, cx) -> {
        Band band = KeyPress.cycle(Band.values(), s.band());
        return Step.of(s.edit().band(band).message("band " + band.word()).build());
    }),
    ESTIMATE("c", "curve: the neighbours' mean or median (--estimate)", (s, k, cx) -> {
        EstimateKind e = KeyPress.cycle(EstimateKind.values(), s.estimate());
        return Step.of(s.edit().estimate(e).message("estimate " + e.word()).build());
    }),
    FLAG_MARKS("f", "flag marks on or off", "f marks", (s, k, cx) -> Step.of(s.edit().flagMarks(!s.flagMarks()).build())),
    FLAG_TABLE("F", "flagged-rows table, largest |z| first (Enter marks the row on the plot)", "F flagged",
            (s, k, cx) -> Step.of(s.edit().open(Overlay.FLAGS, Ask.NOTHING).build())),
    LOAD_REPORT("L", "load report: rows read, ragged lines, blank and bad cells per column with their lines",
            "L load", (s, k, cx) -> Step.of(s.edit().open(Overlay.LOAD, Ask.NOTHING).build())),
    RESIDUALS("r", "residuals instead of the response", (s, k, cx) -> Step.of(s.edit()
            .mode(s.mode() == PlotMode.RESIDUALS ? PlotMode.RESPONSE : PlotMode.RESIDUALS).build())),
    OVER_TIME("T", "residuals over time", (s, k, cx) -> cx.hasTime()
            ? Step.of(s.edit().mode(s.mode() == PlotMode.RESIDUALS_OVER_TIME ? PlotMode.RESPONSE
                    : PlotMode.RESIDUALS_OVER_TIME).build())
            : Step.of(s.edit().warning("no time column in this file").build())),
    GROUP("g", "choose the group column", "g group", (s, k, cx) -> KeyPress.picker(s, Ask.GROUP, cx)),
    NEXT_GROUP("n", "highlight the next group", (s, k, cx) -> KeyPress.stepGroup(s, cx, 1)),
    PREVIOUS_GROUP("p", "highlight the previous group", (s, k, cx) -> KeyPress.stepGroup(s, cx, -1)),
    ALL_GROUPS("a", "all groups", (s, k, cx) -> Step.of(s.edit().group(-1).compare(false).build())),
    COMPARE("o", "compare the group with a curve fitted on the other groups", (s, k, cx) -> s.group() < 0
            ? Step.of(s.edit().warning("highlight a group first: g, then n or p").build())
            : Step.of(s.edit().compare(!s.compare()).build())),
    MOVE("arrows", "move the crosshair (up and down in bigger steps)", "arrows crosshair",
            on(KeyType.ArrowLeft, KeyType.ArrowRight, KeyType.ArrowDown, KeyType.ArrowUp), KeyPress::moveCrosshair),
    ZOOM_IN("]", "zoom in around the crosshair", (s, k, cx) -> KeyPress.zoom(s, cx, 0.5)),
    ZOOM_OUT("[", "zoom out", (s, k, cx) -> s.wholeRange()
            ? Step.of(s.edit().warning("already showing the whole data").build()) : KeyPress.zoom(s, cx, 2.0)),
    WHOLE("0", "the whole data", (s, k, cx) -> Step.of(s.wholeRange()
            ? s.edit().warning("already showing the whole data").build()
            : s.edit().zoom(Double.NaN, Double.NaN).build())),
    HELD("v", "choose which extra input is held fixed", (s, k, cx) -> s.inputs().size() > 1
            ? KeyPress.picker(s, Ask.HELD_INPUT, cx) : Step.of(s.edit().warning("only one input: nothing is held").build())),
    HELD_STEP("< >", "held value down or up a 5 % quantile step", "", onCharacters("<>"), KeyPress::moveHeld),
    NEAR_HELD("h", "only rows near the held values", (s, k, cx) -> s.inputs().size() > 1
            ? Step.of(s.edit().nearHeldOnly(!s.nearHeldOnly()).build())
            : Step.of(s.edit().warning("only one input: nothing is held").build())),
    CONDITION("/", "row condition: column op value [and ...], ops = != < <= > >=, times as ISO dates",
            "/ condition", (s, k, cx) -> Step.of(s.edit().open(Overlay.PROMPT, Ask.CONDITION).typed(s.condition()).build())),
    REFERENCE("R", "the row condition narrows the reference too, or only what is shown (the default)",
            (s, k, cx) -> {
                boolean narrows = !s.conditionNarrowsReference();
                return Step.of(s.edit().conditionNarrowsReference(narrows).markedRow(-1).message(narrows
                        ? "the row condition now narrows the reference too (R: all rows)"
                        : "the reference is all rows; the row condition narrows what is shown (R: condition)").build());
            }),
    EXPORT("e", "export the curve, the flagged rows, the plot as PNG or as text", "e export",
            (s, k, cx) -> Step.of(s.edit().open(Overlay.EXPORT, Ask.NOTHING).build()));

    /** What a key does on the plot: the next state and any effect. */
    @FunctionalInterface
    public interface Action {
        Step act(ViewState state, KeyStroke key, KeyContext context);
    }

    /** Which key strokes reach an entry: these characters (without Ctrl), or these special keys. */
    record Trigger(String characters, List<KeyType> types) {
        boolean matches(KeyStroke k) {
            if (k.getKeyType() == KeyType.Character) {
                return !k.isCtrlDown() && characters.indexOf(k.getCharacter()) >= 0;
            }
            return types.contains(k.getKeyType());
        }

        /** Every key stroke that reaches the entry. */
        List<KeyStroke> strokes() {
            List<KeyStroke> out = new ArrayList<>();
            for (char c : characters.toCharArray()) {
                out.add(new KeyStroke(c, false, false));
            }
            for (KeyType t : types) {
                out.add(new KeyStroke(t));
            }
            return out;
        }
    }

    /** Width of the key column in help. */
    public static final int KEY_COLUMN = 7;

    private final String key;
    private final String meaning;
    private final String bar;
    private final Trigger trigger;
    private final Action action;

    /** A one-character key, in help only. */
    KeyTable(String key, String meaning, Action action) {
        this(key, meaning, "", onCharacters(key), action);
    }

    /** A one-character key, in help and on the key bar. */
    KeyTable(String key, String meaning, String bar, Action action) {
        this(key, meaning, bar, onCharacters(key), action);
    }

    KeyTable(String key, String meaning, String bar, Trigger trigger, Action action) {
        this.key = key;
        this.meaning = meaning;
        this.bar = bar;
        this.trigger = trigger;
        this.action = action;
    }

    private static Trigger onCharacters(String characters) {
        return new Trigger(characters, List.of());
    }

    private static Trigger on(KeyType... types) {
        return new Trigger("", List.of(types));
    }

    /** The entry a key stroke reaches on the plot, or {@code null} for a key that does nothing there. */
    public static KeyTable of(KeyStroke k) {
        for (KeyTable e : values()) {
            if (e.trigger.matches(k)) {
                return e;
            }
        }
        return null;
    }

    /** This entry's action for a key stroke that reaches it. */
    public Step act(ViewState state, KeyStroke k, KeyContext context) {
        return action.act(state, k, context);
    }

    /** Whether a key stroke reaches this entry. */
    public boolean reachedBy(KeyStroke k) {
        return trigger.matches(k);
    }

    /** Every key stroke that reaches this entry on the plot. */
    List<KeyStroke> strokes() {
        return trigger.strokes();
    }

    /** The entry on the key bar, empty when the key is only in help. */
    public String bar() {
        return bar;
    }

    /** The key as the user types it. */
    public String key() {
        return key;
    }

    /** What it does, one line. */
    public String meaning() {
        return meaning;
    }

    /** This entry's line in help: the key, padded to the key column, then what it does. */
    public String helpLine() {
        return key + " ".repeat(Math.max(1, KEY_COLUMN - key.length())) + meaning;
    }

    /** The help overlay's lines, one per entry in order. */
    public static List<String> helpLines() {
        List<String> out = new ArrayList<>();
        for (KeyTable k : values()) {
            out.add(k.helpLine());
        }
        return out;
    }

    /** The key bar for a window {@code width} columns wide: whole entries in order, skipping those that no longer fit. */
    public static String keyBar(int width) {
        StringBuilder sb = new StringBuilder();
        for (KeyTable k : values()) {
            if (k.bar.isEmpty()) {
                continue;
            }
            String part = (sb.length() == 0 ? "" : "  ") + k.bar;
            if (sb.length() + part.length() > width) {
                continue;
            }
            sb.append(part);
        }
        return sb.toString();
    }
}
