/**
 * Plots as a grid of cells and as PNG, from one value: a {@link nearfit.plot.Scene} (points, curve, band,
 * flags, highlighted groups, axes). Knows nothing of the terminal library, of tables or of the k-NN engine:
 * it depends on no other nearfit package, and the faces map its {@link nearfit.plot.Role}s to colours.
 *
 * <h2>Data flow</h2>
 * <pre>
 * Scene ─▶ {@link nearfit.plot.ScatterComposer} ─▶ PlotFrame (axes, {@link nearfit.plot.Ticks}) + {@link nearfit.plot.Canvas}
 *   (BrailleCanvas 2×4 dots a cell, AsciiCanvas) ─▶ {@link nearfit.plot.CellGrid} (code point + Role per cell)
 *   ─▶ {@link nearfit.plot.TextRenderer} (plain or 256-colour SGR through a {@link nearfit.plot.Palette}) or the explorer's screen
 * Scene ─▶ {@link nearfit.plot.PngRenderer} (Java2D, headless)
 * </pre>
 *
 * <h2>Usage</h2>
 * <pre>{@code
 * Scene scene = Scene.builder(x, y).labels(title, "wind_ms", "power_kw")
        .curve(xs, fit).band(xs, lo, hi, Scene.BandStyle.LINES).build();
 * ComposedPlot plot = ScatterComposer.compose(scene, 100, 30, CanvasKind.BRAILLE);
 * String text = TextRenderer.ansi(plot.grid(), Palette.night());
 * PngRenderer.write(scene, 1200, 800, Path.of("t05.png"));
 * }</pre>
 *
 * <h2>Invariants</h2>
 * <ul>
 * <li><b>Text and PNG take the same Scene</b>, so they cannot show different data; a Scene's arrays are
 *     not copied and must not change after it is built.</li>
 * <li><b>Layers</b> merge bottom to top: points, band shading, band edges, curve, flags, crosshair; without
 *     colour the layers differ by shape.</li>
 * <li><b>Ticks</b> are an exact integer times a power of ten (Heckbert 1990), so labels never show
 *     floating-point noise; time ticks fall on UTC calendar steps.</li>
 * <li><b>Points are binned once</b> per data, range and size ({@link nearfit.plot.PointLayer}); a frame
 *     draws the other layers over a copy.</li>
 * </ul>
 */
package nearfit.plot;
