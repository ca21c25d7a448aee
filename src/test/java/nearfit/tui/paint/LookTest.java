package nearfit.tui.paint;

import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Map;

import org.junit.jupiter.api.Test;

class LookTest {
    @Test
    void aUtf8LocaleDrawsBrailleInColour() {
        Look look = Look.of(false, Map.of("LANG", "en_GB.UTF-8"));
        assertFalse(look.ascii());
        assertTrue(look.colour());
    }

    @Test
    void noLocaleMeansTheCLocaleAndPlainAscii() {
        assertTrue(Look.of(false, Map.of()).ascii());
    }

    @Test
    void lcAllOverridesLangAsPosixSays() {
        // POSIX, Base Definitions, chapter 8: LC_ALL takes precedence over LC_CTYPE, which takes precedence over LANG.
        assertTrue(Look.of(false, Map.of("LANG", "C.UTF-8", "LC_ALL", "C")).ascii());
        assertFalse(Look.of(false, Map.of("LANG", "C", "LC_CTYPE", "de_DE.utf8")).ascii());
    }

    @Test
    void theAsciiOptionWinsOverAUtf8Locale() {
        assertTrue(Look.of(true, Map.of("LANG", "C.UTF-8")).ascii());
    }

    @Test
    void noColorSetAndNotEmptyTurnsColourOff() {
        // no-color.org: honoured when present and not an empty string.
        assertFalse(Look.of(false, Map.of("LANG", "C.UTF-8", "NO_COLOR", "1")).colour());
        assertTrue(Look.of(false, Map.of("LANG", "C.UTF-8", "NO_COLOR", "")).colour());
    }
}
