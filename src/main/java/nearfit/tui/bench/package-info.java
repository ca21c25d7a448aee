/**
 * The core packages as the explorer sees them: one loaded table and what can be fitted, tuned, flagged
 * and drawn from it, behind the {@link nearfit.tui.bench.Workbench} interface.
 *
 * <h2>Owns</h2>
 * {@link nearfit.tui.bench.CoreWorkbench} (table loader and row conditions, the knn package's curves,
 * tuning, flags and scoring call, the plot package's scatter, strip, tuning chart and PNG), its caches
 * ({@code WorkbenchCache}: rows per condition, sorted values, fitted models, flags, compared residuals),
 * the plot scene ({@link nearfit.tui.bench.PlotScene}, turned into the plot package's scene by
 * {@code ScenePoints}) and the job contract ({@link nearfit.tui.bench.JobControl},
 * {@link nearfit.tui.bench.JobReport}).
 *
 * <h2>Invariants</h2>
 * <ul>
 * <li>Every statistic comes from the core (knn, table); this package only moves values between the core
 *     and the explorer's records. The residuals of a compared group come from {@code knn.Scoring}.</li>
 * <li>Long calls report progress through their {@code JobControl} and end with a
 *     {@link java.util.concurrent.CancellationException} once it is cancelled.</li>
 * <li>Implementations allow calls from several threads at once (the loop's jobs, the drawing thread).</li>
 * <li>What is drawn is what the results hold: the scene's residuals come from the scene's flags and curve,
 *     never from a cache.</li>
 * </ul>
 *
 * <h2>Entry points</h2>
 * {@code CoreWorkbench.open(file, shownName, control)} (loads), {@code CoreWorkbench.of(table, name)}
 * (tests and benchmarks); then the {@code Workbench} calls.
 */
package nearfit.tui.bench;
