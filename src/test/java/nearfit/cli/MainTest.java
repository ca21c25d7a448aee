package nearfit.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;

import org.junit.jupiter.api.Test;

class MainTest {
    record Result(int status, String out, String err) {}

    static Result run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int status = Main.run(args, new PrintWriter(out), new PrintWriter(err));
        return new Result(status, out.toString(), err.toString());
    }

    @Test
    void unknownOptionIsAUsageErrorOnOneLine() {
        Result r = run("--no-such-option");
        assertEquals(2, r.status());
        assertTrue(r.err().startsWith("nearfit: "), r.err());
        assertEquals(1, r.err().strip().lines().count(), r.err());
    }

    @Test
    void aMistypedOptionGetsTheClosestOptionOnASecondLine() {
        Result r = run("check", "ref.nfm", "log.csv", "--grup", "turbine");
        assertEquals(2, r.status());
        assertEquals("nearfit: Unknown options: '--grup', 'turbine'\nnearfit: did you mean --group?\n", r.err());
        // A swap of neighbouring letters is one edit: --wehre is --where, not --weights.
        assertTrue(run("fit", "log.csv", "-x", "a", "-y", "b", "-o", "m.nfm", "--wehre", "a > 1").err().endsWith("nearfit: did you mean --where?\n"));
        assertTrue(run("check", "--limt=3", "a", "b").err().endsWith("nearfit: did you mean --limit?\n"));
    }

    @Test
    void aMistypedCommandGetsTheClosestCommand() {
        Result r = run("chek", "ref.nfm", "log.csv");
        assertEquals(2, r.status());
        assertTrue(r.err().startsWith("nearfit: "), r.err());
        assertTrue(r.err().endsWith("\nnearfit: did you mean check?\n"), r.err());
        assertEquals(2, r.err().lines().count(), r.err());
    }

    @Test
    void aWordCloseToNoNameGetsNoGuess() {
        Result r = run("xyz");
        assertEquals(2, r.status());
        assertEquals(1, r.err().lines().count(), r.err());
    }

    @Test
    void versionPrintsTheToolName() {
        Result r = run("--version");
        assertEquals(0, r.status());
        assertTrue(r.out().startsWith("nearfit "), r.out());
    }

    @Test
    void bashCompletionNamesTheCommands() {
        Result r = run("completion", "bash");
        assertEquals(0, r.status());
        assertTrue(r.out().contains("describe") && r.out().contains("check"), "completion lists commands");
    }

    @Test
    void aCommandLineThatNamesACommandBuildsOnlyThatCommand() {
        picocli.CommandLine one = Main.commandLine(picocli.CommandLine.defaultFactory(),
                new String[] {"--debug", "describe", "check"}); // "check" here is a file name
        assertEquals(java.util.Set.of("describe"), one.getSubcommands().keySet());
        for (String[] args : new String[][] {{}, {"--help"}, {"--version"}, {"chek", "m.nfm"}}) {
            assertEquals(java.util.Set.of("view", "describe", "plot", "tune", "fit", "predict", "check", "completion"),
                    Main.commandLine(picocli.CommandLine.defaultFactory(), args).getSubcommands().keySet(),
                    String.join(" ", args));
        }
        // Help still lists every command, and a mistyped one still gets its suggestion.
        Result help = run("--help");
        assertTrue(help.out().contains("describe") && help.out().contains("completion"), help.out());
        Result typo = run("chek", "m.nfm", "data.csv");
        assertEquals(2, typo.status());
        assertTrue(typo.err().contains("did you mean check?"), typo.err());
    }
}
