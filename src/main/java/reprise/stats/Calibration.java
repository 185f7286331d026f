package reprise.stats;

import org.apache.commons.statistics.inference.AlternativeHypothesis;
import org.apache.commons.statistics.inference.BinomialTest;
import org.apache.commons.statistics.inference.KolmogorovSmirnovTest;

/**
 * Checks that a test is calibrated: given K p-values from K independent replications under a true
 * hypothesis, the rejection rate at alpha should be about alpha and the p-values about uniform.
 *
 * <p>The summary gives the number of rejections (p &lt; alpha), their rate with a Wilson score interval,
 * the two-sided exact binomial p-value of "rejections ~ Binomial(K, alpha)" (Commons Statistics
 * {@link BinomialTest}), and the Kolmogorov-Smirnov p-value of uniformity of the p-values on [0, 1]
 * (Commons Statistics {@link KolmogorovSmirnovTest}, one sample, two-sided). Discrete tests (exact or
 * with few games) give p-values that are not exactly uniform; the KS check is then conservative in the
 * wrong direction and the binomial check is the one to read.
 *
 * <p>References:
 * <ul>
 *   <li>Wilson, E.B. (1927). Probable inference, the law of succession, and statistical inference.
 *       Journal of the American Statistical Association 22, 209-212.</li>
 *   <li>Kolmogorov, A.N. (1933). Sulla determinazione empirica di una legge di distribuzione. Giornale
 *       dell'Istituto Italiano degli Attuari 4, 83-91.</li>
 * </ul>
 */
public final class Calibration {

    /**
     * The calibration summary.
     *
     * @param replications K
     * @param rejections the number of p-values below alpha
     * @param alpha the nominal level
     * @param rejectionRate rejections / K, with its Wilson interval
     * @param binomialPValue the two-sided exact binomial p-value of rejections against Binomial(K, alpha)
     * @param uniformityPValue the Kolmogorov-Smirnov p-value of the p-values against Uniform(0, 1)
     */
    public record Summary(long replications, long rejections, double alpha, Interval rejectionRate,
                          double binomialPValue, double uniformityPValue) {

        /**
         * Whether the false-alarm count is consistent with alpha at the given level (binomial check).
         *
         * @param level the level of the check in (0, 1), e.g. 0.01
         * @return true if the binomial p-value is at least the level
         */
        public boolean consistentWithAlpha(double level) {
            return binomialPValue >= Checks.level("level", level);
        }
    }

    private Calibration() {
    }

    /**
     * Summarises K p-values.
     *
     * @param pValues K &ge; 1 p-values in [0, 1] from independent replications
     * @param alpha the nominal level in (0, 1)
     * @param confidence the level of the Wilson interval in (0, 1)
     * @return the summary
     */
    public static Summary summarize(double[] pValues, double alpha, double confidence) {
        if (pValues == null || pValues.length == 0) {
            throw new IllegalArgumentException("calibration needs at least one p-value: none");
        }
        Checks.level("alpha", alpha);
        int k = pValues.length;
        int rejections = 0;
        for (int i = 0; i < k; i++) {
            if (Checks.probability("p-value " + i, pValues[i]) < alpha) {
                rejections++;
            }
        }
        Interval rate = WilsonInterval.of(rejections, k, confidence, WilsonInterval.Correction.NONE);
        double binomial = BinomialTest.withDefaults().with(AlternativeHypothesis.TWO_SIDED)
            .test(k, rejections, alpha).getPValue();
        double uniform = KolmogorovSmirnovTest.withDefaults()
            .test(pValues.clone(), x -> Math.min(1, Math.max(0, x))).getPValue();
        return new Summary(k, rejections, alpha, rate, binomial, uniform);
    }
}
