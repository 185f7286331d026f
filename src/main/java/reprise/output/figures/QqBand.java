package reprise.output.figures;

import org.apache.commons.statistics.distribution.BetaDistribution;

/**
 * Pointwise bands for a uniform QQ plot.
 *
 * <p>Implementation note: if U_(1) <= ... <= U_(K) are the order statistics of K independent
 * Uniform(0, 1) variables, U_(i) has the Beta(i, K + 1 - i) distribution (David and Nagaraja 2003,
 * section 2.2), with mean i/(K+1). The band at i is that distribution's central interval, from the
 * Commons Statistics inverse CDF. It is pointwise: each i is covered with the stated probability, the
 * whole curve is not.
 *
 * <p>References:
 * <ul>
 *   <li>David, H. A. and Nagaraja, H. N. (2003). Order Statistics, 3rd ed. Wiley.</li>
 * </ul>
 */
final class QqBand {
    private QqBand() {
    }

    /**
     * The central band of each uniform order statistic.
     *
     * @param k the sample size K, at least 1
     * @param level the coverage of each pointwise interval, in (0, 1)
     * @return {lower, upper}, each of length K; index i - 1 belongs to the i-th smallest value
     */
    static double[][] pointwise(int k, double level) {
        if (k < 1) {
            throw new IllegalArgumentException("sample size K must be at least 1: " + k);
        }
        if (!(level > 0 && level < 1)) {
            throw new IllegalArgumentException("band level must be in (0, 1): " + level);
        }
        double tail = (1 - level) / 2;
        double[] lower = new double[k];
        double[] upper = new double[k];
        for (int i = 1; i <= k; i++) {
            BetaDistribution b = BetaDistribution.of(i, k + 1.0 - i);
            lower[i - 1] = b.inverseCumulativeProbability(tail);
            upper[i - 1] = b.inverseSurvivalProbability(tail);
        }
        return new double[][] {lower, upper};
    }
}
