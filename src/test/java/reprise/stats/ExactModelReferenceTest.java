package reprise.stats;

import static org.junit.jupiter.api.Assertions.assertTrue;

import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import reprise.chain.ChainSampler;
import reprise.chain.CountMoments;
import reprise.chain.MarkovChain;
import reprise.game.Horizon;

/**
 * Monte Carlo p-values under the exact model for the Wald, transition and snapshot statistics: observed
 * studies and reference studies are both drawn from the exact chain, so the p-values must be valid
 * (Davison &amp; Hinkley 1997, section 4.2: P(p &le; u) &le; u for a Monte Carlo test of a simple hypothesis).
 */
class ExactModelReferenceTest {

    /**
     * Transitions (tft vs gtft at noise 0.0025, the crash case of issue 12 item 7b, 20 rounds, 20 games) and
     * snapshots at round 3 (tft vs tft at noise 0.01, the crash case of item 7a): 200 studies each, B = 99;
     * under the hypothesis the count of p &le; 0.05 is at most Binomial(200, 0.05); fail above 22,
     * probability 3e-4 each (normal approximation, z = 3.9; the exact tail is of the same order).
     */
    @Test
    void transitionAndSnapshotPValuesAreValid() {
        long seed = 17;
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(seed);
        Horizon h = new Horizon.Rounds(20);
        MarkovChain tg = new CoverageCases.Case("", "tft", "gtft", 0.0025, 0, h, 20, CoverageCases.state(0)).chain();
        ChainSampler tgs = ChainSampler.of(tg);
        double[][] p0 = tg.observableTransitionMatrix();
        ExactModelReference ref = ExactModelReference.of(tgs, 20, h, 0);
        int transitions = 0;
        for (int k = 0; k < 200; k++) {
            double t = ref.transitions(rng, p0, SparseCells.COCHRAN_MINIMUM, TransitionTest.Form.PEARSON).getAsDouble();
            double p = MonteCarloPValue.fixed(t, ref.transitions(rng, p0, SparseCells.COCHRAN_MINIMUM,
                TransitionTest.Form.PEARSON), 99).pValue();
            transitions += p <= 0.05 ? 1 : 0;
        }
        assertTrue(transitions <= 22, transitions + " of 200 transition p-values <= 0.05, seed " + seed);
        MarkovChain tt = new CoverageCases.Case("", "tft", "tft", 0.01, 0, h, 20, CoverageCases.state(0)).chain();
        ExactModelReference snap = ExactModelReference.of(ChainSampler.of(tt), 20, h, 0);
        double[] at3 = tt.roundStateDistributionAt(3);
        int snapshots = 0;
        for (int k = 0; k < 200; k++) {
            double t = snap.snapshot(rng, 3, at3).getAsDouble();
            snapshots += MonteCarloPValue.fixed(t, snap.snapshot(rng, 3, at3), 99).pValue() <= 0.05 ? 1 : 0;
        }
        assertTrue(snapshots <= 22, snapshots + " of 200 snapshot p-values <= 0.05, seed " + seed);
    }

    /**
     * Issue 12 item 3 repaired: the Wald test on tf2t vs stft at 0.005, 40 rounds, 300 games, with the
     * sequential Monte Carlo p-value (h = 5, up to 9999 draws) instead of the chi-square reference, over
     * 2000 studies drawn from the exact chain. Under the hypothesis the count of p &le; 1e-3 is at most
     * Binomial(2000, 0.001) (mean 2); fail above 9: probability P(Poisson(2) &ge; 10) = 4.6e-5. The
     * chi-square reference gave 45 (see {@code MonteCarloPValueTest}). Runtime about 30 s.
     */
    @Test
    @Tag("calibration")
    void waldMonteCarloPValueIsValidInTheTail() {
        CoverageCases.Case c = MonteCarloPValueTest.tailCase();
        MarkovChain chain = c.chain();
        CountMoments m = CountMoments.rounds(chain, 1, 40);
        ExactModelReference ref = ExactModelReference.of(ChainSampler.of(chain), 300, c.horizon(), 0);
        long seed = 23;
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(seed);
        int below = 0;
        long draws = 0;
        for (int k = 0; k < 2000; k++) {
            double t = ref.wald(rng, m.mean(), m.covariance()).getAsDouble();
            MonteCarloPValue.Result r = MonteCarloPValue.sequential(t, ref.wald(rng, m.mean(), m.covariance()), 5, 9999);
            draws += r.draws();
            below += r.pValue() <= 1e-3 ? 1 : 0;
        }
        System.out.println("Wald Monte Carlo: " + below + " of 2000 p <= 1e-3, " + draws + " reference draws");
        assertTrue(below <= 9, below + " of 2000 p-values <= 1e-3, seed " + seed);
    }
}
