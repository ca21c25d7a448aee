package nearfit.tui.results;

/**
 * A drawn plot and the window-width strip that goes under it, aligned column for column.
 *
 * @param plot  the plot's cells
 * @param strip one row of cells, blank while there is no curve
 */
public record PlotCells(Cells plot, Cells strip) {
}
