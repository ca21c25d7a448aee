package nearfit.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTimeoutPreemptively;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.InputStream;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.List;
import java.util.Map;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.TimeUnit;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

import com.googlecode.lanterna.TerminalSize;
import com.googlecode.lanterna.input.KeyStroke;
import com.googlecode.lanterna.screen.TerminalScreen;
import com.googlecode.lanterna.terminal.virtual.DefaultVirtualTerminal;

import nearfit.tui.bench.CoreWorkbench;
import nearfit.tui.paint.Look;
import nearfit.tui.session.StartSettings;
import nearfit.tui.session.TerminalSession;

class ViewCommandTest {
    private static String[] run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int status = Main.run(args, new PrintWriter(out), new PrintWriter(err));
        return new String[] {Integer.toString(status), err.toString()};
    }

    @Test
    void withoutATerminalViewExitsWith2AndPointsToPlot(@TempDir Path dir) throws Exception {
        // Surefire runs without a console, as a pipe or a cron job would.
        Path csv = dir.resolve("small.csv");
        Files.writeString(csv, "wind_ms,power_kw\n1,2\n3,4\n");
        String[] r = run("view", csv.toString());
        assertEquals("2", r[0]);
        assertTrue(r[1].contains("interactive terminal") && r[1].contains("nearfit plot"), r[1]);
        assertEquals(1, r[1].strip().lines().count(), r[1]);
    }

    @Test
    void aMissingFileIsNamedOnOneLine(@TempDir Path dir) {
        String[] r = run("view", dir.resolve("absent.csv").toString());
        assertEquals("2", r[0]);
        assertTrue(r[1].startsWith("nearfit: ") && r[1].contains("absent.csv: no such file"), r[1]);
    }

    @Test
    void theDemoLogIsFoundUnderNearfitHome() {
        assertEquals(Path.of("/opt/nf/data-demo/site-log.csv.gz"), ViewCommand.demoLog(Map.of("NEARFIT_HOME", "/opt/nf")));
        assertEquals(Path.of("data-demo/site-log.csv.gz"), ViewCommand.demoLog(Map.of()));
    }

    /** The corpus cases with what plot, tune and fit must do, read from the corpus test itself. */
    static List<BadInputCorpusTest.Case> corpus() {
        return BadInputCorpusTest.modelCorpus();
    }

    /**
     * Each corpus file opened as {@code view FILE -x wind_ms,air_temp_c -y power_kw} does, on Lanterna's virtual
     * terminal with the same opener: a file the loader refuses ends with status 2 and the corpus test's line on
     * standard error once the screen is restored; a file that loads shows a frame, with the engine's message
     * on the status line when no model can be made, and {@code q} ends it with 0. Never a stack trace, never a
     * hang (60 s).
     */
    @ParameterizedTest(name = "view {0}")
    @MethodSource("corpus")
    void viewEndsEachCorpusFileWithTheLoadersLineOrShowsAFrame(BadInputCorpusTest.Case c, @TempDir Path dir)
            throws Exception {
        Path file = dir.resolve(c.file());
        try (InputStream in = ViewCommandTest.class.getResourceAsStream("/bad-input/" + c.file())) {
            Files.write(file, in.readAllBytes());
        }
        boolean loads = !isRefusedByTheLoader(c.file());
        DefaultVirtualTerminal vt = new DefaultVirtualTerminal(new TerminalSize(120, 40));
        StringWriter err = new StringWriter();
        TerminalScreen screen = new TerminalScreen(vt);
        String[] frame = {""};
        int status = assertTimeoutPreemptively(Duration.ofSeconds(60), () -> {
            CompletableFuture<Integer> session = CompletableFuture.supplyAsync(() -> TerminalSession.run(
                    screen, file, file.toString(), CoreWorkbench::open,
                    new StartSettings(List.of("wind_ms", "air_temp_c"), "power_kw", 0), new Look(false, true),
                    new PrintWriter(err)));
            if (loads) {
                frame[0] = awaitFrame(vt, c.status() == 2 ? c.message().substring("nearfit: ".length()) : "LOO RMSE");
                vt.addInput(new KeyStroke('q', false, false));
            }
            return session.get(50, TimeUnit.SECONDS);
        });
        String shown = frame[0] + err;
        assertFalse(shown.contains("\tat ") || shown.contains("Exception"), () -> "a stack trace: " + shown);
        if (loads) {
            assertEquals(0, status, err::toString);
            assertEquals("", err.toString());
            // the header shows the path, or only the file's name when the line is short of room
            assertTrue(frame[0].startsWith("nearfit  " + file) || frame[0].startsWith("nearfit  " + file.getFileName()),
                    frame[0]);
        } else {
            assertEquals(2, status);
            assertEquals(c.message().replace("FILE", file.toString()), err.toString().strip());
        }
    }

    /** Whether describe, which only loads, also refuses the file: then the message is the loader's. */
    private static boolean isRefusedByTheLoader(String file) {
        for (BadInputCorpusTest.Case d : BadInputCorpusTest.corpus()) {
            if (d.file().equals(file)) {
                return d.status() == 2;
            }
        }
        throw new IllegalArgumentException("not in the corpus: " + file);
    }

    /** Polls the virtual terminal until its text holds {@code wanted}; returns that text. */
    /**
     * The screen once it shows {@code wanted} and two reads 20 ms apart agree: the explorer draws on its own
     * thread, and a read in the middle of a redraw mixed a new header with the old one's characters.
     */
    private static String awaitFrame(DefaultVirtualTerminal vt, String wanted) throws InterruptedException {
        String before = "";
        String text = "";
        while (!text.contains(wanted) || !text.equals(before)) {
            Thread.sleep(20);
            before = text;
            text = screenText(vt);
        }
        return text;
    }

    private static String screenText(DefaultVirtualTerminal vt) {
        TerminalSize size = vt.getTerminalSize();
        StringBuilder sb = new StringBuilder();
        for (int r = 0; r < size.getRows(); r++) {
            for (int col = 0; col < size.getColumns(); col++) {
                sb.append(vt.getBufferCharacter(col, r).getCharacterString());
            }
            sb.append('\n');
        }
        return sb.toString();
    }
}
