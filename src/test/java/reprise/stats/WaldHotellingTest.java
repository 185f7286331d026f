package reprise.stats;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.stream.IntStream;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.SingularValueDecomposition;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.apache.commons.statistics.distribution.ChiSquaredDistribution;
import org.apache.commons.statistics.distribution.FDistribution;
import org.apache.commons.statistics.inference.TTest;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/** Wald and Hotelling tests: singularity handling, degenerate components, agreement of routes. */
class WaldHotellingTest {

    static final double[][] M = TransitionTestTest.M;
    static final double[] START_CC = {1, 0, 0, 0};
    static final int ROUNDS = 6;
    /** Brute-force exact moments of the counts of a 6-round game of the REFERENCES item 7 chain from CC. */
    static final double[][] MOMENTS = Chains.exactCountMoments(M, START_CC, ROUNDS);
    static final long SEED = 20240611L;

    static GameSummary simulatedGames(int games, long seed) {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(seed);
        long[][] counts = new long[games][];
        for (int g = 0; g < games; g++) {
            counts[g] = Chains.simulateCounts(M, START_CC, ROUNDS, rng);
        }
        return GameSummary.of(counts);
    }

    @Test
    void exactCovarianceHasRankThree() {
        double[][] c = Chains.covariance(MOMENTS);
        for (double[] row : c) {
            double sum = 0;
            for (double v : row) {
                sum += v;
            }
            // Counts sum to 6 in every game, so every row of the covariance sums to 0 (rounding only).
            assertEquals(0, sum, 1e-12);
        }
        // Rank by singular values (Commons Math 3 SVD). The all-ones vector spans the null space that the
        // fixed total forces; with every transition probability of this chain in (0, 1) no other
        // combination of the four counts is constant, so exactly one singular value vanishes (the
        // multinomial-type fact that k counts with a fixed total have rank k - 1; common practice, no source).
        // Tolerances relative to the largest singular value (4.18): the vanishing one is rounding (observed
        // 1.2e-14, i.e. 3e-15 relative), so 1e-12 leaves two orders of room; the third (0.41) is 0.1 of the
        // largest, so 1e-6 cannot be reached by rounding and fails only if a real direction were lost.
        SingularValueDecomposition svd = new SingularValueDecomposition(new Array2DRowRealMatrix(c));
        double[] sv = svd.getSingularValues();
        assertEquals(4, sv.length);
        assertTrue(sv[2] > 1e-6 * sv[0], () -> "third singular value is not clearly positive: "
            + java.util.Arrays.toString(sv));
        assertTrue(sv[3] < 1e-12 * sv[0], () -> "fourth singular value is not zero: " + java.util.Arrays.toString(sv));
        double[] ones = {0.5, 0.5, 0.5, 0.5};
        double[] nullDirection = svd.getV().getColumn(3);
        double dot = 0;
        for (int i = 0; i < 4; i++) {
            dot += ones[i] * nullDirection[i];
        }
        // The null direction is the unit all-ones vector (up to sign): |<v, 1/2>| = 1 to rounding.
        assertEquals(1, Math.abs(dot), 1e-9);
    }

    @Test
    void waldIsInvariantToTheDroppedStateAndEqualsThePseudoInverseRoute() {
        GameSummary s = simulatedGames(200, SEED);
        TestResult pinv = WaldTest.withDefaults().testMeanCounts(s, MOMENTS[0], Chains.covariance(MOMENTS));
        assertEquals(3, pinv.degreesOfFreedom());
        for (int drop = 0; drop < 4; drop++) {
            TestResult r = WaldTest.withDefaults().withDroppedState(drop)
                .testMeanCounts(s, MOMENTS[0], Chains.covariance(MOMENTS));
            // 1e-9 relative: a 3 x 3 LU solve versus a 4 x 4 eigen-decomposition of the same well-conditioned
            // matrix (condition number ~10 after scaling) agree to ~1e-14; 1e-9 leaves room.
            assertEquals(pinv.statistic(), r.statistic(), 1e-9 * pinv.statistic(), "dropped " + drop);
            assertEquals(3, r.degreesOfFreedom());
            assertEquals(pinv.pValue(), r.pValue(), 1e-9);
        }
        // The p-value is the chi-square(3) survival function of the statistic.
        assertEquals(ChiSquaredDistribution.of(3).survivalProbability(pinv.statistic()), pinv.pValue(), 1e-15);
    }

    @Test
    void ratioRouteEqualsMeanCountRouteForFixedLength() {
        // For fixed length n, Sigma 1 = 0, so A Sigma A' = Sigma and R = mean counts / n: the same W.
        GameSummary s = simulatedGames(100, SEED + 1);
        double[][] sigma = Chains.covariance(MOMENTS);
        TestResult counts = WaldTest.withDefaults().testMeanCounts(s, MOMENTS[0], sigma);
        TestResult ratio = WaldTest.withDefaults().testRatio(s, MOMENTS[0], sigma);
        assertEquals(counts.statistic(), ratio.statistic(), 1e-8 * counts.statistic());
        assertEquals(counts.degreesOfFreedom(), ratio.degreesOfFreedom());
    }

    @Test
    void oneDimensionalWaldByHand() {
        // Computed by hand: W = (2.5 - 2)^2 / 0.1 = 2.5 with 1 df.
        TestResult r = WaldTest.withDefaults().test(new double[] {2.5}, new double[] {2}, new double[][] {{0.1}});
        assertEquals(2.5, r.statistic(), 1e-14);
        assertEquals(1, r.degreesOfFreedom());
        assertEquals(ChiSquaredDistribution.of(1).survivalProbability(2.5), r.pValue(), 1e-15);
    }

    /** Multinomial counts of 10 iid rounds with p = (0, 0.2, 0.3, 0.5): CC has zero variance. */
    static double[][] multinomialCovariance(double[] p, double n) {
        double[][] c = new double[p.length][p.length];
        for (int i = 0; i < p.length; i++) {
            for (int j = 0; j < p.length; j++) {
                c[i][j] = n * ((i == j ? p[i] : 0) - p[i] * p[j]);
            }
        }
        return c;
    }

    @ParameterizedTest(name = "route {0}")
    @ValueSource(ints = {-1, 0, 1, 3})
    void degenerateComponentEqualToExpectationIsDropped(int drop) {
        double[] p = {0, 0.2, 0.3, 0.5};
        double[] mu = {0, 2, 3, 5};
        double[] observed = {0, 2.3, 2.9, 4.8};
        WaldTest t = drop < 0 ? WaldTest.withDefaults() : WaldTest.withDefaults().withDroppedState(drop);
        TestResult r = t.test(observed, mu, multinomialCovariance(p, 10));
        assertEquals(2, r.degreesOfFreedom());
        assertTrue(r.note().contains("CC"), r.note());
        // By hand, the Pearson form of the multinomial Wald statistic over the 3 free cells, scaled to one
        // game: sum (x - mu)^2 / mu = 0.09/2 + 0.01/3 + 0.04/5 = 0.0563333...
        assertEquals(0.045 + 0.01 / 3 + 0.008, r.statistic(), 1e-12);
    }

    @Test
    void degenerateComponentDifferentFromExpectationRejectsWithPZero() {
        double[] p = {0, 0.2, 0.3, 0.5};
        TestResult r = WaldTest.withDefaults().test(new double[] {0.1, 2, 2.9, 5}, new double[] {0, 2, 3, 5},
            multinomialCovariance(p, 10));
        assertEquals(0, r.pValue());
        assertEquals(Double.POSITIVE_INFINITY, r.statistic());
        assertTrue(r.note().startsWith("CC has zero variance"), r.note());
        assertTrue(r.reject(1e-12));
    }

    @Test
    void deviationAlongTheFixedSumRejectsWithPZero() {
        double[] p = {0.1, 0.2, 0.3, 0.4};
        double[] mu = {1, 2, 3, 4};
        double[] observed = {1.5, 2, 3, 4};
        TestResult pinv = WaldTest.withDefaults().test(observed, mu, multinomialCovariance(p, 10));
        assertEquals(0, pinv.pValue());
        assertTrue(pinv.note().contains("direction of zero variance"), pinv.note());
        TestResult dropped = WaldTest.withDefaults().withDroppedState(2).test(observed, mu,
            multinomialCovariance(p, 10));
        assertEquals(0, dropped.pValue());
        assertTrue(dropped.note().contains("sum"), dropped.note());
    }

    @Test
    void allDeterministicGivesNothingToTest() {
        TestResult r = WaldTest.withDefaults().test(new double[] {0, 0, 0, 6}, new double[] {0, 0, 0, 6},
            new double[4][4]);
        assertEquals(0, r.degreesOfFreedom());
        assertEquals(1, r.pValue());
    }

    @Test
    void hotellingInOneDimensionIsTheSquaredTTest() {
        // Independent route: Commons Statistics TTest on the raw data; T^2 = t^2 and p(F(1, G-1)) = two-sided p.
        double[] x = {2.1, 1.7, 2.9, 2.4, 1.5, 2.2, 3.1, 2.6};
        double mean = IntStream.range(0, x.length).mapToDouble(i -> x[i]).average().orElseThrow();
        double ss = 0;
        for (double v : x) {
            ss += (v - mean) * (v - mean);
        }
        TestResult r = HotellingTest.withDefaults().test(new double[] {mean}, new double[][] {{ss / (x.length - 1)}},
            x.length, new double[] {2});
        TTest.Result t = TTest.withDefaults().withMu(2).test(x);
        assertEquals(t.getStatistic() * t.getStatistic(), r.statistic(), 1e-12);
        assertEquals(t.getPValue(), r.pValue(), 1e-12);
    }

    @Test
    void hotellingOnGameCountsUsesRankThreeAndIsRouteInvariant() {
        GameSummary s = simulatedGames(60, SEED + 2);
        TestResult pinv = HotellingTest.withDefaults().testMeanCounts(s, MOMENTS[0]);
        assertEquals(3, pinv.degreesOfFreedom());
        double f = (60 - 3) / (3 * 59.0) * pinv.statistic();
        assertEquals(FDistribution.of(3, 57).survivalProbability(f), pinv.pValue(), 1e-14);
        for (int drop = 0; drop < 4; drop++) {
            TestResult r = HotellingTest.withDefaults().withDroppedState(drop).testMeanCounts(s, MOMENTS[0]);
            assertEquals(pinv.statistic(), r.statistic(), 1e-9 * pinv.statistic());
        }
        // The ratio form on fixed-length games tests the same hypothesis (frequencies = mu / n).
        double[] f0 = new double[4];
        for (int i = 0; i < 4; i++) {
            f0[i] = MOMENTS[0][i] / ROUNDS;
        }
        f0[3] = 1 - f0[0] - f0[1] - f0[2];
        TestResult ratio = HotellingTest.withDefaults().testRatio(s, f0);
        assertEquals(pinv.statistic(), ratio.statistic(), 1e-7 * pinv.statistic());
    }

    @Test
    void badInputs() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> WaldTest.withDefaults()
            .test(new double[] {1, 2}, new double[] {1, 2}, new double[][] {{1, 0.5}, {0.4, 1}}));
        assertTrue(e.getMessage().contains("symmetric"), e.getMessage());
        e = assertThrows(IllegalArgumentException.class, () -> WaldTest.withDefaults()
            .test(new double[] {1, Double.NaN}, new double[] {1, 2}, new double[][] {{1, 0}, {0, 1}}));
        assertEquals("observed mean[1] must be a finite number: NaN", e.getMessage());
        double[][] identity = {{1, 0, 0}, {0, 1, 0}, {0, 0, 1}};
        e = assertThrows(IllegalArgumentException.class, () -> HotellingTest.withDefaults()
            .test(new double[] {1, 2, 3}, identity, 3, new double[] {1, 2, 3}));
        assertEquals("Hotelling's test needs more games than the rank 3: 3", e.getMessage());
        e = assertThrows(IllegalArgumentException.class, () -> new GameSummary(1, new long[] {1, 0, 0, 0},
            new long[][] {{1, 0, 0, 0}, {0, 0, 0, 0}, {0, 0, 0, 0}, {0, 0, 0, 0}}, new long[] {1, 0, 0, 0}, 2, 1));
        assertTrue(e.getMessage().startsWith("sum of lengths must equal"), e.getMessage());
    }
}
