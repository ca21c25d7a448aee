package nearfit.tui.paint;

import com.googlecode.lanterna.SGR;
import com.googlecode.lanterna.TextCharacter;
import com.googlecode.lanterna.TextColor;
import com.googlecode.lanterna.graphics.TextGraphics;

import nearfit.tui.results.Cells;
import nearfit.tui.results.Figures;
import nearfit.tui.results.Ink;

/** Writes text and cells into a Lanterna back buffer in the explorer's inks, clipped to the screen. */
public final class Pen {
    private final TextGraphics g;
    private final Look look;
    private final int width;
    private final int height;
    private static final int INKS = Ink.values().length;
    /** The highlighted group's cells when colour is off: U+2022 BULLET, a shape no other layer uses. */
    static final char HIGHLIGHT_GLYPH = '\u2022';
    /** Characters made so far, by code point times {@link #INKS} plus ink; shared by the frames of one look. */
    private final it.unimi.dsi.fastutil.ints.Int2ObjectOpenHashMap<TextCharacter> made;

    public Pen(TextGraphics g, Look look, int width, int height,
            it.unimi.dsi.fastutil.ints.Int2ObjectOpenHashMap<TextCharacter> made) {
        this.made = made;
        this.g = g;
        this.look = look;
        this.width = width;
        this.height = height;
    }

    public Look look() {
        return look;
    }

    int width() {
        return width;
    }

    /** Blanks the whole buffer. */
    public void clear() {
        clearRows(0, height);
    }

    /** Blanks rows [from, to) across the whole width. */
    public void clearRows(int from, int to) {
        g.setForegroundColor(TextColor.ANSI.DEFAULT);
        g.setBackgroundColor(TextColor.ANSI.DEFAULT);
        g.clearModifiers();
        int top = Math.max(0, from);
        int bottom = Math.min(height, to);
        if (bottom > top) {
            g.fillRectangle(new com.googlecode.lanterna.TerminalPosition(0, top),
                    new com.googlecode.lanterna.TerminalSize(width, bottom - top), ' ');
        }
    }

    /**
     * Writes text from a cell rightwards in one ink, clipped at the right edge. Control characters are made
     * visible here too, as a last guard: callers already do so for text that a file supplies.
     */
    public void text(int col, int row, String text, Ink ink) {
        if (row < 0 || row >= height || col >= width) {
            return;
        }
        text = nearfit.table.VisibleText.of(text);
        String shown = text.length() > width - col ? text.substring(0, width - col) : text;
        g.setForegroundColor(InkColours.foreground(ink, look));
        g.setBackgroundColor(TextColor.ANSI.DEFAULT);
        g.clearModifiers();
        if (ink == Ink.SELECTED) {
            g.enableModifiers(SGR.REVERSE);
        } else if (ink == Ink.WARNING || ink == Ink.TITLE) {
            g.enableModifiers(SGR.BOLD);
        }
        g.putString(col, row, shown);
    }

    /** Copies drawn cells with their top-left at (col, row). */
    public void cells(Cells cells, int col, int row) {
        TextColor bg = TextColor.ANSI.DEFAULT;
        for (int r = 0; r < cells.height(); r++) {
            for (int c = 0; c < cells.width(); c++) {
                int x = col + c;
                int y = row + r;
                if (x < 0 || x >= width || y < 0 || y >= height) {
                    continue;
                }
                g.setCharacter(x, y, character(cells.codePoint(c, r), cells.ink(c, r), bg));
            }
        }
    }

    /**
     * The Lanterna character for a code point in an ink, made once per pair: a frame has thousands of cells
     * but only a few hundred distinct braille patterns and inks.
     */
    private TextCharacter character(int cp, Ink ink, TextColor bg) {
        int key = cp * INKS + ink.ordinal();
        TextCharacter t = made.get(key);
        if (t == null) {
            char ch = Character.isBmpCodePoint(cp) ? (char) cp : '?';
            if (nearfit.table.VisibleText.needsEscape(String.valueOf(ch))) {
                ch = '?';
            }
            if (ink == Ink.HIGHLIGHT && !look.colour() && !look.ascii()) {
                // Without colour the highlighted group needs a shape of its own (ASCII already draws it as #).
                ch = HIGHLIGHT_GLYPH;
            }
            t = ink == Ink.CURVE ? new TextCharacter(ch, InkColours.foreground(ink, look), bg, SGR.BOLD)
                    : new TextCharacter(ch, InkColours.foreground(ink, look), bg);
            made.put(key, t);
        }
        return t;
    }

    /** A box with a title, its inside blanked; box lines in ASCII when the look asks for it. */
    public void box(int col, int row, int w, int h, String title) {
        String horizontal = look.ascii() ? "-" : "─";
        String side = look.ascii() ? "|" : "│";
        String[] corners = look.ascii() ? new String[] {"+", "+", "+", "+"} : new String[] {"╭", "╮", "╰", "╯"};
        text(col, row, corners[0] + horizontal.repeat(Math.max(0, w - 2)) + corners[1], Ink.AXIS);
        for (int r = 1; r < h - 1; r++) {
            text(col, row + r, side + " ".repeat(Math.max(0, w - 2)) + side, Ink.AXIS);
        }
        text(col, row + h - 1, corners[2] + horizontal.repeat(Math.max(0, w - 2)) + corners[3], Ink.AXIS);
        if (!title.isEmpty()) {
            text(col + 2, row, " " + Figures.fit(title, w - 6, look.ascii()) + " ", Ink.TITLE);
        }
    }
}
