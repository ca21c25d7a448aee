package nearfit.tui.loop;

import java.io.IOException;
import java.util.concurrent.BlockingQueue;

import com.googlecode.lanterna.input.KeyStroke;
import com.googlecode.lanterna.input.KeyType;
import com.googlecode.lanterna.screen.TerminalScreen;
import com.googlecode.lanterna.terminal.virtual.VirtualTerminal;

/** The thread that reads keys from the terminal into the explorer's queue; it ends with an EOF key. */
final class KeyReader {
    private KeyReader() {
    }

    /** Starts the reader as a daemon thread. */
    static void start(TerminalScreen screen, BlockingQueue<Event> events) {
        Thread reader = new Thread(() -> {
            try {
                // Lanterna's virtual terminal holds its lock while it blocks in readInput, which would stop
                // every frame, so it is polled; a real terminal is read blocking.
                boolean poll = screen.getTerminal() instanceof VirtualTerminal;
                while (true) {
                    KeyStroke k = poll ? screen.pollInput() : screen.readInput();
                    if (poll && k == null) {
                        Thread.sleep(5);
                        continue;
                    }
                    events.add(new Event.Key(k == null ? new KeyStroke(KeyType.EOF) : k));
                    if (k == null || k.getKeyType() == KeyType.EOF) {
                        return;
                    }
                }
            } catch (IOException | RuntimeException e) {
                events.add(new Event.Key(new KeyStroke(KeyType.EOF)));
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
            }
        }, "nearfit-keys");
        reader.setDaemon(true);
        reader.start();
    }
}
