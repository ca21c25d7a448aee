/**
 * The explorer's event loop: one thread that owns the view state and the latest results, one queue of
 * {@code Event}s (keys from the reader thread, finished jobs, ticks), background jobs, and a frame after
 * the events.
 *
 * <h2>Owns</h2>
 * {@link nearfit.tui.loop.Explorer} (the loop: handles events, performs effects, starts the jobs a state
 * needs, draws), {@code Jobs} (two lanes: the curve alone, tuning and flags after one another; at most one
 * live job per kind, tagged with a generation), {@code Event} (a sealed type), {@code KeyReader},
 * {@code DataExtent} (the quantiles a curve request needs) and {@code Sketches} (the frame's drawings from
 * the plot package, made before painting and kept while their inputs are unchanged).
 *
 * <h2>Invariants</h2>
 * <ul>
 * <li>The state and the results are read and written on the loop's thread only; jobs only post events.</li>
 * <li>A finished job carries how its value goes into the results; one whose generation is no longer the
 *     latest of its kind is dropped. Jobs are keyed by records of what they depend on.</li>
 * <li>A frame is painted from the state, the results and the drawings only; the painter starts no job.</li>
 * </ul>
 *
 * <h2>Entry points</h2>
 * {@code new Explorer(screen, workbench, initialState, look)}, then {@code run()} (a session) or
 * {@code start()}, {@code press(key)}, {@code settle()} (tests and benchmarks).
 */
package nearfit.tui.loop;
