package nearfit.plot;

/** Draws a frame's axis lines, tick marks, tick labels and names into a grid (text charts). */
final class AxesPainter {
    private AxesPainter() {
    }

    static void paint(CellGrid.Builder g, PlotFrame f, CanvasKind kind, String yName, String title, String xName) {
        int axisCol = f.col0() - 1;
        int axisRow = f.row0() + f.rows();
        for (int r = f.row0(); r < axisRow; r++) {
            g.set(axisCol, r, kind.vertical, Role.AXIS);
        }
        for (int c = f.col0(); c < f.col0() + f.cols(); c++) {
            g.set(c, axisRow, kind.horizontal, Role.AXIS);
        }
        g.set(axisCol, axisRow, kind.corner, Role.AXIS);
        yTicks(g, f, kind);
        xTicks(g, f, kind, axisRow);
        if (f.row0() > 0) {
            header(g, yName, title);
        }
        if (!xName.isEmpty()) {
            int len = xName.codePointCount(0, xName.length());
            g.text(Math.max(0, g.width() - len), axisRow + 2, xName, Role.LABEL);
        }
    }

    private static void yTicks(CellGrid.Builder g, PlotFrame f, CanvasKind kind) {
        Ticks t = f.y().ticks();
        for (int i = 0; i < t.size(); i++) {
            int row = f.rowOf(t.values()[i]);
            if (row < 0) {
                continue;
            }
            g.set(f.col0() - 1, row, kind.yTick, Role.AXIS);
            String label = t.labels()[i];
            g.text(f.col0() - 1 - label.codePointCount(0, label.length()), row, label, Role.TICK_LABEL);
        }
    }

    /** Labels centred under their ticks, shifted inside the grid, skipped when they would touch the previous one. */
    private static void xTicks(CellGrid.Builder g, PlotFrame f, CanvasKind kind, int axisRow) {
        Ticks t = f.x().ticks();
        int freeFrom = 0;
        for (int i = 0; i < t.size(); i++) {
            int col = f.columnOf(t.values()[i]);
            if (col < 0) {
                continue;
            }
            g.set(col, axisRow, kind.xTick, Role.AXIS);
            String label = t.labels()[i];
            int len = label.codePointCount(0, label.length());
            int start = Math.min(Math.max(col - len / 2, 0), g.width() - len);
            if (start >= freeFrom) {
                g.text(start, axisRow + 1, label, Role.TICK_LABEL);
                freeFrom = start + len + 1;
            }
        }
    }

    private static void header(CellGrid.Builder g, String yName, String title) {
        g.text(0, 0, yName, Role.LABEL);
        int used = yName.isEmpty() ? 0 : yName.codePointCount(0, yName.length()) + 2;
        int len = title.codePointCount(0, title.length());
        int start = Math.max(used, (g.width() - len) / 2);
        g.text(start, 0, title, Role.TITLE);
    }
}
