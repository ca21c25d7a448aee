/**
 * The explorer's results: the values its background jobs produce and a frame is drawn from.
 *
 * <h2>Owns</h2>
 * {@link nearfit.tui.results.Results} (the latest curve, tuning and flags with their progress),
 * {@link nearfit.tui.results.CurveRequest} and {@link nearfit.tui.results.CurveResult} (with a compared
 * group's residuals, {@link nearfit.tui.results.ComparedResiduals}), {@link nearfit.tui.results.FlaggedRows},
 * {@link nearfit.tui.results.TuningFigures}, the table's facts ({@link nearfit.tui.results.ColumnInfo},
 * {@link nearfit.tui.results.FrameInput}) and drawn cells ({@link nearfit.tui.results.Cells},
 * {@link nearfit.tui.results.PlotCells}, {@link nearfit.tui.results.Ink} roles), and how figures read as
 * text ({@link nearfit.tui.results.Figures}: numbers, counts, times and durations).
 *
 * <h2>Invariants</h2>
 * <ul>
 * <li>Every value is immutable once built; arrays are never changed after construction (they are not
 *     copied, so a job hands them over and keeps no reference).</li>
 * <li>Nothing here computes: the figures come from the core through {@code tui.bench}, in a job.</li>
 * <li>Depends on no other room of the explorer.</li>
 * </ul>
 */
package nearfit.tui.results;
