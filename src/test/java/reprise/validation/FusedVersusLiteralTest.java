package reprise.validation;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigInteger;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.LUDecomposition;
import org.apache.commons.math3.linear.RealMatrix;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.apache.commons.statistics.distribution.FDistribution;
import org.junit.jupiter.api.Test;
import reprise.game.Horizon;
import reprise.game.Match;
import reprise.game.Noise;
import reprise.game.Player;
import reprise.game.StageGame;
import reprise.game.Strategies;
import reprise.sim.Enactment;
import reprise.sim.SimulationResult;
import reprise.sim.SimulationSpec;
import reprise.sim.Simulator;

/**
 * The fused memory-one path against the literal path over whole long games: for random memory-one
 * pairs with both error kinds (execution and perception, drawn per player), fixed lengths of 100 to 600
 * rounds and random lengths with mean 100 to 500 rounds, the per-game state-count vectors of the two
 * paths must have the same mean.
 *
 * <p>The fused path (lockstep blocks for fixed lengths, one game at a time for random lengths) folds
 * both errors into one cooperation probability per state and player; the literal path draws the
 * intended move from the table, then the execution flip, then each player's perception flip, with its
 * own draws. The two make different draws, so they are compared in distribution: per case a two-sample
 * Hotelling T^2 test on the per-game count vectors (Hotelling 1931), independent games on each side,
 * with the pooled sample covariance. With fixed length the four counts sum to the length, so CC, CD, DC
 * are used (p = 3); with random length all four (p = 4). T^2 (n1 + n2 - p - 1) / (p (n1 + n2 - 2)) is
 * F(p, n1 + n2 - p - 1) under equal means for normal data; here each count vector is a sum over hundreds
 * of rounds and n1 = n2 = 2,000 games, so the F law holds by the central limit theorem (equal sample
 * sizes make the test insensitive to unequal covariances; common practice, no source for the setting).
 *
 * <p>Failure budget: 40 independent cases (own pair, own seeds) at alpha = 0.001 each; the check fails if
 * 2 or more reject, P(Binomial(40, 0.001) &ge; 2) = 1 - 0.999^40 - 40 (0.001) 0.999^39 = 7.8e-4 (binomial
 * sum computed by hand), or if any single p-value is below 1e-6 (at most 40 x 1e-6 = 4e-5 by the union
 * bound). Total false-failure probability at most 8.2e-4. Seeds: SEED for the cases, SEED + 2k + 1 and
 * SEED + 2k + 2 for case k's two paths (in every failure message).
 *
 * <p>References: Hotelling, H. (1931). The generalization of Student's ratio. Annals of Mathematical
 * Statistics 2, 360-378.
 */
class FusedVersusLiteralTest {
    private static final long SEED = 20261202L;
    private static final int CASES = 40;
    private static final int GAMES = 2_000;
    private static final double ALPHA = 0.001;
    private static final double EXTREME = 1e-6;

    @Test
    void fusedAndLiteralPathsAgreeOverLongGames() {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(SEED);
        List<String> rejected = new ArrayList<>();
        List<String> extreme = new ArrayList<>();
        for (int k = 0; k < CASES; k++) {
            Comparison c = compare(k, rng, 0);
            if (c.p() < ALPHA) {
                rejected.add(c.what());
            }
            if (c.p() < EXTREME) {
                extreme.add(c.what());
            }
        }
        assertTrue(rejected.size() < 2, "2 or more of " + CASES + " cases reject at " + ALPHA + ": " + rejected);
        assertTrue(extreme.isEmpty(), "p below " + EXTREME + ": " + extreme);
    }

    /**
     * The same comparison must see a planted defect: the literal side plays with X's perception error
     * raised by 0.25 (as if that flip were drawn with the wrong probability). On 8 cases of a separate
     * seed every p-value must fall below ALPHA; the largest observed was 1.5e-6 (the others below 1e-16),
     * so a miss would mean the test lost its power, not bad luck. Smaller shifts are not always visible in
     * the mean counts: with heavy noise the exact stationary law can hardly move (one case here moves by
     * 0.002 in DD for a shift of 0.1, by the exact engine), which is why the defect is large.
     */
    @Test
    void aPlantedPerceptionDefectIsSeen() {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(SEED + 1);
        List<String> missed = new ArrayList<>();
        for (int k = 0; k < 8; k++) {
            Comparison c = compare(k, rng, 0.25);
            if (!(c.p() < ALPHA)) {
                missed.add(c.what());
            }
        }
        assertTrue(missed.isEmpty(), "planted defect not seen: " + missed);
    }

    private record Comparison(double p, String what) {
    }

    /** Case k: a random pair, noise and horizon from rng; fused against literal (X's perception + shift). */
    private static Comparison compare(int k, UniformRandomProvider rng, double perceptionShiftX) {
        Match match = new Match(StageGame.DEFAULT, Strategies.parse(randomMemoryOne(rng), StageGame.DEFAULT,
            Player.X), Strategies.parse(randomMemoryOne(rng), StageGame.DEFAULT, Player.Y),
            new Noise(0.2 * rng.nextDouble(), 0.2 * rng.nextDouble(), 0.2 * rng.nextDouble(),
                0.2 * rng.nextDouble()));
        boolean fixed = k % 2 == 0;
        Horizon horizon = fixed ? Horizon.rounds(100 + rng.nextInt(501))
            : Horizon.continuation(1 - 1.0 / (100 + rng.nextInt(401)));
        SimulationSpec spec = SimulationSpec.of(match, horizon, GAMES, SEED + 2L * k + 1).withThreads(2);
        Noise n = match.noise();
        Match literalMatch = new Match(match.game(), match.x(), match.y(), new Noise(n.executionX(),
            n.executionY(), n.perceptionX() + perceptionShiftX, n.perceptionY()));
        Simulator fused = new Simulator(spec);
        Simulator literal = new Simulator(SimulationSpec.of(literalMatch, horizon, GAMES, SEED + 2L * k + 2)
            .withThreads(2).withEnactment(Enactment.LITERAL));
        assertTrue(fused.usesFastPath(), "case " + k + " must take the fused path");
        assertFalse(literal.usesFastPath(), "case " + k + " must take the literal path");
        double p = twoSampleHotelling(fused.run(), literal.run(), fixed ? 3 : 4);
        return new Comparison(p, String.format(Locale.ROOT, "case %d (%s, %s, %s vs %s, seeds %d/%d): p = %.3g", k,
            horizon.describe(), n, match.x().label(), match.y().label(), SEED + 2L * k + 1, SEED + 2L * k + 2, p));
    }

    /** memory1:CC,CD,DC,DD@p0 with every probability uniform in (0, 1). */
    private static String randomMemoryOne(UniformRandomProvider rng) {
        StringBuilder sb = new StringBuilder("memory1:");
        for (int i = 0; i < 4; i++) {
            sb.append(i == 0 ? "" : ",").append(rng.nextDouble());
        }
        return sb.append('@').append(rng.nextDouble()).toString();
    }

    /**
     * The two-sample Hotelling T^2 p-value for equal means of the first {@code p} per-game state counts,
     * from each run's sums of counts and of products of counts over games.
     */
    static double twoSampleHotelling(SimulationResult a, SimulationResult b, int p) {
        assertEquals(a.replicates(), a.gamesTallied());
        assertEquals(b.replicates(), b.gamesTallied());
        double n1 = a.replicates();
        double n2 = b.replicates();
        double[] m1 = mean(a, p);
        double[] m2 = mean(b, p);
        double[][] s1 = scatter(a, m1, p);
        double[][] s2 = scatter(b, m2, p);
        double[][] pooled = new double[p][p];
        double[] d = new double[p];
        for (int i = 0; i < p; i++) {
            d[i] = m1[i] - m2[i];
            for (int j = 0; j < p; j++) {
                pooled[i][j] = (s1[i][j] + s2[i][j]) / (n1 + n2 - 2);
            }
        }
        RealMatrix inverse = new LUDecomposition(new Array2DRowRealMatrix(pooled)).getSolver().getInverse();
        double q = 0;
        for (int i = 0; i < p; i++) {
            for (int j = 0; j < p; j++) {
                q += d[i] * inverse.getEntry(i, j) * d[j];
            }
        }
        double t2 = n1 * n2 / (n1 + n2) * q;
        double f = t2 * (n1 + n2 - p - 1) / (p * (n1 + n2 - 2));
        return FDistribution.of(p, n1 + n2 - p - 1).survivalProbability(f);
    }

    private static double[] mean(SimulationResult r, int p) {
        long[] sums = r.stateCounts();
        double[] m = new double[p];
        for (int i = 0; i < p; i++) {
            m[i] = sums[i] / (double) r.replicates();
        }
        return m;
    }

    /** Sum over games of (c - mean)(c - mean)^T, from the exact integer sums of products. */
    private static double[][] scatter(SimulationResult r, double[] mean, int p) {
        BigInteger[][] products = r.sumOfStateCountProducts();
        double n = r.replicates();
        double[][] s = new double[p][p];
        for (int i = 0; i < p; i++) {
            for (int j = 0; j < p; j++) {
                s[i][j] = products[i][j].doubleValue() - n * mean[i] * mean[j];
            }
        }
        return s;
    }
}
