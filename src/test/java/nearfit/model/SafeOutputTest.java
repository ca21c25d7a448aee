package nearfit.model;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import nearfit.table.NearfitException;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class SafeOutputTest {
    @TempDir
    Path dir;

    @Test
    void writesTheContent() throws IOException {
        Path p = dir.resolve("out.csv");
        SafeOutput.write(p, false, List.of(), out -> out.write("a,b\n".getBytes(StandardCharsets.UTF_8)));
        assertEquals("a,b\n", Files.readString(p));
    }

    @Test
    void aNewFileIsReadableByOthersNotOwnerOnlyLikeItsTemporaryFile() throws IOException {
        Path p = dir.resolve("plot.png");
        SafeOutput.write(p, false, List.of(), out -> out.write(1));
        assertEquals("rw-r--r--", java.nio.file.attribute.PosixFilePermissions.toString(Files.getPosixFilePermissions(p)));
    }

    @Test
    void aReplacedFileKeepsItsPermissions() throws IOException {
        Path p = dir.resolve("model.nfm");
        Files.writeString(p, "old");
        Files.setPosixFilePermissions(p, java.nio.file.attribute.PosixFilePermissions.fromString("rw-rw----"));
        SafeOutput.write(p, true, List.of(), out -> out.write(1));
        assertEquals("rw-rw----", java.nio.file.attribute.PosixFilePermissions.toString(Files.getPosixFilePermissions(p)));
    }

    @Test
    void refusesToReplaceAnExistingFileWithoutForce() throws IOException {
        Path p = dir.resolve("out.csv");
        Files.writeString(p, "old");
        NearfitException e = assertThrows(NearfitException.class,
                () -> SafeOutput.write(p, false, List.of(), out -> out.write('x')));
        assertEquals(p + ": exists already; add --force to replace it", e.getMessage());
        assertEquals("old", Files.readString(p));
    }

    @Test
    void replacesWithForce() throws IOException {
        Path p = dir.resolve("out.csv");
        Files.writeString(p, "old");
        SafeOutput.write(p, true, List.of(), out -> out.write("new".getBytes(StandardCharsets.UTF_8)));
        assertEquals("new", Files.readString(p));
    }

    @Test
    void neverWritesOverAnInputEvenWithForce() throws IOException {
        Path in = dir.resolve("log.csv");
        Files.writeString(in, "a\n1\n");
        NearfitException e = assertThrows(NearfitException.class,
                () -> SafeOutput.write(dir.resolve("./log.csv"), true, List.of(in), out -> out.write('x')));
        assertEquals(dir.resolve("./log.csv") + ": is an input of this run; choose another output file", e.getMessage());
        assertEquals("a\n1\n", Files.readString(in));
    }

    // A fault-injecting writer stands for a full disk or a kill mid-write: the old file must survive
    // and no temporary file may be left behind.
    @Test
    void anInterruptedWriteLeavesThePreviousFileAndNoPartFile() throws IOException {
        Path p = dir.resolve("model.nfm");
        Files.writeString(p, "previous");
        assertThrows(NearfitException.class, () -> SafeOutput.write(p, true, List.of(), out -> {
            out.write(new byte[100_000]);
            throw new IOException("No space left on device");
        }));
        assertEquals("previous", Files.readString(p));
        try (var files = Files.list(dir)) {
            assertEquals(List.of(p), files.toList());
        }
    }

    @Test
    void anInterruptedFirstWriteLeavesNoFileAtTheTarget() throws IOException {
        Path p = dir.resolve("new.png");
        assertThrows(NearfitException.class, () -> SafeOutput.write(p, false, List.of(), out -> {
            out.write(1);
            throw new IOException("killed");
        }));
        assertEquals(false, Files.exists(p));
    }

    /** The POSIX file type bits of {@code p} (S_IFMT of stat's st_mode). */
    private static int fileType(Path p) throws IOException {
        return ((Integer) Files.getAttribute(p, "unix:mode")) & 0170000;
    }

    private static boolean runsAsRoot() {
        return "root".equals(System.getProperty("user.name"));
    }

    /** A named pipe given as the output is written into, with or without --force, and stays a pipe. */
    @Test
    void aNamedPipeIsWrittenIntoNotReplaced() throws Exception {
        Path fifo = dir.resolve("out.fifo");
        assertEquals(0, new ProcessBuilder("mkfifo", fifo.toString()).start().waitFor());
        java.util.concurrent.CompletableFuture<byte[]> read = java.util.concurrent.CompletableFuture.supplyAsync(() -> {
            try (java.io.InputStream in = new java.io.FileInputStream(fifo.toFile())) {
                java.io.ByteArrayOutputStream bytes = new java.io.ByteArrayOutputStream();
                in.transferTo(bytes); // not readAllBytes: on a file input stream it seeks, which a pipe refuses
                return bytes.toByteArray();
            } catch (IOException e) {
                throw new java.io.UncheckedIOException(e);
            }
        });
        SafeOutput.write(fifo, true, List.of(), out -> out.write("a,b\n1,2\n".getBytes(StandardCharsets.UTF_8)));
        assertEquals("a,b\n1,2\n", new String(read.get(60, java.util.concurrent.TimeUnit.SECONDS), StandardCharsets.UTF_8));
        assertEquals(0010000, fileType(fifo), "still a named pipe (before: renamed over with a regular file)");
    }

    /**
     * A character device (here a second null device made with mknod, as /dev/null is made) is written
     * into and stays a device; before, --force renamed a regular file over it, as root over /dev/null.
     */
    @Test
    void aCharacterDeviceIsWrittenIntoNotReplaced() throws Exception {
        org.junit.jupiter.api.Assumptions.assumeTrue(runsAsRoot(), "mknod needs root; this run is not root");
        Path device = dir.resolve("null-device");
        int made = new ProcessBuilder("mknod", device.toString(), "c", "1", "3").start().waitFor();
        org.junit.jupiter.api.Assumptions.assumeTrue(made == 0, "mknod is not permitted here (no CAP_MKNOD)");
        SafeOutput.write(device, true, List.of(), out -> out.write(new byte[442_000]));
        assertEquals(0020000, fileType(device), "still a character device");
        assertEquals(0, Files.size(device));
        try (var files = Files.list(dir)) {
            assertEquals(List.of(device), files.toList(), "no temporary file beside it");
        }
    }

    @Test
    void aSocketIsRefusedWithOneLine() throws IOException {
        Path socket = dir.resolve("out.sock");
        try (java.nio.channels.ServerSocketChannel server = java.nio.channels.ServerSocketChannel.open(
                java.net.StandardProtocolFamily.UNIX)) {
            server.bind(java.net.UnixDomainSocketAddress.of(socket));
            NearfitException e = assertThrows(NearfitException.class,
                    () -> SafeOutput.write(socket, true, List.of(), out -> out.write('x')));
            assertEquals(socket + ": is a socket; name a regular file to write", e.getMessage());
            assertEquals(0140000, fileType(socket));
        }
    }

    /** The temporary name is short, so a 244-character name works (before: "File name too long" after the work). */
    @Test
    void aLongNameThatTheFileSystemTakesIsWritten() throws IOException {
        Path p = dir.resolve("p".repeat(240) + ".csv");
        SafeOutput.write(p, false, List.of(), out -> out.write("a\n".getBytes(StandardCharsets.UTF_8)));
        assertEquals("a\n", Files.readString(p));
    }

    @Test
    void aNameTooLongIsRefusedByTheCheckBeforeTheWork() {
        Path p = dir.resolve("p".repeat(300) + ".csv");
        NearfitException e = assertThrows(NearfitException.class, () -> SafeOutput.checkTarget(p, false, List.of()));
        assertEquals(p + ": file name too long (304 bytes; file systems take 255)", e.getMessage());
    }
}
