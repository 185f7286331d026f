package reprise.sim;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigDecimal;
import java.math.BigInteger;
import java.util.ArrayList;
import java.util.List;
import java.util.function.Supplier;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import reprise.game.Horizon;
import reprise.game.Match;
import reprise.game.Noise;
import reprise.game.StageGame;

/** Validation messages, progress reports, burn-in bookkeeping and exact identities of the tallies. */
class SimulationSpecTest {
    private static final Match M = DeterminismTest.match("wsls", "tf2t", Noise.symmetric(0.05, 0.05));
    private static final SimulationSpec BASE = SimulationSpec.of(M, Horizon.rounds(10), 100, 1);

    static Stream<Arguments> invalid() {
        return Stream.of(
            Arguments.of((Supplier<Object>) () -> BASE.withReplicates(0), "replicates must be at least 1: 0"),
            Arguments.of((Supplier<Object>) () -> BASE.withBurnIn(-1), "burn-in must be at least 0 rounds: -1"),
            Arguments.of((Supplier<Object>) () -> BASE.withBurnIn(10),
                "burn-in must be shorter than the game (10 rounds): 10"),
            Arguments.of((Supplier<Object>) () -> BASE.withSnapshots(3, 0), "snapshot rounds must be at least 1: 0"),
            Arguments.of((Supplier<Object>) () -> BASE.withSnapshots(11),
                "snapshot round is beyond the game's 10 rounds: 11"),
            Arguments.of((Supplier<Object>) () -> BASE.withTimeResolved(11),
                "time-resolved rounds exceed the game's 10 rounds: 11"),
            Arguments.of((Supplier<Object>) () -> BASE.withTimeResolved(-2),
                "time-resolved rounds must be at least 0: -2"),
            Arguments.of((Supplier<Object>) () -> BASE.withThreads(0), "threads must be between 1 and 1024: 0"));
    }

    @ParameterizedTest(name = "{1}")
    @MethodSource("invalid")
    void invalidSpecsAreRefusedWithOneLine(Supplier<Object> build, String message) {
        assertEquals(message, assertThrows(IllegalArgumentException.class, build::get).getMessage());
    }

    @Test
    void tooLargeTalliesAreRefusedWithTheEstimate() {
        SimulationSpec huge = SimulationSpec.of(M, Horizon.continuation(0.5), 10, 1).withTimeResolved(500_000_000)
            .withThreads(2);
        String msg = assertThrows(IllegalArgumentException.class, () -> new Simulator(huge)).getMessage();
        assertTrue(msg.matches("tallies would need about \\d+\\.\\d MiB \\(500000000 time-resolved rounds, 0 snapshot "
            + "rounds, 2 threads\\); the limit is \\d+\\.\\d MiB, half the maximum heap: request fewer rounds or "
            + "threads"), msg);
    }

    @Test
    void snapshotsAreSortedAndDeduplicated() {
        assertArrayEquals(new long[] {2, 5, 9}, BASE.withSnapshots(9, 2, 5, 2).snapshotRounds());
    }

    @Test
    void progressIsReportedUpToTheTotal() {
        List<long[]> reports = new ArrayList<>();
        SimulationSpec spec = BASE.withReplicates(5_000).withThreads(2);
        SimulationResult r = new Simulator(spec, 300).run((d, n, rounds, expected) -> reports.add(
            new long[] {d, n, rounds, expected}));
        assertEquals(17, reports.size(), "one report per chunk of 300 replicates");
        long[] last = reports.get(reports.size() - 1);
        assertArrayEquals(new long[] {5_000, 5_000, 50_000, 50_000}, last);
        for (int i = 1; i < reports.size(); i++) {
            assertTrue(reports.get(i)[0] > reports.get(i - 1)[0] && reports.get(i)[2] > reports.get(i - 1)[2]);
        }
        assertEquals(50_000, r.lengthSum());
    }

    @Test
    void burnInLeavesShortGamesOutOfTheTallies() {
        long b = 3;
        SimulationSpec spec = SimulationSpec.of(M, Horizon.continuation(0.6), 20_000, 8).withBurnIn(b)
            .withSnapshots(1, 2, 3, 4).withThreads(2);
        SimulationResult r = new Simulator(spec).run();
        long[] reached = r.snapshotReached();
        assertEquals(20_000, reached[0], "every game reaches round 1");
        assertEquals(reached[3], r.gamesTallied(), "games with a tallied round are those reaching round b + 1");
        assertEquals(r.lengthSum() - (reached[0] + reached[1] + reached[2]), r.roundsTotal(),
            "tallied rounds = played rounds - sum over games of min(N, b)");
        long transitions = 0;
        for (long[] row : r.transitionCounts()) {
            for (long v : row) {
                transitions += v;
            }
        }
        assertEquals(r.roundsTotal() - r.gamesTallied(), transitions, "one transition per tallied round but the first");
    }

    @Test
    void sufficientStatisticsAndHistoryTalliesAreConsistent() {
        SimulationResult r = new Simulator(SimulationSpec.of(M, Horizon.continuation(0.9), 3_000, 4).withBurnIn(1)
            .withThreads(2)).run();
        BigInteger[][] nn = r.sumOfStateCountProducts();
        BigInteger[] ln = r.sumOfLengthTimesStateCounts();
        BigInteger sumLn = BigInteger.ZERO;
        for (int s = 0; s < 4; s++) {
            BigInteger row = BigInteger.ZERO;
            for (int q = 0; q < 4; q++) {
                row = row.add(nn[s][q]);
                assertEquals(nn[s][q], nn[q][s]);
            }
            assertEquals(ln[s], row, "sum_r N_s N_r = L N_s game by game");
            sumLn = sumLn.add(ln[s]);
        }
        assertEquals(r.sumOfSquaredTalliedLengths(), sumLn, "sum_s L N_s = L^2");
        assertEquals(2, r.historyMemory(), "tf2t reads two rounds");
        long[][] h = r.historyTransitionCounts();
        long[][] t = r.transitionCounts();
        long[][] marginal = new long[4][4];
        for (int from = 0; from < 16; from++) {
            for (int to = 0; to < 16; to++) {
                if (h[from][to] != 0) {
                    assertEquals(from & 3, to >> 2, "a history step shifts the last round up");
                    marginal[from & 3][to & 3] += h[from][to];
                }
            }
        }
        assertArrayEquals(t, marginal);
        StageGame g = M.game();
        long[] n = r.stateCounts();
        BigDecimal exact = BigDecimal.ZERO;
        for (int s = 0; s < 4; s++) {
            exact = exact.add(new BigDecimal(g.payoffX(s)).multiply(BigDecimal.valueOf(n[s])));
        }
        assertEquals(exact.doubleValue(), r.payoffTotalX());
        assertEquals(Simulator.GENERATOR, r.generator());
        assertEquals(4, r.seed());
    }
}
