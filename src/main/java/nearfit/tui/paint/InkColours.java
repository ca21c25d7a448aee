package nearfit.tui.paint;

import com.googlecode.lanterna.TextColor;

import nearfit.tui.results.Ink;

/**
 * The explorer's colours: one 256-colour index per {@link Ink}. Point densities run from slate to pale cyan
 * so that the amber curve, the gold band and the red flags stand out over them.
 */
final class InkColours {
    private static final int[] INDEX = new int[Ink.values().length];
    private static final TextColor[] COLOUR = new TextColor[Ink.values().length];

    static {
        java.util.Arrays.fill(INDEX, -1);
        set(Ink.AXIS, 245);
        set(Ink.TICK_LABEL, 250);
        set(Ink.LABEL, 252);
        set(Ink.TITLE, 231);
        set(Ink.POINTS_1, 60);
        set(Ink.POINTS_2, 67);
        set(Ink.POINTS_3, 74);
        set(Ink.POINTS_4, 117);
        set(Ink.POINTS_5, 195);
        set(Ink.HIGHLIGHT, 154);
        int[] classes = {39, 208, 41, 199, 226, 141, 166, 250};
        for (int i = 0; i < classes.length; i++) {
            INDEX[Ink.CLASS_0.ordinal() + i] = classes[i];
        }
        set(Ink.BAND, 136);
        set(Ink.CURVE, 214);
        set(Ink.FLAG, 196);
        set(Ink.CROSSHAIR, 255);
        set(Ink.MARKER, 213);
        set(Ink.WIDTH, 109);
        set(Ink.WARNING, 203);
        for (Ink ink : Ink.values()) {
            int i = INDEX[ink.ordinal()];
            COLOUR[ink.ordinal()] = i < 0 ? TextColor.ANSI.DEFAULT : new TextColor.Indexed(i);
        }
    }

    private InkColours() {
    }

    private static void set(Ink ink, int index) {
        INDEX[ink.ordinal()] = index;
    }

    /** The foreground colour of an ink; the terminal's default when colour is off or the ink has none. */
    static TextColor foreground(Ink ink, Look look) {
        return look.colour() ? COLOUR[ink.ordinal()] : TextColor.ANSI.DEFAULT;
    }
}
