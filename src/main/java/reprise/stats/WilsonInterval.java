package reprise.stats;

import org.apache.commons.statistics.distribution.NormalDistribution;

/**
 * The Wilson (1927) score interval for a proportion of successes in independent trials: snapshot states
 * across independent games, or rejection rates in a calibration run. Not for rounds of one game, which
 * are not independent.
 *
 * <p>Without continuity correction, with p = x/n and z the (1 + confidence)/2 normal quantile:
 * (p + z^2/(2n) &plusmn; z sqrt(p(1-p)/n + z^2/(4n^2))) / (1 + z^2/n).
 *
 * <p>With continuity correction (Newcombe 1998, method 4):
 * L = (2np + z^2 - 1 - z sqrt(z^2 - 2 - 1/n + 4p(n(1-p) + 1))) / (2(n + z^2)),
 * U = (2np + z^2 + 1 + z sqrt(z^2 + 2 - 1/n + 4p(n(1-p) - 1))) / (2(n + z^2)),
 * with L = 0 when x = 0 and U = 1 when x = n (for both forms: in exact arithmetic the plain form has these
 * ends too, and setting them avoids a lower end of 1e-17 above an estimate of 0). Bounds are clipped to
 * [0, 1] and to lower &le; x/n &le; upper.
 *
 * <p>References:
 * <ul>
 *   <li>Wilson, E.B. (1927). Probable inference, the law of succession, and statistical inference.
 *       Journal of the American Statistical Association 22, 209-212.</li>
 *   <li>Newcombe, R.G. (1998). Two-sided confidence intervals for the single proportion: comparison of
 *       seven methods. Statistics in Medicine 17, 857-872.</li>
 * </ul>
 */
public final class WilsonInterval {

    /** Whether to apply the continuity correction. */
    public enum Correction {
        /** The plain score interval (Newcombe's method 3). */
        NONE,
        /** The continuity-corrected score interval (Newcombe's method 4); wider, more conservative. */
        CONTINUITY
    }

    private WilsonInterval() {
    }

    /**
     * The score interval for x successes in n independent trials.
     *
     * @param successes x, in [0, n]
     * @param trials n, at least 1
     * @param confidence the coverage in (0, 1)
     * @param correction NONE or CONTINUITY
     * @return the interval with estimate x/n
     */
    public static Interval of(long successes, long trials, double confidence, Correction correction) {
        if (trials < 1) {
            throw new IllegalArgumentException("number of trials must be at least 1: " + trials);
        }
        if (successes < 0 || successes > trials) {
            throw new IllegalArgumentException("number of successes must be in [0, " + trials + "]: " + successes);
        }
        double z = NormalDistribution.of(0, 1).inverseSurvivalProbability(0.5 * (1 - Checks.level("confidence",
            confidence)));
        return of(successes, trials, z, confidence, correction);
    }

    /**
     * The score interval with a given normal quantile z (for reproducing tables printed with z = 1.96).
     *
     * @param successes x, in [0, n]
     * @param trials n, at least 1
     * @param z the quantile, &gt; 0
     * @param confidence the coverage the quantile stands for, recorded in the result
     * @param correction NONE or CONTINUITY
     * @return the interval
     */
    public static Interval of(long successes, long trials, double z, double confidence, Correction correction) {
        Checks.positive("normal quantile z", z);
        Checks.level("confidence", confidence);
        if (trials < 1 || successes < 0 || successes > trials) {
            throw new IllegalArgumentException("successes must be in [0, trials] with trials >= 1: "
                + successes + " of " + trials);
        }
        double n = trials;
        double p = successes / n;
        double z2 = z * z;
        double lower;
        double upper;
        if (correction == Correction.NONE) {
            double centre = p + z2 / (2 * n);
            double spread = z * Math.sqrt(p * (1 - p) / n + z2 / (4 * n * n));
            // At x = 0 (x = n) the lower (upper) bound is exactly 0 (1), but centre - spread rounds to a few
            // 1e-18 for large z: take the exact value so that lower <= x/n <= upper always holds.
            lower = successes == 0 ? 0 : (centre - spread) / (1 + z2 / n);
            upper = successes == trials ? 1 : (centre + spread) / (1 + z2 / n);
        } else {
            double d = 2 * (n + z2);
            lower = successes == 0 ? 0
                : (2 * n * p + z2 - 1 - z * Math.sqrt(z2 - 2 - 1 / n + 4 * p * (n * (1 - p) + 1))) / d;
            upper = successes == trials ? 1
                : (2 * n * p + z2 + 1 + z * Math.sqrt(z2 + 2 - 1 / n + 4 * p * (n * (1 - p) - 1))) / d;
        }
        return new Interval(p, Math.min(p, Math.max(0, lower)), Math.max(p, Math.min(1, upper)), confidence);
    }
}
