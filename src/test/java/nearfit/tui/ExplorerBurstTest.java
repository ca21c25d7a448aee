package nearfit.tui;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTimeoutPreemptively;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.List;
import java.util.Random;

import com.googlecode.lanterna.input.KeyStroke;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import nearfit.knn.Metric;
import nearfit.table.CsvLoader;
import nearfit.table.LoadOptions;

/**
 * Hundreds of {@code +}, {@code -} and {@code m} presses in a burst, with no waiting between them, while the
 * curve, tuning and flag jobs of earlier states are still running: the explorer ends on the settings of the
 * last key, with the results of exactly those settings, no failure and no deadlock.
 */
class ExplorerBurstTest {
    /** A deadlock detector, not a speed bound: the whole burst settles in seconds. */
    private static final Duration HANG = Duration.ofSeconds(300);

    @TempDir
    Path dir;

    private Workbench workbench() throws Exception {
        Path csv = dir.resolve("small-site.csv");
        Files.writeString(csv, TmuxViewTest.smallLog(), StandardCharsets.UTF_8);
        return CoreWorkbench.of(CsvLoader.load(csv, csv.toString(), LoadOptions.DEFAULT), csv.toString());
    }

    private void burst(long seed, int presses) throws Exception {
        Workbench wb = workbench();
        try (VirtualScreen v = new VirtualScreen(wb, ViewState.initial("power_kw", List.of("wind_ms"), 20), 120, 40,
                new Look(false, true))) {
            Random r = new Random(seed);
            int k = 20;
            Metric metric = v.explorer.state().metric();
            int maxK = v.explorer.results().rowsUsed() - 1;
            for (int i = 0; i < presses; i++) {
                char c = "+-m".charAt(r.nextInt(3));
                v.explorer.press(new KeyStroke(c, false, false)); // no settle: the jobs pile up
                k = c == '+' ? KLadder.up(k, maxK) : c == '-' ? KLadder.down(k) : k;
                metric = c == 'm' ? Metric.values()[(metric.ordinal() + 1) % Metric.values().length] : metric;
            }
            assertTimeoutPreemptively(HANG, () -> v.explorer.settle());
            ViewState s = v.explorer.state();
            assertEquals(k, s.k());
            assertEquals(metric, s.metric());
            String header = v.text();
            assertTrue(header.contains("k=" + k + " ") || header.contains("k=" + k + "\n"), header);
            assertTrue(header.contains(metric.word() + ", weights"), header);
            Results got = v.explorer.results();
            assertEquals("", got.failure(), "no job failed");
            // The shown curve and flags are those of the final settings, recomputed here from scratch.
            // A second workbench on the same file: nothing it computes comes from the first one's caches.
            Workbench again = workbench();
            CurveResult fresh = again.curve(s.model(), v.explorer.request(), JobControl.NONE);
            assertArrayEquals(fresh.fit(), got.curve().fit(), "curve of the last settings, not a stale one");
            assertArrayEquals(fresh.width(), got.curve().width());
            FlaggedRows flags = again.flags(s.model(), s.groupColumn(), s.condition(), JobControl.NONE);
            assertArrayEquals(flags.result().z(), got.flags().result().z(), "flags of the last settings");
            assertEquals(flags.rows(), got.flags().rows());
            assertEquals(s.model().settings().k(), k);
        }
    }

    @Test
    void threeHundredMixedKeysEndOnTheLastKeysSettingsWithTheirOwnResults() throws Exception {
        burst(1, 300);
    }

    @Test
    void anotherBurstOfSixHundredKeysAlsoEndsOnTheLastKeysSettings() throws Exception {
        burst(2, 600);
    }
}
