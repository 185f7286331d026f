package reprise.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * Mistakes a new user makes on the command line: each is one line on stderr naming the option or field and
 * the value, exit code 2, nothing on stdout.
 */
class UsageErrorTest {

    record Run(int code, String out, String err) {
    }

    static Run run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Main.run(args, new PrintWriter(out), new PrintWriter(err));
        return new Run(code, out.toString(), err.toString());
    }

    static Stream<Arguments> mistakes() {
        return Stream.of(
            Arguments.of(new String[] {}, "reprise: a command is required (see 'reprise --help')"),
            Arguments.of(new String[] {"check"},
                "reprise check: Missing required parameter: 'FILE' (see 'reprise check --help')"),
            Arguments.of(new String[] {"solve", "--x", "tft"},
                "reprise solve: Missing required option: '--y=SPEC' (see 'reprise solve --help')"),
            Arguments.of(new String[] {"solve", "--x", "tft", "--y", "tft", "--nosie", "0.05"},
                "reprise solve: Unknown options: '--nosie', '0.05'; did you mean --noise? "
                    + "(see 'reprise solve --help')"),
            Arguments.of(new String[] {"solve", "--x", "tft", "--y", "tft", "--noise", "5"},
                "reprise solve: --noise must be a probability in [0, 1]: 5"),
            Arguments.of(new String[] {"simulate", "--x", "tft", "--y", "tft", "--rounds", "x"},
                "reprise simulate: Invalid value for option '--rounds': 'x' is not a long "
                    + "(see 'reprise simulate --help')"));
    }

    @ParameterizedTest
    @MethodSource("mistakes")
    void mistakeIsOneLine(String[] args, String message) {
        Run r = run(args);
        assertEquals(Main.BAD_INPUT, r.code(), r.err());
        assertEquals("", r.out());
        assertEquals(message, r.err().strip());
    }

    @Test
    void strategyTypoListsTheKnownNames() {
        Run r = run("solve", "--x", "tfft", "--y", "tft");
        assertEquals(Main.BAD_INPUT, r.code(), r.err());
        assertEquals(1, r.err().strip().lines().count(), r.err());
        assertFalse(r.err().contains("\n("), r.err());
        org.junit.jupiter.api.Assertions.assertTrue(r.err().startsWith("reprise solve: --x: unknown strategy 'tfft'; known: allc, "), r.err());
    }

    @Test
    void claimsFolderIsNamedAsAFolder(@TempDir Path dir) throws IOException {
        Files.createDirectory(dir.resolve("claims"));
        Path file = dir.resolve("e.yaml");
        Files.writeString(file, "experiment: e\npairs:\n  - name: p\n    x: tft\n    y: tft\ngrid:\n  noise: [0.01]\n"
            + "  rounds: [10]\nreplicates: 10\nclaims: claims\n");
        Path out = dir.resolve("out");
        Run r = run("check", file.toString(), "--out", out.toString(), "--quiet");
        assertEquals(Main.BAD_INPUT, r.code(), r.err());
        assertEquals("", r.out());
        assertEquals("reprise check: " + file + ":10: claims: is a folder, not a claims file: " + dir.resolve("claims"),
            r.err().strip());
        assertFalse(Files.exists(out));
    }
}
