package nearfit.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Batch commands load only the columns they use: a log with an extra column of junk (numbers with text
 * and quoted commas among them, so the whole file has bad cells there) gives the same output as the log
 * without it, and the junk's bad cells are not counted.
 */
class UsedColumnsTest {
    @TempDir
    static Path dir;
    static Path healthy;
    static Path healthyJunk;
    static Path weak;
    static Path weakJunk;
    static String model;

    @BeforeAll
    static void writeLogsAndFit() throws IOException {
        healthy = WindSiteCsv.write(dir.resolve("healthy.csv"), 3, 200, 21, 0, 0, 0);
        weak = WindSiteCsv.write(dir.resolve("weak.csv"), 3, 200, 22, 2, 100, 0.25);
        healthyJunk = withJunkColumn(healthy, dir.resolve("healthy-junk.csv"));
        weakJunk = withJunkColumn(weak, dir.resolve("weak-junk.csv"));
        model = dir.resolve("ref.nfm").toString();
        CliRun.Result r = CliRun.inProcess("fit", healthy.toString(), "-x", "wind_ms", "-y", "power_kw",
                "--k", "15", "--group", "turbine", "-o", model, "--quiet");
        assertEquals(0, r.status(), r.toString());
    }

    /** A copy with a column "note" after turbine: mostly numbers, every 25th row text, every 40th a quoted "a,b". */
    static Path withJunkColumn(Path from, Path to) throws IOException {
        List<String> lines = Files.readAllLines(from, StandardCharsets.UTF_8);
        StringBuilder sb = new StringBuilder();
        for (int i = 0; i < lines.size(); i++) {
            String[] f = lines.get(i).split(",", 3);
            String note = i == 0 ? "note" : i % 25 == 0 ? "sensor offline" : i % 40 == 0 ? "\"a,b\"" : Integer.toString(i);
            sb.append(f[0]).append(',').append(f[1]).append(',').append(note).append(',').append(f[2]).append('\n');
        }
        Files.writeString(to, sb.toString(), StandardCharsets.UTF_8);
        return to;
    }

    @Test
    void theJunkColumnHasBadCellsWhenTheWholeFileIsDescribed() {
        CliRun.Result r = CliRun.inProcess("describe", "--quiet", healthyJunk.toString());
        assertEquals(0, r.status(), r.toString());
        // Of 600 rows, 24 are multiples of 25 and 12 more are multiples of 40: 36 bad cells.
        assertTrue(r.out().contains("bad cells: 36 (read as missing)"), r.out());
    }

    @Test
    void fitWithARowConditionGivesTheSameModelReportAndCountsNoBadCells() {
        String[] args = {"-x", "wind_ms", "-y", "power_kw", "--k", "9", "--where", "turbine != T03 and temp_c > 0"};
        CliRun.Result plain = fit(healthy, "plain.nfm", args);
        CliRun.Result junk = fit(healthyJunk, "junk.nfm", args);
        assertEquals(plain.out().replace(healthy.toString(), "LOG").replace("plain.nfm", "M"),
                junk.out().replace(healthyJunk.toString(), "LOG").replace("junk.nfm", "M"));
        assertTrue(junk.err().contains("nearfit: read 600 rows from " + healthyJunk + " in "), junk.err());
        assertFalse(junk.err().contains("bad cells"), junk.err());
    }

    private static CliRun.Result fit(Path log, String out, String... args) {
        List<String> all = new java.util.ArrayList<>(List.of("fit", log.toString(), "-o", dir.resolve(out).toString(),
                "--force"));
        all.addAll(List.of(args));
        CliRun.Result r = CliRun.inProcess(all.toArray(new String[0]));
        assertEquals(0, r.status(), r.toString());
        return r;
    }

    @Test
    void predictWritesTheSameRowsWithOrWithoutTheJunkColumn() {
        CliRun.Result plain = CliRun.inProcess("predict", model, weak.toString(), "--quiet");
        CliRun.Result junk = CliRun.inProcess("predict", model, weakJunk.toString(), "--quiet");
        assertEquals(0, junk.status(), junk.toString());
        assertEquals(601, junk.out().lines().count());
        assertEquals(plain.out(), junk.out());
    }

    @Test
    void checkGivesTheSameReportWithOrWithoutTheJunkColumnAndCountsNoBadCells() {
        CliRun.Result plain = CliRun.inProcess("check", model, weak.toString(), "--where", "wind_ms > 4");
        CliRun.Result junk = CliRun.inProcess("check", model, weakJunk.toString(), "--where", "wind_ms > 4");
        assertEquals(1, junk.status(), junk.toString());
        // The header's time of the run may differ by a second between the two.
        String run = "run: nearfit \\S+ at \\S+";
        assertEquals(plain.out().replace(weak.toString(), "LOG").replaceAll(run, "RUN"),
                junk.out().replace(weakJunk.toString(), "LOG").replaceAll(run, "RUN"));
        assertFalse(junk.err().contains("bad cells"), junk.err());
    }

    @Test
    void tuneAndPlotGiveTheSameOutputWithOrWithoutTheJunkColumn() {
        for (String command : new String[] {"tune", "plot"}) {
            String[] extra = command.equals("tune") ? new String[] {"--kmax", "20"} : new String[] {"--ascii", "--k", "9"};
            List<String> a = new java.util.ArrayList<>(List.of(command, "", "-x", "wind_ms,temp_c", "-y", "power_kw",
                    "--quiet"));
            a.addAll(List.of(extra));
            a.set(1, healthy.toString());
            CliRun.Result plain = CliRun.inProcess(a.toArray(new String[0]));
            a.set(1, healthyJunk.toString());
            CliRun.Result junk = CliRun.inProcess(a.toArray(new String[0]));
            assertEquals(0, junk.status(), junk.toString());
            assertFalse(junk.out().isBlank(), command);
            assertEquals(plain.out(), junk.out(), command);
        }
    }

    @Test
    void aRowConditionNamingAColumnTheFileLacksNamesTheOptionAndListsTheColumns() {
        CliRun.Result r = CliRun.inProcess("check", model, weak.toString(), "--quiet", "--where", "rotor_rpm > 3");
        assertEquals(2, r.status(), r.toString());
        assertEquals("nearfit: --where: no column \"rotor_rpm\" in " + weak
                + " (columns: time, turbine, wind_ms, temp_c, power_kw)", r.err().strip());
    }

    @Test
    void aMissingModelInputIsNamedWithTheColumnsOfTheFile() throws IOException {
        Path other = Files.writeString(dir.resolve("other.csv"), "speed,note,power_kw\n3.5,x,100\n");
        CliRun.Result r = CliRun.inProcess("predict", model, other.toString(), "--quiet");
        assertEquals(2, r.status(), r.toString());
        assertEquals("nearfit: model input: no column \"wind_ms\" in " + other + " (columns: speed, note, power_kw)",
                r.err().strip());
    }
}
