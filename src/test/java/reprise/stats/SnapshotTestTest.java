package reprise.stats;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.stream.Stream;
import org.apache.commons.rng.simple.RandomSource;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.statistics.distribution.BinomialDistribution;
import org.apache.commons.statistics.distribution.ChiSquaredDistribution;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/** The snapshot test: Pearson for large expected counts, exact multinomial otherwise. */
class SnapshotTestTest {

    /**
     * Hand enumeration (computed by hand from the multinomial formula), G = 3 games, p = (0.5, 0.3, 0.2) and a
     * fourth state of probability 0 that must be ignored. The 10 outcomes (a, b, c) have probabilities
     * 3!/(a! b! c!) 0.5^a 0.3^b 0.2^c: (3,0,0) 0.125, (0,3,0) 0.027, (0,0,3) 0.008, (2,1,0) 0.225,
     * (2,0,1) 0.15, (1,2,0) 0.135, (0,2,1) 0.054, (1,0,2) 0.06, (0,1,2) 0.036, (1,1,1) 0.18 (sum 1).
     * p = sum of those no larger than the observed one.
     */
    static Stream<Arguments> handEnumeration() {
        return Stream.of(
            Arguments.of(new long[] {0, 1, 2, 0}, 0.036 + 0.027 + 0.008),
            Arguments.of(new long[] {0, 0, 3, 0}, 0.008),
            Arguments.of(new long[] {1, 1, 1, 0}, 1 - 0.225),
            Arguments.of(new long[] {2, 1, 0, 0}, 1.0));
    }

    @ParameterizedTest
    @MethodSource("handEnumeration")
    void exactTestMatchesHandEnumeration(long[] counts, double p) {
        double[] probabilities = {0.5, 0.3, 0.2, 0};
        TestResult r = SnapshotTest.withDefaults().test(counts, probabilities);
        // 1e-14: ten products of short decimals, summed in double.
        assertEquals(p, r.pValue(), 1e-14);
        assertTrue(r.note().startsWith("exact multinomial test, 10 outcomes"), r.note());
        assertEquals(TestResult.SmallSample.EXACT, r.smallSample());
        assertEquals(2, r.degreesOfFreedom());
    }

    /**
     * The remembered binomial inversion used by the Monte Carlo test must give exactly the draws of the
     * library's own sampler (Commons Statistics BinomialDistribution.createSampler, inversion of one
     * uniform), so that p-values stay bit for bit the same: compared on 20,000 uniforms per
     * distribution, plus the edge uniforms 0 and the largest double below 1, over trial counts and
     * success probabilities from degenerate (0 and 1) to skewed and symmetric. A deterministic
     * comparison against the reference library, no tolerance.
     */
    static Stream<Arguments> binomials() {
        return Stream.of(Arguments.of(1, 0.5), Arguments.of(7, 0.0), Arguments.of(7, 1.0), Arguments.of(50, 0.001),
            Arguments.of(200, 0.3), Arguments.of(2000, 0.9), Arguments.of(2000, 0.0015), Arguments.of(100_000, 0.5),
            Arguments.of(30, 0.999999));
    }

    @ParameterizedTest
    @MethodSource("binomials")
    void rememberedInversionDrawsWhatTheLibrarySamplerDraws(int trials, double probability) {
        BinomialDistribution library = BinomialDistribution.of(trials, probability);
        SnapshotTest.MemoBinomial memo = new SnapshotTest.MemoBinomial(trials, probability);
        UniformRandomProvider a = RandomSource.XO_RO_SHI_RO_128_PP.create(17L);
        UniformRandomProvider b = RandomSource.XO_RO_SHI_RO_128_PP.create(17L);
        var sampler = library.createSampler(a);
        for (int i = 0; i < 20_000; i++) {
            int expected = sampler.sample();
            assertEquals(expected, memo.inverseCumulativeProbability(b.nextDouble()), "draw " + i);
            assertEquals(library.logProbability(expected), memo.logProbability(expected));
        }
        for (double u : new double[] {0, Math.nextDown(1.0), 1e-300, 0.5}) {
            assertEquals(library.inverseCumulativeProbability(u), memo.inverseCumulativeProbability(u), "u = " + u);
        }
    }

    @Test
    void monteCarloFallbackAgreesWithEnumeration() {
        // Enumeration limit 1 forces the fallback. Fixed seed; M = 20000 gives a standard error of
        // sqrt(0.071 * 0.929 / 20000) = 0.0018, and the tolerance 0.01 is 5.5 standard errors.
        long seed = 7L;
        SnapshotTest t = SnapshotTest.withDefaults().withEnumerationLimit(1)
            .withMonteCarlo(RandomSource.XO_RO_SHI_RO_128_PP.create(seed), 20000);
        TestResult r = t.test(new long[] {0, 1, 2, 0}, new double[] {0.5, 0.3, 0.2, 0});
        assertEquals(0.071, r.pValue(), 0.01, "seed " + seed);
        assertTrue(r.note().startsWith("Monte Carlo"), r.note());
        assertEquals(TestResult.SmallSample.MONTE_CARLO, r.smallSample());
    }

    @Test
    void fallbackWithoutGeneratorIsAnError() {
        IllegalStateException e = assertThrows(IllegalStateException.class, () -> SnapshotTest.withDefaults()
            .withEnumerationLimit(1).test(new long[] {0, 1, 2}, new double[] {0.5, 0.3, 0.2}));
        assertTrue(e.getMessage().contains("withMonteCarlo"), e.getMessage());
    }

    @Test
    void largeExpectedCountsUsePearson() {
        // Computed by hand: G = 100, p = (0.4, 0.3, 0.2, 0.1), counts (45, 25, 18, 12):
        // X^2 = 25/40 + 25/30 + 4/20 + 4/10 = 2.058333..., 3 df.
        long[] n = {45, 25, 18, 12};
        double[] p = {0.4, 0.3, 0.2, 0.1};
        TestResult r = SnapshotTest.withDefaults().test(n, p);
        double x2 = 25 / 40.0 + 25 / 30.0 + 0.2 + 0.4;
        assertEquals(x2, r.statistic(), 1e-13);
        assertEquals(ChiSquaredDistribution.of(3).survivalProbability(x2), r.pValue(), 1e-14);
        assertEquals("Pearson chi-square", r.note());
        assertEquals(TestResult.SmallSample.NONE, r.smallSample());
    }

    @Test
    void countInZeroProbabilityStateIsImpossible() {
        TestResult r = SnapshotTest.withDefaults().test(new long[] {1, 1, 1, 1}, new double[] {0.5, 0.3, 0.2, 0});
        assertEquals(0, r.pValue());
        assertTrue(r.note().contains("impossible"), r.note());
    }

    @Test
    void badInputs() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
            () -> SnapshotTest.withDefaults().test(new long[] {1, 2}, new double[] {0.5, 0.6}));
        assertEquals("snapshot probabilities must sum to 1: 1.1", e.getMessage());
        assertThrows(IllegalArgumentException.class,
            () -> SnapshotTest.withDefaults().test(new long[] {0, 0}, new double[] {0.5, 0.5}));
    }
}
