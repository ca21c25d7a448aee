package nearfit.tui.loop;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.io.BufferedWriter;
import java.io.File;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.UUID;
import java.util.concurrent.TimeUnit;
import java.util.function.Predicate;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import nearfit.tui.keys.KeyTable;
import nearfit.tui.session.TmuxSocket;
import nearfit.tui.session.TmuxViewTest;

/**
 * Signals at awkward moments, in a real terminal: {@code nearfit view} in a detached tmux pane, run as
 * {@code sh -c 'java ... view FILE; echo EXIT=$?'}. Ctrl-C during a load, during tuning and with an overlay
 * open each end with status 130, SIGTERM with 143, and every time the terminal's settings ({@code stty -g})
 * are as before. Each test has its own session, polls for at most a minute and kills the session at the end.
 */
class ExplorerSignalTest {
    private static final long WAIT_MILLIS = 60_000;

    @TempDir
    Path dir;

    private String session;
    /** A unique mark on the child's command line, so the signal goes to that JVM and no other. */
    private final String mark = "nearfit.signal." + UUID.randomUUID().toString().substring(0, 8);

    private void open() throws Exception {
        assumeTrue(hasTmux() || System.getenv("CI") != null, "tmux is not installed (CI installs it)");
        session = "nearfit-signal-" + UUID.randomUUID().toString().substring(0, 8);
        tmux("new-session", "-d", "-s", session, "-x", "120", "-y", "40", "bash --norc --noprofile");
    }

    private void close() throws Exception {
        if (session != null) {
            new ProcessBuilder(TmuxSocket.command("kill-session", "-t", session)).start().waitFor(10, TimeUnit.SECONDS);
        }
    }

    /** Starts the explorer on {@code file} in the pane, after the shell lines in {@code before}. */
    private void view(String before, String file) throws Exception {
        String java = Path.of(System.getProperty("java.home"), "bin", "java").toString();
        String cp = System.getProperty("surefire.test.class.path", System.getProperty("java.class.path"));
        Path script = dir.resolve("run.sh");
        Files.writeString(script, "cd '" + dir + "'\n" + before + "\nt=$(stty -g)\nLANG=C.UTF-8 " + java + " -D" + mark
                + " -cp " + cp + " nearfit.cli.Main view " + file + "\ns=$?\n[ \"$t\" = \"$(stty -g)\" ] && same=yes || "
                + "same=no\necho \"EXIT=$s TTY_RESTORED=$same\"\n", StandardCharsets.UTF_8);
        tmux("send-keys", "-t", session, "clear; sh " + script, "Enter");
    }

    /** Sends SIGTERM to the child JVM, found by its mark and signalled by its process id alone. */
    private void terminate() throws Exception {
        Process p = new ProcessBuilder("pgrep", "-f", mark).start();
        String pids = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8).strip();
        assertEquals(0, p.waitFor(), "a java process marked " + mark);
        List<String> found = pids.lines().toList();
        assertEquals(1, found.size(), "one java process marked " + mark + ": " + found);
        ProcessHandle child = ProcessHandle.of(Long.parseLong(found.get(0)))
                .orElseThrow(() -> new AssertionError("process " + found.get(0) + " is gone"));
        // On Unix ProcessHandle.destroy sends SIGTERM (destroyForcibly would send SIGKILL).
        assertTrue(child.destroy(), "SIGTERM sent to " + child.pid());
    }

    private void expectExit(int status) throws Exception {
        String pane;
        try {
            pane = waitFor(s -> s.contains("EXIT="), "the shell after the explorer");
        } catch (AssertionError stuck) {
            throw new AssertionError(stuck.getMessage() + "\nthe explorer's threads:\n" + threadsOfTheChild(), stuck);
        }
        assertTrue(pane.contains("EXIT=" + status + " TTY_RESTORED=yes"), pane);
        assertTrue(!hasBraille(pane) && !pane.contains("? help"), "the explorer's screen is gone:\n" + pane);
    }

    /** A named pipe that gives a header and a few rows, then nothing for minutes: a load that never ends. */
    private static final String STALLED_PIPE = "rm -f slow.csv; mkfifo slow.csv\n"
            + "(printf 'wind_ms,power_kw\\n3,20\\n5,90\\n'; sleep 300) > slow.csv &";

    /** Starts the explorer, waits until {@code busy} shows, then sends Ctrl-C or SIGTERM and expects the status. */
    private void interrupt(String before, String file, Predicate<String> busy, boolean ctrlC) throws Exception {
        try {
            open();
            view(before, file);
            waitFor(busy, "the explorer at work");
            if (ctrlC) {
                tmux("send-keys", "-t", session, "C-c");
            } else {
                terminate();
            }
            expectExit(ctrlC ? 130 : 143);
        } finally {
            close();
        }
    }

    @Test
    void ctrlCDuringALoadExits130AndRestoresTheTerminal() throws Exception {
        interrupt(STALLED_PIPE, "slow.csv", s -> s.contains("loading slow.csv"), true);
    }

    @Test
    void sigtermDuringALoadExits143AndRestoresTheTerminal() throws Exception {
        interrupt(STALLED_PIPE, "slow.csv", s -> s.contains("loading slow.csv"), false);
    }

    /** A log big enough that tuning runs for several seconds after the first frame (200 000 rows, 2 inputs). */
    private void writeTuningLog() throws IOException {
        try (BufferedWriter w = Files.newBufferedWriter(dir.resolve("site.csv"), StandardCharsets.UTF_8)) {
            w.write("wind_ms,air_temp_c,power_kw\n");
            java.util.Random r = new java.util.Random(4);
            for (int i = 0; i < 200_000; i++) {
                double wind = 25 * r.nextDouble();
                w.write(String.format(Locale.ROOT, "%.2f,%.1f,%.1f%n", wind, 10 * r.nextGaussian(),
                        Math.min(2000, 1.1 * wind * wind * wind) + 20 * r.nextGaussian()));
            }
        }
    }

    @Test
    void ctrlCDuringTuningExits130AndRestoresTheTerminal() throws Exception {
        writeTuningLog();
        interrupt("", "site.csv", s -> s.matches("(?s).*tuning \\d+ %.*"), true);
    }

    /**
     * SIGTERM while tuning runs behind the open tuning panel: the shutdown hook restores the terminal while the
     * explorer's thread may be drawing a frame, which once left the last frame on the screen (fixed: no frame
     * is sent once the screen is stopped).
     */
    @Test
    void sigtermDuringTuningWithTheTuningPanelOpenExits143AndRestoresTheTerminal() throws Exception {
        writeTuningLog();
        try {
            open();
            view("", "site.csv");
            waitFor(s -> s.contains("k=20") && hasBraille(s), "first frame");
            tmux("send-keys", "-t", session, "t");
            // The panel's title shows the job's progress until the table is in; flags run first on the same lane.
            waitFor(s -> s.matches("(?s).*tuning: tuning \\d+ %.*"), "the tuning panel with tuning running");
            terminate();
            expectExit(143);
        } finally {
            close();
        }
    }

    /** Opens the small log, opens an overlay with {@code key}, waits for {@code shown}, then Ctrl-C. */
    private void ctrlCInOverlay(String key, String shown) throws Exception {
        try {
            open();
            Files.writeString(dir.resolve("small-site.csv"), TmuxViewTest.smallLog(), StandardCharsets.UTF_8);
            view("", "small-site.csv");
            waitFor(s -> s.contains("k=20") && hasBraille(s), "first frame");
            tmux("send-keys", "-t", session, key);
            waitFor(s -> s.contains(shown), "the overlay of " + key);
            tmux("send-keys", "-t", session, "C-c");
            expectExit(130);
        } finally {
            close();
        }
    }

    @Test
    void ctrlCWithTheHelpOverlayOpenExits130AndRestoresTheTerminal() throws Exception {
        ctrlCInOverlay("?", KeyTable.FLAG_MARKS.meaning());
    }

    @Test
    void ctrlCWithTheFlaggedTableOpenExits130AndRestoresTheTerminal() throws Exception {
        ctrlCInOverlay("F", "flagged rows:");
    }

    /** The thread dump of the child JVM (jstack), to say where a child that did not exit is stuck. */
    private String threadsOfTheChild() throws Exception {
        Process p = new ProcessBuilder("pgrep", "-f", mark).start();
        String pid = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8).strip();
        p.waitFor();
        if (pid.isEmpty()) {
            return "(no such process: it exited)";
        }
        String jstack = Path.of(System.getProperty("java.home"), "bin", "jstack").toString();
        Process d = new ProcessBuilder(jstack, pid.lines().findFirst().orElseThrow()).redirectErrorStream(true).start();
        String dump = new String(d.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
        d.waitFor(30, TimeUnit.SECONDS);
        return dump;
    }

    private static boolean hasTmux() {
        for (String d : System.getenv().getOrDefault("PATH", "").split(File.pathSeparator)) {
            if (Files.isExecutable(Path.of(d, "tmux"))) {
                return true;
            }
        }
        return false;
    }

    private static boolean hasBraille(String s) {
        return s.chars().anyMatch(c -> c > 0x2800 && c <= 0x28ff);
    }

    private String waitFor(Predicate<String> ok, String what) throws Exception {
        long end = System.currentTimeMillis() + WAIT_MILLIS;
        String last = "";
        while (System.currentTimeMillis() < end) {
            Process p = new ProcessBuilder(TmuxSocket.command("capture-pane", "-p", "-J", "-t", session)).redirectErrorStream(true).start();
            last = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
            p.waitFor(10, TimeUnit.SECONDS);
            if (ok.test(last)) {
                return last;
            }
            Thread.sleep(200);
        }
        throw new AssertionError("timed out waiting for " + what + "; the pane showed:\n" + last);
    }

    private static void tmux(String... args) throws IOException, InterruptedException {
        List<String> cmd = TmuxSocket.command(args);
        Process p = new ProcessBuilder(cmd).redirectErrorStream(true).start();
        String out = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
        assertEquals(0, p.waitFor(), "tmux " + String.join(" ", args) + ": " + out);
    }
}
