package reprise.validation;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.apache.commons.statistics.inference.BinomialTest;
import org.junit.jupiter.api.Test;
import reprise.evolution.Abundance;
import reprise.evolution.BirthDeathChain;
import reprise.evolution.Fixation;
import reprise.evolution.PayoffBasis;
import reprise.game.Horizon;
import reprise.game.MemoryStrategy;
import reprise.game.Noise;
import reprise.game.Population;
import reprise.game.StageGame;
import reprise.sim.InvasionTally;
import reprise.sim.MutationRun;
import reprise.sim.PopulationSimulator;
import reprise.stats.BatchMeans;
import reprise.stats.Estimate;
import reprise.stats.Interval;
import reprise.stats.WilsonInterval;

/**
 * Basis (c), the exact law of realised payoffs, against the population simulator on random cases: with
 * fresh games at every update the population is the birth-death chain that (c) computes, so the two must
 * agree (the exact side builds update probabilities from chains and Fourier transforms, the simulator
 * plays every round of every game).
 *
 * <p>Failure budget of {@link #realisedPayoffsAgreeWithSimulation()}: 14 random cases, each with an exact
 * two-sided binomial test of the fixation count (Commons Statistics BinomialTest) and a z-test of the mean
 * time to fixation against the exact conditional time (sample standard deviation; thousands of
 * fixations, so the normal reference is accurate), 28 tests at alpha = 0.001 on independent streams; the
 * check fails only if 3 or more reject: P(Binomial(28, 0.001) &ge; 3) = 3.3e-6 (binomial sum).
 */
class PopulationAgreementTest {

    private static final long SEED = 20261202L;

    record Case(StageGame game, List<MemoryStrategy> strategies, Noise noise, Horizon horizon, Population population) {
    }

    private static MemoryStrategy randomStrategy(UniformRandomProvider r, String label) {
        double[] p = new double[4];
        for (int s = 0; s < 4; s++) {
            p[s] = r.nextInt(5) == 0 ? r.nextInt(2) : r.nextDouble();
        }
        return MemoryStrategy.memoryOne(label, p, r.nextDouble());
    }

    static List<Case> cases() {
        UniformRandomProvider r = RandomSource.XO_RO_SHI_RO_128_PP.create(SEED);
        List<Case> out = new ArrayList<>();
        for (int c = 0; c < 14; c++) {
            StageGame g = r.nextBoolean() ? StageGame.DEFAULT : StageGame.donation(3, 1);
            List<MemoryStrategy> s = List.of(randomStrategy(r, "a" + c), randomStrategy(r, "b" + c));
            Noise noise = Noise.symmetric(0.1 * r.nextDouble(), r.nextBoolean() ? 0 : 0.1 * r.nextDouble());
            int n = 3 + r.nextInt(6);
            boolean moran = c % 3 == 2;
            Horizon h = !moran && r.nextBoolean() ? Horizon.continuation(0.2 + 0.5 * r.nextDouble())
                : Horizon.rounds(1 + r.nextInt(6));
            Population p;
            if (moran) {
                p = r.nextBoolean() ? Population.moran(n, 0.1 + 0.3 * r.nextDouble(), Population.Fitness.LINEAR)
                    : Population.moran(n, 0.2 + 1.5 * r.nextDouble(), Population.Fitness.EXPONENTIAL);
            } else {
                p = Population.pairwise(n, 0.3 + 2.5 * r.nextDouble());
            }
            if (r.nextInt(3) == 0) {
                p = p.withCoPlayers(1 + r.nextInt(n - 1));
            }
            out.add(new Case(g, s, noise, h, p));
        }
        return out;
    }

    @Test
    void realisedPayoffsAgreeWithSimulation() {
        int invasions = 20_000;
        int rejections = 0;
        StringBuilder log = new StringBuilder();
        List<Case> cases = cases();
        for (int c = 0; c < cases.size(); c++) {
            Case k = cases.get(c);
            PayoffBasis.Realised basis = new PayoffBasis.Realised(k.game(), k.strategies(), k.noise(), k.horizon());
            Fixation.Result exact = Fixation.probability(basis, k.population(), 0, 1);
            PopulationSimulator sim = new PopulationSimulator(k.game(), k.strategies(), k.noise(), k.horizon(),
                k.population(), SEED + c);
            InvasionTally t = sim.invasions(0, 1, 0, invasions, 2);
            double pFix = BinomialTest.withDefaults().test(invasions, (int) t.fixations(), exact.probability()).getPValue();
            BirthDeathChain chain = exact.chain();
            double time = chain.conditionalFixationTime();
            double mean = t.meanFixationTime();
            double var = (t.fixationTimeSquares().doubleValue() - t.fixations() * mean * mean) / (t.fixations() - 1);
            double z = (mean - time) / Math.sqrt(var / t.fixations());
            boolean rejectFix = pFix < 0.001;
            boolean rejectTime = Math.abs(z) > 3.2905;
            rejections += (rejectFix ? 1 : 0) + (rejectTime ? 1 : 0);
            Interval w = WilsonInterval.of(t.fixations(), invasions, 0.999, WilsonInterval.Correction.NONE);
            log.append(String.format("case %d %s %s N=%d: exact %.5f (%s), simulated %.5f [%.5f, %.5f] p=%.3g; time %.2f vs %.2f z=%.2f%n",
                c, k.population().update(), k.horizon().describe(), k.population().size(), exact.probability(),
                exact.method(), t.fixationFrequency(), w.lower(), w.upper(), pFix, time, mean, z));
        }
        System.out.print(log);
        assertTrue(rejections <= 2, "seed " + SEED + ": " + rejections + " of 28 tests rejected\n" + log);
    }

    /**
     * The abundance of one long run with explicit mutation, by batch means (valid for one autocorrelated
     * run), against the exact stationary distribution of the population chain. Three cases, each a 99.9%
     * interval; fails if 2 or more miss: P(Binomial(3, 0.001) &ge; 2) = 3e-6 (batch means is asymptotic in
     * the run length; 2 x 10^5 updates are many mixing times for these small populations).
     */
    @Test
    void explicitMutationAbundanceAgreesWithExactStationaryDistribution() {
        StageGame g = StageGame.DEFAULT;
        List<MemoryStrategy> s = List.of(MemoryStrategy.memoryOne("wsls", new double[] {1, 0, 0, 1}, 1),
            MemoryStrategy.memoryOne("alld", new double[] {0, 0, 0, 0}, 0));
        Noise noise = Noise.symmetric(0.05, 0);
        Horizon h = Horizon.rounds(5);
        Population[] pops = {Population.pairwise(6, 1), Population.moran(5, 0.5, Population.Fitness.EXPONENTIAL),
            Population.pairwise(8, 0.5).withCoPlayers(3)};
        int misses = 0;
        StringBuilder log = new StringBuilder();
        for (int c = 0; c < pops.length; c++) {
            double mu = 0.05;
            double exact = Abundance.explicitMutationAbundance(new PayoffBasis.Realised(g, s, noise, h), pops[c], 0, 1, mu);
            MutationRun run = new PopulationSimulator(g, s, noise, h, pops[c], SEED).mutationRun(0, 1, mu, 0, 200_000, 1, c);
            Estimate e = BatchMeans.estimate(run.fractions());
            Interval ci = e.interval(0.999);
            boolean miss = exact < ci.lower() || exact > ci.upper();
            misses += miss ? 1 : 0;
            log.append(String.format("case %d: exact %.5f, simulated %.5f [%.5f, %.5f]%n", c, exact, e.value(), ci.lower(),
                ci.upper()));
        }
        System.out.print(log);
        assertTrue(misses <= 1, "seed " + SEED + ": " + misses + " of 3 missed\n" + log);
    }

    /** Results do not depend on the number of threads or on how the invasions are cut into ranges. */
    @Test
    void invasionsAreBitIdenticalForAnyThreadsAndRanges() {
        Case k = cases().get(0);
        PopulationSimulator sim = new PopulationSimulator(k.game(), k.strategies(), k.noise(), k.horizon(), k.population(),
            7);
        InvasionTally one = sim.invasions(0, 1, 0, 3000, 1);
        assertEquals(one, sim.invasions(0, 1, 0, 3000, 2));
        assertEquals(one, sim.invasions(0, 1, 0, 3000, 3));
        assertEquals(one, sim.invasions(0, 1, 0, 1234, 1).plus(sim.invasions(0, 1, 1234, 3000, 2)));
    }
}
