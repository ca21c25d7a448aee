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
import java.util.concurrent.atomic.AtomicReference;

import nearfit.table.NearfitException;

/**
 * Writes a file so that a reader never sees half of it: the content goes to a temporary file in the
 * target's folder and is renamed into place only when complete and flushed to disk.
 *
 * <p>An existing target is replaced only when {@code force} is set, and never when it is one of the
 * run's own input files or its standard input. Only regular files are replaced: a character device or a
 * named pipe is written into, a socket or block device refused. If writing fails (a full disk, an
 * exception in the writer, SIGTERM or Ctrl-C) the temporary file is removed and the previous target, if
 * any, is left as it was; only SIGKILL can leave a temporary file ({@code .nf-N.part}) behind.
 */
public final class SafeOutput {
    /** Writes the content of a file to a stream; may throw {@link IOException}. */
    @FunctionalInterface
    public interface Content {
        void writeTo(OutputStream out) throws IOException;
    }

    private SafeOutput() {
    }

    /** Longest file name, in bytes, that the usual Linux file systems take (NAME_MAX; common practice). */
    static final int NAME_MAX = 255;
    /** Temporary names are short, so any name that fits the file system leaves room for them (.nf-N.part). */
    static final String PART_PREFIX = ".nf-";
    static final String PART_SUFFIX = ".part";

    /** What writing a checked target means. */
    private enum Way {
        /** A regular file, or none yet: a temporary file beside it, renamed over it when complete. */
        REPLACE,
        /** A character device or a named pipe (say /dev/null): the content is written into it, never renamed over it. */
        INTO
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
        if (check(target, force, inputs) == Way.INTO) {
            writeInto(target, name, content);
            return;
        }
        Path folder = target.toAbsolutePath().getParent();
        // A SIGTERM or Ctrl-C runs shutdown hooks but no finally blocks: this one removes the part file.
        AtomicReference<Path> part = new AtomicReference<>();
        Thread cleanup = new Thread(() -> deleteQuietly(part.getAndSet(null)), "nearfit-part-cleanup");
        Runtime.getRuntime().addShutdownHook(cleanup);
        try {
            part.set(Files.createTempFile(folder, PART_PREFIX, PART_SUFFIX));
            try (FileChannel channel = FileChannel.open(part.get(), StandardOpenOption.WRITE);
                 OutputStream out = new java.io.BufferedOutputStream(
                         java.nio.channels.Channels.newOutputStream(channel), 1 << 16)) {
                content.writeTo(out);
                out.flush();
                channel.force(true);
            }
            keepPermissions(part.get(), target);
            move(part.get(), target, force);
            part.set(null);
        } catch (FileAlreadyExistsException e) {
            throw NearfitException.inFile(name, "exists already; add --force to replace it");
        } catch (IOException e) {
            throw NearfitException.inFile(name, "cannot write: " + describe(e), e);
        } finally {
            deleteQuietly(part.getAndSet(null));
            try {
                Runtime.getRuntime().removeShutdownHook(cleanup);
            } catch (IllegalStateException shuttingDown) {
                // The hook is running or about to: it finds nothing left to delete.
            }
        }
    }

    private static void deleteQuietly(Path p) {
        if (p != null) {
            try {
                Files.deleteIfExists(p);
            } catch (IOException ignored) {
                // Best effort: the temporary name starts with a dot and ends in .part.
            }
        }
    }

    private static void writeInto(Path target, String name, Content content) {
        try (OutputStream out = new java.io.BufferedOutputStream(Files.newOutputStream(target,
                StandardOpenOption.WRITE), 1 << 16)) {
            content.writeTo(out);
        } catch (IOException e) {
            throw NearfitException.inFile(name, "cannot write: " + describe(e), e);
        }
    }

    /**
     * Fails when {@code target} may not be written; exposed so commands can check before long work: the
     * target is not an input or this run's standard input, not a folder, socket or block device, exists
     * only with {@code force} (a character device or named pipe is written into, not replaced), has a
     * name the file system takes, and its folder exists and takes a new file.
     */
    public static void checkTarget(Path target, boolean force, Collection<Path> inputs) {
        check(target, force, inputs);
    }

    private static Way check(Path target, boolean force, Collection<Path> inputs) {
        String name = target.toString();
        for (Path input : inputs) {
            if (input != null && sameFile(input, target)) {
                throw NearfitException.inFile(name, "is an input of this run; choose another output file");
            }
        }
        if (Files.isDirectory(target)) {
            throw NearfitException.inFile(name, "is a folder; name a file to write");
        }
        if (Files.exists(target) && !Files.isRegularFile(target)) {
            return special(target, name);
        }
        if (Files.isRegularFile(target) && isStandardInput(target)) {
            throw NearfitException.inFile(name, "is this run's standard input; choose another output file");
        }
        if (Files.exists(target) && !force) {
            throw NearfitException.inFile(name, "exists already; add --force to replace it");
        }
        Path fileName = target.getFileName();
        int bytes = fileName == null ? 0 : fileName.toString().getBytes(nameCharset()).length;
        if (bytes > NAME_MAX) {
            throw NearfitException.inFile(name, "file name too long (" + bytes + " bytes; file systems take "
                    + NAME_MAX + ")");
        }
        Path folder = target.toAbsolutePath().getParent();
        if (folder == null || !Files.isDirectory(folder)) {
            throw NearfitException.inFile(name, "its folder does not exist");
        }
        try {
            // Before the work, not after it: a read-only or full folder fails here, in one line.
            // The probe is not named .part, so a watcher waiting for the write to begin is not misled.
            Files.delete(Files.createTempFile(folder, PART_PREFIX, ".probe"));
        } catch (IOException e) {
            throw NearfitException.inFile(name, "cannot write in its folder: " + describe(e), e);
        }
        return Way.REPLACE;
    }

    /** A target that exists and is neither a regular file nor a folder, by its POSIX file type. */
    private static Way special(Path target, String name) {
        int type;
        try {
            type = ((Integer) Files.getAttribute(target, "unix:mode")) & 0170000;
        } catch (IOException | UnsupportedOperationException | IllegalArgumentException e) {
            throw NearfitException.inFile(name, "is not a regular file; name a regular file to write");
        }
        return switch (type) {
            case 0020000, 0010000 -> Way.INTO; // character device, named pipe
            case 0140000 -> throw NearfitException.inFile(name, "is a socket; name a regular file to write");
            case 0060000 -> throw NearfitException.inFile(name, "is a block device; name a regular file to write");
            default -> throw NearfitException.inFile(name, "is not a regular file; name a regular file to write");
        };
    }

    /** Whether standard input is {@code target} itself (same device and inode), as in {@code ... -o s.csv < s.csv}. */
    private static boolean isStandardInput(Path target) {
        Path stdin = Path.of("/proc/self/fd/0");
        try {
            return Files.isRegularFile(stdin) && Files.isSameFile(stdin, target);
        } catch (IOException | SecurityException e) {
            return false;
        }
    }

    private static java.nio.charset.Charset nameCharset() {
        try {
            return java.nio.charset.Charset.forName(System.getProperty("sun.jnu.encoding"));
        } catch (RuntimeException e) {
            return java.nio.charset.StandardCharsets.UTF_8;
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
