package reprise.stats;

import org.apache.commons.statistics.distribution.ChiSquaredDistribution;
import org.apache.commons.statistics.distribution.NormalDistribution;
import org.apache.commons.statistics.distribution.PoissonDistribution;
import org.apache.commons.statistics.distribution.TDistribution;

/**
 * How many games (or rounds) to plan for, from exact variances supplied by the exact engine.
 *
 * <p>All per-game variances refer to the per-game quantity whose mean is estimated (for a frequency of a
 * fixed-length game, Var(N_s / n); for the ratio estimator of random-length games, Var(Y - R L) / E[L]^2,
 * the delta-method variance of one game).
 *
 * <p>Implementation note: the power of the multivariate Wald test needs the noncentral chi-square
 * distribution, which Commons Statistics 1.1 does not provide; its survival function is computed here as
 * the Poisson mixture P(X &gt; x) = sum_j e^{-lambda/2} (lambda/2)^j / j! Q_{r+2j}(x) (Johnson, Kotz
 * &amp; Balakrishnan 1995, ch. 29), summed over j within lambda/2 &plusmn; (12 sqrt(lambda/2) + 12), which
 * leaves out Poisson mass below 1e-25, with the central terms Q from the library's survival functions.
 *
 * <p>References:
 * <ul>
 *   <li>Johnson, N.L., Kotz, S. &amp; Balakrishnan, N. (1995). Continuous Univariate Distributions,
 *       Vol. 2, 2nd ed. Wiley, ch. 29 (noncentral chi-square).</li>
 *   <li>Wald, A. (1943). Tests of statistical hypotheses concerning several parameters when the number of
 *       observations is large. Transactions of the American Mathematical Society 54(3), 426-482 (the
 *       noncentral chi-square limit under local alternatives).</li>
 *   <li>The normal sample-size formula G = ((z_{1-alpha/2} + z_power) sigma / delta)^2 is common practice,
 *       no single source.</li>
 * </ul>
 */
public final class Planning {

    private static final NormalDistribution STANDARD_NORMAL = NormalDistribution.of(0, 1);

    private Planning() {
    }

    /**
     * The smallest number of games G &ge; 2 whose t-interval half-width t_{G-1,(1+c)/2} sqrt(sigma^2 / G)
     * is at most the target.
     *
     * @param perGameVariance sigma^2 of the per-game quantity, &gt; 0
     * @param halfWidth the target half-width, &gt; 0
     * @param confidence the interval level in (0, 1)
     * @return G
     */
    public static long gamesForHalfWidth(double perGameVariance, double halfWidth, double confidence) {
        Checks.positive("per-game variance", perGameVariance);
        Checks.positive("half-width", halfWidth);
        double tail = 0.5 * (1 - Checks.level("confidence", confidence));
        double z = STANDARD_NORMAL.inverseSurvivalProbability(tail);
        long g = Math.max(2, (long) Math.ceil(planned(z * z * perGameVariance / (halfWidth * halfWidth),
            "a half-width of " + halfWidth, "games")));
        while (TDistribution.of(g - 1).inverseSurvivalProbability(tail) * Math.sqrt(perGameVariance / g) > halfWidth) {
            g++;
        }
        return g;
    }

    /**
     * The number of games for a two-sided level-alpha test of one mean to detect a deviation delta with
     * the given power: ceil(((z_{1-alpha/2} + z_power) sigma / |delta|)^2) (normal approximation, the
     * far tail neglected).
     *
     * @param perGameVariance sigma^2, &gt; 0
     * @param deviation delta, non-zero
     * @param alpha the level in (0, 1)
     * @param power the target power in (0, 1)
     * @return G, at least 1
     */
    public static long gamesToDetect(double perGameVariance, double deviation, double alpha, double power) {
        Checks.positive("per-game variance", perGameVariance);
        if (!(Math.abs(deviation) > 0 && Double.isFinite(deviation))) {
            throw new IllegalArgumentException("deviation to detect must be finite and non-zero: " + deviation);
        }
        double za = STANDARD_NORMAL.inverseSurvivalProbability(0.5 * Checks.level("alpha", alpha));
        double zb = STANDARD_NORMAL.inverseCumulativeProbability(Checks.level("power", power));
        double g = (za + zb) * (za + zb) * perGameVariance / (deviation * deviation);
        return Math.max(1, (long) Math.ceil(planned(g, "a deviation of " + deviation, "games (or rounds)")));
    }

    /**
     * The power of the level-alpha Wald test ({@link WaldTest}) with G games when the true mean differs
     * from the hypothesis by delta: P(chi2'_{r, lambda} &gt; chi2_{r, 1-alpha}) with noncentrality
     * lambda = G delta' Sigma^- delta and r = rank(Sigma).
     *
     * @param perGameCovariance Sigma, the exact per-game covariance (k x k)
     * @param deviation delta (k)
     * @param games G, at least 1
     * @param alpha the level in (0, 1)
     * @return the power; 1 if delta has a component along a zero-variance direction
     */
    public static double waldPower(double[][] perGameCovariance, double[] deviation, long games, double alpha) {
        if (games < 1) {
            throw new IllegalArgumentException("number of games must be at least 1: " + games);
        }
        QuadraticForms.Form form = perGameForm(perGameCovariance, deviation);
        if (form.impossible()) {
            return 1;
        }
        if (form.rank() == 0) {
            return alpha;
        }
        double critical = ChiSquaredDistribution.of(form.rank()).inverseSurvivalProbability(Checks.level("alpha",
            alpha));
        return noncentralChiSquaredSurvival(critical, form.rank(), games * form.value());
    }

    /**
     * The smallest number of games for which the Wald test reaches the given power against delta (see
     * {@link #waldPower}).
     *
     * @param perGameCovariance Sigma (k x k)
     * @param deviation delta (k), with delta' Sigma^- delta &gt; 0
     * @param alpha the level in (0, 1)
     * @param power the target power in (alpha, 1)
     * @return G; 1 if delta lies along a zero-variance direction (a single game then refutes the hypothesis)
     */
    public static long gamesToDetect(double[][] perGameCovariance, double[] deviation, double alpha, double power) {
        Checks.level("alpha", alpha);
        if (!(power > alpha && power < 1)) {
            throw new IllegalArgumentException("power must be in (alpha, 1): " + power);
        }
        QuadraticForms.Form form = perGameForm(perGameCovariance, deviation);
        if (form.impossible()) {
            return 1;
        }
        if (!(form.value() > 0)) {
            throw new IllegalArgumentException("the deviation has no component the test can see "
                + "(delta' Sigma^- delta = 0): " + form.value());
        }
        long hi = 1;
        while (waldPower(perGameCovariance, deviation, hi, alpha) < power) {
            hi *= 2;
        }
        long lo = hi / 2;
        while (hi - lo > 1) {
            long mid = lo + (hi - lo) / 2;
            if (waldPower(perGameCovariance, deviation, mid, alpha) >= power) {
                hi = mid;
            } else {
                lo = mid;
            }
        }
        return hi;
    }

    /**
     * The number of rounds n of one long chain for a target half-width z sqrt(sigma^2 / n):
     * ceil((z sigma / halfWidth)^2).
     *
     * @param asymptoticVariance sigma^2 = lim Var(sum_t f(S_t)) / n, &gt; 0
     * @param halfWidth the target, &gt; 0
     * @param confidence the level in (0, 1)
     * @return n
     */
    public static long roundsForHalfWidth(double asymptoticVariance, double halfWidth, double confidence) {
        Checks.positive("asymptotic variance", asymptoticVariance);
        Checks.positive("half-width", halfWidth);
        double z = STANDARD_NORMAL.inverseSurvivalProbability(0.5 * (1 - Checks.level("confidence", confidence)));
        return Math.max(1, (long) Math.ceil(planned(z * z * asymptoticVariance / (halfWidth * halfWidth),
            "a half-width of " + halfWidth, "rounds of one chain")));
    }

    /**
     * The most games (or rounds of one chain) a plan may ask for: 10^15, far beyond any simulation that
     * can be run (about ten days of rounds at 10^9 rounds per second for one-round games) and well inside
     * the range where a double still counts whole numbers exactly.
     */
    public static final double MOST_PLANNED = 1e15;

    private static double planned(double needed, String target, String unit) {
        if (!(needed <= MOST_PLANNED)) {
            throw new IllegalArgumentException(String.format(java.util.Locale.ROOT, "%s needs about %.3g %s, more "
                + "than any simulation can run (at most %.0e): ask for a larger target", target, needed, unit,
                MOST_PLANNED));
        }
        return needed;
    }

    /**
     * The survival function of the noncentral chi-square distribution (see the implementation note).
     *
     * @param x the point, any real (P = 1 for x &le; 0)
     * @param degreesOfFreedom r &gt; 0
     * @param noncentrality lambda &ge; 0
     * @return P(chi2'_{r, lambda} &gt; x)
     */
    public static double noncentralChiSquaredSurvival(double x, double degreesOfFreedom, double noncentrality) {
        Checks.positive("degrees of freedom", degreesOfFreedom);
        Checks.nonNegative("noncentrality", noncentrality);
        if (Double.isNaN(x)) {
            throw new IllegalArgumentException("point must not be NaN");
        }
        if (x <= 0) {
            return 1;
        }
        double mean = 0.5 * noncentrality;
        if (mean == 0) {
            return ChiSquaredDistribution.of(degreesOfFreedom).survivalProbability(x);
        }
        double spread = 12 * Math.sqrt(mean) + 12;
        int lo = (int) Math.max(0, Math.floor(mean - spread));
        int hi = (int) Math.ceil(mean + spread);
        PoissonDistribution poisson = PoissonDistribution.of(mean);
        double sum = 0;
        for (int j = lo; j <= hi; j++) {
            double w = poisson.probability(j);
            if (w > 0) {
                sum += w * ChiSquaredDistribution.of(degreesOfFreedom + 2.0 * j).survivalProbability(x);
            }
        }
        return Math.min(1, sum);
    }

    private static QuadraticForms.Form perGameForm(double[][] covariance, double[] deviation) {
        double[] d = Checks.finiteVector("deviation", deviation, -1);
        double[][] c = Checks.symmetricMatrix("per-game covariance", covariance, d.length);
        return QuadraticForms.compute(d, new double[d.length], c, WaldTest.names(d.length), -1);
    }
}
