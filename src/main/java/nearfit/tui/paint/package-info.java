/**
 * Paints one frame of the explorer from the view state, the latest results, the table's facts and the
 * drawings made before the frame.
 *
 * <h2>Owns</h2>
 * {@link nearfit.tui.paint.ScreenPainter} (header, plot, strip, status and key bar), the panels over the
 * plot ({@code Panels}, {@code FlagTable}, {@link nearfit.tui.paint.LoadPanel}), the screen's rows
 * ({@link nearfit.tui.paint.ScreenRegions}), the {@link nearfit.tui.paint.Pen} over Lanterna's text graphics
 * with its colours ({@code InkColours}, {@link nearfit.tui.paint.Look}).
 *
 * <h2>Invariants</h2>
 * <ul>
 * <li>Painting reads and lays out; it asks the core for nothing and starts no job. It imports nothing
 *     from {@code nearfit.knn}, {@code nearfit.model}, {@code tui.bench} or {@code tui.loop}
 *     ({@code nearfit.tui.RoomsTest} checks).</li>
 * <li>Every figure shown comes from the results; whole fields give way in narrow windows, never digits.</li>
 * <li>Text from the file (column names, labels, the path) is made visible before it reaches the screen.</li>
 * </ul>
 *
 * <h2>Entry point</h2>
 * {@code ScreenPainter.paint(pen, layout, state, results, frameInput, drawings)}.
 */
package nearfit.tui.paint;
