package reprise.stats;

import org.apache.commons.statistics.distribution.BetaDistribution;
import org.apache.commons.statistics.distribution.NormalDistribution;
import org.apache.commons.statistics.distribution.TDistribution;

/**
 * Intervals for the per-round mean of a bounded quantity that stay inside its range and never collapse
 * to a point, for the regime where most games show the same value (rare states, low error rates, few or
 * short games) and the t-interval of {@link ReplicateInference} under-covers.
 *
 * <p>The quantity is Y_g = w . N_g per game, with every per-round value in [a, b] (a frequency: [0, 1];
 * a payoff: [min, max] of the stage game), so Y_g lies in [a L_g, b L_g] and the ratio estimate
 * R = sum Y / sum L lies in [a, b]. Two intervals:
 * <ul>
 *   <li>{@link #effectiveSize} (Korn &amp; Graubard 1998): rescale to p = (R - a)/(b - a) in [0, 1], with
 *       the linearised (delta-method) variance v of {@link ReplicateInference#mean}. The effective number
 *       of rounds is n* = p (1 - p) / v (t_{G-1}/z)^2 (the design effect with the degrees-of-freedom
 *       adjustment of Korn &amp; Graubard), capped at the number of tallied rounds sum L, and set to sum L
 *       when v = 0 or p is 0 or 1. The interval is the Clopper-Pearson interval for x* = p n* successes in
 *       n* trials: lower = B^{-1}(alpha/2; x*, n* - x* + 1) (0 when x* = 0), upper =
 *       B^{-1}(1 - alpha/2; x* + 1, n* - x*) (1 when x* = n*), mapped back to [a, b]. It handles fixed and
 *       random lengths (the ratio estimator is exactly the survey proportion the method was made for). It
 *       is an approximation whose coverage is measured ({@code BoundedMeanIntervalCoverageTest}); with zero
 *       spread it is the interval of sum L independent rounds, i.e. it then assumes the rounds were no
 *       more alike than independent ones.</li>
 *   <li>{@link #empiricalBernstein} (Maurer &amp; Pontil 2009, Theorem 4, both tails at alpha/2): for
 *       fixed length n, the per-game averages X_g = Y_g / n lie in [a, b] and, with their sample variance
 *       s^2 and G games, R &plusmn; (sqrt(2 s^2 ln(4/alpha) / G) + 7 (b - a) ln(4/alpha) / (3 (G - 1))),
 *       clipped to [a, b]. Valid in finite samples for any distribution on [a, b] (no approximation), and
 *       wide: with zero spread its half-width is 7 (b - a) ln(4/alpha) / (3 (G - 1)), the whole range for
 *       G &le; 10 at alpha = 0.05.</li>
 *   <li>{@link #binomialDominance} (Bentkus 2004): for fixed length, the sum S = sum_g X_g of G
 *       independent per-game averages rescaled to [0, 1] with mean mu satisfies
 *       P(S &ge; x) &le; e P(B &ge; floor(x)) for B ~ Binomial(G, mu), and the same for G - S; so the
 *       Clopper-Pearson interval for floor(S) (lower end) and ceil(S) (upper end) successes in G trials,
 *       each end at tail alpha / (2 e), holds with probability at least 1 - alpha in finite samples. It
 *       ignores the spread (a Bernoulli variable is the worst case of a given mean on [0, 1]), so it is
 *       narrow where most games sit at one end of the range (rare states, near-deterministic play: with
 *       zero spread at the top and G games its lower end is (alpha / (2 e))^(1/G)) and wider than the
 *       empirical Bernstein interval where per-game values are spread inside the range.</li>
 * </ul>
 * {@link #choose} picks one of them (or the t-interval) from the {@link Regime} of the quantity.
 * Degenerate cases: a = b (a constant quantity) gives the point [a, a] with certainty, since nothing can
 * vary; G &lt; 2 is rejected.
 *
 * <p>Implementation note: R and v come from {@link ReplicateInference#mean} (exact integer sums, one
 * rounding). The Beta quantiles are Commons Statistics' {@link BetaDistribution}, which accepts
 * non-integer shapes, so n* need not be rounded. Results are clamped to [a, b] against rounding in the
 * back-transformation.
 *
 * <p>References:
 * <ul>
 *   <li>Korn, E.L. &amp; Graubard, B.I. (1998). Confidence intervals for proportions with small expected
 *       number of positive counts estimated from survey data. Survey Methodology 24(2), 193-201.</li>
 *   <li>Clopper, C.J. &amp; Pearson, E.S. (1934). The use of confidence or fiducial limits illustrated in
 *       the case of the binomial. Biometrika 26(4), 404-413.</li>
 *   <li>Maurer, A. &amp; Pontil, M. (2009). Empirical Bernstein bounds and sample variance penalization.
 *       Proceedings of the 22nd Conference on Learning Theory (COLT).</li>
 *   <li>Bentkus, V. (2004). On Hoeffding's inequalities. Annals of Probability 32(2), 1650-1673 (the
 *       factor e and the interpolated binomial tail, which floor(x) bounds from above; from memory).</li>
 *   <li>Hoeffding, W. (1963). Probability inequalities for sums of bounded random variables. Journal of
 *       the American Statistical Association 58, 13-30 (Theorem 3: the binomial dominates in convex
 *       order).</li>
 *   <li>Kish, L. (1965). Survey Sampling. Wiley (the design effect).</li>
 * </ul>
 */
public final class BoundedMeanInterval {

    /** Which interval {@link #choose} used. */
    public enum Method {
        /** The t-interval of {@link ReplicateInference}, clipped to the range. */
        T,
        /** The Korn &amp; Graubard effective-size interval (approximate, coverage measured). */
        EFFECTIVE_SIZE,
        /** The intersection of the binomial-dominance and empirical Bernstein intervals (finite-sample valid). */
        FINITE_SAMPLE,
        /** A quantity that cannot vary (a = b). */
        CONSTANT
    }

    /**
     * An interval with the method that made it.
     *
     * @param interval the interval, inside [a, b]
     * @param method the method
     * @param finiteSampleValid whether its coverage holds in finite samples without approximation
     * @param reason one line: why this method
     */
    public record Choice(Interval interval, Method method, boolean finiteSampleValid, String reason) {
    }

    private BoundedMeanInterval() {
    }

    /**
     * The interval the regime calls for:
     * <ul>
     *   <li>a = b: the point, CONSTANT;</li>
     *   <li>{@link Regime.Kind#ORDINARY} and a positive standard error: the t-interval clipped to [a, b];</li>
     *   <li>{@link Regime.Kind#SKEWED}, a proportion (every weight 0 or 1) and a positive standard error:
     *       the effective-size interval; for other quantities (payoffs) the clipped t-interval, which
     *       covered there while the effective-size interval, built for 0/1 rounds, was four times wider;</li>
     *   <li>otherwise, games of one length: FINITE_SAMPLE, the intersection of the binomial-dominance and
     *       the empirical Bernstein intervals, each at level 1 - (1 - confidence)/2 (so the intersection
     *       holds with probability at least {@code confidence});</li>
     *   <li>otherwise (random lengths): the effective-size interval, marked as not finite-sample valid (no
     *       finite-sample interval is known here for a ratio of unbounded per-game sums).</li>
     * </ul>
     * A zero standard error never gives the t-interval, so zero spread never gives a zero-width interval.
     *
     * @param summary G &ge; 2 games
     * @param weights w
     * @param lower a
     * @param upper b &ge; a
     * @param confidence the level in (0, 1)
     * @param regime the regime of this quantity at this number of games (from the exact model)
     * @return the interval and how it was made
     */
    public static Choice choose(GameSummary summary, double[] weights, double lower, double upper, double confidence,
                               Regime regime) {
        checkRange(lower, upper);
        Checks.level("confidence", confidence);
        Estimate e = ReplicateInference.mean(summary, weights);
        if (lower == upper) {
            return new Choice(new Interval(lower, lower, upper, confidence), Method.CONSTANT, true,
                "the quantity cannot vary");
        }
        boolean spread = e.standardError() > 0;
        Regime.Kind kind = regime.kind();
        if (spread && (kind == Regime.Kind.ORDINARY || (kind == Regime.Kind.SKEWED && !proportion(weights)))) {
            Interval t = e.interval(confidence);
            double r = clamp(e.value(), lower, upper);
            return new Choice(new Interval(r, clamp(t.lower(), lower, r), clamp(t.upper(), r, upper), confidence),
                Method.T, false, regime.describe());
        }
        if (kind == Regime.Kind.SKEWED && spread && proportion(weights)) {
            return new Choice(effectiveSize(summary, weights, lower, upper, confidence), Method.EFFECTIVE_SIZE, false,
                "skewed per-game values: " + regime.describe());
        }
        String why = spread ? regime.describe() : "no spread across the " + summary.games() + " games";
        if (summary.fixedLength()) {
            double each = 1 - (1 - confidence) / 2;
            Interval bd = binomialDominance(summary, weights, lower, upper, each);
            Interval eb = empiricalBernstein(summary, weights, lower, upper, each);
            Interval both = new Interval(bd.estimate(), Math.max(bd.lower(), eb.lower()),
                Math.min(bd.upper(), eb.upper()), confidence);
            return new Choice(both, Method.FINITE_SAMPLE, true, why);
        }
        return new Choice(effectiveSize(summary, weights, lower, upper, confidence), Method.EFFECTIVE_SIZE, false,
            why + "; random lengths: no finite-sample interval, the effective-size interval is approximate");
    }

    private static boolean proportion(double[] w) {
        for (double v : w) {
            if (v != 0 && v != 1) {
                return false;
            }
        }
        return true;
    }

    /**
     * The Korn &amp; Graubard effective-size Clopper-Pearson interval (see the class description).
     *
     * @param summary G &ge; 2 games
     * @param weights w, per state CC, CD, DC, DD
     * @param lower a, the smallest per-round value the quantity can take (e.g. min_s w_s)
     * @param upper b &ge; a, the largest
     * @param confidence the level in (0, 1)
     * @return the interval around R, inside [a, b]
     */
    public static Interval effectiveSize(GameSummary summary, double[] weights, double lower, double upper,
                                         double confidence) {
        checkRange(lower, upper);
        Checks.level("confidence", confidence);
        Estimate e = ReplicateInference.mean(summary, weights);
        double r = clamp(e.value(), lower, upper);
        double width = upper - lower;
        if (width == 0) {
            return new Interval(r, lower, upper, confidence);
        }
        double p = clamp((r - lower) / width, 0, 1);
        double v = e.standardError() * e.standardError() / (width * width);
        double rounds = summary.sumLength();
        double alpha = 1 - confidence;
        double n = rounds;
        if (v > 0 && p > 0 && p < 1) {
            double z = NormalDistribution.of(0, 1).inverseSurvivalProbability(alpha / 2);
            double t = TDistribution.of(e.degreesOfFreedom()).inverseSurvivalProbability(alpha / 2);
            n = Math.min(rounds, p * (1 - p) / v * (z / t) * (z / t));
        }
        double x = p * n;
        double lo = x <= 0 ? 0 : BetaDistribution.of(x, n - x + 1).inverseCumulativeProbability(alpha / 2);
        double hi = x >= n ? 1 : BetaDistribution.of(x + 1, n - x).inverseSurvivalProbability(alpha / 2);
        lo = Math.min(lo, p);
        hi = Math.max(hi, p);
        return new Interval(r, clamp(lower + lo * width, lower, r), clamp(lower + hi * width, r, upper), confidence);
    }

    /**
     * The Maurer &amp; Pontil empirical Bernstein interval for games of fixed length (see the class
     * description).
     *
     * @param summary G &ge; 2 games, all of the same tallied length
     * @param weights w, per state CC, CD, DC, DD
     * @param lower a, the smallest per-round value
     * @param upper b &ge; a, the largest
     * @param confidence the level in (0, 1)
     * @return the interval, inside [a, b]
     * @throws IllegalArgumentException if the games' lengths differ (the bound needs bounded i.i.d. values;
     *     use {@link #effectiveSize} for random lengths)
     */
    public static Interval empiricalBernstein(GameSummary summary, double[] weights, double lower, double upper,
                                              double confidence) {
        checkRange(lower, upper);
        Checks.level("confidence", confidence);
        if (!summary.fixedLength()) {
            throw new IllegalArgumentException("the empirical Bernstein interval needs games of one length; lengths "
                + "vary (mean " + summary.meanLength() + ")");
        }
        Estimate e = ReplicateInference.mean(summary, weights);
        double r = clamp(e.value(), lower, upper);
        long g = summary.games();
        double log = Math.log(4 / (1 - confidence));
        double s2 = e.standardError() * e.standardError() * g;
        double h = Math.sqrt(2 * s2 * log / g) + 7 * (upper - lower) * log / (3.0 * (g - 1));
        return new Interval(r, clamp(r - h, lower, r), clamp(r + h, r, upper), confidence);
    }

    /**
     * The binomial-dominance interval of Bentkus (2004) for games of fixed length (see the class
     * description): valid in finite samples for any distribution of the per-game averages on [a, b].
     *
     * @param summary G &ge; 2 games, all of the same tallied length
     * @param weights w, per state CC, CD, DC, DD
     * @param lower a, the smallest per-round value
     * @param upper b &ge; a, the largest
     * @param confidence the level in (0, 1)
     * @return the interval, inside [a, b], never a single point when a &lt; b
     * @throws IllegalArgumentException if the games' lengths differ
     */
    public static Interval binomialDominance(GameSummary summary, double[] weights, double lower, double upper,
                                             double confidence) {
        checkRange(lower, upper);
        Checks.level("confidence", confidence);
        if (!summary.fixedLength()) {
            throw new IllegalArgumentException("the binomial-dominance interval needs games of one length; lengths "
                + "vary (mean " + summary.meanLength() + ")");
        }
        Estimate e = ReplicateInference.mean(summary, weights);
        double r = clamp(e.value(), lower, upper);
        double width = upper - lower;
        if (width == 0) {
            return new Interval(r, lower, upper, confidence);
        }
        long g = summary.games();
        double sum = clamp((r - lower) / width, 0, 1) * g;
        double tail = (1 - confidence) / (2 * Math.E);
        long kLow = (long) Math.floor(sum + 1e-9 * g);
        long kHigh = (long) Math.ceil(sum - 1e-9 * g);
        kLow = Math.max(0, Math.min(g, kLow));
        kHigh = Math.max(0, Math.min(g, kHigh));
        double lo = kLow == 0 ? 0 : BetaDistribution.of(kLow, g - kLow + 1).inverseCumulativeProbability(tail);
        double hi = kHigh == g ? 1 : BetaDistribution.of(kHigh + 1, g - kHigh).inverseSurvivalProbability(tail);
        return new Interval(r, clamp(lower + lo * width, lower, r), clamp(lower + hi * width, r, upper), confidence);
    }

    /**
     * The range [min_s w_s, max_s w_s] of a per-round value w . (state indicator).
     *
     * @param weights w, 4 finite values
     * @return {min, max}
     */
    public static double[] range(double[] weights) {
        double[] w = Checks.finiteVector("weights", weights, 4);
        double lo = w[0];
        double hi = w[0];
        for (double v : w) {
            lo = Math.min(lo, v);
            hi = Math.max(hi, v);
        }
        return new double[] {lo, hi};
    }

    private static void checkRange(double lower, double upper) {
        Checks.finite("lower end of the range", lower);
        Checks.finite("upper end of the range", upper);
        if (!(lower <= upper)) {
            throw new IllegalArgumentException("range must have lower <= upper: " + lower + " > " + upper);
        }
    }

    private static double clamp(double v, double lo, double hi) {
        return Math.max(lo, Math.min(hi, v));
    }
}
