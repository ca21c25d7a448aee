package nearfit.plot;

/**
 * Turns a {@link CellGrid} into text: plain, or coloured with ANSI SGR escape codes (ECMA-48
 * "select graphic rendition", 256-colour foreground {@code ESC[38;5;Nm}). Rows end with a
 * newline; trailing spaces are trimmed; a coloured row always ends reset.
 */
public final class TextRenderer {
    private static final String RESET = "\u001b[0m";

    private TextRenderer() {
    }

    /** @return the grid's rows with no escape codes */
    public static String plain(CellGrid grid) {
        StringBuilder sb = new StringBuilder((grid.width() + 1) * grid.height());
        for (int r = 0; r < grid.height(); r++) {
            int end = trimmedEnd(grid, r);
            for (int c = 0; c < end; c++) {
                sb.appendCodePoint(grid.codePoint(c, r));
            }
            sb.append('\n');
        }
        return sb.toString();
    }

    /** @return the grid's rows coloured by role with a palette's nearest 256-colour indices */
    public static String ansi(CellGrid grid, Palette palette) {
        int[] index = new int[Role.values().length];
        for (Role role : Role.values()) {
            int rgb = palette.rgb(role);
            index[role.ordinal()] = rgb < 0 ? -1 : Palette.xterm256(rgb);
        }
        StringBuilder sb = new StringBuilder((grid.width() * 4 + 8) * grid.height());
        for (int r = 0; r < grid.height(); r++) {
            int end = trimmedEnd(grid, r);
            int current = -1;
            for (int c = 0; c < end; c++) {
                int cp = grid.codePoint(c, r);
                int want = cp == ' ' ? current : index[grid.role(c, r).ordinal()];
                if (want != current) {
                    sb.append(want < 0 ? RESET : "\u001b[38;5;" + want + "m");
                    current = want;
                }
                sb.appendCodePoint(cp);
            }
            if (current >= 0) {
                sb.append(RESET);
            }
            sb.append('\n');
        }
        return sb.toString();
    }

    private static int trimmedEnd(CellGrid grid, int row) {
        int end = grid.width();
        while (end > 0 && grid.codePoint(end - 1, row) == ' ') {
            end--;
        }
        return end;
    }
}
