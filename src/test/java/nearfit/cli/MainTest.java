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
}
