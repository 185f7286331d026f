package reprise.stats;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
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
 * <p><b>Tails.</b> {@link #tails} gives the rejection rates at {@link #TAIL_LEVELS} (0.05, 0.01, 0.001)
 * with Wilson intervals and, for each, the one-sided exact binomial p-value of an excess,
 * P(X &ge; rejections) for X ~ Binomial(K, alpha). The lower tail is reported as departing from uniform
 * when any of these is below {@link #TAIL_WARNING_LEVEL} / 3 (Bonferroni over the three levels): a test
 * that is calibrated at 0.05 can still be far too liberal at the thresholds a multiple-testing correction
 * applies. A level at which K alpha &lt; 5 and no significant excess is seen is too rare to check with K
 * repetitions, and is said so.
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

    /** The levels at which {@link #tails} reports rejection rates. */
    public static final double[] TAIL_LEVELS = {0.05, 0.01, 0.001};
    /** The family-wise level of the lower-tail warning (split over the three levels). */
    public static final double TAIL_WARNING_LEVEL = 0.01;

    /**
     * Rejection rates at several levels and the lower-tail check.
     *
     * @param replications K
     * @param levels the levels alpha_j
     * @param rejections the number of p-values below each level
     * @param rates the rejection rates with Wilson intervals
     * @param excessPValues one-sided exact binomial p-values of an excess at each level
     * @param warnings one line per level whose excess is significant, or that is too rare to check; empty
     *     when the lower tail is consistent with uniform at every checkable level
     */
    public record TailSummary(long replications, double[] levels, long[] rejections, Interval[] rates,
                              double[] excessPValues, List<String> warnings) {

        /**
         * Copies the arrays and list.
         *
         * @param replications K
         * @param levels levels
         * @param rejections rejections
         * @param rates rates
         * @param excessPValues p-values
         * @param warnings lines
         */
        public TailSummary {
            levels = levels.clone();
            rejections = rejections.clone();
            rates = rates.clone();
            excessPValues = excessPValues.clone();
            warnings = List.copyOf(warnings);
        }

        /** @return whether some checkable level shows too many small p-values */
        public boolean lowerTailDeparts() {
            for (int j = 0; j < levels.length; j++) {
                if (excessPValues[j] < TAIL_WARNING_LEVEL / levels.length) {
                    return true;
                }
            }
            return false;
        }

        /** @return the levels (a copy) */
        @Override
        public double[] levels() {
            return levels.clone();
        }

        /** @return the rejections (a copy) */
        @Override
        public long[] rejections() {
            return rejections.clone();
        }

        /** @return the rates (a copy) */
        @Override
        public Interval[] rates() {
            return rates.clone();
        }

        /** @return the excess p-values (a copy) */
        @Override
        public double[] excessPValues() {
            return excessPValues.clone();
        }
    }

    private Calibration() {
    }

    /**
     * Rejection rates at 0.05, 0.01 and 0.001 and the lower-tail check (see the class description).
     *
     * @param pValues K &ge; 1 p-values from independent replications under a true hypothesis
     * @param confidence the level of the Wilson intervals in (0, 1)
     * @return the summary
     */
    public static TailSummary tails(double[] pValues, double confidence) {
        if (pValues == null || pValues.length == 0) {
            throw new IllegalArgumentException("calibration needs at least one p-value: none");
        }
        int k = pValues.length;
        int m = TAIL_LEVELS.length;
        long[] rejections = new long[m];
        for (int i = 0; i < k; i++) {
            double p = Checks.probability("p-value " + i, pValues[i]);
            for (int j = 0; j < m; j++) {
                if (p < TAIL_LEVELS[j]) {
                    rejections[j]++;
                }
            }
        }
        Interval[] rates = new Interval[m];
        double[] excess = new double[m];
        List<String> warnings = new ArrayList<>();
        for (int j = 0; j < m; j++) {
            double a = TAIL_LEVELS[j];
            rates[j] = WilsonInterval.of(rejections[j], k, confidence, WilsonInterval.Correction.NONE);
            excess[j] = BinomialTest.withDefaults().with(AlternativeHypothesis.GREATER_THAN)
                .test(k, (int) rejections[j], a).getPValue();
            if (excess[j] < TAIL_WARNING_LEVEL / m) {
                warnings.add(String.format(Locale.ROOT, "p < %s in %d of %d repetitions (%.3g%%, %.0f%% interval "
                    + "%.3g%%-%.3g%%), expected %.3g%%: the lower tail of the p-values is heavier than uniform "
                    + "(one-sided binomial p = %.2g), so corrected thresholds at or below %s are not trustworthy for "
                    + "this test", level(a), rejections[j], k, 100.0 * rejections[j] / k, 100 * confidence,
                    100 * rates[j].lower(), 100 * rates[j].upper(), 100 * a, excess[j], level(a)));
            } else if (k * a < 5) {
                warnings.add(String.format(Locale.ROOT, "p < %s: %d repetitions expect %.2g rejections, too few to "
                    + "check the tail there", level(a), k, k * a));
            }
        }
        return new TailSummary(k, TAIL_LEVELS, rejections, rates, excess, warnings);
    }

    private static String level(double a) {
        return a >= 0.01 ? String.format(Locale.ROOT, "%.2f", a) : String.format(Locale.ROOT, "%.3f", a);
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
