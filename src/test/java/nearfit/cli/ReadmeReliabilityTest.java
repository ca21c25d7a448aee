package nearfit.cli;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;

import org.junit.jupiter.api.Test;

/**
 * README's Reliability section promises behaviour and names the test that proves each promise
 * ({@code SomeTest#method}, or {@code #method} after a class named earlier in the same cell). This checks that
 * every named test class exists under src/test and declares every named method, so a renamed or deleted test
 * cannot leave a promise without its proof. (That the tests pass is the rest of the suite's job.)
 */
class ReadmeReliabilityTest {
    private static final Pattern CLASS_THEN_METHODS =
            Pattern.compile("\\b([A-Z][a-z][A-Za-z0-9]*(?:Test|IT))\\b((?:\\s*[#,]\\s*#?[a-z][A-Za-z0-9_]*)*)");
    private static final Pattern METHOD = Pattern.compile("#([a-z][A-Za-z0-9_]*)");

    @Test
    void everyTestTheReliabilitySectionNamesExists() throws IOException {
        String readme = Files.readString(Path.of("README.md"), StandardCharsets.UTF_8);
        int start = readme.indexOf("\n## Reliability");
        assertTrue(start >= 0, "README has a Reliability section");
        int end = readme.indexOf("\n## ", start + 5);
        String section = readme.substring(start, end < 0 ? readme.length() : end);
        Map<String, String> sources = new HashMap<>();
        try (Stream<Path> files = Files.walk(Path.of("src/test/java"))) {
            for (Path f : (Iterable<Path>) files.filter(p -> p.toString().endsWith(".java"))::iterator) {
                sources.put(f.getFileName().toString().replace(".java", ""), Files.readString(f, StandardCharsets.UTF_8));
            }
        }
        List<String> missing = new ArrayList<>();
        int named = 0;
        Matcher m = CLASS_THEN_METHODS.matcher(section);
        while (m.find()) {
            String source = sources.get(m.group(1));
            named++;
            if (source == null) {
                missing.add(m.group(1));
                continue;
            }
            Matcher method = METHOD.matcher(m.group(2));
            while (method.find()) {
                if (!Pattern.compile("\\b" + method.group(1) + "\\s*\\(").matcher(source).find()) {
                    missing.add(m.group(1) + "#" + method.group(1));
                }
            }
        }
        assertTrue(named > 100, "the section names its tests (found " + named + ")");
        assertTrue(missing.isEmpty(), "README's Reliability section names tests that do not exist: " + missing);
    }
}
