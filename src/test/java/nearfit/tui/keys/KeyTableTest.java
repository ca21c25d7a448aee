package nearfit.tui.keys;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;

import org.junit.jupiter.api.Test;

import com.googlecode.lanterna.input.KeyStroke;
import com.googlecode.lanterna.input.KeyType;

import nearfit.tui.bench.ScriptedWorkbench;
import nearfit.tui.loop.ExplorerTest;
import nearfit.tui.loop.VirtualScreen;
import nearfit.tui.results.Results;

/** The key table is the one list of keys: the key press, the help overlay and the key bar all come from it. */
class KeyTableTest {
    private final ScriptedWorkbench wb = new ScriptedWorkbench();
    private final KeyContext cx = new KeyContext(wb.columns(), Results.none(1000), 0, 25, 3, 0, true, 5);
    private final ViewState two = ViewState.initial("power_kw", List.of("wind_ms", "air_density"), 20).edit()
            .groupColumn("turbine").group(0).build();

    @Test
    void everyEntryIsReachedByItsKeysAndAKeyPressRunsItsAction() {
        Set<String> strokes = new HashSet<>();
        for (KeyTable e : KeyTable.values()) {
            assertFalse(e.strokes().isEmpty(), e + " has a key");
            for (KeyStroke k : e.strokes()) {
                assertTrue(strokes.add(k.toString()), "one entry per key stroke: " + k);
                assertSame(e, KeyTable.of(k), "the stroke " + k + " reaches " + e);
                assertEquals(e.act(two, k, cx), KeyPress.next(two, k, cx), "a key press on the plot runs " + e);
            }
        }
        assertEquals(null, KeyTable.of(new KeyStroke('Z', false, false)), "a key not in the table does nothing");
    }

    @Test
    void theHelpOverlayAndTheKeyBarOnScreenComeFromTheTable() throws Exception {
        try (VirtualScreen v = VirtualScreen.standard(new ScriptedWorkbench())) {
            int keyRow = 39;
            assertEquals(KeyTable.keyBar(120), v.row(keyRow), "the key bar row is the table's key bar");
            v.type("?");
            List<String> pages = new ArrayList<>();
            for (int i = 0; i < KeyTable.values().length; i++) {
                pages.add(ExplorerTest.helpBody(v.text()));
                v.key(KeyType.PageDown);
            }
            String help = String.join(" ", pages);
            assertEquals(KeyTable.values().length, KeyTable.helpLines().size(), "one help line per entry");
            for (KeyTable e : KeyTable.values()) {
                String line = e.helpLine().replaceAll("\\s+", " ");
                assertTrue(help.contains(line), "the help overlay shows " + e + ": " + line);
            }
        }
    }

    @Test
    void theKeyBarHoldsEveryBarLabelInTableOrderAndNothingElse() {
        String wide = KeyTable.keyBar(10_000);
        List<String> labels = new ArrayList<>();
        for (KeyTable e : KeyTable.values()) {
            if (!e.bar().isEmpty()) {
                labels.add(e.bar());
            }
        }
        assertEquals(String.join("  ", labels), wide);
        // Narrow windows drop whole entries; every part left is still one of the table's labels.
        for (int width = 10; width <= 120; width += 7) {
            String bar = KeyTable.keyBar(width);
            assertTrue(bar.length() <= width, bar);
            for (String part : bar.split("  ")) {
                assertTrue(part.isEmpty() || labels.contains(part), "key bar part '" + part + "' at " + width);
            }
        }
    }
}
