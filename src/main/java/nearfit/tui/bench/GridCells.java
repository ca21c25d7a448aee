package nearfit.tui.bench;

import nearfit.plot.CellGrid;
import nearfit.plot.Role;
import nearfit.tui.results.Cells;
import nearfit.tui.results.Ink;

/** The plot package's {@link CellGrid} seen as explorer {@link Cells}; roles map to inks by name. */
final class GridCells implements Cells {
    private static final Ink[] INK_OF_ROLE = new Ink[Role.values().length];

    static {
        for (Role r : Role.values()) {
            INK_OF_ROLE[r.ordinal()] = Ink.valueOf(r.name());
        }
    }

    private final CellGrid grid;

    GridCells(CellGrid grid) {
        this.grid = grid;
    }

    @Override
    public int width() {
        return grid.width();
    }

    @Override
    public int height() {
        return grid.height();
    }

    @Override
    public int codePoint(int col, int row) {
        return grid.codePoint(col, row);
    }

    @Override
    public Ink ink(int col, int row) {
        return INK_OF_ROLE[grid.role(col, row).ordinal()];
    }
}
