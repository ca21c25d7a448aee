/**
 * The explorer ({@code nearfit view}): a Lanterna screen over one loaded table, in rooms that depend one
 * way, each with its own guide:
 * <pre>
 * room       uses the rooms
 * results    (none)
 * keys       results
 * bench      keys, results              and the core: table, knn, plot
 * paint      keys, results              never the core, bench or loop
 * export     bench, keys, results       and model: ResultCsv, SafeOutput
 * loop       bench, export, keys, paint, results
 * session    bench, keys, loop, paint, results     ◀── cli.ViewCommand
 * </pre>
 * {@code RoomsTest} checks these arrows against the imports.
 * <ul>
 * <li>{@link nearfit.tui.results}: the values jobs produce and frames read.</li>
 * <li>{@link nearfit.tui.keys}: the view state and what a key does to it (the key table).</li>
 * <li>{@link nearfit.tui.bench}: the core packages as the explorer sees them ({@code Workbench}).</li>
 * <li>{@link nearfit.tui.paint}: lays a frame out from the state, the results and the drawings.</li>
 * <li>{@link nearfit.tui.export}: the export menu's files.</li>
 * <li>{@link nearfit.tui.loop}: the event loop, its background jobs and the frame's drawings.</li>
 * <li>{@link nearfit.tui.session}: the terminal session the {@code view} command runs.</li>
 * </ul>
 * The explorer computes no statistics: every figure comes from the core through the bench, in a job.
 */
package nearfit.tui;
