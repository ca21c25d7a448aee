package nearfit.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;

import java.nio.charset.StandardCharsets;
import java.nio.file.Path;

import org.junit.jupiter.api.Test;

/** File arguments as paths; the C-locale case in a child JVM is in {@link InputPathsTest}. */
class ArgumentPathTest {
    @Test
    void aNameGivenAsBytesIsTheSamePathAsThatNameSpelledInUtf8() {
        // This JVM spells names in UTF-8, so both ways must reach the same file.
        Path fromBytes = ArgumentPath.fromBytes("relev\u00e9 donn\u00e9es.csv".getBytes(StandardCharsets.UTF_8));
        assertEquals(Path.of("relev\u00e9 donn\u00e9es.csv").toAbsolutePath(), fromBytes);
        assertEquals(Path.of("/tmp/a b/%.csv"), ArgumentPath.fromBytes("/tmp/a b/%.csv".getBytes(StandardCharsets.UTF_8)));
    }

    @Test
    void anArgumentThatIsNotOnThisProcesssCommandLineHasNoBytes() {
        assertNull(ArgumentPath.rawArgument("no-such-argument-\ufffd\ufffd.csv"));
    }

    @Test
    void aNameTheLocaleSpellsIsTakenAsItIs() {
        assertEquals(Path.of("site-log.csv"), ArgumentPath.of("site-log.csv"));
    }
}
