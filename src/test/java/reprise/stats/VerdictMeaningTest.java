package reprise.stats;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.junit.jupiter.api.Test;
import reprise.chain.ChainSampler;
import reprise.game.Horizon;

/**
 * One meaning per verdict word (Schuirmann 1987; Berger &amp; Hsu 1996, the interval form of TOST) and the
 * regressions of issue 12 items 1 and 4.
 */
class VerdictMeaningTest {

    private static final double[] CC = {1, 0, 0, 0};

    @Test
    void identicalGamesGiveNoCertainVerdict() {
        // Issue 12 item 1: wsls vs wsls, execution error 0.005, 5 rounds, 10 games, claim CC = 0.9821446 (the
        // exact value); no game had an error, so the games are identical. Before: p = 0 and DISAGREES with
        // h = 0.01, a certain AGREES with h = 0.05.
        GameSummary same = BoundedMeanIntervalTest.identical(10, new long[] {5, 0, 0, 0});
        Estimate e = ReplicateInference.mean(same, CC);
        assertEquals(0, e.standardError(), 0);
        for (double h : new double[] {0.01, 0.05}) {
            Equivalence.Result r = Equivalence.assess(e, 0.9821446, h, 0.05);
            assertEquals(Equivalence.Verdict.INCONCLUSIVE, r.verdict(), "h = " + h);
            assertEquals(1, r.equivalencePValue(), 0);
            assertEquals(1, r.nonEquivalencePValue(), 0);
            assertEquals(1, r.differencePValue(), 0);
            assertTrue(r.additionalGamesNeeded().isEmpty());
        }
        // The finite-sample interval at 1 - 2 alpha decides instead: 10 identical games cannot show either.
        Regime sparse = new Regime(10, 0.95, -4.7, new double[] {49, 0.5, 0.5, 0});
        Interval i = BoundedMeanInterval.choose(same, CC, 0, 1, 0.9, sparse).interval();
        assertEquals(Equivalence.Verdict.INCONCLUSIVE, Equivalence.assess(i, 0.9821446, 0.05).verdict());
        // A claim far off is still "disagrees" from identical games: CC = 0.3 with h = 0.05.
        assertEquals(Equivalence.Verdict.DISAGREES, Equivalence.assess(i, 0.3, 0.05).verdict());
    }

    @Test
    void aKnownZeroStandardErrorStillGivesACertainVerdict() {
        // Infinite degrees of freedom: the standard error is known, not estimated (a deterministic quantity).
        Estimate exact = new Estimate(0.52, 0, Double.POSITIVE_INFINITY, 100);
        assertEquals(Equivalence.Verdict.AGREES, Equivalence.assess(exact, 0.5, 0.05, 0.05).verdict());
    }

    @Test
    void anEstimateOutsideTheToleranceIsNotDisagreementUnlessShown() {
        // Issue 12 item 4: the runner's rule "difference test rejects and estimate outside h" said DISAGREES.
        // d = 0.055 with h = 0.05 and se = 0.02 (normal): the difference test rejects (z = 2.75, p = 0.006), but
        // non-equivalence needs (d - h)/se = 0.25 > 1.645: not shown, so INCONCLUSIVE (worked by hand).
        Equivalence.Result r = Equivalence.assess(new Estimate(0.555, 0.02, Double.POSITIVE_INFINITY, 100), 0.5,
            0.05, 0.05);
        assertTrue(r.differencePValue() < 0.01);
        assertEquals(Equivalence.Verdict.INCONCLUSIVE, r.verdict());
        assertEquals(Equivalence.Verdict.INCONCLUSIVE, Equivalence.verdict(0.3, r.nonEquivalencePValue(), 0.05));
    }

    @Test
    void intervalFormByHand() {
        Interval inside = new Interval(0.5, 0.46, 0.54, 0.9);
        Interval straddles = new Interval(0.55, 0.52, 0.58, 0.9);
        Interval above = new Interval(0.6, 0.56, 0.64, 0.9);
        Interval below = new Interval(0.3, 0.2, 0.449, 0.9);
        assertEquals(Equivalence.Verdict.AGREES, Equivalence.assess(inside, 0.5, 0.05).verdict());
        assertEquals(Equivalence.Verdict.INCONCLUSIVE, Equivalence.assess(straddles, 0.5, 0.05).verdict());
        assertEquals(Equivalence.Verdict.DISAGREES, Equivalence.assess(above, 0.5, 0.05).verdict());
        assertEquals(Equivalence.Verdict.DISAGREES, Equivalence.assess(below, 0.5, 0.05).verdict());
        assertEquals("interval entirely outside the tolerance: [0.56, 0.64] against [0.45, 0.55]",
            Equivalence.assess(above, 0.5, 0.05).reason());
    }

    /**
     * Issue 12 item 4 by simulation: a claim off by 0.9 h with 150 games (tft vs gtft, execution error 0.05,
     * 50 rounds, CC; games drawn from the exact chain). Shown |d| &gt; h happens at most at rate alpha = 0.05
     * under |d| &lt; h; 300 runs, fail if more than 27 DISAGREES: P(Binomial(300, 0.05) &gt; 27) = 1.1e-4
     * (exact binomial tail, Commons Statistics), and in fact the rate at 0.9 h is well below alpha.
     */
    @Test
    void aClaimWithinTheToleranceIsRarelyDisagrees() {
        CoverageCases.Case c = new CoverageCases.Case("tft-gtft", "tft", "gtft", 0.05, 0, new Horizon.Rounds(50), 150,
            CC);
        double exact = c.exact();
        ChainSampler sampler = ChainSampler.of(c.chain());
        long seed = 77;
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(seed);
        double h = 0.02;
        int disagrees = 0;
        for (int k = 0; k < 300; k++) {
            Estimate e = ReplicateInference.mean(c.draw(sampler, rng), CC);
            if (Equivalence.assess(e, exact + 0.9 * h, h, 0.05).verdict() == Equivalence.Verdict.DISAGREES) {
                disagrees++;
            }
        }
        assertTrue(disagrees <= 27, disagrees + " of 300 runs said disagrees, seed " + seed);
    }

    /**
     * Issue 12 item 1 by simulation: right claims about wsls vs wsls at 0.5% in 5-round games with 10 games
     * (CC, the exact value) were "disagrees" in every seed. With the finite-sample interval at 1 - 2 alpha
     * (alpha = 0.05), DISAGREES needs the interval to miss the target on one side, probability at most 0.05;
     * 200 runs, fail above 22: P(Binomial(200, 0.05) &gt; 22) = 3e-4 (normal approximation, z = 3.9).
     */
    @Test
    void rightClaimsFromIdenticalGamesAreNotDisagrees() {
        CoverageCases.Case c = CoverageCases.sparse().get(0);
        double exact = c.exact();
        ChainSampler sampler = ChainSampler.of(c.chain());
        Regime regime = Regime.fromModelGames(sampler.sample(RandomSource.XO_RO_SHI_RO_128_PP.create(7), 4000,
            c.horizon(), 0, new long[0]).perGameCounts(), CC, c.games());
        long seed = 88;
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(seed);
        int disagrees = 0;
        for (int k = 0; k < 200; k++) {
            Interval i = BoundedMeanInterval.choose(c.draw(sampler, rng), CC, 0, 1, 0.9, regime).interval();
            if (Equivalence.assess(i, exact, 0.01).verdict() == Equivalence.Verdict.DISAGREES) {
                disagrees++;
            }
        }
        assertTrue(disagrees <= 22, disagrees + " of 200 right claims were disagrees, seed " + seed);
    }

    /**
     * Power is kept on an ordinary case: a claim wrong by 2 h (h = 0.02) about CC of tft vs gtft at 0.05,
     * 50 rounds, 1000 games, is DISAGREES through the chosen interval (the t-interval here) in at least 180 of
     * 200 runs. With se about 0.0056 the non-equivalence z is about (0.04 - 0.02) / 0.0056 = 3.6, power about
     * 0.97; fewer than 180 then has probability below 1e-5 (normal approximation, z = -5.8).
     */
    @Test
    void claimsWrongByTwiceTheToleranceAreDisagrees() {
        CoverageCases.Case c = new CoverageCases.Case("tft-gtft", "tft", "gtft", 0.05, 0, new Horizon.Rounds(50), 1000,
            CC);
        double exact = c.exact();
        ChainSampler sampler = ChainSampler.of(c.chain());
        Regime regime = Regime.fromModelGames(sampler.sample(RandomSource.XO_RO_SHI_RO_128_PP.create(7), 4000,
            c.horizon(), 0, new long[0]).perGameCounts(), CC, c.games());
        assertEquals(Regime.Kind.ORDINARY, regime.kind(), regime.describe());
        long seed = 89;
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(seed);
        int disagrees = 0;
        for (int k = 0; k < 200; k++) {
            Interval i = BoundedMeanInterval.choose(c.draw(sampler, rng), CC, 0, 1, 0.9, regime).interval();
            if (Equivalence.assess(i, exact + 0.04, 0.02).verdict() == Equivalence.Verdict.DISAGREES) {
                disagrees++;
            }
        }
        assertTrue(disagrees >= 180, disagrees + " of 200 wrong claims were disagrees, seed " + seed);
    }
}
