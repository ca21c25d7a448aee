package nearfit.cli;

import java.lang.management.ManagementFactory;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;

import com.googlecode.lanterna.TerminalSize;
import com.googlecode.lanterna.screen.TerminalScreen;
import com.googlecode.lanterna.terminal.virtual.DefaultVirtualTerminal;

import nearfit.tui.bench.CoreWorkbench;
import nearfit.tui.loop.Explorer;
import nearfit.tui.bench.JobControl;
import nearfit.tui.paint.Look;
import nearfit.tui.keys.ViewState;
import nearfit.tui.bench.Workbench;

/**
 * Run in a child JVM by {@link BigInputSoakTest}: opens the explorer as {@code nearfit view} does (the
 * workbench's own loader, every column) on Lanterna's virtual terminal of 120x40, draws the first frame
 * and waits for the first curve. Prints {@code first_frame_s}, {@code first_curve_s} (both from the JVM's
 * start), {@code braille_cells} (cells of the plot holding braille dots, U+2801..U+28FF) and
 * {@code header} (the screen's first line).
 *
 * <p>Arguments: FILE RESPONSE INPUT.
 */
public final class FirstFrameProbe {
    private FirstFrameProbe() {
    }

    public static void main(String[] args) throws Exception {
        try {
            probe(args);
        } catch (OutOfMemoryError e) {
            // as nearfit view ends (Main's handler): one line, status 2
            System.err.println("nearfit: out of memory (heap " + Runtime.getRuntime().maxMemory() / (1 << 20) + " MB)");
            System.exit(2);
        }
    }

    private static void probe(String[] args) throws Exception {
        long jvmStart = ManagementFactory.getRuntimeMXBean().getStartTime();
        Path file = Path.of(args[0]);
        Workbench wb = CoreWorkbench.open(file, file.toString(), JobControl.NONE);
        DefaultVirtualTerminal terminal = new DefaultVirtualTerminal(new TerminalSize(120, 40));
        TerminalScreen screen = new TerminalScreen(terminal);
        screen.startScreen();
        try (Explorer ex = new Explorer(screen, wb, ViewState.initial(args[1], List.of(args[2]), 20),
                new Look(false, true))) {
            ex.start();
            double frame = (System.currentTimeMillis() - jvmStart) / 1e3;
            ex.settleCurve();
            double curve = (System.currentTimeMillis() - jvmStart) / 1e3;
            System.out.printf(Locale.ROOT, "first_frame_s %.1f%nfirst_curve_s %.1f%nbraille_cells %d%nheader %s%n",
                    frame, curve, brailleCells(terminal), line(terminal, 0));
        }
        screen.stopScreen();
        System.exit(0); // background jobs (tuning, flags) may still run
    }

    private static int brailleCells(DefaultVirtualTerminal t) {
        TerminalSize size = t.getTerminalSize();
        int n = 0;
        for (int r = 0; r < size.getRows(); r++) {
            for (int c = 0; c < size.getColumns(); c++) {
                String s = t.getBufferCharacter(c, r).getCharacterString();
                int cp = s.isEmpty() ? 0 : s.codePointAt(0);
                n += cp > 0x2800 && cp <= 0x28FF ? 1 : 0;
            }
        }
        return n;
    }

    private static String line(DefaultVirtualTerminal t, int row) {
        StringBuilder sb = new StringBuilder();
        for (int c = 0; c < t.getTerminalSize().getColumns(); c++) {
            sb.append(t.getBufferCharacter(c, row).getCharacterString());
        }
        return sb.toString().strip();
    }
}
