package nearfit.table;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

class VisibleTextTest {
    @Test
    void titleAndClearSequencesBecomeVisibleEscapes() {
        String hostile = "T01\u001b]2;owned\u0007\u001b[2J";
        String shown = VisibleText.of(hostile);
        assertEquals("T01\\e]2;owned\\a\\e[2J", shown);
        assertFalse(shown.chars().anyMatch(c -> c < 0x20), "no control character survives");
    }

    @Test
    void c1ControlsDeleteAndBidiOverridesAreEscaped() {
        assertEquals("a\\u{009B}2Jb\\x7F\\u{202E}c\\x00", VisibleText.of("a\u009b2Jb\u007f\u202ec\u0000"));
    }

    @Test
    void plainTextIsReturnedAsTheSameInstance() {
        String plain = "gearbox_oil_c °C — T05";
        assertSame(plain, VisibleText.of(plain));
        assertFalse(VisibleText.needsEscape(plain));
        assertTrue(VisibleText.needsEscape("a\tb"));
        assertEquals(null, VisibleText.of(null));
    }
}
