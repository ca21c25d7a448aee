package nearfit.table;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.zip.GZIPOutputStream;

/** Writes small test inputs and loads them. */
final class CsvFiles {
    private CsvFiles() {
    }

    static Path write(Path dir, String name, String text) {
        return write(dir, name, text.getBytes(StandardCharsets.UTF_8));
    }

    static Path write(Path dir, String name, byte[] bytes) {
        try {
            return Files.write(dir.resolve(name), bytes);
        } catch (IOException ex) {
            throw new UncheckedIOException(ex);
        }
    }

    static byte[] gzip(byte[] bytes) {
        try {
            ByteArrayOutputStream out = new ByteArrayOutputStream();
            try (GZIPOutputStream gz = new GZIPOutputStream(out)) {
                gz.write(bytes);
            }
            return out.toByteArray();
        } catch (IOException ex) {
            throw new UncheckedIOException(ex);
        }
    }

    static Table load(Path dir, String text) {
        return load(dir, text, LoadOptions.DEFAULT);
    }

    static Table load(Path dir, String text, LoadOptions options) {
        Path p = write(dir, "in.csv", text);
        return CsvLoader.load(p, "in.csv", options);
    }
}
