package nearfit.plot;

import java.util.Arrays;

/**
 * An immutable grid of cells, each a Unicode code point and a {@link Role}.
 *
 * <p>Cells are addressed by column (0 at the left) and row (0 at the top). Invariant: every
 * cell holds a valid code point of display width one and a role; blank cells are a space with
 * {@link Role#BLANK}. Build one with {@link #builder(int, int)}.
 */
public final class CellGrid {
    private final int width;
    private final int height;
    private final int[] codePoints;
    private final byte[] roles;

    private CellGrid(int width, int height, int[] codePoints, byte[] roles) {
        this.width = width;
        this.height = height;
        this.codePoints = codePoints;
        this.roles = roles;
    }

    /**
     * @param width  columns, at least 0
     * @param height rows, at least 0
     * @return a builder whose cells start blank
     */
    public static Builder builder(int width, int height) {
        return new Builder(width, height);
    }

    /** @return the number of columns */
    public int width() {
        return width;
    }

    /** @return the number of rows */
    public int height() {
        return height;
    }

    /** @return the code point at a cell */
    public int codePoint(int col, int row) {
        return codePoints[index(col, row)];
    }

    /** @return the role at a cell */
    public Role role(int col, int row) {
        return Role.ofOrdinal(roles[index(col, row)]);
    }

    /** @return one row's characters, trailing spaces kept */
    public String rowText(int row) {
        StringBuilder sb = new StringBuilder(width);
        for (int c = 0; c < width; c++) {
            sb.appendCodePoint(codePoints[index(c, row)]);
        }
        return sb.toString();
    }

    /** @return the number of cells with a role */
    public int count(Role role) {
        int n = 0;
        for (byte r : roles) {
            if (r == role.ordinal()) {
                n++;
            }
        }
        return n;
    }

    private int index(int col, int row) {
        if (col < 0 || col >= width || row < 0 || row >= height) {
            throw new IndexOutOfBoundsException("cell (" + col + ", " + row + ") outside " + width + "x" + height);
        }
        return row * width + col;
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof CellGrid g && g.width == width && g.height == height
                && Arrays.equals(g.codePoints, codePoints) && Arrays.equals(g.roles, roles);
    }

    @Override
    public int hashCode() {
        return 31 * Arrays.hashCode(codePoints) + Arrays.hashCode(roles);
    }

    /** The grid's rows as plain text, for debugging. */
    @Override
    public String toString() {
        return TextRenderer.plain(this);
    }

    /** Fills a grid cell by cell; writes outside the grid are ignored, so callers may clip freely. */
    public static final class Builder {
        private final int width;
        private final int height;
        private final int[] codePoints;
        private final byte[] roles;

        private Builder(int width, int height) {
            if (width < 0 || height < 0) {
                throw new IllegalArgumentException("grid size " + width + "x" + height);
            }
            this.width = width;
            this.height = height;
            this.codePoints = new int[width * height];
            this.roles = new byte[width * height];
            Arrays.fill(codePoints, ' ');
        }

        /** @return the number of columns */
        public int width() {
            return width;
        }

        /** @return the number of rows */
        public int height() {
            return height;
        }

        /** Sets one cell; ignored outside the grid. */
        public Builder set(int col, int row, int codePoint, Role role) {
            if (col >= 0 && col < width && row >= 0 && row < height) {
                codePoints[row * width + col] = codePoint;
                roles[row * width + col] = (byte) role.ordinal();
            }
            return this;
        }

        /** Writes text from a cell rightwards, one code point per cell, clipped at the edge. */
        public Builder text(int col, int row, String text, Role role) {
            int c = col;
            for (int i = 0; i < text.length(); ) {
                int cp = text.codePointAt(i);
                set(c++, row, cp, role);
                i += Character.charCount(cp);
            }
            return this;
        }

        /** Copies another grid with its top-left cell at (col, row), clipped. */
        public Builder paste(CellGrid grid, int col, int row) {
            for (int r = 0; r < grid.height; r++) {
                for (int c = 0; c < grid.width; c++) {
                    int i = r * grid.width + c;
                    set(col + c, row + r, grid.codePoints[i], Role.ofOrdinal(grid.roles[i]));
                }
            }
            return this;
        }

        /** @return a grid holding a copy of the cells written so far */
        public CellGrid build() {
            return new CellGrid(width, height, codePoints.clone(), roles.clone());
        }
    }
}
