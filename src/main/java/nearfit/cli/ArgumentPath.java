package nearfit.cli;

import java.io.IOException;
import java.net.URI;
import java.nio.charset.Charset;
import java.nio.file.Files;
import java.nio.file.InvalidPathException;
import java.nio.file.Path;
import java.util.Arrays;

import nearfit.table.NearfitException;
import nearfit.table.VisibleText;

/**
 * A file named on the command line as a {@link Path}, also when the locale cannot spell its name.
 *
 * <p>Under {@code LC_ALL=C} (cron's usual locale) Java decodes arguments and encodes file names as ASCII,
 * so a name such as {@code é.csv} arrives with replacement characters and cannot be made into a path.
 * The bytes the user gave are still in {@code /proc/self/cmdline}; a {@code file:} URI carries them
 * percent-encoded, and the JDK builds a path from such a URI byte for byte. Where that fails too
 * (no {@code /proc}, or two different arguments that read the same) the message says so in one line.
 */
final class ArgumentPath {
    private static final Path COMMAND_LINE = Path.of("/proc/self/cmdline");

    private ArgumentPath() {
    }

    /** The path {@code arg} names, made from the argument's own bytes when the locale cannot encode it. */
    static Path of(String arg) {
        try {
            return Path.of(arg);
        } catch (InvalidPathException e) {
            byte[] raw = rawArgument(arg);
            if (raw != null) {
                try {
                    return fromBytes(raw);
                } catch (RuntimeException ignored) {
                    // fall through to the one-line message
                }
            }
            throw NearfitException.inFile(VisibleText.of(arg), "this file name cannot be spelled in the locale's "
                    + "character set (" + System.getProperty("sun.jnu.encoding") + "); run under a UTF-8 locale, "
                    + "for example LC_ALL=C.UTF-8");
        }
    }

    /**
     * The bytes of the command-line argument that the JVM decoded to {@code arg} (or of the value after
     * {@code =} in {@code --option=value}), or {@code null} when none or several different ones match.
     */
    static byte[] rawArgument(String arg) {
        byte[] all;
        try {
            all = Files.readAllBytes(COMMAND_LINE);
        } catch (IOException | RuntimeException e) {
            return null;
        }
        Charset jnu = platformCharset();
        byte[] found = null;
        int start = 0;
        for (int i = 0; i <= all.length; i++) {
            if (i < all.length && all[i] != 0) {
                continue;
            }
            byte[] entry = Arrays.copyOfRange(all, start, i);
            start = i + 1;
            byte[] match = matching(entry, arg, jnu);
            if (match != null) {
                if (found != null && !Arrays.equals(found, match)) {
                    return null; // ambiguous
                }
                found = match;
            }
        }
        return found;
    }

    private static byte[] matching(byte[] entry, String arg, Charset jnu) {
        if (new String(entry, jnu).equals(arg)) {
            return entry;
        }
        if (entry.length > 1 && entry[0] == '-') {
            for (int i = 0; i < entry.length; i++) {
                if (entry[i] == '=') {
                    byte[] value = Arrays.copyOfRange(entry, i + 1, entry.length);
                    return new String(value, jnu).equals(arg) ? value : null;
                }
            }
        }
        return null;
    }

    private static Charset platformCharset() {
        try {
            return Charset.forName(System.getProperty("sun.jnu.encoding"));
        } catch (RuntimeException e) {
            return Charset.defaultCharset();
        }
    }

    /** The path of these name bytes, relative ones taken from the working folder. */
    static Path fromBytes(byte[] raw) {
        StringBuilder uri = new StringBuilder();
        if (raw.length == 0 || raw[0] != '/') {
            String base;
            try {
                base = Path.of("").toAbsolutePath().toUri().toString();
            } catch (RuntimeException e) {
                base = "file:///proc/self/cwd/"; // the working folder's own name is not spellable either
            }
            uri.append(base.endsWith("/") ? base : base + "/");
        } else {
            uri.append("file://");
        }
        for (byte b : raw) {
            int c = b & 0xff;
            if (c < 0x80 && (Character.isLetterOrDigit(c) || "/-._~".indexOf(c) >= 0)) {
                uri.append((char) c);
            } else {
                uri.append('%').append(Character.toUpperCase(Character.forDigit(c >> 4, 16)))
                        .append(Character.toUpperCase(Character.forDigit(c & 15, 16)));
            }
        }
        return Path.of(URI.create(uri.toString()));
    }
}
