package reprise.stats;

import org.apache.commons.statistics.distribution.FDistribution;

/**
 * Hotelling's T^2 test of a mean vector over G independent games when no exact covariance is known
 * (for example user-written agents): the covariance is estimated from the games themselves.
 *
 * <p>T^2 = G (xbar - mu)' S^- (xbar - mu), with S the sample covariance of the per-game vectors
 * (divisor G - 1) and S^- its pseudo-inverse of rank r (or the inverse after dropping one component, see
 * {@link #withDroppedState(int)}). For multivariate normal games
 * F = (G - r) / (r (G - 1)) T^2 has the F(r, G - r) distribution; for other per-game distributions this
 * holds asymptotically in G. p = P(F(r, G - r) &gt; F) from the survival function; G must exceed r.
 *
 * <p>Singular and degenerate components are handled as in {@link WaldTest}: the state counts of
 * fixed-length games sum to n, so r &le; 3; a component that did not vary across the games is dropped if
 * its mean equals the hypothesised one and otherwise the test rejects with p = 0 and a note (with an
 * estimated covariance this means "the games show no spread, so any difference is infinitely
 * significant", not a proof of impossibility).
 *
 * <p>References:
 * <ul>
 *   <li>Hotelling, H. (1931). The generalization of Student's ratio. Annals of Mathematical Statistics
 *       2(3), 360-378.</li>
 *   <li>Moore, D.S. (1977). Generalized inverses, Wald's method, and the construction of chi-squared
 *       tests of fit. Journal of the American Statistical Association 72, 131-137.</li>
 * </ul>
 */
public final class HotellingTest {

    private static final String[] STATES = {"CC", "CD", "DC", "DD"};

    private final int dropped;

    private HotellingTest(int dropped) {
        this.dropped = dropped;
    }

    /** @return the test using the Moore-Penrose pseudo-inverse of the sample covariance */
    public static HotellingTest withDefaults() {
        return new HotellingTest(-1);
    }

    /**
     * The same test, dropping one component instead of using a pseudo-inverse (see {@link WaldTest}).
     *
     * @param index the component to drop
     * @return the configured test
     */
    public HotellingTest withDroppedState(int index) {
        if (index < 0) {
            throw new IllegalArgumentException("dropped component must be an index >= 0: " + index);
        }
        return new HotellingTest(index);
    }

    /**
     * T^2 (see the class description).
     *
     * @param sampleMean xbar, k &ge; 1 entries
     * @param sampleCovariance S of the per-game vectors (divisor G - 1), k x k
     * @param observations G, the number of games
     * @param expectedMean mu under the hypothesis
     * @return T^2, or +infinity if a zero-spread component disagrees
     */
    public double statistic(double[] sampleMean, double[][] sampleCovariance, long observations,
                            double[] expectedMean) {
        return test(sampleMean, sampleCovariance, observations, expectedMean).statistic();
    }

    /**
     * The T^2 test (see the class description). The result's degrees of freedom are the numerator r;
     * the note gives the F degrees of freedom.
     *
     * @param sampleMean xbar, k &ge; 1 entries
     * @param sampleCovariance S of the per-game vectors (divisor G - 1), k x k
     * @param observations G, the number of games, more than the rank
     * @param expectedMean mu under the hypothesis
     * @return statistic T^2, degrees of freedom r, p-value from F(r, G - r)
     */
    public TestResult test(double[] sampleMean, double[][] sampleCovariance, long observations,
                           double[] expectedMean) {
        double[] x = Checks.finiteVector("sample mean", sampleMean, -1);
        double[] mu = Checks.finiteVector("expected mean", expectedMean, x.length);
        double[][] s = Checks.symmetricMatrix("sample covariance", sampleCovariance, x.length);
        return compute(x, mu, s, observations, x.length == 4 ? STATES : WaldTest.names(x.length), "");
    }

    /**
     * T^2 test of the mean state counts per game against hypothesised expected counts, with the sample
     * covariance computed exactly from the sufficient statistics.
     *
     * @param summary the sufficient statistics of G games
     * @param expectedCounts hypothesised E[N_s] of one game, order CC, CD, DC, DD
     * @return the test result
     */
    public TestResult testMeanCounts(GameSummary summary, double[] expectedCounts) {
        double[] mu = Checks.finiteVector("expected counts", expectedCounts, 4);
        return compute(summary.meanCounts(), mu, summary.sampleCovarianceOfCounts(), summary.games(), STATES, "");
    }

    /**
     * T^2 test that the ratio of expectations E[N] / E[L] equals hypothesised frequencies r0, for games
     * of random length. It tests the linearised per-game vectors Z_g = N_g - r0 L_g, whose expectation
     * is exactly 0 under the hypothesis; their sample covariance is formed from the sufficient statistics.
     *
     * @param summary the sufficient statistics of G games
     * @param expectedFrequencies r0, order CC, CD, DC, DD, summing to 1
     * @return the test result
     */
    public TestResult testRatio(GameSummary summary, double[] expectedFrequencies) {
        double[] r0 = Checks.distribution("expected frequencies", expectedFrequencies, 4);
        long g = summary.games();
        if (g < 2) {
            throw new IllegalArgumentException("a sample covariance needs at least 2 games: " + g);
        }
        long[] n = summary.sumCounts();
        long[][] nn = summary.sumCountProducts();
        long[] ln = summary.sumLengthCounts();
        double sl = summary.sumLength();
        double sll = summary.sumLengthSquared();
        double[] mean = new double[4];
        double[] hypothesis = new double[4];
        double[] z = new double[4];
        for (int s = 0; s < 4; s++) {
            mean[s] = n[s] / (double) g;
            hypothesis[s] = r0[s] * sl / g;
            z[s] = (n[s] - r0[s] * sl) / g;
        }
        double[][] cov = new double[4][4];
        for (int s = 0; s < 4; s++) {
            for (int r = 0; r < 4; r++) {
                double szz = nn[s][r] - r0[s] * ln[r] - ln[s] * r0[r] + r0[s] * r0[r] * sll;
                cov[s][r] = (szz - g * z[s] * z[r]) / (g - 1);
            }
        }
        return compute(mean, hypothesis, cov, g, STATES, "linearised ratio N - r0 L");
    }

    private TestResult compute(double[] x, double[] mu, double[][] s, long g, String[] names, String method) {
        if (g < 2) {
            throw new IllegalArgumentException("Hotelling's test needs at least 2 observations: " + g);
        }
        double[][] c = new double[x.length][x.length];
        for (int i = 0; i < x.length; i++) {
            for (int j = 0; j < x.length; j++) {
                c[i][j] = s[i][j] / g;
            }
        }
        QuadraticForms.Form form = QuadraticForms.compute(x, mu, c, names, dropped);
        String note = WaldTest.join(method, form.note());
        if (form.impossible()) {
            return TestResult.impossible(form.rank(), note);
        }
        int r = form.rank();
        if (r == 0) {
            return new TestResult(0, 0, 1, WaldTest.join(note, "no free component left: p = 1"));
        }
        if (g <= r) {
            throw new IllegalArgumentException("Hotelling's test needs more games than the rank " + r + ": " + g);
        }
        double t2 = form.value();
        double f = (g - r) / (r * (g - 1.0)) * t2;
        double p = FDistribution.of(r, g - r).survivalProbability(f);
        return new TestResult(t2, r, p, WaldTest.join(note, "F = " + f + " on (" + r + ", " + (g - r) + ") df"));
    }
}
