package nearfit.cli;

import java.io.IOException;
import java.io.OutputStream;
import java.io.PrintWriter;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.SplittableRandom;
import java.util.zip.GZIPOutputStream;

/**
 * The training run behind the start-up cache ({@code scripts/startup-cache}): runs the commands a user runs
 * most (every command's usual path, the quick lane of a plain describe line and help), in one JVM, on a
 * small generated compressor log, so that the classes they load and link are recorded. Not a user command;
 * what it computes is thrown away.
 *
 * <p>The log: 4 compressors, 10-minute rows, discharge temperature (°C) rising with load (%) and ambient
 * temperature (°C), with noise; plain and gzip copies, so both load paths are trained.
 */
public final class StartupTraining {
    private StartupTraining() {
    }

    /**
     * {@code args[0]}: an empty working folder; further arguments: the only commands to run (default all; fit
     * always runs first when predict or check is named, for their model). Exits 0 when every command ran as
     * expected.
     */
    public static void main(String[] args) throws IOException {
        Path dir = Path.of(args[0]);
        Path csv = writeLog(dir.resolve("train.csv"), 6000);
        Path gz = dir.resolve("train.csv.gz");
        try (OutputStream o = new GZIPOutputStream(Files.newOutputStream(gz))) {
            Files.copy(csv, o);
        }
        String c = csv.toString();
        String model = dir.resolve("train.nfm").toString();
        String[][] runs = {
            {"describe", c},
            {"describe", gz.toString(), "--format", "json"},
            {"tune", c, "-x", "load_pct,ambient_c", "-y", "discharge_c", "--kmax", "30"},
            {"fit", gz.toString(), "-x", "load_pct,ambient_c", "-y", "discharge_c", "--k", "10", "--group", "unit",
                "--where", "unit != C4", "-o", model, "--quiet"},
            {"predict", model, c, "-o", dir.resolve("pred.csv").toString(), "--quiet"},
            {"check", model, c, "--where", "unit = C4", "--quiet"},
            {"plot", c, "-x", "load_pct", "-y", "discharge_c", "--size", "100x30"},
            {"--help"},
            {"fit", "--help"},
        };
        PrintWriter sink = new PrintWriter(Writer.nullWriter());
        PrintWriter err = new PrintWriter(System.err, true);
        int failed = 0;
        java.util.List<String> only = java.util.Arrays.asList(args).subList(1, args.length);
        for (String[] run : runs) {
            boolean modelNeeded = run[0].equals("fit") && (only.contains("predict") || only.contains("check"));
            if (!only.isEmpty() && !only.contains(run[0]) && !modelNeeded) {
                continue;
            }
            int status = Main.run(run, sink, err);
            if (status != 0 && !(run[0].equals("check") && status == Main.EXIT_CHECK_FAILED)) {
                err.println("startup training: " + String.join(" ", run) + " exited " + status);
                failed++;
            }
        }
        System.exit(failed == 0 ? 0 : 1);
    }

    private static Path writeLog(Path file, int rowsPerUnit) throws IOException {
        SplittableRandom random = new SplittableRandom(20261202L);
        StringBuilder sb = new StringBuilder(rowsPerUnit * 4 * 48).append("time,unit,load_pct,ambient_c,discharge_c\n");
        long start = 1_767_225_600_000L; // 2026-01-01T00:00:00Z
        for (int r = 0; r < rowsPerUnit; r++) {
            String time = java.time.Instant.ofEpochMilli(start + r * 600_000L).toString();
            for (int u = 1; u <= 4; u++) {
                double load = 20 + 80 * random.nextDouble();
                double ambient = -10 + 40 * random.nextDouble();
                double discharge = 60 + 0.55 * load + 0.8 * ambient + 3 * (random.nextDouble() - 0.5);
                sb.append(time).append(",C").append(u).append(',')
                        .append(String.format(Locale.ROOT, "%.2f,%.1f,%.2f", load, ambient, discharge)).append('\n');
            }
        }
        Files.writeString(file, sb, StandardCharsets.UTF_8);
        return file;
    }
}
