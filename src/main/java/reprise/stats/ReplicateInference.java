package reprise.stats;

import java.math.BigDecimal;
import java.math.MathContext;
import reprise.game.Player;

/**
 * Replicate-level estimates: each game is one independent observation, so rounds within a game may be
 * as autocorrelated as they like.
 *
 * <p>Every estimate here is the ratio estimator of a per-round mean,
 * R = sum_g Y_g / sum_g L_g, where Y_g = w . N_g is a linear quantity of game g's state counts
 * N_g = (N_CC, N_CD, N_DC, N_DD) and L_g its length. Its standard error is the delta-method (linearisation)
 * one of survey sampling,
 * se^2 = sum_g (Y_g - R L_g)^2 / (G (G - 1) Lbar^2), Lbar = sum_g L_g / G,
 * and intervals use Student's t with G - 1 degrees of freedom (common practice for ratio estimators).
 *
 * <p><b>Fixed length n.</b> Then L_g = n, R is the mean of the per-game averages Y_g / n, and se^2 is
 * exactly the usual s^2 / G of those averages: the interval is the ordinary one-sample t-interval.
 *
 * <p><b>Random (e.g. geometric) length.</b> R estimates E[Y] / E[L] (for a continuation probability
 * delta, the normalised discounted value). This is <em>not</em> the mean of per-game averages
 * (1/G) sum_g Y_g / L_g, which estimates E[Y / L] and weights short games more; the two differ in general.
 *
 * <p>Implementation note: the sums of Y, Y^2 and L Y are formed from the integer sufficient statistics
 * in exact decimal arithmetic (the weights are converted exactly from double), and
 * sum_g (Y_g - R L_g)^2 (sum L)^2 = sum Y^2 (sum L)^2 - 2 sum Y sum LY sum L + (sum Y)^2 sum L^2 is
 * evaluated exactly, so there is a single rounding and no cancellation even when the per-game spread
 * is tiny compared with the mean.
 *
 * <p>References:
 * <ul>
 *   <li>Cochran, W.G. (1977). Sampling Techniques, 3rd ed. Wiley, ch. 6 (the ratio estimator and its
 *       variance).</li>
 *   <li>Student (1908). The probable error of a mean. Biometrika 6(1), 1-25.</li>
 *   <li>Sidak, Z. (1967). Rectangular confidence regions for the means of multivariate normal
 *       distributions. Journal of the American Statistical Association 62, 626-633.</li>
 * </ul>
 */
public final class ReplicateInference {

    /** X's cooperation count is N_CC + N_CD. */
    private static final double[] COOPERATION_X = {1, 1, 0, 0};
    /** Y's cooperation count is N_CC + N_DC. */
    private static final double[] COOPERATION_Y = {1, 0, 1, 0};

    /** How a set of intervals is made to hold simultaneously. */
    public enum Simultaneity {
        /** Each of k intervals at level 1 - (1 - confidence) / k (valid under any dependence). */
        BONFERRONI,
        /** Each of k intervals at level confidence^(1/k) (exact for independent estimates, slightly narrower). */
        SIDAK
    }

    private ReplicateInference() {
    }

    /**
     * The ratio estimate of the per-round mean of w . state: sum_g (w . N_g) / sum_g L_g, with the
     * delta-method standard error and G - 1 degrees of freedom (see the class description).
     *
     * @param summary the sufficient statistics of G &ge; 2 games
     * @param weights w, one value per state in the order CC, CD, DC, DD
     * @return the estimate (value, standard error, G - 1 degrees of freedom, G replicates)
     * @throws IllegalArgumentException if fewer than 2 games or a weight is not finite
     */
    public static Estimate mean(GameSummary summary, double[] weights) {
        double[] w = Checks.finiteVector("weights", weights, 4);
        long g = summary.games();
        if (g < 2) {
            throw new IllegalArgumentException("a replicate standard error needs at least 2 games: " + g);
        }
        BigDecimal[] sums = summary.linearSums(w);
        BigDecimal sy = sums[0];
        BigDecimal syy = sums[1];
        BigDecimal syl = sums[2];
        BigDecimal sl = BigDecimal.valueOf(summary.sumLength());
        BigDecimal sll = BigDecimal.valueOf(summary.sumLengthSquared());
        BigDecimal q = syy.multiply(sl).multiply(sl)
            .subtract(BigDecimal.valueOf(2).multiply(sy).multiply(syl).multiply(sl))
            .add(sy.multiply(sy).multiply(sll));
        BigDecimal sl2 = sl.multiply(sl);
        BigDecimal variance = q.multiply(BigDecimal.valueOf(g))
            .divide(BigDecimal.valueOf(g - 1).multiply(sl2).multiply(sl2), MathContext.DECIMAL64);
        double value = sy.divide(sl, MathContext.DECIMAL64).doubleValue();
        return new Estimate(value, Math.sqrt(Math.max(0, variance.doubleValue())), g - 1, g);
    }

    /**
     * The ratio estimate of E[a . N] / E[b . N] from G games: R = sum_g (a . N_g) / sum_g (b . N_g), with
     * the delta-method standard error se^2 = sum_g (A_g - R B_g)^2 / (G (G - 1) Bbar^2) (A_g = a . N_g,
     * B_g = b . N_g, Bbar = sum_g B_g / G) and G - 1 degrees of freedom. With b = (1, 1, 1, 1) this is
     * {@link #mean}. The sums are formed exactly, as in {@link #mean}; the cross sum uses
     * 2 sum A B = sum (A + B)^2 - sum A^2 - sum B^2, exact in decimal arithmetic.
     *
     * <p>References: Cochran, W.G. (1977). Sampling Techniques, 3rd ed. Wiley, ch. 6.
     *
     * @param summary the sufficient statistics of G &ge; 2 games
     * @param a the numerator's weights, order CC, CD, DC, DD
     * @param b the denominator's weights
     * @return the estimate
     * @throws IllegalArgumentException if fewer than 2 games, a weight is not finite, or sum_g B_g is 0 (the
     *     ratio is undefined)
     */
    public static Estimate ratio(GameSummary summary, double[] a, double[] b) {
        double[] wa = Checks.finiteVector("numerator weights", a, 4);
        double[] wb = Checks.finiteVector("denominator weights", b, 4);
        long g = summary.games();
        if (g < 2) {
            throw new IllegalArgumentException("a replicate standard error needs at least 2 games: " + g);
        }
        double[] sum = new double[4];
        for (int s = 0; s < 4; s++) {
            sum[s] = wa[s] + wb[s];
        }
        BigDecimal[] sa = summary.linearSums(wa);
        BigDecimal[] sb = summary.linearSums(wb);
        BigDecimal[] ss = summary.linearSums(sum);
        BigDecimal sab2 = ss[1].subtract(sa[1]).subtract(sb[1]);
        if (sb[0].signum() == 0) {
            throw new IllegalArgumentException("the ratio's denominator is 0 in every game: the ratio is undefined");
        }
        // q = sum (A - R B)^2 * (sum B)^2 = sAA sB^2 - 2 sA sAB sB + sA^2 sBB, with 2 sAB = sab2
        BigDecimal q = sa[1].multiply(sb[0]).multiply(sb[0]).subtract(sa[0].multiply(sab2).multiply(sb[0]))
            .add(sa[0].multiply(sa[0]).multiply(sb[1]));
        BigDecimal sb2 = sb[0].multiply(sb[0]);
        BigDecimal variance = q.multiply(BigDecimal.valueOf(g))
            .divide(BigDecimal.valueOf(g - 1).multiply(sb2).multiply(sb2), MathContext.DECIMAL64);
        double value = sa[0].divide(sb[0], MathContext.DECIMAL64).doubleValue();
        return new Estimate(value, Math.sqrt(Math.max(0, variance.doubleValue())), g - 1, g);
    }

    /**
     * The frequency of one state: w = indicator of the state.
     *
     * @param summary the games (G &ge; 2)
     * @param state 0 (CC), 1 (CD), 2 (DC) or 3 (DD)
     * @return the estimate
     */
    public static Estimate stateFrequency(GameSummary summary, int state) {
        double[] w = new double[4];
        w[Checks.state("state", state)] = 1;
        return mean(summary, w);
    }

    /**
     * A player's cooperation rate: X's count is N_CC + N_CD, Y's is N_CC + N_DC.
     *
     * @param summary the games (G &ge; 2)
     * @param player X or Y
     * @return the estimate
     */
    public static Estimate cooperationRate(GameSummary summary, Player player) {
        return mean(summary, player == Player.X ? COOPERATION_X : COOPERATION_Y);
    }

    /**
     * The per-round payoff for a payoff vector u (per-game total sum_s N_s u_s).
     *
     * @param summary the games (G &ge; 2)
     * @param payoff u in the order CC, CD, DC, DD (use Y's payoffs in X's order for Y)
     * @return the estimate
     */
    public static Estimate payoff(GameSummary summary, double[] payoff) {
        return mean(summary, payoff);
    }

    /**
     * Intervals for the four state frequencies that hold simultaneously with probability at least
     * {@code confidence} (Bonferroni) or approximately so (Sidak, which assumes independence or the
     * positive-orthant dependence of Sidak 1967; the four frequencies are negatively correlated, so
     * Bonferroni is the safe choice).
     *
     * @param summary the games (G &ge; 2)
     * @param confidence the joint coverage in (0, 1)
     * @param correction BONFERRONI or SIDAK
     * @return four intervals, order CC, CD, DC, DD, each at the adjusted individual level
     */
    public static Interval[] simultaneousStateFrequencies(GameSummary summary, double confidence,
                                                          Simultaneity correction) {
        Checks.level("confidence", confidence);
        double each = individualLevel(confidence, 4, correction);
        Interval[] out = new Interval[4];
        for (int s = 0; s < 4; s++) {
            out[s] = stateFrequency(summary, s).interval(each);
        }
        return out;
    }

    /**
     * The individual level that gives joint level {@code confidence} over k intervals.
     *
     * @param confidence the joint level in (0, 1)
     * @param k the number of intervals, at least 1
     * @param correction the method
     * @return 1 - (1 - confidence) / k (Bonferroni) or confidence^(1/k) (Sidak)
     */
    public static double individualLevel(double confidence, int k, Simultaneity correction) {
        Checks.level("confidence", confidence);
        if (k < 1) {
            throw new IllegalArgumentException("number of intervals must be at least 1: " + k);
        }
        return correction == Simultaneity.BONFERRONI
            ? 1 - (1 - confidence) / k
            : Math.exp(Math.log(confidence) / k);
    }
}
