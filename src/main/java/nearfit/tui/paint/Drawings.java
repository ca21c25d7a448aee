package nearfit.tui.paint;

import nearfit.tui.results.Cells;
import nearfit.tui.results.PlotCells;

/**
 * The cells a frame takes from the plot package, made before the frame is painted so that painting only
 * lays them out.
 *
 * @param plot        the plot and its window-width strip, {@code null} when there is nothing to plot
 * @param tuningChart the tuning panel's chart, {@code null} when the panel is closed or has no table yet
 */
public record Drawings(PlotCells plot, Cells tuningChart) {
}
