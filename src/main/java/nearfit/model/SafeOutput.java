package nearfit.model;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.channels.FileChannel;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.StandardOpenOption;
import java.util.Collection;

import nearfit.table.NearfitException;

/**
 * Writes a file so that a reader never sees half of it: the content goes to a temporary file in the
 * target's folder and is renamed into place only when complete and flushed to disk.
 *
 * <p>An existing target is replaced only when {@code force} is set, and never when it is one of the
 * run's own input files. If writing fails (a full disk, a kill, an exception in the writer) the
 * temporary file is removed and the previous target, if any, is left as it was.
 */
public final class SafeOutput {
    /** Writes the content of a file to a stream; may throw {@link IOException}. */
    @FunctionalInterface
    public interface Content {
        void writeTo(OutputStream out) throws IOException;
    }

    private SafeOutput() {
    }

    /**
     * Writes {@code target} atomically.
     *
     * @param target the file to write
     * @param force  whether an existing file may be replaced
     * @param inputs the files this run reads, which are never replaced
     * @param content what to write
     * @throws NearfitException naming the target when it exists without {@code force}, is an input,
     *                          or cannot be written
     */
    public static void write(Path target, boolean force, Collection<Path> inputs, Content content) {
        String name = target.toString();
        checkTarget(target, force, inputs);
        Path folder = target.toAbsolutePath().getParent();
        Path temp = null;
        try {
            temp = Files.createTempFile(folder, "." + target.getFileName() + ".", ".part");
            try (FileChannel channel = FileChannel.open(temp, StandardOpenOption.WRITE);
                 OutputStream out = new java.io.BufferedOutputStream(
                         java.nio.channels.Channels.newOutputStream(channel), 1 << 16)) {
                content.writeTo(out);
                out.flush();
                channel.force(true);
            }
            keepPermissions(temp, target);
            move(temp, target, force);
            temp = null;
        } catch (FileAlreadyExistsException e) {
            throw NearfitException.inFile(name, "exists already; add --force to replace it");
        } catch (IOException e) {
            throw NearfitException.inFile(name, "cannot write: " + describe(e), e);
        } finally {
            if (temp != null) {
                try {
                    Files.deleteIfExists(temp);
                } catch (IOException ignored) {
                    // Best effort: the temporary name starts with a dot and ends in .part.
                }
            }
        }
    }

    /** Fails when {@code target} may not be written; exposed so commands can check before long work. */
    public static void checkTarget(Path target, boolean force, Collection<Path> inputs) {
        String name = target.toString();
        for (Path input : inputs) {
            if (input != null && sameFile(input, target)) {
                throw NearfitException.inFile(name, "is an input of this run; choose another output file");
            }
        }
        if (Files.isDirectory(target)) {
            throw NearfitException.inFile(name, "is a folder; name a file to write");
        }
        if (Files.exists(target) && !force) {
            throw NearfitException.inFile(name, "exists already; add --force to replace it");
        }
        Path folder = target.toAbsolutePath().getParent();
        if (folder == null || !Files.isDirectory(folder)) {
            throw NearfitException.inFile(name, "its folder does not exist");
        }
    }

    private static void move(Path temp, Path target, boolean force) throws IOException {
        if (!force) {
            // Without --force a file that appeared meanwhile must not be replaced: link-then-delete
            // fails if the target exists. Filesystems without hard links fall back to a plain move.
            try {
                Files.createLink(target, temp);
                Files.delete(temp);
                return;
            } catch (UnsupportedOperationException | IOException e) {
                if (e instanceof FileAlreadyExistsException) {
                    throw (FileAlreadyExistsException) e;
                }
                Files.move(temp, target);
                return;
            }
        }
        try {
            Files.move(temp, target, StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
        } catch (AtomicMoveNotSupportedException e) {
            Files.move(temp, target, StandardCopyOption.REPLACE_EXISTING);
        }
    }

    /**
     * Temporary files are created owner-only; the finished file gets the permissions of the file it
     * replaces, or rw-r--r-- for a new one, as a plain write would under the usual umask.
     */
    private static void keepPermissions(Path temp, Path target) throws IOException {
        if (!Files.getFileStore(temp).supportsFileAttributeView(java.nio.file.attribute.PosixFileAttributeView.class)) {
            return;
        }
        java.util.Set<java.nio.file.attribute.PosixFilePermission> perms = Files.exists(target)
                ? Files.getPosixFilePermissions(target)
                : java.nio.file.attribute.PosixFilePermissions.fromString("rw-r--r--");
        Files.setPosixFilePermissions(temp, perms);
    }

    private static boolean sameFile(Path a, Path b) {
        try {
            if (Files.exists(a) && Files.exists(b)) {
                return Files.isSameFile(a, b);
            }
            return a.toAbsolutePath().normalize().equals(b.toAbsolutePath().normalize());
        } catch (IOException e) {
            return false;
        }
    }

    private static String describe(IOException e) {
        String m = e.getMessage();
        return m == null ? e.getClass().getSimpleName() : m;
    }
}
