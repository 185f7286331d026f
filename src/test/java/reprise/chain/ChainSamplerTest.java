package reprise.chain;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.stream.Stream;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import reprise.game.Horizon;
import reprise.game.Match;
import reprise.game.Noise;
import reprise.game.Player;
import reprise.game.StageGame;
import reprise.game.Strategies;

/**
 * The exact chain's sampler against exact moments.
 *
 * <p>False-failure budget: {@link #meanCountsMatchTheExactMoments} makes 4 z checks per case over 6 cases
 * (24 checks), each failing with probability P(|Z| &gt; 4.5) = 6.8e-6 under a correct sampler (central limit
 * theorem over 40 000 games), so the family fails falsely with probability at most 24 * 6.8e-6 = 1.6e-4;
 * {@link #snapshotsAndTransitionsFollowTheChain} adds 8 such checks (5.4e-5). Fixed seeds, logged in the
 * messages.
 */
class ChainSamplerTest {

    private static final StageGame PD = StageGame.DEFAULT;
    private static final int GAMES = 40_000;

    static Match match(String x, String y, double execution, double perception) {
        return new Match(PD, Strategies.parse(x, PD, Player.X), Strategies.parse(y, PD, Player.Y),
            Noise.symmetric(execution, perception));
    }

    static Stream<Arguments> cases() {
        return Stream.of(
            Arguments.of("wsls", "wsls", 0.05, 0.0, new Horizon.Rounds(5), 0L, 11L),
            Arguments.of("tf2t", "stft", 0.03, 0.0, new Horizon.Rounds(20), 0L, 12L),
            Arguments.of("tft", "gtft", 0.02, 0.02, new Horizon.Rounds(12), 3L, 13L),
            Arguments.of("wsls", "tft", 0.05, 0.0, new Horizon.Continuation(0.9), 0L, 14L),
            Arguments.of("tf2t", "wsls", 0.05, 0.0, new Horizon.Continuation(0.8), 2L, 15L),
            Arguments.of("gtft", "alld", 0.01, 0.03, new Horizon.Continuation(0.95), 0L, 16L));
    }

    @ParameterizedTest(name = "{0} vs {1}, {4}, burn-in {5}")
    @MethodSource("cases")
    void meanCountsMatchTheExactMoments(String x, String y, double e, double p, Horizon horizon, long burnIn,
                                        long seed) {
        MarkovChain chain = MarkovChain.of(match(x, y, e, p));
        CountMoments exact = horizon instanceof Horizon.Rounds r
            ? CountMoments.rounds(chain, burnIn + 1, r.count())
            : CountMoments.continuation(chain, ((Horizon.Continuation) horizon).probability(), burnIn);
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(seed);
        ChainSampler.Sample s = ChainSampler.of(chain).sample(rng, GAMES, horizon, burnIn, new long[0]);
        double[] mu = exact.mean();
        double[][] sigma = exact.covariance();
        for (int st = 0; st < 4; st++) {
            double sum = 0;
            for (long[] g : s.perGameCounts()) {
                sum += g[st];
            }
            double mean = sum / GAMES;
            double se = Math.sqrt(sigma[st][st] / GAMES);
            if (se == 0) {
                assertEquals(mu[st], mean, 1e-12, "state " + st + ", seed " + seed);
            } else {
                assertTrue(Math.abs(mean - mu[st]) <= 4.5 * se, "state " + st + ": mean " + mean + ", exact "
                    + mu[st] + ", se " + se + ", seed " + seed);
            }
        }
    }

    @Test
    void snapshotsAndTransitionsFollowTheChain() {
        long seed = 21;
        MarkovChain chain = MarkovChain.of(match("tf2t", "stft", 0.05, 0));
        ChainSampler.Sample s = ChainSampler.of(chain).sample(RandomSource.XO_RO_SHI_RO_128_PP.create(seed), GAMES,
            new Horizon.Rounds(10), 0, new long[] {3});
        double[] at3 = chain.roundStateDistributionAt(3);
        for (int st = 0; st < 4; st++) {
            double f = s.snapshotCounts()[0][st] / (double) GAMES;
            double se = Math.sqrt(at3[st] * (1 - at3[st]) / GAMES);
            assertTrue(Math.abs(f - at3[st]) <= 4.5 * se + 1e-12, "snapshot state " + st + ": " + f + " vs " + at3[st]
                + ", seed " + seed);
        }
        // Row DD of tf2t vs stft: each transition is a multinomial draw from row 3 of the chain's matrix
        // (for these memory-two players the chain state is a 16-state history; compare the row of history
        // "DD after DD", index 3 + 4 * 3 = 15).
        double[][] m = chain.transitionMatrix();
        int row = chain.size() == 4 ? 3 : 15;
        long n = 0;
        for (long c : s.transitions()[row]) {
            n += c;
        }
        assertTrue(n > 1000, "row visits " + n);
        int checked = 0;
        for (int j = 0; j < m.length && checked < 4; j++) {
            if (m[row][j] > 0) {
                double f = s.transitions()[row][j] / (double) n;
                double se = Math.sqrt(m[row][j] * (1 - m[row][j]) / n);
                assertTrue(Math.abs(f - m[row][j]) <= 4.5 * se + 1e-12, "transition " + row + " -> " + j + ": " + f
                    + " vs " + m[row][j] + ", seed " + seed);
                checked++;
            } else {
                assertEquals(0, s.transitions()[row][j], "impossible transition " + row + " -> " + j);
            }
        }
    }

    @Test
    void deterministicChainGivesItsOnlyPath() {
        // Worked by hand: from CC (certain) a chain that cycles CC -> CD -> DC -> DD -> CC; 6 rounds with a
        // burn-in of 1 tally CD, DC, DD, CC, CD: counts (1, 2, 1, 1); 4 tallied transitions.
        double[][] m = {{0, 1, 0, 0}, {0, 0, 1, 0}, {0, 0, 0, 1}, {1, 0, 0, 0}};
        ChainSampler s = ChainSampler.of(m, new double[] {1, 0, 0, 0}, new int[] {0, 1, 2, 3});
        ChainSampler.Sample out = s.sample(RandomSource.XO_RO_SHI_RO_128_PP.create(1), 3, new Horizon.Rounds(6), 1,
            new long[] {2, 7});
        for (long[] g : out.perGameCounts()) {
            assertArrayEquals(new long[] {1, 2, 1, 1}, g);
        }
        assertEquals(3, out.transitions()[1][2]);
        assertEquals(3, out.transitions()[3][0]);
        assertArrayEquals(new long[] {0, 3, 0, 0}, out.snapshotCounts()[0]);
        assertArrayEquals(new long[] {0, 0, 0, 0}, out.snapshotCounts()[1]);
    }

    @Test
    void geometricLengthHasMeanOneOverOneMinusDelta() {
        // Textbook: P(L = l) = (1 - delta) delta^(l-1) has mean 1 / (1 - delta) = 4 and variance
        // delta / (1 - delta)^2 = 12 for delta = 0.75; |mean - 4| <= 4.5 se fails falsely with prob 6.8e-6.
        double[][] m = {{0.5, 0.5, 0, 0}, {0, 0.5, 0.5, 0}, {0, 0, 0.5, 0.5}, {0.5, 0, 0, 0.5}};
        ChainSampler s = ChainSampler.of(m, new double[] {0.25, 0.25, 0.25, 0.25}, new int[] {0, 1, 2, 3});
        ChainSampler.Sample out = s.sample(RandomSource.XO_RO_SHI_RO_128_PP.create(5), GAMES,
            new Horizon.Continuation(0.75), 0, new long[0]);
        double total = 0;
        for (long[] g : out.perGameCounts()) {
            total += g[0] + g[1] + g[2] + g[3];
        }
        assertEquals(4, total / GAMES, 4.5 * Math.sqrt(12.0 / GAMES));
    }

    @Test
    void rejectsBadInput() {
        double[][] m = {{1.2, -0.2}, {0.5, 0.5}};
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
            () -> ChainSampler.of(m, new double[] {1, 0}, new int[] {0, 1}));
        assertEquals("transition matrix row 0[0] must be a probability in [0, 1]: 1.2", e.getMessage());
    }
}
