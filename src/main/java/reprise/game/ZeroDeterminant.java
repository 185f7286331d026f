package reprise.game;

import java.util.Locale;

/**
 * Constructors of zero-determinant memory-one strategies, for infinitely repeated games and for games
 * with a continuation probability delta.
 *
 * <p>Implementation note. All three families solve one linear condition. Writing S_o for the player's
 * own payoff vector and S_c for the co-player's, both in the player's own view (own move first), and
 * p_Rep = (1, 1, 0, 0), a memory-one vector p with first-round probability p0 enforces
 * alpha pi_o + beta pi_c + gamma = 0 on the normalised discounted payoffs when
 * <pre>  delta p - p_Rep + (1 - delta) p0 1 = alpha S_o + beta S_c + gamma 1.</pre>
 * With delta = 1 this is Press &amp; Dyson's (2012) condition and p0 is irrelevant; with delta &lt; 1 it
 * is the discounted form of Hilbe, Traulsen &amp; Sigmund (2015). The families below fix
 * (alpha, beta, gamma) up to the scale phi &gt; 0:
 * <ul>
 *   <li>extortionate: pi_o - P_o = chi (pi_c - P_c), bracket phi[(S_o - P_o) - chi (S_c - P_c)], p0 = 0;</li>
 *   <li>generous: pi_o - R_o = chi (pi_c - R_c), bracket phi[(S_o - R_o) - chi (S_c - R_c)], p0 = 1;</li>
 *   <li>equalizer: pi_c = s, bracket phi (s - S_c), p0 free (default 1).</li>
 * </ul>
 * Each entry is affine in phi, so the phis that make all four entries probabilities form an interval,
 * computed exactly here and quoted when a parameter is refused. Our phi is not divided by (P - S) as in
 * Press &amp; Dyson's extortion formula; for games with P - S = 1 (such as 3,0,5,1) the two agree.
 *
 * <p>References:
 * Press, W.H. &amp; Dyson, F.J. (2012). Iterated Prisoner's Dilemma contains strategies that dominate any
 * evolutionary opponent. PNAS 109(26), 10409-10413.
 * Stewart, A.J. &amp; Plotkin, J.B. (2013). From extortion to generosity, evolution in the Iterated
 * Prisoner's Dilemma. PNAS 110(38), 15348-15353.
 * Hilbe, C., Traulsen, A. &amp; Sigmund, K. (2015). Partners or rivals? Strategies for the iterated
 * prisoner's dilemma. Games and Economic Behavior 92, 41-52.
 * Boerlijst, M.C., Nowak, M.A. &amp; Sigmund, K. (1997). Equal pay for all prisoners. American
 * Mathematical Monthly 104, 303-305.
 */
public final class ZeroDeterminant {

    private static final double SLACK = 1e-12;

    private ZeroDeterminant() {
    }

    /**
     * The parameters a zero-determinant strategy was resolved with, for showing to the user.
     *
     * @param family "extortionate", "generous" or "equalizer"
     * @param chi the extortion or generosity factor, NaN for the equalizer
     * @param score the co-player payoff an equalizer enforces, NaN for the other two
     * @param phi the scale actually used (the default when none was given)
     * @param phiLow the smallest allowed phi (phi must be greater than this when it is 0)
     * @param phiHigh the largest allowed phi
     * @param delta the continuation probability the strategy was built for (1: infinitely repeated)
     * @param firstMove the first-round cooperation probability p0
     */
    public record Parameters(String family, double chi, double score, double phi, double phiLow, double phiHigh,
        double delta, double firstMove) {
    }

    /**
     * Resolves the parameters of a zero-determinant strategy without building it: the phi used and the
     * allowed phi interval. Fails exactly when the matching constructor fails, with the same message.
     *
     * @param family "extortionate", "generous" or "equalizer"
     * @param game the stage game
     * @param player whose strategy this is
     * @param level chi for extortionate and generous strategies, the score for an equalizer
     * @param phi the scale, NaN for the default
     * @param delta the continuation probability in (0, 1]
     * @param p0 the equalizer's first-round cooperation probability (ignored by the other two families)
     * @return the parameters
     */
    public static Parameters parameters(String family, StageGame game, Player player, double level, double phi,
        double delta, double p0) {
        checkDelta(delta);
        double[] own = game.ownView(player);
        double[] co = game.coPlayerInView(player);
        double[] bracket = new double[4];
        double first;
        switch (family) {
            case "extortionate" -> {
                checkChi(level);
                for (int i = 0; i < 4; i++) {
                    bracket[i] = (own[i] - own[3]) - level * (co[i] - co[3]);
                }
                first = 0;
            }
            case "generous" -> {
                checkChi(level);
                for (int i = 0; i < 4; i++) {
                    bracket[i] = (own[i] - own[0]) - level * (co[i] - co[0]);
                }
                first = 1;
            }
            case "equalizer" -> {
                Checks.finite("equalizer score", level);
                Checks.probability("equalizer p0", p0);
                for (int i = 0; i < 4; i++) {
                    bracket[i] = level - co[i];
                }
                first = p0;
            }
            default -> throw new IllegalArgumentException("unknown zero-determinant family: " + family);
        }
        String what = family.equals("equalizer")
            ? String.format(Locale.ROOT, "equalizer with score=%s%s%s", Numbers.format(level), deltaText(delta),
                delta < 1 ? ", p0=" + Numbers.format(p0) : "")
            : String.format(Locale.ROOT, "%s strategy with chi=%s%s", family, Numbers.format(level),
                deltaText(delta));
        double[] range = phiRange(bracket, delta, first);
        double usePhi = checkedPhi(what, range, phi, delta);
        boolean eq = family.equals("equalizer");
        return new Parameters(family, eq ? Double.NaN : level, eq ? level : Double.NaN, usePhi, range[0], range[1],
            delta, first);
    }

    /**
     * An extortionate strategy: the player's surplus over mutual defection is chi times the co-player's.
     *
     * @param game the stage game
     * @param player whose strategy this is (its own view is used)
     * @param chi the extortion factor, at least 1
     * @param phi the scale, in (0, phiMax]; NaN picks half of phiMax
     * @param delta the continuation probability in (0, 1], 1 for the infinitely repeated game
     * @return the strategy, with p0 = 0
     */
    public static MemoryStrategy extortionate(StageGame game, Player player, double chi, double phi, double delta) {
        checkChi(chi);
        checkDelta(delta);
        double[] own = game.ownView(player);
        double[] co = game.coPlayerInView(player);
        double[] bracket = new double[4];
        for (int i = 0; i < 4; i++) {
            bracket[i] = (own[i] - own[3]) - chi * (co[i] - co[3]);
        }
        String what = String.format(Locale.ROOT, "extortionate strategy with chi=%s%s", Numbers.format(chi),
            deltaText(delta));
        return build(label("extort", "chi", chi, phi, delta, Double.NaN), what, bracket, phi, delta, 0);
    }

    /**
     * A generous strategy: the player's shortfall below mutual cooperation is chi times the co-player's.
     *
     * @param game the stage game
     * @param player whose strategy this is
     * @param chi at least 1
     * @param phi the scale, in (0, phiMax]; NaN picks half of phiMax
     * @param delta the continuation probability in (0, 1]
     * @return the strategy, with p0 = 1
     */
    public static MemoryStrategy generous(StageGame game, Player player, double chi, double phi, double delta) {
        checkChi(chi);
        checkDelta(delta);
        double[] own = game.ownView(player);
        double[] co = game.coPlayerInView(player);
        double[] bracket = new double[4];
        for (int i = 0; i < 4; i++) {
            bracket[i] = (own[i] - own[0]) - chi * (co[i] - co[0]);
        }
        String what = String.format(Locale.ROOT, "generous strategy with chi=%s%s", Numbers.format(chi),
            deltaText(delta));
        return build(label("generous", "chi", chi, phi, delta, Double.NaN), what, bracket, phi, delta, 1);
    }

    /**
     * An equalizer: the co-player's long-run (or normalised discounted) payoff is {@code score} whatever
     * it does.
     *
     * @param game the stage game
     * @param player whose strategy this is
     * @param score the co-player's payoff to enforce
     * @param phi the scale, in the allowed interval; NaN picks its midpoint
     * @param delta the continuation probability in (0, 1]
     * @param p0 the first-round cooperation probability (matters only when delta &lt; 1)
     * @return the strategy
     */
    public static MemoryStrategy equalizer(StageGame game, Player player, double score, double phi, double delta,
        double p0) {
        Checks.finite("equalizer score", score);
        checkDelta(delta);
        Checks.probability("equalizer p0", p0);
        double[] co = game.coPlayerInView(player);
        double[] bracket = new double[4];
        for (int i = 0; i < 4; i++) {
            bracket[i] = score - co[i];
        }
        String what = String.format(Locale.ROOT, "equalizer with score=%s%s%s", Numbers.format(score),
            deltaText(delta), delta < 1 ? ", p0=" + Numbers.format(p0) : "");
        return build(label("equalizer", "score", score, phi, delta, delta < 1 ? p0 : Double.NaN), what, bracket,
            phi, delta, p0);
    }

    /**
     * The interval of phi for which p = [p_Rep - (1 - delta) p0 + phi * bracket] / delta is a vector of
     * probabilities.
     *
     * @return {lo, hi}, lo &ge; 0; lo &gt; hi when empty
     */
    static double[] phiRange(double[] bracket, double delta, double p0) {
        double lo = 0;
        double hi = Double.POSITIVE_INFINITY;
        for (int i = 0; i < 4; i++) {
            double a = ((i < 2 ? 1 : 0) - (1 - delta) * p0) / delta;
            double b = bracket[i] / delta;
            // need 0 <= a + b phi <= 1
            if (b > 0) {
                lo = Math.max(lo, -a / b);
                hi = Math.min(hi, (1 - a) / b);
            } else if (b < 0) {
                lo = Math.max(lo, (1 - a) / b);
                hi = Math.min(hi, -a / b);
            } else if (a < -SLACK || a > 1 + SLACK) {
                return new double[] {1, 0};
            }
        }
        return new double[] {lo, hi};
    }

    private static MemoryStrategy build(String label, String what, double[] bracket, double phi, double delta,
        double p0) {
        double usePhi = checkedPhi(what, phiRange(bracket, delta, p0), phi, delta);
        double[] p = new double[4];
        for (int i = 0; i < 4; i++) {
            double v = ((i < 2 ? 1 : 0) - (1 - delta) * p0 + usePhi * bracket[i]) / delta;
            // exact 0 and 1 come out of the formula up to rounding; snap them, so that a deterministic
            // entry stays deterministic (otherwise a 1e-17 transition makes a reducible chain look ergodic)
            p[i] = v < SLACK ? 0 : v > 1 - SLACK ? 1 : v;
        }
        return MemoryStrategy.memoryOne(label, p, p0);
    }

    /** The phi to use: the given one checked against the range, or the default (see the constructors). */
    private static double checkedPhi(String what, double[] range, double phi, double delta) {
        double lo = range[0];
        double hi = range[1];
        if (!(hi >= lo - SLACK) || !(hi > SLACK)) {
            throw new IllegalArgumentException("no valid " + what + " exists in this game: no phi > 0 keeps all "
                + "four cooperation probabilities in [0, 1]" + (delta < 1 ? " (try a larger continuation "
                + "probability)" : ""));
        }
        if (Double.isInfinite(hi)) {
            throw new IllegalArgumentException("the " + what + " does not tie the payoffs in this game "
                + "(the condition is void); choose other parameters");
        }
        double usePhi = Double.isNaN(phi) ? (lo > 0 ? (lo + hi) / 2 : hi / 2) : phi;
        if (!(usePhi > 0 && usePhi >= lo - SLACK && usePhi <= hi + SLACK)) {
            throw new IllegalArgumentException(String.format(Locale.ROOT, "phi must be in %s%s, %s] for the %s: %s",
                lo > 0 ? "[" : "(", Numbers.format(lo), Numbers.format(hi), what, Numbers.format(phi)));
        }
        return usePhi;
    }

    private static String label(String kind, String key, double value, double phi, double delta, double p0) {
        StringBuilder sb = new StringBuilder(kind).append(':').append(key).append('=').append(Numbers.format(value));
        if (!Double.isNaN(phi)) {
            sb.append(",phi=").append(Numbers.format(phi));
        }
        if (delta < 1) {
            sb.append(",delta=").append(Numbers.format(delta));
        }
        if (!Double.isNaN(p0)) {
            sb.append(",p0=").append(Numbers.format(p0));
        }
        return sb.toString();
    }

    private static String deltaText(double delta) {
        return delta < 1 ? " and delta=" + Numbers.format(delta) : "";
    }

    private static void checkChi(double chi) {
        if (!(chi >= 1) || Double.isInfinite(chi)) {
            throw new IllegalArgumentException("chi must be a finite number of at least 1: " + chi);
        }
    }

    private static void checkDelta(double delta) {
        if (!(delta > 0 && delta <= 1)) {
            throw new IllegalArgumentException("delta of a zero-determinant strategy must be in (0, 1]: " + delta);
        }
    }
}
