package reprise.sim;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import org.apache.commons.statistics.distribution.NormalDistribution;
import org.apache.commons.statistics.inference.BinomialTest;
import org.junit.jupiter.api.Test;
import reprise.game.Horizon;
import reprise.game.Noise;

/**
 * Geometric game lengths: P(N &gt; t) = delta^t and E[N] = 1 / (1 - delta), Var N = delta / (1 - delta)^2
 * (the geometric distribution on {1, 2, ...}; common practice, no source).
 *
 * <p>Failure budget: 3 values of delta, each with one z-test of the mean and 5 exact binomial tests of
 * the number of games reaching round t (Binomial(G, delta^(t-1))), 18 tests at alpha = 0.01 / 18 each:
 * by Bonferroni the false-failure probability is at most 0.01.
 */
class GameLengthTest {
    @Test
    void geometricLengthsHaveTheRightMeanAndTail() {
        double[] deltas = {0.5, 0.9, 0.99};
        int tests = 18;
        double alpha = 0.01 / tests;
        double zCritical = NormalDistribution.of(0, 1).inverseSurvivalProbability(alpha / 2);
        List<String> rejected = new ArrayList<>();
        int done = 0;
        for (double delta : deltas) {
            int games = delta == 0.99 ? 40_000 : 200_000;
            double mean = 1 / (1 - delta);
            // rounds t with delta^(t-1) from about 0.5 or 0.9 down to about 0.004
            long[] rounds = delta == 0.5 ? new long[] {2, 3, 5, 7, 9}
                : delta == 0.9 ? new long[] {2, 8, 16, 29, 53} : new long[] {11, 70, 161, 299, 550};
            SimulationSpec spec = SimulationSpec.of(DeterminismTest.match("tft", "tft", Noise.symmetric(0.1, 0)),
                Horizon.continuation(delta), games, 77).withSnapshots(rounds).withThreads(2);
            SimulationResult r = new Simulator(spec).run();
            double observedMean = r.lengthSum() / (double) games;
            double z = (observedMean - mean) / Math.sqrt(delta / ((1 - delta) * (1 - delta)) / games);
            done++;
            if (!(Math.abs(z) <= zCritical)) {
                rejected.add("delta " + delta + " mean " + observedMean + " z " + z);
            }
            long[] snaps = r.snapshotRounds();
            long[] reached = r.snapshotReached();
            for (int k = 0; k < snaps.length; k++) {
                double p = Math.pow(delta, snaps[k] - 1);
                double pv = BinomialTest.withDefaults().test(games, (int) reached[k], p).getPValue();
                done++;
                if (!(pv > alpha)) {
                    rejected.add("delta " + delta + " P(N >= " + snaps[k] + "): " + reached[k] + "/" + games
                        + " vs " + p + ", p-value " + pv);
                }
            }
            assertTrue(r.lengthMin() >= 1);
            assertEquals(r.lengthSum(), r.roundsTotal(), "no burn-in: every round is tallied");
        }
        assertEquals(tests, done);
        assertTrue(rejected.isEmpty(), rejected.toString());
    }

    @Test
    void continuationZeroPlaysOneRound() {
        SimulationResult r = new Simulator(SimulationSpec.of(DeterminismTest.match("tft", "alld", Noise.NONE),
            Horizon.continuation(0), 1000, 5).withThreads(1)).run();
        assertEquals(1000, r.lengthSum());
        assertEquals(1, r.lengthMax());
        assertEquals(1000, r.stateCounts()[1], "TFT opens with C, ALLD defects: every game is one CD round");
    }
}
