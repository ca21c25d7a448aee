package nearfit.plot;

/**
 * A composed text chart: its cells and the frame that maps its plot area to data.
 *
 * @param grid  the cells
 * @param frame where the plot area sits and how it maps to data
 */
public record ComposedPlot(CellGrid grid, PlotFrame frame) {
}
