package reprise.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * Inputs that once ran for minutes, ran out of memory or overflowed: each is now refused up front, in one
 * line naming the option, with exit code 2, before any work (so these tests take milliseconds whatever the
 * heap size).
 */
class HostileInputTest {

    @TempDir
    Path tmp;

    private static UsageErrorTest.Run run(String... args) {
        return UsageErrorTest.run(args);
    }

    static Stream<Arguments> refusals() {
        return Stream.of(
            // beyond the 64-bit per-game sums of squares (check refuses the same from a file)
            Arguments.of(new String[] {"simulate", "--x", "tft", "--y", "tft", "--replicates", "10000000000000",
                "--rounds", "1000000000"}, "reprise simulate: --replicates and --rounds/--continuation: "
                    + "10000000000000 games of 1000000000 rounds would overflow"),
            // one game of 10^15 rounds: once silent for minutes; its sum of squares overflows as well
            Arguments.of(new String[] {"simulate", "--x", "tft", "--y", "tft", "--replicates", "1", "--rounds",
                "1000000000000000"}, "reprise simulate: --replicates and --rounds/--continuation: 1 game of "
                    + "1000000000000000 rounds would overflow"),
            Arguments.of(new String[] {"simulate", "--x", "tft", "--y", "tft", "--rounds", "10", "--threads",
                "100000"}, "reprise simulate: --threads must be between 1 and 1024: 100000"),
            // once printed games_for_half_width: -9223372036854775808
            Arguments.of(new String[] {"plan", "--x", "tft", "--y", "gtft", "--noise", "0.01", "--rounds", "100",
                "--half-width", "1e-10"}, "reprise plan: a half-width of 1.0E-10 needs about"),
            Arguments.of(new String[] {"plan", "--x", "tft", "--y", "gtft", "--noise", "0.01", "--rounds", "100",
                "--detect", "1e-12"}, "reprise plan: a deviation of 1.0E-12 needs about"),
            Arguments.of(new String[] {"calibrate", "--x", "tft", "--y", "gtft", "--noise", "0.01", "--rounds",
                "10", "--repetitions", "2000000000"}, "reprise calibrate: --repetitions must be between 1 and 100000"),
            Arguments.of(new String[] {"slurm-script", "experiments/quota-demo.yaml", "--jar", "reprise.jar",
                "--tasks", "1000000000"}, "reprise slurm-script: --tasks must be between 1 and 4000000"),
            Arguments.of(new String[] {"check", "experiments/quota-demo.yaml", "--shard", "1/1000000000"},
                "reprise check: --shard must be I/N with 1 <= I <= N <= 4000000"));
    }

    @ParameterizedTest
    @MethodSource("refusals")
    void refusedInOneLineBeforeAnyWork(String[] args, String start) {
        UsageErrorTest.Run r = run(args);
        assertEquals(Main.BAD_INPUT, r.code(), r.err());
        assertEquals("", r.out());
        assertEquals(1, r.err().strip().lines().count(), r.err());
        assertTrue(r.err().startsWith(start), r.err());
    }

    @Test
    void aScriptPathBelowARegularFileIsBadInputNotACrash() throws IOException {
        Path file = Files.writeString(tmp.resolve("afile"), "x");
        UsageErrorTest.Run r = run("slurm-script", "experiments/quota-demo.yaml", "--jar", "reprise.jar", "--tasks", "4",
            "--script", file.resolve("run.sh").toString());
        assertEquals(Main.BAD_INPUT, r.code(), r.err());
        assertEquals("reprise slurm-script: cannot write into " + file + ": " + file + " is a file, not a folder",
            r.err().strip());
        assertEquals("x", Files.readString(file));
    }

    @Test
    void manyTasksArePlannedInLinearTime() {
        // 4e6 tasks of the demo's units: the old planner scanned every task for every unit and task (hours)
        UsageErrorTest.Run r = run("slurm-script", "experiments/quota-demo.yaml", "--jar", "reprise.jar", "--tasks", "4000000");
        assertEquals(Main.OK, r.code(), r.err());
        assertTrue(r.out().contains("4000000 tasks"), r.out());
        assertFalse(r.out().isEmpty());
    }

    /** A device as the experiment file: once read until out of memory (16-23 s, 5.5 GB), now refused unread. */
    @Test
    void aDeviceIsNotReadAsAnExperiment() {
        Path zero = Path.of("/dev/zero");
        if (!Files.exists(zero)) {
            return;
        }
        UsageErrorTest.Run r = run("check", zero.toString(), "--out", tmp.resolve("out").toString(), "--quiet");
        assertEquals(Main.BAD_INPUT, r.code(), r.err());
        assertEquals("reprise check: /dev/zero: file: is not a regular file (a device or pipe?), not an experiment file",
            r.err().strip());
        assertFalse(Files.exists(tmp.resolve("out")));
    }

    /** A 6 MB experiment file is refused from its size, before YAML parsing (which once took 9 s). */
    @Test
    void aHugeExperimentFileIsRefusedFromItsSize() throws IOException {
        Path big = tmp.resolve("big.yaml");
        Files.writeString(big, "experiment: big\n#" + "x".repeat(6_000_000) + "\n");
        UsageErrorTest.Run r = run("check", big.toString(), "--out", tmp.resolve("out").toString(), "--quiet");
        assertEquals(Main.BAD_INPUT, r.code(), r.err());
        assertEquals("reprise check: " + big + ": file: is too large for an experiment file (6000018 bytes; at most "
            + "1048576)", r.err().strip());
        assertFalse(Files.exists(tmp.resolve("out")));
    }

    /** {@code --out ''} once wrote the results into the current folder and printed "results in ". */
    @ParameterizedTest
    @MethodSource("emptyPaths")
    void anEmptyPathOptionIsRefused(String[] args, String option) {
        UsageErrorTest.Run r = run(args);
        assertEquals(Main.BAD_INPUT, r.code(), r.err());
        assertEquals(1, r.err().strip().lines().count(), r.err());
        assertTrue(r.err().startsWith("reprise " + args[0] + ": Invalid value for " + option + ": must name a file or "
            + "folder, not be empty"), r.err());
        assertEquals("", r.out());
    }

    static Stream<Arguments> emptyPaths() {
        String tiny = "src/test/resources/reprise/ok/tiny.yaml";
        return Stream.of(
            Arguments.of(new String[] {"check", tiny, "--out", "", "--quiet"}, "option '--out'"),
            Arguments.of(new String[] {"check", tiny, "--out", "  ", "--quiet"}, "option '--out'"),
            Arguments.of(new String[] {"check", ""}, "positional parameter at index 0 (FILE)"),
            Arguments.of(new String[] {"calibrate", "--x", "tft", "--y", "gtft", "--rounds", "10", "--repetitions", "5",
                "--out", ""}, "option '--out'"),
            Arguments.of(new String[] {"slurm-script", tiny, "--tasks", "2", "--out", ""}, "option '--out'"),
            Arguments.of(new String[] {"slurm-script", tiny, "--tasks", "2", "--script", ""}, "option '--script'"),
            Arguments.of(new String[] {"merge", "", "--out", "x"}, "positional parameter at index 0 (DIR)"));
    }

    /**
     * Without {@code --out} an over-long name (it would make results/NAME) once failed with "File name too
     * long" after creating an empty results/; now the name is refused before any folder is made.
     */
    @Test
    void anOverLongNameWithoutOutCreatesNothing() throws IOException {
        Path file = tmp.resolve("long.yaml");
        String name = "n".repeat(300);
        Files.writeString(file, "experiment: " + name + "\npairs:\n  - {name: p, x: tft, y: gtft}\ngrid:\n"
            + "  rounds: [20]\nreplicates: 50\n");
        boolean resultsBefore = Files.exists(Path.of("results"));
        UsageErrorTest.Run r = run("check", file.toString(), "--quiet");
        assertEquals(Main.BAD_INPUT, r.code(), r.err());
        assertEquals("reprise check: " + file + ":1: experiment: is 300 characters long; at most 100 (it names the "
            + "output folder)", r.err().strip());
        assertEquals(resultsBefore, Files.exists(Path.of("results")), "a results folder was created");
        assertFalse(Files.exists(Path.of("results", name)));
    }

    /** An --out whose new folder name is longer than file systems allow is refused before anything is made. */
    @Test
    void anOverLongFolderNameIsRefusedBeforeAnythingIsMade() {
        Path out = tmp.resolve("a").resolve("b".repeat(300));
        UsageErrorTest.Run r = run("check", "src/test/resources/reprise/ok/tiny.yaml", "--out", out.toString(), "--quiet");
        assertEquals(Main.BAD_INPUT, r.code(), r.err());
        assertTrue(r.err().strip().endsWith("cannot be created: a folder name of 300 bytes is longer than file systems "
            + "allow (255)"), r.err());
        assertFalse(Files.exists(tmp.resolve("a")));
    }

    /** A garbage or binary curves.csv given to plot: one line naming the file, not Java's "Input length = 1". */
    @ParameterizedTest
    @MethodSource("garbageCurves")
    void plotRefusesAGarbageCurvesFileInOneLine(byte[] content, String reason) throws IOException {
        Path dir = Files.createDirectory(tmp.resolve("res"));
        Files.write(dir.resolve("curves.csv"), content);
        UsageErrorTest.Run r = run("plot", dir.toString());
        assertEquals(Main.BAD_INPUT, r.code(), r.err());
        assertEquals(1, r.err().strip().lines().count(), r.err());
        assertTrue(r.err().startsWith("reprise plot: " + dir.resolve("curves.csv") + ": " + reason), r.err());
        assertFalse(Files.exists(dir.resolve("figures")));
    }

    static Stream<Arguments> garbageCurves() {
        byte[] binary = new byte[4096];
        new java.util.Random(7).nextBytes(binary);
        return Stream.of(
            Arguments.of(binary, "is not UTF-8 text"),
            Arguments.of("PNG\0\0\0".getBytes(java.nio.charset.StandardCharsets.UTF_8), "contains a NUL character"),
            Arguments.of("just some words\nand more\n".getBytes(java.nio.charset.StandardCharsets.UTF_8),
                "not a curves file"),
            Arguments.of("\"unclosed quote,1,2\n".getBytes(java.nio.charset.StandardCharsets.UTF_8),
                "cannot be read: (startline 1) EOF reached before encapsulated token finished"));
    }
}
