package nearfit.tui.loop;

import java.util.function.UnaryOperator;

import com.googlecode.lanterna.input.KeyStroke;

import nearfit.tui.results.Results;

/**
 * What reaches the explorer's one queue: a key from the reader thread, a finished job, or a tick (a job's
 * progress moved on, or the terminal was resized) that only asks for a frame.
 */
sealed interface Event {
    /** A key press, or end of input ({@code KeyType.EOF}). */
    record Key(KeyStroke stroke) implements Event {
    }

    /**
     * A finished job of {@code kind}, asked for by generation {@code generation}: how its value goes into the
     * results, or the failure that ended it ({@code update} is then {@code null}).
     */
    record JobDone(Jobs.Kind kind, long generation, UnaryOperator<Results> update, Throwable failure)
            implements Event {
    }

    /** Asks for a frame and nothing else. */
    record Tick() implements Event {
    }

    /** The shared tick. */
    Tick TICK = new Tick();
}
