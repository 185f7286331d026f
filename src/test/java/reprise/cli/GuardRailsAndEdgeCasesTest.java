package reprise.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

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
 * Guard rails (each warning is triggered and must reach cases.csv or results.csv and report.md) and edge
 * cases, run through {@code check} in-process with few games.
 *
 * <p>Exit codes: every run is made at alpha = 1e-4 (see {@link #experiment}), where Holm's correction
 * makes a correct engine's run disagree with probability at most 1e-4 (Holm 1979, family-wise error);
 * the budget for the whole file is written beside {@code experiment}. An exit 1 here is a real
 * disagreement worth reading, never a reason to change the seed.
 */
class GuardRailsAndEdgeCasesTest {

    @TempDir
    Path tmp;

    private record Run(int code, String stdout, String stderr, Path out) {
        String read(String name) throws IOException {
            return Files.readString(out.resolve(name));
        }
    }

    private Run check(String name, String yaml, String... extra) throws IOException {
        Path file = tmp.resolve(name + ".yaml");
        Files.writeString(file, yaml);
        Path out = tmp.resolve(name + "-out");
        Stream<String> threads = java.util.Arrays.asList(extra).contains("--threads") ? Stream.of()
            : Stream.of("--threads", "2");
        String[] args = Stream.concat(Stream.concat(Stream.of("check", file.toString(), "--out", out.toString(),
            "--quiet"), threads), Stream.of(extra)).toArray(String[]::new);
        StringWriter o = new StringWriter();
        StringWriter e = new StringWriter();
        int code = Main.run(args, new PrintWriter(o), new PrintWriter(e));
        return new Run(code, o.toString(), e.toString(), out);
    }

    /**
     * A one-pair experiment at alpha = 1e-4. These runs assert an exit code under the true model, so their
     * verdicts must not hinge on the seed: 15 runs each assert OK (2 in the rerun test, 1 each in five
     * single tests, 7 edge cases, the uncorrected run), and none of them is about power. With Holm at
     * 1e-4 a run falsely disagrees with probability at most 1e-4 (if the tests hold their level); the
     * uncorrected run makes 30 tests (its report counts them) at 1e-4 each, at most 3e-3. Union bound for
     * the file: 14 x 1e-4 + 3e-3 = 4.4e-3, so a deliberate simulator change that alters the draws is very
     * unlikely to turn one of them red (and would be a real finding if it did: never re-seed).
     */
    private static String experiment(String x, String y, String noise, String horizon, int replicates, String more) {
        return "experiment: e\npairs:\n  - {name: p, x: '" + x + "', y: '" + y + "'}\ngrid:\n  noise: [" + noise
            + "]\n  " + horizon + "\nreplicates: " + replicates + "\nseed: 5\nalpha: 0.0001\n" + more;
    }

    @Test
    void finishedRunIsNotOverwrittenWithoutForce() throws IOException {
        Run first = check("twice", experiment("tft", "gtft", "0.01", "rounds: [20]", 200, ""));
        assertEquals(Main.OK, first.code(), first.stderr());
        byte[] results = Files.readAllBytes(first.out().resolve("results.csv"));
        byte[] runJson = Files.readAllBytes(first.out().resolve("run.json"));

        Run again = check("twice", experiment("tft", "gtft", "0.01", "rounds: [20]", 200, "").replace("seed: 5",
            "seed: 6"));
        assertEquals(Main.BAD_INPUT, again.code());
        assertTrue(again.stderr().contains("holds a finished run (run.json); use --force to replace it"),
            again.stderr());
        assertArrayEquals(results, Files.readAllBytes(first.out().resolve("results.csv")));
        assertArrayEquals(runJson, Files.readAllBytes(first.out().resolve("run.json")));

        Run forced = check("twice", experiment("tft", "gtft", "0.01", "rounds: [20]", 200, "").replace("seed: 5",
            "seed: 6"), "--force");
        assertEquals(Main.OK, forced.code(), forced.stderr());
        assertFalse(java.util.Arrays.equals(results, Files.readAllBytes(first.out().resolve("results.csv"))),
            "--force did not replace results.csv");
        assertTrue(forced.read("run.json").contains("\"seed\" : 6") || forced.read("run.json").contains("\"seed\":6"),
            forced.read("run.json"));
    }

    @Test
    void longMixingTimeAgainstTheGameLengthIsWarned() throws IOException {
        Run r = check("mixing", experiment("tft", "gtft", "0.01", "rounds: [5, 500]", 100, ""));
        assertEquals(Main.OK, r.code(), r.stderr());
        String cases = r.read("cases.csv");
        assertTrue(cases.contains("mixing time") && cases.contains("against a game length of 5 rounds"), cases);
        assertTrue(r.read("report.md").contains("p/rounds=5: mixing time"), r.read("report.md"));
        assertFalse(r.read("report.md").contains("p/rounds=500: mixing time"));
    }

    @Test
    void smallExpectedCountsSwitchTestsAndTheReportSaysSo() throws IOException {
        Run r = check("sparse", experiment("tft", "gtft", "0.01", "rounds: [20]", 50, "snapshots: [10]\n"));
        assertEquals(Main.OK, r.code(), r.stderr());
        String results = r.read("results.csv");
        assertTrue(results.contains("sparse cells (expected count below 5) pooled within their rows"), results);
        assertTrue(results.contains("exact multinomial test"), results);
        String report = r.read("report.md");
        assertTrue(report.contains("p: expected counts too small for the chi-square approximation, handled in "
            + "transitions ("), report);
        assertTrue(report.contains("snapshot_10 (exact multinomial test)"), report);
    }

    /**
     * Tit-for-tat against itself at noise 1e-8: CC and DD are left with probability about 2e-8 per round and
     * CD, DC alternate, so |lambda_2| is within about 1e-8 of 1 (computed by hand from the 4x4 matrix).
     */
    @Test
    void nearlyReducibleChainIsWarned() throws IOException {
        Run r = check("nearly", experiment("tft", "tft", "1e-8", "rounds: [50]", 100, ""));
        assertEquals(Main.OK, r.code(), r.stderr());
        assertTrue(r.read("cases.csv").contains("nearly reducible chain"), r.read("cases.csv"));
        assertTrue(r.read("report.md").contains("nearly reducible chain"), r.read("report.md"));
    }

    @Test
    void manyTestsWithoutCorrectionAreWarned() throws IOException {
        Run r = check("uncorrected", experiment("tft", "gtft", "0.01", "rounds: [10, 20, 40]", 100,
            "correction: none\n"));
        assertEquals(Main.OK, r.code(), r.stderr());
        assertTrue(r.read("report.md").contains("tests were made without a multiple-testing correction"),
            r.read("report.md"));
        Run corrected = check("corrected", experiment("tft", "gtft", "0.01", "rounds: [10, 20, 40]", 100, ""));
        assertFalse(corrected.read("report.md").contains("without a multiple-testing correction"));
    }

    /**
     * A thread count beyond {@link reprise.sim.SimulationSpec#MAX_THREADS} is refused before anything is read
     * or allocated (once it reached the tally-memory guard, whose limit depends on the heap; the guard itself
     * is tested with time-resolved rounds in SimulationSpecTest).
     */
    @Test
    void absurdThreadCountsAreRefusedBeforeStarting() throws IOException {
        Run r = check("memory", experiment("tft", "gtft", "0.01", "rounds: [20]", 100, "snapshots: [1, 2]\n"),
            "--threads", "100000000");
        assertEquals(Main.BAD_INPUT, r.code());
        assertEquals("reprise check: --threads must be between 1 and 1024: 100000000", r.stderr().strip());
        assertFalse(Files.exists(r.out()));
    }

    static Stream<Arguments> edgeCases() {
        return Stream.of(
            Arguments.of("noise-zero", experiment("wsls", "tft", "0", "rounds: [1, 20]", 200, "snapshots: [1]\n")),
            Arguments.of("noise-near-half", experiment("wsls", "tft", "0.49", "rounds: [1, 20]", 200, "")),
            Arguments.of("continuation-zero-and-long", experiment("tft", "gtft", "0.01", "continuation: [0, 0.9999]",
                40, "")),
            Arguments.of("one-round", experiment("reactive:0.3,0.6@0.5", "gtft", "0.05", "rounds: [1]", 400,
                "snapshots: [1]\n")),
            Arguments.of("probabilities-0-and-1", experiment("allc", "alld", "0", "rounds: [1, 10]", 50, "")),
            Arguments.of("deterministic-tables", experiment("memory1:1,0,0,1", "memory1:1,1,0,0", "0, 1",
                "rounds: [5]", 50, "")),
            Arguments.of("memory-three", experiment("memory3:" + String.join(",", java.util.Collections.nCopies(32,
                "0.9,0.1")), "tf2t", "0.02", "rounds: [30]", 200, "snapshots: [3]\n")));
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("edgeCases")
    void edgeCaseRunsAndAgrees(String name, String yaml) throws IOException {
        Run r = check(name, yaml);
        assertEquals(Main.OK, r.code(), r.stderr() + r.stdout());
        assertEquals("", r.stderr());
        for (String f : new String[] {"results.csv", "cases.csv", "curves.csv", "report.md", "run.json"}) {
            assertTrue(Files.isRegularFile(r.out().resolve(f)), f);
        }
    }

    /**
     * Tit-for-tat against suspicious tit-for-tat without noise alternates CD, DC for ever: the chain has
     * several closed classes, so there is no stationary distribution; the time average from the first
     * round is CD 1/2, DC 1/2 (by hand: the play is CD, DC, CD, ...).
     */
    @Test
    void periodicDeterministicPairReportsTheCycleAndTheTimeAverage() throws IOException {
        Run r = check("periodic", experiment("tft", "stft", "0", "rounds: [1, 2, 51]", 100, "snapshots: [1]\n"));
        assertEquals(Main.OK, r.code(), r.stderr());
        String cases = r.read("cases.csv");
        assertTrue(cases.contains("CD -> DC"), cases);
        assertTrue(cases.contains("time average from the first round: CC 0, CD 0.5, DC 0.5, DD 0"), cases);
        assertTrue(cases.contains("no stationary comparison is made"), cases);
        assertFalse(cases.contains("no unique stationary distribution: no unique"), cases);
        String results = r.read("results.csv");
        assertFalse(results.contains(",stationary,"), "a stationary comparison was made:\n" + results);
        // 51 rounds: CD in 26 of them, exactly (no randomness in this pair)
        assertTrue(results.contains("p/rounds=51,p,tft,stft,0,0,rounds,51,CD,exact," + (26.0 / 51)), results);
        assertTrue(r.read("report.md").contains("time average from the first round"), r.read("report.md"));
    }

    @Test
    void userWrittenAgentHasNoExactPredictionSaidPlainly() throws IOException {
        Run r = check("agent", experiment("agent:runcap", "tft", "0.05", "rounds: [30]", 100, ""));
        assertEquals(Main.OK, r.code(), r.stderr());
        String results = r.read("results.csv");
        assertTrue(results.contains("no-prediction,no exact prediction for agent:runcap"), results);
        assertTrue(r.read("report.md").contains("no exact prediction for agent:runcap"), r.read("report.md"));
    }
}
