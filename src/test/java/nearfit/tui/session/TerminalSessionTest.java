package nearfit.tui.session;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Path;
import java.util.List;

import org.junit.jupiter.api.Test;

import com.googlecode.lanterna.TerminalSize;
import com.googlecode.lanterna.input.KeyStroke;
import com.googlecode.lanterna.screen.TerminalScreen;
import com.googlecode.lanterna.terminal.virtual.DefaultVirtualTerminal;

import nearfit.table.NearfitException;
import nearfit.tui.bench.ScriptedWorkbench;
import nearfit.tui.paint.Look;

class TerminalSessionTest {
    private static final StartSettings START = new StartSettings(List.of("wind_ms"), "power_kw", 0);

    @Test
    void aBadFileEndsWithTheLoadersMessageOnOneLineAfterTheScreenIsRestored() throws Exception {
        DefaultVirtualTerminal vt = new DefaultVirtualTerminal(new TerminalSize(100, 30));
        StringWriter err = new StringWriter();
        int status = TerminalSession.run(new TerminalScreen(vt), Path.of("broken.csv"), "broken.csv",
                (file, name, c) -> {
                    throw NearfitException.atLine(name, 7, "5 fields where the header has 4");
                }, START, new Look(false, true), new PrintWriter(err));
        assertEquals(2, status);
        assertEquals("nearfit: broken.csv:7: 5 fields where the header has 4", err.toString().strip());
    }

    @Test
    void qQuitsWith0AndCtrlCWith130() throws Exception {
        for (KeyStroke key : List.of(new KeyStroke('q', false, false), new KeyStroke('c', true, false))) {
            DefaultVirtualTerminal vt = new DefaultVirtualTerminal(new TerminalSize(100, 30));
            vt.addInput(key);
            StringWriter err = new StringWriter();
            int status = TerminalSession.run(new TerminalScreen(vt), Path.of("x.csv"), "x.csv",
                    (file, name, c) -> new ScriptedWorkbench(), START, new Look(false, true), new PrintWriter(err));
            assertEquals(key.isCtrlDown() ? 130 : 0, status, "after " + key);
            assertTrue(err.toString().isEmpty(), err.toString());
        }
    }

    @Test
    void anUnknownColumnIsNamedWithItsOption() throws Exception {
        DefaultVirtualTerminal vt = new DefaultVirtualTerminal(new TerminalSize(100, 30));
        StringWriter err = new StringWriter();
        int status = TerminalSession.run(new TerminalScreen(vt), Path.of("x.csv"), "x.csv",
                (file, name, c) -> new ScriptedWorkbench(), new StartSettings(List.of("gust_ms"), null, 0),
                new Look(false, true), new PrintWriter(err));
        assertEquals(2, status);
        assertEquals("nearfit: option -x: no column named gust_ms", err.toString().strip());
    }
}
