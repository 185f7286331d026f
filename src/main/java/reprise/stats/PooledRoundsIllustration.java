package reprise.stats;

import org.apache.commons.statistics.inference.ChiSquareTest;

/**
 * ILLUSTRATION ONLY, never a verdict: the Pearson chi-square on state counts pooled over all rounds of
 * all games, as if every round were an independent draw from the expected state frequencies.
 *
 * <p><b>Why it is miscalibrated.</b> Rounds of a repeated game are autocorrelated: a state tends to
 * persist (or to alternate), so the variance of a pooled count is not the multinomial n p (1 - p) but
 * roughly n p (1 - p) times an inflation factor 1 + 2 sum_k rho_k (rho_k the lag-k autocorrelation of the
 * state indicator), often 5 to 50 for sticky strategies. The statistic is then about that factor times a
 * chi-square variable, and a true model is rejected far more often than alpha (44% at alpha = 0.05 in a
 * typical case); with negatively correlated play it can instead be too lenient. Use {@link WaldTest} on
 * per-game counts, {@link HotellingTest}, {@link TransitionTest} or {@link SnapshotTest} for a valid test.
 * This class exists so that reports can show the pitfall side by side with a valid test.
 *
 * <p>References:
 * <ul>
 *   <li>Pearson, K. (1900). On the criterion that a given system of deviations from the probable in the
 *       case of a correlated system of variables is such that it can be reasonably supposed to have
 *       arisen from random sampling. Philosophical Magazine Series 5, 50, 157-175.</li>
 *   <li>Anderson, T.W. &amp; Goodman, L.A. (1957). Statistical inference about Markov chains. Annals of
 *       Mathematical Statistics 28(1), 89-110 (tests that do respect the dependence).</li>
 * </ul>
 */
public final class PooledRoundsIllustration {

    /** The label every result of this class carries. */
    public static final String LABEL =
        "ILLUSTRATION ONLY: pooled-rounds chi-square treats autocorrelated rounds as independent; not a verdict";

    private PooledRoundsIllustration() {
    }

    /**
     * The pooled statistic sum_s (N_s - T f_s)^2 / (T f_s), T = sum_s N_s, over states with f_s &gt; 0.
     *
     * @param totalCounts state counts summed over all rounds and games (CC, CD, DC, DD)
     * @param expectedFrequencies the expected per-round frequencies, summing to 1
     * @return the (miscalibrated) statistic; +infinity if a count falls in a state of frequency 0
     */
    public static double misleadingStatistic(long[] totalCounts, double[] expectedFrequencies) {
        return SnapshotTest.withDefaults().statistic(totalCounts, expectedFrequencies);
    }

    /**
     * The pooled "test" with its naive chi-square p-value (k - 1 degrees of freedom). The note is
     * {@link #LABEL}.
     *
     * @param totalCounts state counts summed over all rounds and games (CC, CD, DC, DD)
     * @param expectedFrequencies the expected per-round frequencies, summing to 1
     * @return the result, for illustration
     */
    public static TestResult misleadingTest(long[] totalCounts, double[] expectedFrequencies) {
        long[] n = Checks.counts("pooled counts", totalCounts, -1);
        double[] f = Checks.distribution("expected frequencies", expectedFrequencies, n.length);
        long total = 0;
        int positive = 0;
        for (int j = 0; j < n.length; j++) {
            total += n[j];
            if (f[j] > 0) {
                positive++;
            } else if (n[j] > 0) {
                return TestResult.impossible(n.length - 1, LABEL + "; a count in a state of frequency 0");
            }
        }
        if (positive < 2 || total == 0) {
            return new TestResult(0, 0, 1, LABEL);
        }
        double[] e = new double[positive];
        long[] o = new long[positive];
        for (int j = 0, a = 0; j < n.length; j++) {
            if (f[j] > 0) {
                e[a] = total * f[j];
                o[a++] = n[j];
            }
        }
        double x2 = ChiSquareTest.withDefaults().statistic(e, o);
        return new TestResult(x2, positive - 1, ChiSquareTest.withDefaults().test(e, o).getPValue(), LABEL);
    }
}
