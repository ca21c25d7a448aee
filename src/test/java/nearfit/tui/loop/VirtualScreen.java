package nearfit.tui.loop;

import java.io.IOException;

import com.googlecode.lanterna.TerminalSize;
import com.googlecode.lanterna.input.KeyStroke;
import com.googlecode.lanterna.input.KeyType;
import com.googlecode.lanterna.screen.TerminalScreen;
import com.googlecode.lanterna.terminal.virtual.DefaultVirtualTerminal;

import nearfit.tui.bench.Workbench;
import nearfit.tui.keys.ViewState;
import nearfit.tui.paint.Look;

/** An explorer on Lanterna's virtual terminal, driven key by key and read back as text. */
public final class VirtualScreen implements AutoCloseable {
    public final DefaultVirtualTerminal terminal;
    public final TerminalScreen screen;
    public final Explorer explorer;

    public VirtualScreen(Workbench wb, ViewState first, int width, int height, Look look) throws IOException,
            InterruptedException {
        terminal = new DefaultVirtualTerminal(new TerminalSize(width, height));
        screen = new TerminalScreen(terminal);
        screen.startScreen();
        explorer = new Explorer(screen, wb, first, look);
        explorer.start();
        explorer.settle();
    }

    public static VirtualScreen standard(Workbench wb) throws IOException, InterruptedException {
        return new VirtualScreen(wb, ViewState.initial("power_kw", java.util.List.of("wind_ms"), 20), 120, 40,
                new Look(false, true));
    }

    /** Types characters and special keys, settling after each. */
    public VirtualScreen type(String chars) throws IOException, InterruptedException {
        for (char c : chars.toCharArray()) {
            key(new KeyStroke(c, false, false));
        }
        return this;
    }

    public VirtualScreen key(KeyStroke k) throws IOException, InterruptedException {
        explorer.press(k);
        explorer.settle();
        return this;
    }

    public VirtualScreen key(KeyType t) throws IOException, InterruptedException {
        return key(new KeyStroke(t));
    }

    /** The terminal's visible text, rows joined by newlines. */
    public String text() {
        TerminalSize size = terminal.getTerminalSize();
        StringBuilder sb = new StringBuilder();
        for (int r = 0; r < size.getRows(); r++) {
            StringBuilder line = new StringBuilder();
            for (int c = 0; c < size.getColumns(); c++) {
                line.append(terminal.getBufferCharacter(c, r).getCharacterString());
            }
            sb.append(line.toString().stripTrailing()).append('\n');
        }
        return sb.toString();
    }

    /** One row of the terminal's text. */
    public String row(int r) {
        return text().split("\n", -1)[r];
    }

    @Override
    public void close() throws IOException {
        explorer.close();
        screen.stopScreen();
    }
}
