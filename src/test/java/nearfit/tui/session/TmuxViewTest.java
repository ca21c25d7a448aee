package nearfit.tui.session;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

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

/**
 * End to end in a real terminal: {@code nearfit view} inside a detached tmux session of 120x40, driven with
 * send-keys and read with capture-pane. Builds nothing: it runs the classes the test run already has.
 */
public class TmuxViewTest {
    private static final long WAIT_MILLIS = 60_000;

    @Test
    void viewDrawsBrailleFollowsKeysRedrawsOnResizeAndQuitsCleanly(@TempDir Path dir) throws Exception {
        String session = newSession(dir);
        try {
            // A script keeps the long command line off the screen the test reads.
            Path script = dir.resolve("run-view.sh");
            Files.writeString(script, "cd '" + dir + "'\nLANG=C.UTF-8 " + javaCommand() + " view "
                    + "small-site.csv" + "\necho NEARFIT_EXIT=$?\n", StandardCharsets.UTF_8);
            tmux("send-keys", "-t", session, "sh " + script, "Enter");
            String first = waitFor(session, s -> s.contains("k=20") && hasBraille(s), "first frame");
            assertTrue(first.contains("small-site.csv"), first);

            tmux("send-keys", "-t", session, "+");
            waitFor(session, s -> s.contains("k=30"), "k after +");

            tmux("send-keys", "-t", session, "?");
            waitFor(session, s -> s.contains(KeyTable.FLAG_MARKS.meaning()), "help after ?");
            tmux("send-keys", "-t", session, "Escape");
            waitFor(session, s -> !s.contains(KeyTable.FLAG_MARKS.meaning()), "help closed");

            tmux("send-keys", "-t", session, "F");
            waitFor(session, s -> s.contains("flagged rows:") && s.contains("residual"), "flagged table after F");
            tmux("send-keys", "-t", session, "Escape");
            waitFor(session, s -> !s.contains("flagged rows:"), "flagged table closed");

            tmux("resize-window", "-t", session, "-x", "90", "-y", "26");
            String resized = waitFor(session, s -> lines(s).size() == 26 && lines(s).get(25).startsWith("? help"),
                    "key line at the new bottom after resize");
            assertTrue(lines(resized).get(25).length() <= 90, resized);

            tmux("send-keys", "-t", session, "q");
            String after = waitFor(session, s -> s.contains("NEARFIT_EXIT="), "shell back after q");
            assertTrue(after.contains("NEARFIT_EXIT=0"), after);
            assertFalse(hasBraille(after), "the explorer's screen is gone after quit: " + after);
        } finally {
            new ProcessBuilder(TmuxSocket.command("kill-session", "-t", session)).start().waitFor(10, TimeUnit.SECONDS);
        }
    }

    @Test
    void ctrlCExits130AndSigtermExits143WithTheTerminalSettingsRestored(@TempDir Path dir) throws Exception {
        String session = newSession(dir);
        try {
            // Runs the explorer twice; each time compares the terminal settings (stty -g) before and after.
            Path script = dir.resolve("run-twice.sh");
            String run = "before=$(stty -g); LANG=C.UTF-8 " + javaCommand() + " view " + "small-site.csv"
                    + "; status=$?; [ \"$before\" = \"$(stty -g)\" ] && same=yes || same=no; "
                    + "echo \"NEARFIT_EXIT=$status SAME_TTY=$same\"\n";
            Files.writeString(script, "cd '" + dir + "'\n" + run + run, StandardCharsets.UTF_8);
            tmux("send-keys", "-t", session, "sh " + script, "Enter");
            waitFor(session, s -> s.contains("k=20") && hasBraille(s), "first frame");
            tmux("send-keys", "-t", session, "C-c");
            waitFor(session, s -> s.contains("NEARFIT_EXIT=130 SAME_TTY=yes"), "status 130 after Ctrl-C");
            waitFor(session, s -> s.contains("k=20") && hasBraille(s), "second run's first frame");
            String pid = javaPidUnder(session);
            new ProcessBuilder("kill", "-TERM", pid).start().waitFor(10, TimeUnit.SECONDS);
            waitFor(session, s -> s.contains("NEARFIT_EXIT=143 SAME_TTY=yes"), "status 143 after SIGTERM");
        } finally {
            new ProcessBuilder(TmuxSocket.command("kill-session", "-t", session)).start().waitFor(10, TimeUnit.SECONDS);
        }
    }

    /** Writes the small log into {@code dir} and opens a detached 120x40 session with a plain shell. */
    @Test
    void predictOnATerminalShowsALabelsEscapeSequenceAsTextWhileAPipeGetsTheLabelsBytes(@TempDir Path dir)
            throws Exception {
        String session = newSession(dir);
        try {
            // Turbine labels holding a colour sequence (ESC [ 3 1 m): on a terminal it would turn the text red.
            String log = smallLog().replace(",T01,", ",T\u001b[31m01,");
            Files.writeString(dir.resolve("marked.csv"), log, StandardCharsets.UTF_8);
            Path script = dir.resolve("run-predict.sh");
            String nearfit = "LANG=C.UTF-8 " + javaCommand();
            Files.writeString(script, "cd '" + dir + "'\n"
                    + nearfit + " fit marked.csv -x wind_ms -y power_kw --k 10 --group turbine -o m.nfm --quiet\n"
                    + "clear\n"
                    + nearfit + " predict m.nfm marked.csv --quiet\n"
                    + nearfit + " predict m.nfm marked.csv --quiet | grep -c \"$(printf '\\033')\\\\[31m\" "
                    + "| sed 's/^/PIPED_ESCAPES=/'\n"
                    + "echo NEARFIT_EXIT=$?\n", StandardCharsets.UTF_8);
            tmux("send-keys", "-t", session, "sh " + script, "Enter");
            String screen = waitFor(session, s -> s.contains("NEARFIT_EXIT="), "the predict runs to end");
            // On the terminal the label is shown as the file holds it, made visible: T\e[31m01.
            assertTrue(screen.contains(",T\\e[31m01,"), screen);
            // Through a pipe every T01 row keeps its bytes (375 of the 1500 rows are T01).
            assertTrue(screen.contains("PIPED_ESCAPES=375"), screen);
        } finally {
            new ProcessBuilder(TmuxSocket.command("kill-session", "-t", session)).start().waitFor(10, TimeUnit.SECONDS);
        }
    }

    private static String newSession(Path dir) throws IOException, InterruptedException {
        assumeTrue(hasTmux() || System.getenv("CI") != null, "tmux is not installed (CI installs it)");
        Files.writeString(dir.resolve("small-site.csv"), smallLog(), StandardCharsets.UTF_8);
        String session = "nearfit-view-" + UUID.randomUUID().toString().substring(0, 8);
        tmux("new-session", "-d", "-s", session, "-x", "120", "-y", "40", "bash --norc --noprofile");
        return session;
    }

    /** The java process started under the session's shell: pane shell, then sh, then java. */
    private static String javaPidUnder(String session) throws Exception {
        Process p = new ProcessBuilder(TmuxSocket.command("list-panes", "-t", session, "-F", "#{pane_pid}")).start();
        String pid = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8).strip();
        p.waitFor();
        for (int depth = 0; depth < 3; depth++) {
            Process c = new ProcessBuilder("ps", "-o", "pid=,comm=", "--ppid", pid).start();
            String out = new String(c.getInputStream().readAllBytes(), StandardCharsets.UTF_8).strip();
            c.waitFor();
            for (String line : out.lines().toList()) {
                String[] f = line.strip().split("\\s+");
                if (f.length == 2 && f[1].equals("java")) {
                    return f[0];
                }
            }
            if (out.isEmpty()) {
                break;
            }
            pid = out.lines().findFirst().orElseThrow().strip().split("\\s+")[0];
        }
        throw new AssertionError("no java process under the tmux pane");
    }

    /** A small log: power rising with wind, two planted outliers so that flags exist. */
    public static String smallLog() {
        StringBuilder sb = new StringBuilder("time,turbine,wind_ms,power_kw\n");
        for (int i = 0; i < 1500; i++) {
            double wind = 2 + 20.0 * ((i * 37) % 1500) / 1500;
            double power = Math.min(2000, 3 * Math.pow(Math.max(0, wind - 2), 3)) + (i % 7) * 3;
            if (i == 100 || i == 900) {
                power = 5;
            }
            sb.append(String.format(Locale.ROOT, "2026-03-%02dT%02d:%02d:00Z,T%02d,%.2f,%.1f%n", 1 + i / 144,
                    (i / 6) % 24, (i % 6) * 10, 1 + i % 4, wind, power));
        }
        return sb.toString();
    }

    private static String javaCommand() {
        String java = Path.of(System.getProperty("java.home"), "bin", "java").toString();
        Path jar = Path.of("target", "nearfit.jar").toAbsolutePath();
        Path classes = Path.of("target", "classes", "nearfit", "tui", "Explorer.class");
        try {
            // The jar only when it was built after the classes under test, never a stale one.
            if (Files.isRegularFile(jar) && Files.getLastModifiedTime(jar).compareTo(
                    Files.getLastModifiedTime(classes)) > 0) {
                return java + " -jar " + jar;
            }
        } catch (IOException e) {
            // Fall back to the class path below.
        }
        String cp = System.getProperty("surefire.test.class.path", System.getProperty("java.class.path"));
        return java + " -cp " + cp + " nearfit.cli.Main";
    }

    private static boolean hasTmux() {
        for (String dir : System.getenv().getOrDefault("PATH", "").split(File.pathSeparator)) {
            if (Files.isExecutable(Path.of(dir, "tmux"))) {
                return true;
            }
        }
        return false;
    }

    private static boolean hasBraille(String s) {
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            if (c > '\u2800' && c <= '\u28ff') {
                return true;
            }
        }
        return false;
    }

    private static List<String> lines(String screen) {
        return new ArrayList<>(List.of(screen.split("\n", -1))).subList(0, Math.max(0, screen.split("\n", -1).length - 1));
    }

    private static String waitFor(String session, Predicate<String> ok, String what) throws Exception {
        long end = System.currentTimeMillis() + WAIT_MILLIS;
        String last = "";
        while (System.currentTimeMillis() < end) {
            last = capture(session);
            if (ok.test(last)) {
                return last;
            }
            Thread.sleep(200);
        }
        throw new AssertionError("timed out waiting for " + what + "; the pane showed:\n" + last);
    }

    private static String capture(String session) throws IOException, InterruptedException {
        Process p = new ProcessBuilder(TmuxSocket.command("capture-pane", "-p", "-t", session)).redirectErrorStream(true).start();
        String out = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
        p.waitFor(10, TimeUnit.SECONDS);
        return out;
    }

    private static void tmux(String... args) throws IOException, InterruptedException {
        List<String> cmd = TmuxSocket.command(args);
        Process p = new ProcessBuilder(cmd).redirectErrorStream(true).start();
        String out = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
        assertEquals(0, p.waitFor(), "tmux " + String.join(" ", args) + ": " + out);
    }
}
