package reprise.stats;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.apache.commons.statistics.distribution.TDistribution;
import org.junit.jupiter.api.Test;
import reprise.game.Player;

/**
 * Replicate-level estimates, checked against the textbook formulas evaluated directly on per-game data
 * in the test (one-sample t-interval; ratio estimator of Cochran 1977, ch. 6). Tolerances 1e-13 relative:
 * the two routes round differently but both are O(10) operations on numbers of size 1.
 */
class ReplicateInferenceTest {

    static final long[][] FIXED = {{6, 1, 2, 1}, {4, 2, 2, 2}, {7, 1, 1, 1}, {3, 3, 2, 2}, {5, 2, 1, 2}};
    static final long[][] RANDOM = {{6, 1, 2, 1}, {1, 0, 1, 0}, {12, 3, 4, 5}, {0, 1, 0, 2}, {3, 2, 1, 1}, {9, 0, 0, 1}};

    @Test
    void fixedLengthIsTheOrdinaryTInterval() {
        GameSummary s = GameSummary.of(FIXED);
        assertTrue(s.fixedLength());
        double[] u = {3, 0, 5, 1};
        int g = FIXED.length;
        double[] y = new double[g];
        double mean = 0;
        for (int i = 0; i < g; i++) {
            for (int st = 0; st < 4; st++) {
                y[i] += u[st] * FIXED[i][st] / 10.0;
            }
            mean += y[i] / g;
        }
        double ss = 0;
        for (double v : y) {
            ss += (v - mean) * (v - mean);
        }
        double se = Math.sqrt(ss / (g - 1) / g);
        Estimate e = ReplicateInference.payoff(s, u);
        assertEquals(mean, e.value(), 1e-13 * mean);
        assertEquals(se, e.standardError(), 1e-13 * se);
        assertEquals(g - 1, e.degreesOfFreedom());
        Interval i = e.interval(0.95);
        double q = TDistribution.of(g - 1).inverseSurvivalProbability(0.025);
        assertEquals(mean - q * se, i.lower(), 1e-13);
        assertEquals(mean + q * se, i.upper(), 1e-13);
    }

    @Test
    void randomLengthUsesTheRatioEstimator() {
        GameSummary s = GameSummary.of(RANDOM);
        assertTrue(!s.fixedLength());
        int g = RANDOM.length;
        double sy = 0;
        double sl = 0;
        double meanOfAverages = 0;
        double[] y = new double[g];
        double[] l = new double[g];
        for (int i = 0; i < g; i++) {
            y[i] = RANDOM[i][0] + RANDOM[i][1];
            l[i] = RANDOM[i][0] + RANDOM[i][1] + RANDOM[i][2] + RANDOM[i][3];
            sy += y[i];
            sl += l[i];
            meanOfAverages += y[i] / l[i] / g;
        }
        double r = sy / sl;
        double q = 0;
        for (int i = 0; i < g; i++) {
            q += (y[i] - r * l[i]) * (y[i] - r * l[i]);
        }
        double lbar = sl / g;
        double se = Math.sqrt(q / (g * (g - 1.0) * lbar * lbar));
        Estimate e = ReplicateInference.cooperationRate(s, Player.X);
        assertEquals(r, e.value(), 1e-13);
        assertEquals(se, e.standardError(), 1e-13 * se);
        // The ratio of sums is not the mean of per-game averages (0.67857 vs 0.62877 here, computed by hand).
        assertNotEquals(meanOfAverages, e.value(), 1e-3);
    }

    @Test
    void stateFrequenciesAndSimultaneousLevels() {
        GameSummary s = GameSummary.of(FIXED);
        assertEquals(25 / 50.0, ReplicateInference.stateFrequency(s, 0).value(), 1e-15);
        assertEquals(0.9875, ReplicateInference.individualLevel(0.95, 4, ReplicateInference.Simultaneity.BONFERRONI),
            1e-15);
        assertEquals(Math.pow(0.95, 0.25),
            ReplicateInference.individualLevel(0.95, 4, ReplicateInference.Simultaneity.SIDAK), 1e-15);
        Interval[] joint = ReplicateInference.simultaneousStateFrequencies(s, 0.95,
            ReplicateInference.Simultaneity.BONFERRONI);
        for (int st = 0; st < 4; st++) {
            Interval single = ReplicateInference.stateFrequency(s, st).interval(0.9875);
            assertEquals(single.lower(), joint[st].lower(), 0);
            assertEquals(single.upper(), joint[st].upper(), 0);
            assertTrue(joint[st].halfWidth() > ReplicateInference.stateFrequency(s, st).interval(0.95).halfWidth());
        }
    }

    @Test
    void errorPaths() {
        GameSummary one = GameSummary.of(new long[][] {{1, 2, 3, 4}});
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
            () -> ReplicateInference.stateFrequency(one, 0));
        assertEquals("a replicate standard error needs at least 2 games: 1", e.getMessage());
        e = assertThrows(IllegalArgumentException.class,
            () -> ReplicateInference.stateFrequency(GameSummary.of(FIXED), 4));
        assertEquals("state must be a state index 0 (CC) to 3 (DD): 4", e.getMessage());
    }
}
