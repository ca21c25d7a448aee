package nearfit.tui.bench;

import nearfit.tui.keys.FitKey;
import nearfit.tui.keys.PlotMode;
import nearfit.tui.keys.ViewState;
import nearfit.tui.results.CurveRequest;
import nearfit.tui.results.CurveResult;
import nearfit.tui.results.FlaggedRows;
import nearfit.tui.results.FrameInput;
import nearfit.tui.results.Results;

/**
 * Everything the plot shows, handed to the plot package in one value.
 *
 * @param model        the model settings (response, inputs, rows)
 * @param request      where the curve was asked for; its range is the plot's horizontal range
 * @param curve        the latest curve for this request, or {@code null} while it is computed
 * @param flags        the latest flags, or {@code null}
 * @param mode         what the axes show
 * @param flagMarks    whether flagged rows are marked
 * @param crosshairX   the crosshair's display-input value, NaN for none
 * @param heldQuantile the quantile level (0 to 1) of each held input's value
 * @param nearHeldOnly whether only rows near the held values are drawn
 * @param markedRow    a row to mark (jumped to from the flagged table), -1 for none
 * @param ascii        whether to draw with plain ASCII instead of braille
 * @param shownCondition the row condition of the rows drawn; the model's own condition may be wider (empty)
 */
public record PlotScene(FitKey model, CurveRequest request, CurveResult curve, FlaggedRows flags,
        PlotMode mode, boolean flagMarks, double crosshairX, java.util.Map<String, Double> heldQuantile, boolean nearHeldOnly, int markedRow, boolean ascii,
        String shownCondition) {
    /** The scene of a state and its latest results; {@code in.request()} must not be {@code null}. */
    public static PlotScene of(ViewState s, Results r, FrameInput in, boolean ascii) {
        CurveRequest q = in.request();
        double x = q.from() + s.crosshair() * (q.to() - q.from());
        CurveResult curve = r.curve() != null && r.curve().size() == q.steps() ? r.curve() : null;
        return new PlotScene(s.model(), q, curve, r.flags(), s.mode(), s.flagMarks(), x, s.heldQuantile(),
                s.nearHeldOnly(), s.markedRow(), ascii, s.condition());
    }
}
