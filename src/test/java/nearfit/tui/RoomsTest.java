package nearfit.tui;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeSet;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;

import org.junit.jupiter.api.Test;

/** The explorer's rooms depend one way, as the package guide draws them; painting never reaches the core. */
class RoomsTest {
    private static final Path TUI = Path.of("src/main/java/nearfit/tui");
    /** Each room and the rooms it may use: the table in {@code nearfit/tui/package-info.java}. */
    private static final Map<String, Set<String>> ALLOWED = Map.of(
            "results", Set.of(),
            "keys", Set.of("results"),
            "bench", Set.of("keys", "results"),
            "paint", Set.of("keys", "results"),
            "export", Set.of("bench", "keys", "results"),
            "loop", Set.of("bench", "export", "keys", "paint", "results"),
            "session", Set.of("bench", "keys", "loop", "paint", "results"));
    private static final Pattern ROOM = Pattern.compile("\\bnearfit\\.tui\\.([a-z]+)\\.[A-Z]");

    @Test
    void everyRoomHasItsGuideAndTheFlatPackageHoldsNoClass() throws IOException {
        List<String> rooms = new ArrayList<>();
        try (Stream<Path> s = Files.list(TUI)) {
            s.forEach(p -> {
                if (Files.isDirectory(p)) {
                    rooms.add(p.getFileName().toString());
                } else {
                    assertEquals("package-info.java", p.getFileName().toString(), "a class in the flat package");
                }
            });
        }
        assertEquals(new TreeSet<>(ALLOWED.keySet()), new TreeSet<>(rooms));
        for (String room : rooms) {
            assertTrue(Files.exists(TUI.resolve(room).resolve("package-info.java")), room + " has a package-info");
        }
    }

    @Test
    void eachRoomUsesOnlyTheRoomsItsGuideAllows() throws IOException {
        for (Map.Entry<String, Set<String>> e : ALLOWED.entrySet()) {
            for (Path f : sources(e.getKey())) {
                Matcher m = ROOM.matcher(code(f));
                while (m.find()) {
                    String used = m.group(1);
                    assertTrue(used.equals(e.getKey()) || e.getValue().contains(used),
                            f + " uses the room " + used + ", which " + e.getKey() + " may not");
                }
            }
        }
    }

    @Test
    void paintingImportsNothingFromTheCoreOrTheWorkbench() throws IOException {
        List<Path> paint = sources("paint");
        assertFalse(paint.isEmpty());
        for (Path f : paint) {
            String code = code(f);
            for (String banned : List.of("nearfit.knn.", "nearfit.model.", "nearfit.plot.", "nearfit.tui.bench.",
                    "nearfit.tui.loop.", "Workbench", "Jobs")) {
                assertFalse(code.contains(banned), f + " refers to " + banned);
            }
        }
    }

    private static List<Path> sources(String room) throws IOException {
        try (Stream<Path> s = Files.list(TUI.resolve(room))) {
            return s.filter(p -> p.toString().endsWith(".java") && !p.endsWith("package-info.java")).sorted().toList();
        }
    }

    /** The file without its comments, so that a link in a comment is not a use. */
    private static String code(Path f) throws IOException {
        String text = Files.readString(f, StandardCharsets.UTF_8);
        return text.replaceAll("(?s)/\\*.*?\\*/", "").replaceAll("//[^\n]*", "");
    }
}
