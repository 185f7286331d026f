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
}
