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
}
