package nearfit.plot;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

class TextRendererTest {
    private static CellGrid sample() {
        Scene s = Scene.builder(new double[] {0, 5, 10}, new double[] {1, 2, 3}).labels("T01", "wind_ms", "power_kw")
                .curve(new double[] {0, 10}, new double[] {1, 3}).build();
        return ScatterComposer.compose(s, 50, 16, CanvasKind.BRAILLE).grid();
    }

    @Test
    void plainOutputHasNoEscapeCharacters() {
        String text = TextRenderer.plain(sample());
        assertFalse(text.contains("\u001b"));
        assertEquals(16, text.split("\n", -1).length - 1);
    }

    @Test
    void colouredOutputHasEscapesAndResetsEachColouredRow() {
        String text = TextRenderer.ansi(sample(), Palette.night());
        assertTrue(text.contains("\u001b[38;5;"));
        for (String row : text.split("\n")) {
            if (row.contains("\u001b[38;5;")) {
                assertTrue(row.endsWith("\u001b[0m"), row);
            }
        }
    }

    @Test
    void trailingSpacesAreTrimmed() {
        CellGrid g = CellGrid.builder(10, 2).text(0, 0, "ab", Role.LABEL).build();
        assertEquals("ab\n\n", TextRenderer.plain(g));
    }

    @Test
    void xterm256MapsCubeCornersAndGreys() {
        // xterm 256-colour layout (common practice): 16 + 36 r + 6 g + b over levels 0, 95, 135, 175, 215, 255; greys 232.. at 8 + 10 i
        assertEquals(16, Palette.xterm256(0x000000));
        assertEquals(231, Palette.xterm256(0xFFFFFF));
        assertEquals(196, Palette.xterm256(0xFF0000));
        assertEquals(16 + 36 * 1 + 6 * 2 + 3, Palette.xterm256(0x5F87AF));
        assertEquals(232 + 5, Palette.xterm256(0x3A3A3A));
    }
}
