package nearfit.model;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** A write killed from outside (SIGKILL, SIGTERM) mid-way leaves the previous file exactly as it was. */
class SafeOutputRobustnessTest {
    @TempDir
    Path dir;

    /** Child process: replaces the file named in args[0] with 2 GB written slowly, saying when it has begun. */
    public static final class SlowWriter {
        public static void main(String[] args) {
            SafeOutput.write(Path.of(args[0]), true, List.of(), out -> {
                byte[] block = new byte[1 << 20];
                for (int i = 0; i < 2048; i++) {
                    out.write(block);
                    if (i == 8) {
                        System.out.println("writing");
                        System.out.flush();
                    }
                }
            });
        }
    }

    /** How the child is stopped. */
    enum Stop { SIGKILL, SIGTERM, SIGINT }

    private void stopMidWrite(Stop stop) throws Exception {
        Path target = dir.resolve("reference.nfm");
        byte[] previous = "the previous model\n".getBytes(StandardCharsets.UTF_8);
        Files.write(target, previous);
        String java = Path.of(System.getProperty("java.home"), "bin", "java").toString();
        String cp = System.getProperty("surefire.test.class.path", System.getProperty("java.class.path"));
        Process p = new ProcessBuilder(java, "-cp", cp, SlowWriter.class.getName(), target.toString())
                .redirectErrorStream(true).start();
        try (BufferedReader r = new BufferedReader(new InputStreamReader(p.getInputStream(), StandardCharsets.UTF_8))) {
            assertEquals("writing", r.readLine(), "the child began writing");
            assertEquals(1, parts().size(), "the temporary file is there, 9 MB into the write");
            switch (stop) {
                case SIGKILL -> p.destroyForcibly();
                case SIGTERM -> p.destroy();
                case SIGINT -> assertEquals(0, new ProcessBuilder("kill", "-INT", Long.toString(p.pid())).start().waitFor());
            }
            assertTrue(p.waitFor(60, TimeUnit.SECONDS));
        }
        assertTrue(p.exitValue() != 0, "the child was stopped, not finished");
        assertArrayEquals(previous, Files.readAllBytes(target));
        if (stop == Stop.SIGKILL) {
            // No clean-up runs in a killed process, so its temporary file may stay: hidden, short, named .part.
            for (String n : parts()) {
                assertTrue(n.matches("\\.nf-[0-9]+\\.part"), n);
            }
        } else {
            // SIGTERM and Ctrl-C run the shutdown hook that removes it (before: a 13 MB .part stayed).
            assertEquals(List.of(), parts());
        }
    }

    private List<String> parts() throws IOException {
        try (Stream<Path> files = Files.list(dir)) {
            return files.map(f -> f.getFileName().toString()).filter(n -> !n.equals("reference.nfm")).toList();
        }
    }

    @Test
    void aWriteKilledWithSigkillLeavesThePreviousFileIntact() throws Exception {
        stopMidWrite(Stop.SIGKILL);
    }

    @Test
    void aWriteStoppedWithSigtermLeavesThePreviousFileIntactAndNoPartFile() throws Exception {
        stopMidWrite(Stop.SIGTERM);
    }

    @Test
    void aWriteStoppedWithCtrlCLeavesThePreviousFileIntactAndNoPartFile() throws Exception {
        stopMidWrite(Stop.SIGINT);
    }
}
