package nearfit.cli;

import java.io.IOException;
import java.io.OutputStream;
import java.io.PrintWriter;
import java.io.Writer;
import java.nio.file.Path;
import java.util.Collection;

import nearfit.model.ResultCsv;
import nearfit.model.SafeOutput;
import nearfit.table.NearfitException;

/**
 * Where a command's output file goes: {@code -} is standard output (the Unix convention, and what {@code -}
 * already means for an input file); any other name is written through {@link SafeOutput}. Progress and
 * notes stay on standard error either way.
 */
final class CommandOutput {
    /** The output name that means standard output. */
    static final String STANDARD_OUTPUT = "-";

    /** Writes text to a writer. */
    @FunctionalInterface
    interface TextBody {
        void writeTo(Writer w) throws IOException;
    }

    private CommandOutput() {
    }

    /** Whether {@code target} is {@code -}, standard output. */
    static boolean isStandardOutput(Path target) {
        return target != null && STANDARD_OUTPUT.equals(target.toString());
    }

    /** Checks a file target before the work ({@link SafeOutput#checkTarget}); standard output needs no check. */
    static void check(Path target, boolean force, Collection<Path> inputs) {
        if (target != null && !isStandardOutput(target)) {
            SafeOutput.checkTarget(target, force, inputs);
        }
    }

    /** Writes text to {@code target}, or to {@code stdout} when target is {@code -} or {@code null}. */
    /**
     * The CSV writer for rows written on {@code w} for {@code target}: {@link ResultCsv#forTerminal} when they
     * land on a terminal a person reads (standard output, {@code null} or {@code -}, that is the process's own
     * and connected to a terminal), else the plain writer (a file or a pipe keeps the source's bytes).
     */
    static ResultCsv csv(Writer w, Path target, PrintWriter stdout) throws IOException {
        boolean terminal = (target == null || isStandardOutput(target)) && stdout instanceof StandardOutputWriter
                && System.console() != null;
        return terminal ? ResultCsv.forTerminal(w) : new ResultCsv(w);
    }

    static void text(Path target, boolean force, Collection<Path> inputs, PrintWriter stdout, TextBody body) {
        if (target == null || isStandardOutput(target)) {
            try {
                body.writeTo(stdout);
                stdout.flush();
            } catch (IOException e) {
                throw new NearfitException("cannot write to standard output: " + e.getMessage());
            }
            return;
        }
        SafeOutput.write(target, force, inputs, out -> {
            Writer w = new java.io.BufferedWriter(new java.io.OutputStreamWriter(out,
                    java.nio.charset.StandardCharsets.UTF_8), 1 << 16);
            body.writeTo(w);
            w.flush();
        });
    }

    /**
     * Writes bytes (a picture) to {@code target}, or to standard output when target is {@code -}; standard
     * output takes bytes only when it is the process's own ({@link StandardOutputWriter}).
     */
    static void bytes(Path target, boolean force, Collection<Path> inputs, PrintWriter stdout,
                      SafeOutput.Content content) {
        if (!isStandardOutput(target)) {
            SafeOutput.write(target, force, inputs, content);
            return;
        }
        if (!(stdout instanceof StandardOutputWriter w)) {
            throw new NearfitException("standard output: takes no binary data in this run; name a file");
        }
        try {
            OutputStream out = w.bytes();
            content.writeTo(out);
            out.flush();
        } catch (IOException e) {
            throw new NearfitException("cannot write to standard output: " + e.getMessage());
        }
    }
}
