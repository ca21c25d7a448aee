package nearfit.tui.keys;

import java.util.List;
import java.util.Map;

import nearfit.knn.Band;
import nearfit.knn.EstimateKind;
import nearfit.knn.FlagScale;
import nearfit.knn.KnnSettings;
import nearfit.knn.Metric;
import nearfit.knn.Scaling;
import nearfit.knn.Weighting;
import nearfit.tui.results.HeldOutChoice;

/**
 * Everything the explorer shows, as one immutable value: a key press makes a new state
 * ({@link KeyPress#next}), and a frame is drawn from a state and the latest results alone.
 *
 * @param condition     the row condition, empty for all rows
 * @param response      the response column
 * @param inputs        the model inputs, in order; {@code displayInput} is one of them
 * @param displayInput  the input on the horizontal axis
 * @param k             neighbours per estimate
 * @param metric        distance
 * @param weighting     neighbour weights
 * @param scaling       input scaling
 * @param band          band kind
 * @param estimate      the curve: the neighbours' mean or median
 * @param flagMarks     whether flagged rows are marked on the plot
 * @param mode          what the axes show
 * @param groupColumn   the group column, or {@code null}
 * @param group         the highlighted group code, -1 for all groups
 * @param compare       whether the curve is fitted on the other groups
 * @param responseClass the class whose vote share is the curve, for a category response
 * @param zoomFrom      the left edge of the view in display-input units, NaN for the whole data
 * @param zoomTo        the right edge, NaN for the whole data
 * @param crosshair     the crosshair as a fraction (0 to 1) of the view's width
 * @param heldQuantile  for each input that is held, the quantile (0 to 1) of its held value
 * @param heldInput     the input whose held value {@code <} and {@code >} move, or {@code null}
 * @param nearHeldOnly  whether only rows near the held values are drawn
 * @param markedRow     a row marked from the flagged table, -1 for none
 * @param overlay       the open panel
 * @param ask           what the open picker or prompt asks for
 * @param cursor        the highlighted line of the open panel
 * @param typed         the text typed into the open prompt
 * @param export        the export chosen in the menu, or {@code null}
 * @param message       a one-line note for the status line, empty for none
 * @param quit          whether the explorer should end
 * @param caretBack     characters of {@code typed} after the prompt's caret (0: the caret is at the end)
 * @param warning       whether {@code message} is a warning (drawn in the warning ink) rather than a note
 * @param conditionNarrowsReference whether the row condition also narrows the reference rows the model is
 *                      fitted on; when false it narrows only what is shown (points, flagged rows)
 * @param heldOut       which rows tuning holds out to choose k
 */
public record ViewState(String condition, String response, List<String> inputs, String displayInput, int k,
        Metric metric, Weighting weighting, Scaling scaling, Band band, EstimateKind estimate, boolean flagMarks,
        PlotMode mode,
        String groupColumn, int group, boolean compare, int responseClass, double zoomFrom, double zoomTo,
        double crosshair, Map<String, Double> heldQuantile, String heldInput, boolean nearHeldOnly, int markedRow,
        Overlay overlay, Ask ask, int cursor, String typed, ExportKind export, String message, boolean quit,
        int caretBack, boolean warning, boolean conditionNarrowsReference, HeldOutChoice heldOut) {

    /** Copies the collections so that the record stays immutable. */
    public ViewState {
        inputs = List.copyOf(inputs);
        heldQuantile = Map.copyOf(heldQuantile);
    }

    /** The first state: one response, the given inputs with the first displayed, held values at medians. */
    public static ViewState initial(String response, List<String> inputs, int k) {
        return initial(response, inputs, k, EstimateKind.MEAN);
    }

    /** The first state with the given estimate. */
    public static ViewState initial(String response, List<String> inputs, int k, EstimateKind estimate) {
        java.util.HashMap<String, Double> held = new java.util.HashMap<>();
        for (int i = 1; i < inputs.size(); i++) {
            held.put(inputs.get(i), 0.5);
        }
        return new ViewState("", response, inputs, inputs.get(0), k, Metric.EUCLIDEAN, Weighting.UNIFORM,
                Scaling.Z, Band.Q10_Q90, estimate, true, PlotMode.RESPONSE, null, -1, false, 0,
                Double.NaN, Double.NaN, 0.5, held, inputs.size() > 1 ? inputs.get(1) : null, false, -1,
                Overlay.NONE, Ask.NOTHING, 0, "", null, "", false, 0, false, false, HeldOutChoice.LEAVE_ONE_OUT);
    }

    /**
     * The settings a fit depends on. Its condition is the reference's: the row condition when it narrows the
     * reference, otherwise empty (all rows).
     *
     * <p>Flags divide each leave-one-out residual by the local spread of its neighbours, as {@code check}
     * does by default: on logs where most rows sit below cut-in or at rated power the global MAD is
     * tiny, and the global scale flagged about 10 % of the demo site's rows.
     */
    public FitKey model() {
        return new FitKey(referenceCondition(), response, inputs, new KnnSettings(k, metric, weighting, scaling, band,
                estimate, KnnSettings.DEFAULT_FLAG_THRESHOLD, FlagScale.LOCAL_SD, FitKey.THREADS));
    }

    /** Whether the curve is the neighbours' mean, the default (the median is named in the header). */
    public boolean meanEstimate() {
        return estimate == EstimateKind.MEAN;
    }

    /** The condition that chooses the reference rows: the row condition, or empty for all rows. */
    public String referenceCondition() {
        return conditionNarrowsReference ? condition : "";
    }

    /**
     * The held-out choice tuning runs with: the chosen one while it applies, else leave-one-out (a group choice
     * once the group column is gone).
     */
    public HeldOutChoice tuningChoice(boolean hasTime) {
        return heldOut.appliesWith(hasTime, groupColumn != null) ? heldOut : HeldOutChoice.LEAVE_ONE_OUT;
    }

    /** Whether the view shows the whole range of the display input. */
    public boolean wholeRange() {
        return Double.isNaN(zoomFrom);
    }

    /** A builder starting from this state. */
    public Builder edit() {
        return new Builder(this);
    }

    /** Changes a few fields of a state; every other field keeps its value. */
    public static final class Builder {
        private String condition;
        private String response;
        private List<String> inputs;
        private String displayInput;
        private int k;
        private Metric metric;
        private Weighting weighting;
        private Scaling scaling;
        private Band band;
        private EstimateKind estimate;
        private boolean flagMarks;
        private PlotMode mode;
        private String groupColumn;
        private int group;
        private boolean compare;
        private int responseClass;
        private double zoomFrom;
        private double zoomTo;
        private double crosshair;
        private Map<String, Double> heldQuantile;
        private String heldInput;
        private boolean nearHeldOnly;
        private int markedRow;
        private Overlay overlay;
        private Ask ask;
        private int cursor;
        private String typed;
        private ExportKind export;
        private String message;
        private boolean quit;
        private int caretBack;
        private boolean warning;
        private boolean conditionNarrowsReference;
        private HeldOutChoice heldOut;

        private Builder(ViewState s) {
            condition = s.condition;
            response = s.response;
            inputs = s.inputs;
            displayInput = s.displayInput;
            k = s.k;
            metric = s.metric;
            weighting = s.weighting;
            scaling = s.scaling;
            band = s.band;
            estimate = s.estimate;
            flagMarks = s.flagMarks;
            mode = s.mode;
            groupColumn = s.groupColumn;
            group = s.group;
            compare = s.compare;
            responseClass = s.responseClass;
            zoomFrom = s.zoomFrom;
            zoomTo = s.zoomTo;
            crosshair = s.crosshair;
            heldQuantile = s.heldQuantile;
            heldInput = s.heldInput;
            nearHeldOnly = s.nearHeldOnly;
            markedRow = s.markedRow;
            overlay = s.overlay;
            ask = s.ask;
            cursor = s.cursor;
            typed = s.typed;
            export = s.export;
            message = s.message;
            quit = s.quit;
            caretBack = s.caretBack;
            warning = s.warning;
            conditionNarrowsReference = s.conditionNarrowsReference;
            heldOut = s.heldOut;
        }

        public Builder condition(String v) { condition = v; return this; }
        public Builder response(String v) { response = v; return this; }
        public Builder inputs(List<String> v) { inputs = v; return this; }
        public Builder displayInput(String v) { displayInput = v; return this; }
        public Builder k(int v) { k = v; return this; }
        public Builder metric(Metric v) { metric = v; return this; }
        public Builder weighting(Weighting v) { weighting = v; return this; }
        public Builder scaling(Scaling v) { scaling = v; return this; }
        public Builder band(Band v) { band = v; return this; }
        public Builder estimate(EstimateKind v) { estimate = v; return this; }
        public Builder flagMarks(boolean v) { flagMarks = v; return this; }
        public Builder mode(PlotMode v) { mode = v; return this; }
        public Builder groupColumn(String v) { groupColumn = v; return this; }
        public Builder group(int v) { group = v; return this; }
        public Builder compare(boolean v) { compare = v; return this; }
        public Builder responseClass(int v) { responseClass = v; return this; }
        public Builder zoom(double from, double to) { zoomFrom = from; zoomTo = to; return this; }
        public Builder crosshair(double v) { crosshair = v; return this; }
        public Builder heldQuantile(Map<String, Double> v) { heldQuantile = v; return this; }
        public Builder heldInput(String v) { heldInput = v; return this; }
        public Builder nearHeldOnly(boolean v) { nearHeldOnly = v; return this; }
        public Builder markedRow(int v) { markedRow = v; return this; }
        public Builder overlay(Overlay v) { overlay = v; return this; }
        public Builder ask(Ask v) { ask = v; return this; }
        public Builder cursor(int v) { cursor = v; return this; }
        public Builder typed(String v) { typed = v; return this; }
        public Builder export(ExportKind v) { export = v; return this; }
        /** A note for the status line, drawn as plain text. */
        public Builder message(String v) { message = v; warning = false; return this; }
        /** A warning for the status line: something the user asked for did not happen. */
        public Builder warning(String v) { message = v; warning = true; return this; }
        public Builder caretBack(int v) { caretBack = v; return this; }
        public Builder conditionNarrowsReference(boolean v) { conditionNarrowsReference = v; return this; }
        public Builder quit(boolean v) { quit = v; return this; }
        public Builder heldOut(HeldOutChoice v) { heldOut = v; return this; }

        /** Opens a panel with its cursor on the first line. */
        public Builder open(Overlay o, Ask a) {
            overlay = o;
            ask = a;
            cursor = 0;
            typed = "";
            caretBack = 0;
            return this;
        }

        /** Closes any panel. */
        public Builder close() { return open(Overlay.NONE, Ask.NOTHING); }

        /** The new state. */
        public ViewState build() {
            return new ViewState(condition, response, inputs, displayInput, k, metric, weighting, scaling, band,
                    estimate, flagMarks, mode, groupColumn, group, compare, responseClass, zoomFrom, zoomTo, crosshair,
                    heldQuantile, heldInput, nearHeldOnly, markedRow, overlay, ask, cursor, typed, export,
                    message, quit, caretBack, warning, conditionNarrowsReference, heldOut);
        }
    }
}
