package reprise.stats;

import java.util.Locale;
import org.apache.commons.statistics.distribution.NormalDistribution;

/**
 * Whether an asymptotic (normal or chi-square) p-value can be trusted down to the threshold the
 * multiple-testing correction will apply to it, alpha* (for Holm's first step alpha / m with m tests).
 *
 * <p>The rule comes from the one-term Edgeworth expansion of a standardised sum with skewness gamma_n:
 * P(Z_n &gt; z) = 1 - Phi(z) + phi(z) gamma_n (z^2 - 1) / 6 + o(gamma_n), whose relative error against
 * 1 - Phi(z) is about gamma_n z (z^2 - 1) / 6 (Mills' ratio 1 - Phi(z) ~ phi(z) / z). It grows like z^3:
 * a test calibrated at 0.05 can be off by a factor of several at 1e-4 (issue 12: a Wald test with 5.5%
 * rejections at 0.05 gave p &lt; 1e-4 in 1.6% of runs). The reference is trusted at alpha* iff that
 * relative error at z = z_{1 - alpha* / 2} is at most {@link #RELATIVE_ERROR} (0.5: the true tail is within a
 * factor 1.5 of the nominal one):
 * <ul>
 *   <li>mean-based tests (z, Wald): gamma_n = max over states of |gamma_s| / sqrt(G), gamma_s the skewness
 *       of one game's count, and at least {@link Regime#MINIMUM_INFORMATIVE_GAMES} informative games;</li>
 *   <li>cell-count tests (transitions, snapshots): a cell with expected count e contributes
 *       (n - e) / sqrt(e), of skewness about 1 / sqrt(e), so every cell kept needs
 *       e &ge; (z (z^2 - 1) / (6 * 0.5))^2. At alpha* = 0.05 this is e &ge; 3.4, close to Cochran's (1954)
 *       rule of 5; at 0.01, 23; at 1e-4, 336.</li>
 * </ul>
 * When the reference is not trusted, the p-value is computed by {@link MonteCarloPValue} under the exact
 * model with {@link MonteCarloPValue#drawsToResolve} draws, or, if that is beyond the budget, the
 * comparison is inconclusive with the reason {@link Trust#reason()}.
 *
 * <p>References:
 * <ul>
 *   <li>Hall, P. (1992). The Bootstrap and Edgeworth Expansion. Springer, ch. 2.</li>
 *   <li>Cochran, W.G. (1954). Some methods for strengthening the common chi-square tests. Biometrics
 *       10(4), 417-451.</li>
 *   <li>Koehler, K.J. &amp; Larntz, K. (1980). An empirical investigation of goodness-of-fit statistics
 *       for sparse multinomials. Journal of the American Statistical Association 75, 336-344.</li>
 * </ul>
 */
public final class TailTrust {

    /** The largest relative error of the nominal tail at the threshold that is accepted. */
    public static final double RELATIVE_ERROR = 0.5;

    /**
     * The decision.
     *
     * @param trusted whether the asymptotic p-value may be compared with the threshold
     * @param threshold alpha*
     * @param reason one line: the figures behind the decision
     */
    public record Trust(boolean trusted, double threshold, String reason) {
    }

    private TailTrust() {
    }

    /**
     * The smallest expected cell count at which a chi-square reference is trusted at alpha*.
     *
     * @param threshold alpha* in (0, 1)
     * @return (z (z^2 - 1) / (6 RELATIVE_ERROR))^2, z = z_{1 - alpha* / 2} (0 when z &le; 1)
     */
    public static double minimumExpectedCount(double threshold) {
        double z = z(threshold);
        double g = z * (z * z - 1) / (6 * RELATIVE_ERROR);
        return z <= 1 ? 0 : g * g;
    }

    /**
     * The rule for a cell-count test.
     *
     * @param smallestExpectedCount the smallest expected count of a cell kept in the statistic (after any
     *     pooling), over all rows
     * @param threshold alpha*
     * @return the decision
     */
    public static Trust cells(double smallestExpectedCount, double threshold) {
        Checks.nonNegative("smallest expected count", smallestExpectedCount);
        double need = minimumExpectedCount(threshold);
        boolean ok = smallestExpectedCount >= need;
        return new Trust(ok, threshold, String.format(Locale.ROOT, "smallest expected cell count %.3g %s %.3g "
            + "needed for the chi-square tail at %.3g", smallestExpectedCount, ok ? ">=" : "<", need, threshold));
    }

    /**
     * The rule for a mean-based test.
     *
     * @param regimes the regime of each state's count (or of the tested quantity), at the study's G
     * @param threshold alpha*
     * @return the decision
     */
    public static Trust means(Regime[] regimes, double threshold) {
        if (regimes == null || regimes.length == 0) {
            throw new IllegalArgumentException("means rule needs at least one regime: none");
        }
        double z = z(threshold);
        double worst = 0;
        double fewest = Double.POSITIVE_INFINITY;
        for (Regime r : regimes) {
            if (r.modalProbability() == 1) {
                continue;
            }
            worst = Math.max(worst, Math.abs(r.skewness()) / Math.sqrt(r.games()));
            fewest = Math.min(fewest, r.informativeGames());
        }
        double error = worst * z * Math.max(0, z * z - 1) / 6;
        boolean ok = error <= RELATIVE_ERROR && !(fewest < Regime.MINIMUM_INFORMATIVE_GAMES);
        return new Trust(ok, threshold, String.format(Locale.ROOT, "skewness of the mean %.3g gives a tail error "
            + "of about %.0f%% at %.3g; fewest informative games %.3g (%s)", worst, 100 * error, threshold,
            Double.isInfinite(fewest) ? 0 : fewest, ok ? "normal reference trusted" : "normal reference not trusted"));
    }

    private static double z(double threshold) {
        return NormalDistribution.of(0, 1).inverseSurvivalProbability(Checks.level("threshold", threshold) / 2);
    }
}
