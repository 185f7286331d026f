package reprise.stats;

import org.apache.commons.statistics.distribution.ChiSquaredDistribution;

/**
 * Wald test of mean state counts (or frequencies) over G independent games against the exact
 * expectation, with the exact covariance supplied by the exact engine.
 *
 * <p>W = (xbar - mu)' C^- (xbar - mu), where xbar is the mean over games of a vector statistic, mu its
 * exact expectation and C the exact covariance of xbar (the per-game covariance divided by G). Under
 * the hypothesis W is asymptotically chi-square with rank(C) degrees of freedom (G large; each game is
 * one observation, so autocorrelation within a game is accounted for by the per-game covariance).
 * p = P(chi2_rank &gt; W) from the survival function.
 *
 * <p><b>Singular covariance.</b> For fixed-length games the four counts sum to n, so C has rank 3 (or
 * less). Two routes, which give the same W:
 * <ul>
 *   <li>{@link #withDefaults()}: Moore-Penrose pseudo-inverse, degrees of freedom = numerical rank;</li>
 *   <li>{@link #withDroppedState(int)}: drop one component and invert the rest (valid when the only
 *       singularity is that the components sum to a constant; the result is invariant to which one).</li>
 * </ul>
 * <b>Degenerate components.</b> A component with zero variance under the hypothesis (for example
 * N_CC = 0 in every game of ALLD against ALLD) is dropped if its observed mean equals its expectation;
 * if it does not, the hypothesis is impossible and the test returns p = 0 with a note saying which
 * component and why. Tolerances are in the implementation note of the package-private helper: zero
 * variance means C_ii &le; 1e-12 max C_jj, equality means agreement within 1e-9 of the larger magnitude.
 *
 * <p>References:
 * <ul>
 *   <li>Wald, A. (1943). Tests of statistical hypotheses concerning several parameters when the number of
 *       observations is large. Transactions of the American Mathematical Society 54(3), 426-482.</li>
 *   <li>Moore, D.S. (1977). Generalized inverses, Wald's method, and the construction of chi-squared
 *       tests of fit. Journal of the American Statistical Association 72, 131-137.</li>
 *   <li>Cochran, W.G. (1977). Sampling Techniques, 3rd ed. Wiley, ch. 6 (ratio estimator, delta
 *       method).</li>
 * </ul>
 */
public final class WaldTest {

    private static final String[] STATES = {"CC", "CD", "DC", "DD"};

    private final int dropped;

    private WaldTest(int dropped) {
        this.dropped = dropped;
    }

    /** @return the test using the Moore-Penrose pseudo-inverse */
    public static WaldTest withDefaults() {
        return new WaldTest(-1);
    }

    /**
     * The same test, dropping one component instead of using a pseudo-inverse. If that component was
     * already removed because it has zero variance, the last remaining one is dropped instead.
     *
     * @param index the component to drop (a state 0..3 for state vectors)
     * @return the configured test
     */
    public WaldTest withDroppedState(int index) {
        if (index < 0) {
            throw new IllegalArgumentException("dropped component must be an index >= 0: " + index);
        }
        return new WaldTest(index);
    }

    /**
     * The Wald statistic W (see the class description).
     *
     * @param observedMean the observed mean vector xbar (k &ge; 1 entries; for states: CC, CD, DC, DD)
     * @param expectedMean its exact expectation mu (same order)
     * @param covarianceOfMean the exact covariance of xbar, k x k symmetric (per-game covariance / G)
     * @return W, or +infinity if the data are impossible under the hypothesis
     */
    public double statistic(double[] observedMean, double[] expectedMean, double[][] covarianceOfMean) {
        return test(observedMean, expectedMean, covarianceOfMean).statistic();
    }

    /**
     * The Wald test (see the class description).
     *
     * @param observedMean the observed mean vector xbar (k &ge; 1 entries; for states: CC, CD, DC, DD)
     * @param expectedMean its exact expectation mu (same order)
     * @param covarianceOfMean the exact covariance of xbar, k x k symmetric (per-game covariance / G)
     * @return statistic, degrees of freedom = rank, p-value, note on dropped components
     */
    public TestResult test(double[] observedMean, double[] expectedMean, double[][] covarianceOfMean) {
        double[] x = Checks.finiteVector("observed mean", observedMean, -1);
        double[] mu = Checks.finiteVector("expected mean", expectedMean, x.length);
        double[][] c = Checks.symmetricMatrix("covariance of the mean", covarianceOfMean, x.length);
        return chiSquareResult(QuadraticForms.compute(x, mu, c, names(x.length), dropped), "");
    }

    /**
     * The Wald test of the mean state counts per game, sum_g N_g / G, against the exact expected counts,
     * using the exact per-game covariance divided by G. For fixed-length games this is the same as a
     * test of frequencies (both sides scale by 1/n). For random-length games it tests the mean counts
     * themselves (and hence the mean length), with a full-rank covariance.
     *
     * @param summary the sufficient statistics of G games
     * @param expectedCounts E[N_s] of one game, order CC, CD, DC, DD
     * @param perGameCovariance Cov(N_s, N_r) of one game (4 x 4)
     * @return the test result
     */
    public TestResult testMeanCounts(GameSummary summary, double[] expectedCounts, double[][] perGameCovariance) {
        double[] mu = Checks.finiteVector("expected counts", expectedCounts, 4);
        double[][] c = Checks.symmetricMatrix("per-game covariance", perGameCovariance, 4);
        double g = summary.games();
        for (double[] row : c) {
            for (int j = 0; j < 4; j++) {
                row[j] /= g;
            }
        }
        return chiSquareResult(QuadraticForms.compute(summary.meanCounts(), mu, c, STATES, dropped), "");
    }

    /**
     * The Wald test of the ratio estimator of the state frequencies, R = sum_g N_g / sum_g L_g, against
     * r0 = E[N] / E[L], for games of random (e.g. geometric) length. R estimates the ratio of expectations,
     * not the mean of per-game frequencies. Its covariance is the delta-method one,
     * Cov(R) = A Sigma A' / (G E[L]^2) with A = I - r0 1' and Sigma = Cov(N) of one game (L = 1'N, so
     * Cov(N, L) = Sigma 1 and Var L = 1' Sigma 1 are implied). A 1 = 0, so the rank is at most 3.
     *
     * @param summary the sufficient statistics of G games
     * @param expectedCounts E[N_s] of one game, order CC, CD, DC, DD (their sum is E[L])
     * @param perGameCovariance Cov(N_s, N_r) of one game (4 x 4)
     * @return the test result
     */
    public TestResult testRatio(GameSummary summary, double[] expectedCounts, double[][] perGameCovariance) {
        double[] mu = Checks.finiteVector("expected counts", expectedCounts, 4);
        double[][] sigma = Checks.symmetricMatrix("per-game covariance", perGameCovariance, 4);
        double length = mu[0] + mu[1] + mu[2] + mu[3];
        Checks.positive("expected length (sum of expected counts)", length);
        double[] r0 = new double[4];
        for (int s = 0; s < 4; s++) {
            r0[s] = mu[s] / length;
        }
        double[] sigmaOne = new double[4];
        double total = 0;
        for (int s = 0; s < 4; s++) {
            for (int r = 0; r < 4; r++) {
                sigmaOne[s] += sigma[s][r];
            }
            total += sigmaOne[s];
        }
        double[][] c = new double[4][4];
        double scale = summary.games() * length * length;
        for (int s = 0; s < 4; s++) {
            for (int r = 0; r < 4; r++) {
                c[s][r] = (sigma[s][r] - r0[s] * sigmaOne[r] - sigmaOne[s] * r0[r] + r0[s] * r0[r] * total) / scale;
            }
        }
        return chiSquareResult(QuadraticForms.compute(summary.pooledFrequencies(), r0, c, STATES, dropped),
            "ratio estimator sum N / sum L, delta-method covariance");
    }

    static TestResult chiSquareResult(QuadraticForms.Form form, String method) {
        String note = join(method, form.note());
        if (form.impossible()) {
            return TestResult.impossible(form.rank(), note);
        }
        if (form.rank() == 0) {
            return new TestResult(0, 0, 1, join(note, "no free component left: p = 1"));
        }
        double p = ChiSquaredDistribution.of(form.rank()).survivalProbability(form.value());
        return new TestResult(form.value(), form.rank(), p, note);
    }

    static String join(String a, String b) {
        return a.isEmpty() ? b : b.isEmpty() ? a : a + "; " + b;
    }

    static String[] names(int k) {
        if (k == 4) {
            return STATES.clone();
        }
        String[] n = new String[k];
        for (int i = 0; i < k; i++) {
            n[i] = "component " + i;
        }
        return n;
    }
}
