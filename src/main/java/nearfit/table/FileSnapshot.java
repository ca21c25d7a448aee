package nearfit.table;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.nio.file.attribute.BasicFileAttributes;
import java.nio.file.attribute.FileTime;
import java.util.Objects;

/**
 * A regular file's size, modification time and identity (the inode on POSIX file systems; may be
 * {@code null} elsewhere), taken before and after a load so that the loader can tell a file that was
 * written, cut, replaced or deleted while it read it.
 *
 * @param size     bytes
 * @param modified the last-modified time, at the file system's resolution
 * @param key      the file's identity, or {@code null} where the file system has none
 */
record FileSnapshot(long size, FileTime modified, Object key) {
    static FileSnapshot of(Path path) throws IOException {
        BasicFileAttributes a = Files.readAttributes(path, BasicFileAttributes.class);
        return new FileSnapshot(a.size(), a.lastModifiedTime(), a.fileKey());
    }

    /**
     * Compares the file now with this snapshot, taken before {@code table} was read from its first
     * {@link #size} bytes. A file that shrank or was replaced may have given rows of two versions, so
     * that fails; one that grew (a log still being written), was touched or was deleted (its data stay
     * readable through the open handle) gave a consistent table, returned with a warning.
     */
    Table confirm(Path path, String name, Table table) throws IOException {
        FileSnapshot now;
        try {
            now = of(path);
        } catch (NoSuchFileException e) {
            return warn(table, name + ": was deleted while it was read; the rows are those it held when the load began");
        }
        if (!Objects.equals(key, now.key)) {
            throw NearfitException.inFile(name, "was replaced by another file while it was read; load it again");
        }
        if (now.size < size) {
            throw NearfitException.inFile(name, "shrank from " + size + " to " + now.size + " bytes while it was read, "
                    + "so the rows read may be cut or mixed; load it again once it is complete");
        }
        if (now.size > size) {
            return warn(table, name + ": grew from " + size + " to " + now.size + " bytes while it was read; "
                    + "only the first " + size + " bytes were read");
        }
        if (!modified.equals(now.modified)) {
            return warn(table, name + ": was modified while it was read (same size, " + size + " bytes); "
                    + "if it was rewritten, load it again");
        }
        return table;
    }

    private static Table warn(Table table, String warning) {
        return table.withReport(table.report().withWarning(warning));
    }
}
