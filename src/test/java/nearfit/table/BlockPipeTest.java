package nearfit.table;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTimeoutPreemptively;

import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.io.InputStream;
import java.io.SequenceInputStream;
import java.nio.charset.StandardCharsets;
import java.time.Duration;
import org.junit.jupiter.api.Test;

/** A failure on the reading thread reaches the parser, whatever its kind, instead of leaving it waiting. */
class BlockPipeTest {

    /** Some bytes, then the given failure from the next read. */
    private static InputStream failingAfter(String text, RuntimeException runtime, Error error) {
        InputStream failing = new InputStream() {
            @Override
            public int read() {
                if (error != null) {
                    throw error;
                }
                throw runtime;
            }
        };
        return new SequenceInputStream(new ByteArrayInputStream(text.getBytes(StandardCharsets.US_ASCII)), failing);
    }

    @Test
    void anErrorOnTheReadingThreadIsThrownToTheParserNotAHang() {
        OutOfMemoryError planted = new OutOfMemoryError("planted");
        assertTimeoutPreemptively(Duration.ofSeconds(30), () -> {
            try (BlockPipe pipe = BlockPipe.start(failingAfter("a,b\n", null, planted), "x.csv")) {
                InputStream in = pipe.stream();
                OutOfMemoryError thrown = assertThrows(OutOfMemoryError.class, in::readAllBytes);
                assertEquals("planted", thrown.getMessage());
            }
        });
    }

    @Test
    void aRuntimeExceptionOnTheReadingThreadIsThrownToTheParser() {
        assertTimeoutPreemptively(Duration.ofSeconds(30), () -> {
            try (BlockPipe pipe = BlockPipe.start(failingAfter("a,b\n", new IllegalStateException("planted"), null),
                    "x.csv")) {
                assertThrows(IllegalStateException.class, pipe.stream()::readAllBytes);
            }
        });
    }

    @Test
    void aStreamThatDoesNotFailPassesThroughWhole() throws IOException {
        try (BlockPipe pipe = BlockPipe.start(new ByteArrayInputStream("a,b\n1,2\n".getBytes(StandardCharsets.US_ASCII)),
                "x.csv")) {
            assertEquals("a,b\n1,2\n", new String(pipe.stream().readAllBytes(), StandardCharsets.US_ASCII));
        }
    }
}
