package reprise.stats;

import org.apache.commons.statistics.distribution.NormalDistribution;
import org.apache.commons.statistics.distribution.TDistribution;

/**
 * A point estimate with its standard error and the degrees of freedom of its reference distribution.
 *
 * <p>Intervals are value &plusmn; q se, where q is the two-sided quantile of Student's t with
 * {@code degreesOfFreedom} degrees of freedom, or of the standard normal when the degrees of freedom
 * are infinite (a standard error known exactly, not estimated).
 *
 * @param value the point estimate
 * @param standardError its standard error, at least 0 (0 for a deterministic quantity)
 * @param degreesOfFreedom &gt; 0, or {@link Double#POSITIVE_INFINITY} for a normal reference
 * @param replicates the number of independent replicates (games, or batches of one chain) behind it;
 *     planning routines scale the standard error by the square root of this number
 */
public record Estimate(double value, double standardError, double degreesOfFreedom, long replicates) {

    /**
     * Validates the estimate.
     *
     * @param value finite
     * @param standardError finite, at least 0
     * @param degreesOfFreedom positive (may be infinite)
     * @param replicates at least 1
     */
    public Estimate {
        Checks.finite("estimate", value);
        Checks.nonNegative("standard error", standardError);
        if (!(degreesOfFreedom > 0)) {
            throw new IllegalArgumentException("degrees of freedom must be > 0: " + degreesOfFreedom);
        }
        if (replicates < 1) {
            throw new IllegalArgumentException("number of replicates must be at least 1: " + replicates);
        }
    }

    /**
     * The two-sided interval value &plusmn; q se with q the (1 + confidence)/2 quantile.
     *
     * @param confidence the coverage in (0, 1)
     * @return the interval
     */
    public Interval interval(double confidence) {
        double q = quantile(degreesOfFreedom, 0.5 * (1 - Checks.level("confidence", confidence)));
        double h = q * standardError;
        return new Interval(value, value - h, value + h, confidence);
    }

    /**
     * The upper-tail quantile of the reference distribution: the x with P(T &gt; x) = tail.
     *
     * @param degreesOfFreedom the t degrees of freedom, or infinity for the normal
     * @param tail the upper-tail probability
     * @return the quantile
     */
    static double quantile(double degreesOfFreedom, double tail) {
        return degreesOfFreedom == Double.POSITIVE_INFINITY
            ? NormalDistribution.of(0, 1).inverseSurvivalProbability(tail)
            : TDistribution.of(degreesOfFreedom).inverseSurvivalProbability(tail);
    }

    /** P(T &gt; x) of the reference distribution. */
    static double survival(double degreesOfFreedom, double x) {
        return degreesOfFreedom == Double.POSITIVE_INFINITY
            ? NormalDistribution.of(0, 1).survivalProbability(x)
            : TDistribution.of(degreesOfFreedom).survivalProbability(x);
    }
}
