/**
 * The explorer's view state and what a key does to it, as pure functions: no terminal, no jobs, no
 * statistics.
 *
 * <h2>Owns</h2>
 * {@link nearfit.tui.keys.ViewState} (everything the user chose: columns, k and the estimator's settings
 * as a {@link nearfit.tui.keys.FitKey}, zoom, crosshair, group, the open panel), the one key table
 * {@link nearfit.tui.keys.KeyTable} (each key's strokes, action, help line and key-bar label), and
 * {@link nearfit.tui.keys.KeyPress}, which takes a state, a key stroke and a
 * {@link nearfit.tui.keys.KeyContext} to a {@link nearfit.tui.keys.Step}: the next state and an
 * {@link nearfit.tui.keys.Effect} (a condition to check, a file to write, an interrupt) for the loop.
 * Panels' own keys (pickers, prompts, the tuning and flagged tables, the export menu) are handled in
 * {@code KeyPress}, {@code Prompts} and {@code Pickers}.
 *
 * <h2>Invariants</h2>
 * <ul>
 * <li>The key table is the only list of the plot's keys: help, the key bar and dispatch read it. A new
 *     key is one more constant with its action ({@code KeyTableTest} checks all three).</li>
 * <li>{@code KeyPress.next} is a function of its arguments; a key that cannot act says why in the
 *     state's warning instead of doing nothing silently.</li>
 * <li>Depends only on {@code tui.results} and the knn package's setting enums.</li>
 * </ul>
 *
 * <h2>Entry points</h2>
 * {@code KeyPress.next(state, key, context)}, {@code ViewState.initial(...)}, {@code KeyTable.helpLines()},
 * {@code KeyTable.keyBar(width)}.
 */
package nearfit.tui.keys;
