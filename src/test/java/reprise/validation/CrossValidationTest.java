package reprise.validation;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import reprise.chain.CountMoments;
import reprise.experiment.BaseQuantity;
import reprise.experiment.CalibrationStudy;
import reprise.experiment.CaseAnalysis;
import reprise.experiment.TestId;
import reprise.game.Horizon;
import reprise.game.Match;
import reprise.game.Noise;
import reprise.game.StageGame;
import reprise.sim.SimulationResult;
import reprise.sim.SimulationSpec;
import reprise.sim.Simulator;
import reprise.stats.TestResult;

/**
 * Where the simulator and the exact engine meet: simulated tallies against the exact n-round law, on
 * the twelve cases of {@link Cases}, thread independence, and planted defects that must be caught.
 *
 * <p>Failure budget of {@link #simulationAgreesWithExactLaw()}: per case the Wald test of the state
 * counts and (where the true history is a Markov chain) the Anderson &amp; Goodman Pearson test of the
 * transition counts, M = 23 tests at alpha = 0.01 each, on independent simulations (one seed per case);
 * the check fails only if 3 or more reject: P(Binomial(23, 0.01) &ge; 3) = 0.0015 (computed
 * independently from the binomial sum). Besides, every state's z-score (exact standard error) must lie
 * within the two-sided Bonferroni bound at 0.01 / 48 over all 48 state z-scores, a false failure
 * probability of at most 0.01 whatever their dependence. Total false-failure probability at most 0.012.
 * Seeds: SEED + case index (logged in failure messages).
 */
class CrossValidationTest {
    private static final long SEED = 0x7E57_5EEDL;
    private static final double ALPHA = 0.01;
    private static final int MAX_REJECTIONS = 2;

    private static SimulationResult simulate(Cases.Case c, long seed, int threads) {
        return new Simulator(SimulationSpec.of(c.match(), c.horizon(), c.games(), seed).withBurnIn(c.burnIn())
            .withThreads(threads)).run();
    }

    private static Map<TestId, TestResult> stateTests(CaseAnalysis.Exact exact, SimulationResult r) {
        return CaseAnalysis.tests(exact, r, StageGame.DEFAULT, BaseQuantity.STATES);
    }

    @Test
    void simulationAgreesWithExactLaw() {
        List<String> rejected = new ArrayList<>();
        List<String> zFailures = new ArrayList<>();
        int tests = 0;
        int zTests = 0;
        double zBound = org.apache.commons.statistics.distribution.NormalDistribution.of(0, 1)
            .inverseSurvivalProbability(0.01 / 48 / 2);
        List<Cases.Case> cases = Cases.all();
        for (int i = 0; i < cases.size(); i++) {
            Cases.Case c = cases.get(i);
            long seed = SEED + i;
            CaseAnalysis.Exact exact = CaseAnalysis.exact(c.match(), c.horizon(), c.burnIn());
            SimulationResult r = simulate(c, seed, 2);
            for (Map.Entry<TestId, TestResult> t : stateTests(exact, r).entrySet()) {
                TestId id = t.getKey();
                if (id == TestId.Standard.FREQUENCIES_WALD || id == TestId.Standard.TRANSITIONS_PEARSON) {
                    tests++;
                    if (t.getValue().reject(ALPHA)) {
                        rejected.add(c + " seed " + seed + ": " + id.label() + " p = " + t.getValue().pValue());
                    }
                } else if (id instanceof TestId.ZScore zs) {
                    double z = t.getValue().statistic();
                    if (exact.value(zs.quantity().weights(StageGame.DEFAULT)) > 0) {
                        zTests++;
                        if (!(Math.abs(z) < zBound)) {
                            zFailures.add(c + " seed " + seed + ": " + id.label() + " = " + z);
                        }
                    }
                }
            }
        }
        assertEquals(23, tests, "Wald tests on 12 cases and Pearson tests on the 11 with a Markov true history");
        assertTrue(zTests >= 40, "state z-scores with a non-zero exact frequency: " + zTests);
        assertTrue(rejected.size() <= MAX_REJECTIONS, "more than " + MAX_REJECTIONS + " of " + tests
            + " rejections at alpha " + ALPHA + ": " + rejected);
        assertTrue(zFailures.isEmpty(), "z-scores beyond the Bonferroni bound " + zBound + ": " + zFailures);
    }

    static Stream<Arguments> threadCases() {
        List<Cases.Case> all = Cases.all();
        return Stream.of(Arguments.of(all.get(0)), Arguments.of(all.get(5)), Arguments.of(all.get(7)));
    }

    /** The simulation is a function of (seed, replicate) only; exact equality, no tolerance. */
    @ParameterizedTest
    @MethodSource("threadCases")
    void simulationIsIdenticalForOneAndTwoThreads(Cases.Case c) {
        SimulationResult one = simulate(c, SEED, 1);
        SimulationResult two = simulate(c, SEED, 2);
        assertEquals(one, two);
        assertArrayEquals(one.transitionCounts(), two.transitionCounts());
    }

    /** Repetitions run on one thread each, so the study too is identical for any thread count. */
    @Test
    void calibrationIsIdenticalForOneAndTwoThreads() {
        Cases.Case c = Cases.all().get(8);
        SimulationSpec s = SimulationSpec.of(c.match(), c.horizon(), 200, SEED);
        CalibrationStudy.Result one = CalibrationStudy.of(s.withThreads(1)).withRepetitions(6).run(null);
        CalibrationStudy.Result two = CalibrationStudy.of(s.withThreads(2)).withRepetitions(6).run(null);
        assertEquals(one.tests().size(), two.tests().size());
        for (int i = 0; i < one.tests().size(); i++) {
            assertEquals(one.tests().get(i).test(), two.tests().get(i).test());
            assertArrayEquals(one.tests().get(i).pValues(), two.tests().get(i).pValues());
        }
        assertEquals(one.roundsTotal(), two.roundsTotal());
    }

    private static TestResult named(Map<TestId, TestResult> tests, TestId id) {
        TestResult t = tests.get(id);
        if (t == null) {
            throw new AssertionError("no test " + id.label() + " in " + tests);
        }
        return t;
    }

    /**
     * A noise level misstated by one percentage point (true 0.05, predicted 0.04) on tft vs tft over 50
     * rounds with 2000 games. The calibrate command measured 100/100 rejections by the transition tests
     * already with 500 games (seed 1), so at 2000 games a miss at p &lt; 1e-4 has negligible probability.
     */
    @Test
    void wrongNoiseLevelIsCaught() {
        Cases.Case c = new Cases.Case("tft vs tft", "tft", "tft", new Noise(0.05, 0.05, 0, 0), Horizon.rounds(50), 0,
            2000);
        Match wrong = new Match(c.match().game(), c.match().x(), c.match().y(), new Noise(0.04, 0.04, 0, 0));
        Map<TestId, TestResult> tests = CaseAnalysis.tests(CaseAnalysis.exact(wrong, c.horizon(), 0),
            simulate(c, SEED, 2));
        assertTrue(named(tests, TestId.Standard.TRANSITIONS_PEARSON).pValue() < 1e-4, tests.toString());
        assertTrue(named(tests, TestId.Standard.TRANSITIONS_LR).pValue() < 1e-4, tests.toString());
    }

    /**
     * States in the wrong order: the exact moments with CD and DC swapped, on gtft vs alld, where X is
     * exploited (CD) far more often than Y (DC). 4000 games of mean length 20.
     */
    @Test
    void swappedStatesAreCaught() {
        Cases.Case c = Cases.all().get(2);
        CaseAnalysis.Exact e = CaseAnalysis.exact(c.match(), c.horizon(), c.burnIn());
        int[] order = {0, 2, 1, 3};
        double[] mean = e.moments().mean();
        double[][] cov = e.moments().covariance();
        double[] m2 = new double[4];
        double[][] c2 = new double[4][4];
        double[] f2 = new double[4];
        for (int a = 0; a < 4; a++) {
            m2[a] = mean[order[a]];
            f2[a] = e.frequencies()[order[a]];
            for (int b = 0; b < 4; b++) {
                c2[a][b] = cov[order[a]][order[b]];
            }
        }
        CaseAnalysis.Exact swapped = new CaseAnalysis.Exact(e.chain(), e.prediction(), new CountMoments(m2, c2), f2,
            e.transitions(), e.transitionsNote());
        SimulationResult r = simulate(c, SEED, 2);
        Map<TestId, TestResult> good = stateTests(e, r);
        Map<TestId, TestResult> bad = stateTests(swapped, r);
        assertTrue(named(bad, TestId.Standard.FREQUENCIES_WALD).pValue() < 1e-6, bad.toString());
        assertTrue(named(bad, new TestId.ZScore(BaseQuantity.CD)).pValue() < 1e-6, bad.toString());
        assertTrue(named(good, TestId.Standard.FREQUENCIES_WALD).pValue() > 1e-6, "the unplanted case must pass: "
            + good);
    }

    /** Predicting n + 1 rounds for an n-round game: every game's counts sum to n, impossible under n + 1. */
    @Test
    void horizonOffByOneIsCaught() {
        Cases.Case c = Cases.all().get(0);
        CaseAnalysis.Exact wrong = CaseAnalysis.exact(c.match(), Horizon.rounds(51), 0);
        TestResult w = named(CaseAnalysis.tests(wrong, simulate(c, SEED, 2)), TestId.Standard.FREQUENCIES_WALD);
        assertEquals(0, w.pValue(), w.toString());
        assertNotNull(w.note());
    }

    /**
     * A subtler off-by-one: the right length but the window shifted by one round (rounds 2..n+1 instead
     * of 1..n), on 10-round tft vs tft at 5% noise with 20000 games; only the opening transient differs
     * (round 1 starts in CC with probability 0.9025, round 11 with about 0.4).
     */
    @Test
    void shiftedWindowIsCaught() {
        Cases.Case c = new Cases.Case("tft vs tft, 10 rounds", "tft", "tft", new Noise(0.05, 0.05, 0, 0),
            Horizon.rounds(10), 0, 20000);
        CaseAnalysis.Exact shifted = CaseAnalysis.exact(c.match(), Horizon.rounds(11), 1);
        SimulationResult r = simulate(c, SEED, 2);
        TestResult w = named(CaseAnalysis.tests(shifted, r), TestId.Standard.FREQUENCIES_WALD);
        assertTrue(w.pValue() < 1e-6, w.toString());
        TestResult right = named(CaseAnalysis.tests(CaseAnalysis.exact(c.match(), c.horizon(), 0), r),
            TestId.Standard.FREQUENCIES_WALD);
        assertTrue(right.pValue() > 1e-6, right.toString());
    }
}
