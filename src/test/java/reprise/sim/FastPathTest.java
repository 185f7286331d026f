package reprise.sim;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import org.apache.commons.statistics.inference.ChiSquareTest;
import org.junit.jupiter.api.Test;
import reprise.game.Horizon;
import reprise.game.Noise;

/**
 * The fused memory-one path and the literal path agree in distribution: for each round t = 1..8 the
 * state of round t is, across independent games, a multinomial draw; a 2 x k chi-square test of
 * homogeneity (k the states seen) compares the two paths at each round (Pearson 1900; the asymptotic
 * chi-square law is common practice, no source for the setting).
 *
 * <p>Failure budget: 5 cases x 8 rounds = 40 tests at alpha = 0.01 / 40 each, so by Bonferroni the
 * false-failure probability is at most 0.01 even though the rounds of one case are dependent.
 */
class FastPathTest {
    private static final int ROUNDS = 8;

    @Test
    void fusedAndLiteralPathsAgreeRoundByRound() {
        String[][] players = {
            {"memory1:0.9,0.2,0.7,0.1", "memory1:0.8,0.3,0.6,0.2"},
            {"wsls", "tft"},
            {"reactive:0.9,0.2@0.3", "reactive:0.7,0.4@0.6"},
            {"gtft", "extort:chi=2"},
            {"grim", "memory1:0.5,0.9,0.1,0.7"}};
        Noise[] noises = {Noise.symmetric(0.05, 0.1), new Noise(0.02, 0.1, 0.2, 0), Noise.symmetric(0, 0.15),
            Noise.symmetric(0.1, 0), new Noise(0, 0.05, 0.05, 0.3)};
        int tests = players.length * ROUNDS;
        double alpha = 0.01 / tests;
        List<String> rejected = new ArrayList<>();
        int done = 0;
        for (int c = 0; c < players.length; c++) {
            SimulationSpec spec = SimulationSpec.of(DeterminismTest.match(players[c][0], players[c][1], noises[c]),
                Horizon.rounds(ROUNDS), 100_000, 900 + c).withTimeResolved(ROUNDS).withThreads(2);
            Simulator fused = new Simulator(spec);
            assertTrue(fused.usesFastPath());
            Simulator literal = new Simulator(spec.withSeed(1900 + c).withEnactment(Enactment.LITERAL));
            assertFalse(literal.usesFastPath());
            long[][] a = fused.run().timeResolvedCounts();
            long[][] b = literal.run().timeResolvedCounts();
            for (int t = 0; t < ROUNDS; t++) {
                long[][] table = nonEmptyColumns(a[t], b[t]);
                done++;
                if (table[0].length < 2) {
                    assertArrayEquals(a[t], b[t], "a single possible state must be the same on both paths");
                    continue;
                }
                double p = ChiSquareTest.withDefaults().test(table).getPValue();
                if (!(p > alpha)) {
                    rejected.add("case " + c + " round " + (t + 1) + ": p = " + p);
                }
            }
        }
        assertEquals(tests, done);
        assertTrue(rejected.isEmpty(), rejected.toString());
    }

    private static long[][] nonEmptyColumns(long[] a, long[] b) {
        int k = 0;
        for (int s = 0; s < 4; s++) {
            k += a[s] + b[s] > 0 ? 1 : 0;
        }
        long[][] t = new long[2][k];
        int j = 0;
        for (int s = 0; s < 4; s++) {
            if (a[s] + b[s] > 0) {
                t[0][j] = a[s];
                t[1][j] = b[s];
                j++;
            }
        }
        return t;
    }
}
