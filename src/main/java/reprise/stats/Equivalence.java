package reprise.stats;

import java.util.Locale;
import java.util.OptionalLong;

/**
 * Does an observed mean agree with a target (an exact prediction) within a tolerance h that the user
 * chooses? Two one-sided tests (TOST) beside the ordinary difference test, and a plain verdict.
 *
 * <p>With d = estimate - target, standard error se and reference distribution T (Student t with the
 * estimate's degrees of freedom, or normal), at level alpha:
 * <ul>
 *   <li>TOST p-value = max(P(T &gt; (d + h)/se), P(T &gt; (h - d)/se)): small when -h &lt; d &lt; h is
 *       established; equivalently the (1 - 2 alpha) interval d &plusmn; q se, q = the 1 - alpha quantile,
 *       lies inside (-h, h).</li>
 *   <li>Non-equivalence p-value = min(P(T &gt; (d - h)/se), P(T &gt; (-h - d)/se)): small when |d| &gt; h is
 *       established in one direction; equivalently that (1 - 2 alpha) interval lies entirely outside
 *       [-h, h].</li>
 *   <li>Ordinary difference p-value = 2 P(T &gt; |d|/se), reported for reference (it answers "is there any
 *       difference", which a large enough study always finds).</li>
 * </ul>
 * <b>Verdict: one meaning per word.</b> {@link Verdict#AGREES} = shown |d| &lt; h (TOST p &lt; alpha);
 * {@link Verdict#DISAGREES} = shown |d| &gt; h (non-equivalence p &lt; alpha); otherwise
 * {@link Verdict#INCONCLUSIVE} ({@link #verdict}). The first two cannot both hold (for alpha &lt; 0.5). With a
 * multiple-testing correction, alpha is the corrected level or the p-values are the adjusted ones; a
 * difference test that rejects while the estimate lies outside &plusmn;h is <em>not</em> "disagrees": it
 * shows d &ne; 0, not |d| &gt; h.
 *
 * <p><b>Zero standard error.</b> With infinite degrees of freedom a zero standard error is known (a
 * deterministic quantity) and the verdict is certain. With finite degrees of freedom it is a sample
 * spread of zero: G identical games say nothing about how much the games can vary, so every p-value is 1
 * and the verdict is INCONCLUSIVE; {@link #assess(Interval, double, double)} with a finite-sample interval
 * ({@link BoundedMeanInterval}) then decides.
 *
 * <p><b>From any interval.</b> {@link #assess(Interval, double, double)} applies the same rule to a
 * (1 - 2 alpha) interval [l, u] that need not be symmetric: AGREES iff target - h &lt; l and u &lt; target + h;
 * DISAGREES iff u &lt; target - h or l &gt; target + h; otherwise INCONCLUSIVE (the interval inclusion form of
 * TOST, Berger &amp; Hsu 1996, valid for any interval of that level). For an
 * inconclusive result the number of additional games needed is the smallest G' with
 * z_{1-alpha} se sqrt(G/G') &lt; | h - |d| |, i.e. assuming the estimate stays where it is and the standard
 * error shrinks as 1/sqrt(G) (normal quantile, as for large G); none is given when |d| = h.
 *
 * <p>References:
 * <ul>
 *   <li>Schuirmann, D.J. (1987). A comparison of the two one-sided tests procedure and the power approach
 *       for assessing the equivalence of average bioavailability. Journal of Pharmacokinetics and
 *       Biopharmaceutics 15(6), 657-680.</li>
 *   <li>Berger, R.L. &amp; Hsu, J.C. (1996). Bioequivalence trials, intersection-union tests and
 *       equivalence confidence sets. Statistical Science 11(4), 283-319.</li>
 * </ul>
 */
public final class Equivalence {

    /** The outcome in plain words. */
    public enum Verdict {
        /** The mean is within the tolerance of the target (TOST rejects non-equivalence at alpha). */
        AGREES,
        /** The mean differs from the target by more than the tolerance (shown at alpha, one-sided). */
        DISAGREES,
        /** Neither can be shown with the present data. */
        INCONCLUSIVE
    }

    /**
     * The full outcome.
     *
     * @param estimate the observed mean
     * @param target the value it is compared with
     * @param tolerance h &gt; 0
     * @param standardError se of the estimate
     * @param interval the (1 - 2 alpha) interval of the estimate, the one TOST uses
     * @param equivalencePValue the TOST p-value
     * @param nonEquivalencePValue p-value for |d| &gt; h
     * @param differencePValue the ordinary two-sided p-value for d = 0
     * @param verdict AGREES, DISAGREES or INCONCLUSIVE
     * @param additionalGamesNeeded for INCONCLUSIVE, how many more replicates would settle it if the
     *     estimate stayed put; empty if conclusive or if |d| = h
     */
    public record Result(double estimate, double target, double tolerance, double standardError, Interval interval,
                         double equivalencePValue, double nonEquivalencePValue, double differencePValue,
                         Verdict verdict, OptionalLong additionalGamesNeeded) {
    }

    /**
     * Finite-horizon bias beside sampling error: a finite game's expected mean f_n differs from the
     * stationary value pi by f_n - pi, however many games are played.
     *
     * @param bias f_n - pi
     * @param standardError the sampling standard error of the observed mean
     * @param biasInStandardErrors bias / standard error (infinite if the standard error is 0)
     * @param explanation a sentence for the user
     */
    public record BiasReport(double bias, double standardError, double biasInStandardErrors, String explanation) {
    }

    /**
     * A verdict from an interval.
     *
     * @param interval the (1 - 2 alpha) interval of the estimate
     * @param target the value it is compared with
     * @param tolerance h
     * @param verdict AGREES, DISAGREES or INCONCLUSIVE
     * @param reason one line: where the interval lies against [target - h, target + h]
     */
    public record IntervalVerdict(Interval interval, double target, double tolerance, Verdict verdict,
                                  String reason) {
    }

    private Equivalence() {
    }

    /**
     * The one rule behind every verdict word: AGREES iff the equivalence (TOST) p-value is below alpha,
     * else DISAGREES iff the non-equivalence p-value is below alpha, else INCONCLUSIVE.
     *
     * @param equivalencePValue the TOST p-value (adjusted, if a correction applies)
     * @param nonEquivalencePValue the p-value for |d| &gt; h (adjusted, if a correction applies)
     * @param alpha the level in (0, 0.5)
     * @return the verdict
     */
    public static Verdict verdict(double equivalencePValue, double nonEquivalencePValue, double alpha) {
        Checks.probability("equivalence p-value", equivalencePValue);
        Checks.probability("non-equivalence p-value", nonEquivalencePValue);
        checkAlpha(alpha);
        return equivalencePValue < alpha ? Verdict.AGREES
            : nonEquivalencePValue < alpha ? Verdict.DISAGREES : Verdict.INCONCLUSIVE;
    }

    /**
     * The verdict from a (1 - 2 alpha) interval (see the class description).
     *
     * @param interval the interval, e.g. {@link BoundedMeanInterval#choose} at level 1 - 2 alpha
     * @param target the value compared with
     * @param tolerance h &gt; 0
     * @return the verdict with its reason
     */
    public static IntervalVerdict assess(Interval interval, double target, double tolerance) {
        Checks.finite("target", target);
        double h = Checks.positive("tolerance h", tolerance);
        double lo = target - h;
        double hi = target + h;
        Verdict v;
        String why;
        if (lo < interval.lower() && interval.upper() < hi) {
            v = Verdict.AGREES;
            why = "interval inside the tolerance";
        } else if (interval.upper() < lo || interval.lower() > hi) {
            v = Verdict.DISAGREES;
            why = "interval entirely outside the tolerance";
        } else {
            v = Verdict.INCONCLUSIVE;
            why = "interval overlaps an end of the tolerance";
        }
        return new IntervalVerdict(interval, target, h, v, why + ": [" + brief(interval.lower()) + ", "
            + brief(interval.upper()) + "] against [" + brief(lo) + ", " + brief(hi) + "]");
    }

    /**
     * The TOST and non-equivalence p-values of a family of nested intervals, by inversion: with I(c) the
     * interval at confidence c (wider as c grows),
     * p_eq = inf { a : I(1 - 2a) lies inside (target - h, target + h) } and
     * p_neq = inf { a : I(1 - 2a) lies entirely outside [target - h, target + h] }, each 1 when no a in
     * (0, 0.5) qualifies. If every I(c) has coverage at least c for the true mean mu, then under |mu - target|
     * &ge; h P(p_eq &le; u) &le; u, and under |mu - target| &le; h P(p_neq &le; u) &le; u: both are valid
     * p-values (the interval-inclusion form of TOST, Berger &amp; Hsu 1996), which a multiple-testing
     * correction can adjust. Found by bisection on log a over [1e-12, 0.5) to a relative precision of about
     * 1% (a value below 1e-12 is reported as 1e-12, except for a point interval, which is certain: 0).
     *
     * @param intervalAtLevel I(c) for c in (0, 1)
     * @param target the value compared with
     * @param tolerance h &gt; 0
     * @return {p_eq, p_neq}
     */
    public static double[] intervalPValues(java.util.function.DoubleFunction<Interval> intervalAtLevel, double target,
                                           double tolerance) {
        Checks.finite("target", target);
        double h = Checks.positive("tolerance h", tolerance);
        java.util.function.DoublePredicate inside = a -> {
            Interval i = intervalAtLevel.apply(1 - 2 * a);
            return target - h < i.lower() && i.upper() < target + h;
        };
        java.util.function.DoublePredicate outside = a -> {
            Interval i = intervalAtLevel.apply(1 - 2 * a);
            return i.upper() < target - h || i.lower() > target + h;
        };
        Interval narrow = intervalAtLevel.apply(1 - 2 * SMALLEST_LEVEL);
        boolean point = narrow.lower() == narrow.upper();
        return new double[] {invert(inside, point), invert(outside, point)};
    }

    private static final double SMALLEST_LEVEL = 1e-12;
    private static final double LARGEST_LEVEL = 0.4999;

    private static double invert(java.util.function.DoublePredicate holds, boolean point) {
        if (!holds.test(LARGEST_LEVEL)) {
            return 1;
        }
        if (holds.test(SMALLEST_LEVEL)) {
            return point ? 0 : SMALLEST_LEVEL;
        }
        double lo = Math.log(SMALLEST_LEVEL);
        double hi = Math.log(LARGEST_LEVEL);
        while (hi - lo > 0.01) {
            double mid = 0.5 * (lo + hi);
            if (holds.test(Math.exp(mid))) {
                hi = mid;
            } else {
                lo = mid;
            }
        }
        return Math.exp(hi);
    }

    /** Six significant digits without trailing zeros. */
    private static String brief(double v) {
        return new java.math.BigDecimal(String.format(Locale.ROOT, "%.6g", v)).stripTrailingZeros().toPlainString();
    }

    private static void checkAlpha(double alpha) {
        if (!(alpha > 0 && alpha < 0.5)) {
            throw new IllegalArgumentException("alpha must be in (0, 0.5): " + alpha);
        }
    }

    /**
     * TOST, non-equivalence and difference tests and the verdict (see the class description).
     *
     * @param estimate the observed mean with its standard error, degrees of freedom and replicates G
     * @param target the predicted value
     * @param tolerance h &gt; 0, the largest difference that counts as agreement
     * @param alpha the level in (0, 0.5)
     * @return the result
     */
    public static Result assess(Estimate estimate, double target, double tolerance, double alpha) {
        Checks.finite("target", target);
        Checks.positive("tolerance h", tolerance);
        checkAlpha(alpha);
        double d = estimate.value() - target;
        double se = estimate.standardError();
        double df = estimate.degreesOfFreedom();
        double h = tolerance;
        double pEquivalent;
        double pNotEquivalent;
        double pDifference;
        if (se == 0 && df == Double.POSITIVE_INFINITY) {
            pEquivalent = Math.abs(d) < h ? 0 : 1;
            pNotEquivalent = Math.abs(d) > h ? 0 : 1;
            pDifference = d == 0 ? 1 : 0;
        } else if (se == 0) {
            pEquivalent = 1;
            pNotEquivalent = 1;
            pDifference = 1;
        } else {
            pEquivalent = Math.max(Estimate.survival(df, (d + h) / se), Estimate.survival(df, (h - d) / se));
            pNotEquivalent = Math.min(Estimate.survival(df, (d - h) / se), Estimate.survival(df, (-h - d) / se));
            pDifference = Math.min(1, 2 * Estimate.survival(df, Math.abs(d) / se));
        }
        Verdict verdict = verdict(pEquivalent, pNotEquivalent, alpha);
        OptionalLong more = OptionalLong.empty();
        double margin = Math.abs(h - Math.abs(d));
        if (verdict == Verdict.INCONCLUSIVE && margin > 0 && se > 0) {
            double z = Estimate.quantile(Double.POSITIVE_INFINITY, alpha);
            double ratio = z * se / margin;
            double needed = estimate.replicates() * ratio * ratio;
            long total = (long) Math.min(Long.MAX_VALUE / 2.0, Math.floor(needed) + 1);
            more = OptionalLong.of(Math.max(1, total - estimate.replicates()));
        }
        double q = Estimate.quantile(df, alpha);
        Interval interval = new Interval(estimate.value(), estimate.value() - q * se, estimate.value() + q * se,
            1 - 2 * alpha);
        return new Result(estimate.value(), target, h, se, interval, pEquivalent, pNotEquivalent, pDifference,
            verdict, more);
    }

    /**
     * Separates finite-horizon bias from sampling error.
     *
     * @param finiteHorizonMean f_n, the exact expected mean for games of the length played
     * @param stationaryMean pi, the stationary (long-run) value a claim refers to
     * @param estimate the observed mean with its standard error
     * @return the report; its sentence says whether the bias, the noise, or neither dominates
     */
    public static BiasReport biasReport(double finiteHorizonMean, double stationaryMean, Estimate estimate) {
        double bias = Checks.finite("finite-horizon mean", finiteHorizonMean)
            - Checks.finite("stationary mean", stationaryMean);
        double se = estimate.standardError();
        double ratio = se == 0 ? (bias == 0 ? 0 : Double.POSITIVE_INFINITY) : bias / se;
        String sentence;
        if (Math.abs(ratio) >= 2) {
            sentence = String.format(Locale.ROOT, "The finite-horizon bias f_n - pi = %.4g is %.1f standard errors "
                + "(se = %.3g): games of this length do not reach the stationary value, so a stationary claim "
                + "fails even if the exact finite-horizon prediction is right; more games will not remove it, "
                + "longer games will.", bias, ratio, se);
        } else {
            sentence = String.format(Locale.ROOT, "The finite-horizon bias f_n - pi = %.4g is %.1f standard errors "
                + "(se = %.3g): small against the sampling error at this number of games.", bias, ratio, se);
        }
        return new BiasReport(bias, se, ratio, sentence);
    }
}
