package nearfit.plot;

/** Which glyphs a text chart uses: Unicode braille and box drawing, or plain ASCII. */
public enum CanvasKind {
    /** {@link BrailleCanvas}, box-drawing axes, block-element bars. */
    BRAILLE('│', '─', '└', '┤', '┬'),
    /** {@link AsciiCanvas}, axes of {@code | - +}. */
    ASCII('|', '-', '+', '+', '+');

    final char vertical;
    final char horizontal;
    final char corner;
    final char yTick;
    final char xTick;

    CanvasKind(char vertical, char horizontal, char corner, char yTick, char xTick) {
        this.vertical = vertical;
        this.horizontal = horizontal;
        this.corner = corner;
        this.yTick = yTick;
        this.xTick = xTick;
    }

    /** @return a new, empty canvas of this kind */
    public Canvas newCanvas(int cols, int rows) {
        return this == BRAILLE ? new BrailleCanvas(cols, rows) : new AsciiCanvas(cols, rows);
    }
}
