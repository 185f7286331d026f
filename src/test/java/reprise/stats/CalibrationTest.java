package reprise.stats;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.junit.jupiter.api.Test;

/**
 * Calibration with independent simulated data generated here with seeded generators. Each check runs
 * K = 200 independent tests at alpha = 0.05 under a true hypothesis and fails if more than 20 reject:
 * P(Binomial(200, 0.05) &gt; 20) = 0.00116 (SciPy 1.17.1, binom.sf(20, 200, 0.05)), the false-failure
 * budget of each check if the test is exactly calibrated.
 */
class CalibrationTest {

    static final int K = 200;
    static final int BUDGET = 20;
    static final double ALPHA = 0.05;

    @Test
    void snapshotPearsonFalseAlarmRate() {
        long seed = 101L;
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(seed);
        double[] p = {0.4, 0.3, 0.2, 0.1};
        double[] pValues = new double[K];
        for (int k = 0; k < K; k++) {
            long[] counts = new long[4];
            for (int g = 0; g < 100; g++) {
                counts[Chains.draw(p, rng)]++;
            }
            pValues[k] = SnapshotTest.withDefaults().test(counts, p).pValue();
        }
        Calibration.Summary s = Calibration.summarize(pValues, ALPHA, 0.95);
        assertTrue(s.rejections() <= BUDGET, "seed " + seed + ": " + s);
    }

    @Test
    void waldOnIidMultinomialGamesFalseAlarmRate() {
        // Each "game" is 10 iid rounds, so its counts are multinomial with covariance n (diag p - p p').
        long seed = 202L;
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(seed);
        double[] p = {0.4, 0.3, 0.2, 0.1};
        double[][] cov = WaldHotellingTest.multinomialCovariance(p, 10);
        double[] mu = {4, 3, 2, 1};
        int rejections = 0;
        for (int k = 0; k < K; k++) {
            long[][] games = new long[50][4];
            for (long[] game : games) {
                for (int t = 0; t < 10; t++) {
                    game[Chains.draw(p, rng)]++;
                }
            }
            if (WaldTest.withDefaults().testMeanCounts(GameSummary.of(games), mu, cov).reject(ALPHA)) {
                rejections++;
            }
        }
        assertTrue(rejections <= BUDGET, "seed " + seed + ": " + rejections + " rejections");
    }

    /**
     * A sticky two-state chain (stay with probability 0.9, stationary start (1/2, 1/2)), games of 20 rounds,
     * 50 games per experiment. The per-game covariance of (N_0, N_1) is computed by brute force over all
     * 2^20 paths. Var(N_0) = 35.115 against the 5 a multinomial would have, so the pooled chi-square is
     * about 7.02 chi2_1 and rejects with probability P(chi2_1 &gt; 3.841 / 7.02) = 0.4596 (SciPy 1.17.1). It
     * must reject more than 60 of 200 times (P(Binomial(200, 0.4596) &le; 60) = 2.9e-6) while the Wald test
     * on per-game counts stays within the budget of 20.
     */
    @Test
    void pooledChiSquareFailsOnAutocorrelatedPlayWhileWaldHolds() {
        double[][] p = {{0.9, 0.1}, {0.1, 0.9}};
        double[] start = {0.5, 0.5};
        int n = 20;
        double[][] moments = Chains.exactCountMoments(p, start, n);
        // Var(N_0) against the closed form
        // (1/4)(n + 2 sum_k (n - k) 0.8^k) evaluated in Python; 1e-7: sequential summation of 2^20 terms
        // of size up to E[N^2] = 135 has a rounding bound 2^20 * 2^-53 * 135 = 1.6e-8.
        assertEquals(35.11529215046069, moments[1][0], 1e-7);
        double[][] cov = Chains.covariance(moments);
        long seed = 303L;
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(seed);
        int wald = 0;
        int pooled = 0;
        for (int k = 0; k < K; k++) {
            double[] sum = new double[2];
            long[] total = new long[2];
            for (int g = 0; g < 50; g++) {
                long[] c = Chains.simulateCounts(p, start, n, rng);
                for (int s = 0; s < 2; s++) {
                    sum[s] += c[s] / 50.0;
                    total[s] += c[s];
                }
            }
            double[][] covOfMean = {{cov[0][0] / 50, cov[0][1] / 50}, {cov[1][0] / 50, cov[1][1] / 50}};
            if (WaldTest.withDefaults().test(sum, moments[0], covOfMean).reject(ALPHA)) {
                wald++;
            }
            TestResult naive = PooledRoundsIllustration.misleadingTest(total, new double[] {0.5, 0.5});
            assertTrue(naive.note().startsWith("ILLUSTRATION ONLY"));
            if (naive.reject(ALPHA)) {
                pooled++;
            }
        }
        assertTrue(wald <= BUDGET, "seed " + seed + ": Wald rejected " + wald);
        assertTrue(pooled > 60, "seed " + seed + ": pooled rejected only " + pooled);
    }

    /**
     * Games of geometric length (continuation 0.8, mean 5) with iid rounds p = (0.4, 0.3, 0.2, 0.1). By the
     * law of total covariance (derived by hand), Cov(N) = E[L] (diag p - p p') + Var(L) p p' with E[L] = 5 and
     * Var(L) = 0.8 / 0.2^2 = 20. The Wald ratio test (exact covariance) and the Hotelling ratio test
     * (sample covariance) of E[N] / E[L] = p each stay within the budget over K = 200 experiments of 100 games.
     */
    @Test
    void ratioTestsOnGeometricLengthsFalseAlarmRate() {
        long seed = 505L;
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(seed);
        double[] p = {0.4, 0.3, 0.2, 0.1};
        double[][] cov = WaldHotellingTest.multinomialCovariance(p, 5);
        double[] mu = new double[4];
        for (int i = 0; i < 4; i++) {
            mu[i] = 5 * p[i];
            for (int j = 0; j < 4; j++) {
                cov[i][j] += 20 * p[i] * p[j];
            }
        }
        int wald = 0;
        int hotelling = 0;
        for (int k = 0; k < K; k++) {
            long[][] games = new long[100][4];
            for (long[] game : games) {
                do {
                    game[Chains.draw(p, rng)]++;
                } while (rng.nextDouble() < 0.8);
            }
            GameSummary s = GameSummary.of(games);
            if (WaldTest.withDefaults().testRatio(s, mu, cov).reject(ALPHA)) {
                wald++;
            }
            if (HotellingTest.withDefaults().testRatio(s, p).reject(ALPHA)) {
                hotelling++;
            }
        }
        assertTrue(wald <= BUDGET, "seed " + seed + ": Wald rejected " + wald);
        assertTrue(hotelling <= BUDGET, "seed " + seed + ": Hotelling rejected " + hotelling);
    }

    @Test
    void summaryOfEvenlySpreadPValues() {
        // p_i = (i + 0.5) / 100: exactly 5 are below 0.05, so the rate is 0.05 and the binomial check passes;
        // the empirical distribution is within 0.005 of uniform, so the KS p-value is essentially 1.
        double[] p = new double[100];
        for (int i = 0; i < 100; i++) {
            p[i] = (i + 0.5) / 100;
        }
        Calibration.Summary s = Calibration.summarize(p, 0.05, 0.95);
        assertEquals(5, s.rejections());
        assertEquals(0.05, s.rejectionRate().estimate(), 1e-15);
        assertTrue(s.consistentWithAlpha(0.05));
        assertTrue(s.uniformityPValue() > 0.99, "KS p = " + s.uniformityPValue());
        // Wilson interval for 5/100 (same formula as REFERENCES item 9).
        assertEquals(WilsonInterval.of(5, 100, 0.95, WilsonInterval.Correction.NONE).lower(),
            s.rejectionRate().lower(), 0);
    }

    @Test
    void tooManyFalseAlarmsAreFlagged() {
        // 30 of 100 below 0.05: by hand P(Binomial(100, 0.05) >= 30) is about 1e-11, far below 0.001.
        double[] p = new double[100];
        for (int i = 0; i < 100; i++) {
            p[i] = i < 30 ? 0.01 : 0.5 + i / 250.0;
        }
        Calibration.Summary s = Calibration.summarize(p, 0.05, 0.95);
        assertTrue(!s.consistentWithAlpha(0.001), s.toString());
        assertTrue(s.uniformityPValue() < 1e-6, s.toString());
        assertThrows(IllegalArgumentException.class, () -> Calibration.summarize(new double[] {1.5}, 0.05, 0.95));
    }
}
