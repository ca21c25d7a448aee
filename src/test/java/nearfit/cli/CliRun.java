package nearfit.cli;

import java.io.File;
import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;

/** Runs nearfit command lines in-process through {@link Main#run} or as a real Java process. */
final class CliRun {
    /** Exit status and the two output streams of one run. */
    record Result(int status, String out, String err) {
        @Override
        public String toString() {
            return "status " + status + "\n--- out\n" + out + "--- err\n" + err;
        }
    }

    private CliRun() {
    }

    static Result inProcess(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int status = Main.run(args, new PrintWriter(out), new PrintWriter(err));
        return new Result(status, out.toString(), err.toString());
    }

    /** Runs {@code java -cp <test class path> nearfit.cli.Main args} in {@code dir}. */
    static Result process(Path dir, String... args) throws IOException, InterruptedException {
        return processWithShellPrefix(dir, null, args);
    }

    /**
     * As {@link #process}, but through {@code bash -c "PREFIX; exec java ..."} when a prefix is given
     * (e.g. {@code ulimit -f 8} to make writes fail past 8 KiB).
     */
    static Result processWithShellPrefix(Path dir, String prefix, String... args)
            throws IOException, InterruptedException {
        List<String> command = new ArrayList<>();
        command.add(Path.of(System.getProperty("java.home"), "bin", "java").toString());
        command.add("-cp");
        command.add(classPath());
        command.add("nearfit.cli.Main");
        command.addAll(List.of(args));
        if (prefix != null) {
            StringBuilder line = new StringBuilder(prefix).append("; exec");
            for (String c : command) {
                line.append(" '").append(c.replace("'", "'\\''")).append('\'');
            }
            command = List.of("bash", "-c", line.toString());
        }
        Process p = new ProcessBuilder(command).directory(dir.toFile()).redirectInput(ProcessBuilder.Redirect.PIPE)
                .start();
        p.getOutputStream().close();
        // Both streams are small in these tests; read them after the process ends.
        if (!p.waitFor(120, TimeUnit.SECONDS)) {
            p.destroyForcibly();
            throw new AssertionError("nearfit did not finish within 120 s: " + command);
        }
        String out = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
        String err = new String(p.getErrorStream().readAllBytes(), StandardCharsets.UTF_8);
        return new Result(p.exitValue(), out, err);
    }

    /** The test class path (surefire passes the real one in surefire.test.class.path). */
    private static String classPath() {
        String cp = System.getProperty("surefire.test.class.path");
        if (cp == null || cp.isBlank()) {
            cp = System.getProperty("java.class.path");
        }
        return cp.replace(File.pathSeparatorChar == ':' ? ";" : ":", File.pathSeparator);
    }
}
