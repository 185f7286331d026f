package reprise.stats;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;

/**
 * How much information a study's games carry about one quantity, and whether the normal approximation
 * behind the t-interval and the z, Wald and chi-square tests can be trusted there.
 *
 * <p>For a per-game value V_g (the per-round average Y_g / L_g of a quantity Y = w . N), with G games:
 * <ul>
 *   <li>the modal probability m = max_v P(V = v) and the expected number of informative games
 *       G (1 - m), the games in which the quantity is not at its modal value: with low error rates most
 *       games follow the error-free path and only these few carry the variation;</li>
 *   <li>the skewness gamma = E(V - EV)^3 / sd^3 of one game's value (0 when sd = 0): the error of the
 *       t-interval's coverage grows with gamma^2 / G (Hall 1992, ch. 3, the Edgeworth expansion of the
 *       studentised mean);</li>
 *   <li>the expected count of each state over the G games, G E[N_s]; a state expected fewer than
 *       {@link #SPARSE_STATE_COUNT} times makes every test that involves it rest on a poor normal
 *       approximation (the rule of calibrate's rare-state warning).</li>
 * </ul>
 * {@link #kind()} is the rule chosen by measured coverage of the t-interval and of the effective-size
 * interval (measured in {@code IntervalCoverageCalibrationTest} on games drawn from the exact chain,
 * 1000 runs per case):
 * <ul>
 *   <li>{@link Kind#ORDINARY}: at least {@link #MINIMUM_INFORMATIVE_GAMES} informative games expected and
 *       gamma^2 / G &le; {@link #ORDINARY_SKEWNESS}: the t-interval covered 0.94-0.96;</li>
 *   <li>{@link Kind#SKEWED}: as many informative games, gamma^2 / G &le; {@link #SKEWED_SKEWNESS}: the
 *       t-interval fell to 0.92, the effective-size interval of proportions stayed at 0.94-0.96;</li>
 *   <li>{@link Kind#SPARSE}: otherwise (t-interval coverage 0.26-0.90 on the cases of issue 12): only a
 *       finite-sample interval is trusted.</li>
 * </ul>
 *
 * <p>References:
 * <ul>
 *   <li>Hall, P. (1992). The Bootstrap and Edgeworth Expansion. Springer, ch. 3.</li>
 * </ul>
 *
 * @param games G
 * @param modalProbability m, the probability that one game's value is at its most frequent value
 * @param skewness gamma of one game's value (0 for a value without spread)
 * @param expectedStateCounts G E[N_s] for CC, CD, DC, DD
 */
public record Regime(long games, double modalProbability, double skewness, double[] expectedStateCounts) {

    /** Calibrate's threshold: a state expected fewer times over the games than this is sparse. */
    public static final double SPARSE_STATE_COUNT = 20;
    /** Fewer expected informative games than this: the regime is sparse. */
    public static final double MINIMUM_INFORMATIVE_GAMES = 20;
    /** The largest gamma^2 / G of the ordinary regime. */
    public static final double ORDINARY_SKEWNESS = 0.02;
    /** The largest gamma^2 / G of the skewed regime. */
    public static final double SKEWED_SKEWNESS = 0.1;

    /** The three regimes (see the class description). */
    public enum Kind {
        /** The normal approximation is trusted: t-interval, asymptotic p-values. */
        ORDINARY,
        /** Enough informative games but a skewed per-game value: effective-size intervals for proportions. */
        SKEWED,
        /** Few games carry the variation: finite-sample intervals, Monte Carlo or no p-values. */
        SPARSE
    }

    private static final String[] NAMES = {"CC", "CD", "DC", "DD"};

    /**
     * Validates and copies.
     *
     * @param games at least 1
     * @param modalProbability in [0, 1]
     * @param skewness finite
     * @param expectedStateCounts 4 finite values &ge; 0
     */
    public Regime {
        if (games < 1) {
            throw new IllegalArgumentException("number of games must be at least 1: " + games);
        }
        Checks.probability("modal probability", modalProbability);
        Checks.finite("skewness", skewness);
        expectedStateCounts = Checks.finiteVector("expected state counts", expectedStateCounts, 4);
        for (int s = 0; s < 4; s++) {
            Checks.nonNegative("expected count of state " + NAMES[s], expectedStateCounts[s]);
        }
    }

    /**
     * The regime of a quantity from the per-game counts of many games drawn from the exact model (for
     * example by {@code reprise.chain.ChainSampler}), scaled to a study of G games.
     *
     * @param modelGames per-game counts (CC, CD, DC, DD) of M &ge; 2 model games, each with at least one
     *     tallied round
     * @param weights w, the quantity
     * @param games G, the study's number of games
     * @return the regime
     */
    public static Regime fromModelGames(long[][] modelGames, double[] weights, long games) {
        double[] w = Checks.finiteVector("weights", weights, 4);
        if (modelGames == null || modelGames.length < 2) {
            throw new IllegalArgumentException("the regime needs at least 2 model games: "
                + (modelGames == null ? "none" : modelGames.length));
        }
        int m = modelGames.length;
        double[] v = new double[m];
        double[] stateMeans = new double[4];
        for (int g = 0; g < m; g++) {
            long[] c = Checks.counts("counts of model game " + g, modelGames[g], 4);
            long len = c[0] + c[1] + c[2] + c[3];
            if (len < 1) {
                throw new IllegalArgumentException("model game " + g + " has no tallied round");
            }
            double y = 0;
            for (int s = 0; s < 4; s++) {
                y += w[s] * c[s];
                stateMeans[s] += c[s];
            }
            v[g] = y / len;
        }
        for (int s = 0; s < 4; s++) {
            stateMeans[s] = stateMeans[s] / m * games;
        }
        return new Regime(games, modalFraction(v), skewness(v), stateMeans);
    }

    /**
     * As {@link #fromModelGames(long[][], double[], long)}, with the expected state counts taken from the
     * exact model instead of the model games.
     *
     * @param modelGames per-game counts of M &ge; 2 model games
     * @param weights w, the quantity
     * @param games G
     * @param exactMeanCounts E[N_s] of one game from the exact engine (e.g. {@code CountMoments.mean()})
     * @return the regime, with expected state counts G E[N_s]
     */
    public static Regime fromModelGames(long[][] modelGames, double[] weights, long games, double[] exactMeanCounts) {
        Regime sampled = fromModelGames(modelGames, weights, games);
        double[] mu = Checks.finiteVector("exact mean counts", exactMeanCounts, 4);
        for (int s = 0; s < 4; s++) {
            mu[s] = Checks.nonNegative("exact mean count of state " + NAMES[s], mu[s]) * games;
        }
        return new Regime(games, sampled.modalProbability(), sampled.skewness(), mu);
    }

    /** @return the expected number of informative games G (1 - m) */
    public double informativeGames() {
        return games * (1 - modalProbability);
    }

    /** @return G E[N_s] (a copy) */
    @Override
    public double[] expectedStateCounts() {
        return expectedStateCounts.clone();
    }

    /** @return gamma^2 / G, the skewness of one game's value squared over the number of games */
    public double skewnessSquaredPerGame() {
        return skewness * skewness / games;
    }

    /**
     * The regime (see the class description).
     *
     * @return ORDINARY, SKEWED or SPARSE
     */
    public Kind kind() {
        if (informativeGames() < MINIMUM_INFORMATIVE_GAMES || skewnessSquaredPerGame() > SKEWED_SKEWNESS) {
            return Kind.SPARSE;
        }
        return skewnessSquaredPerGame() <= ORDINARY_SKEWNESS ? Kind.ORDINARY : Kind.SKEWED;
    }

    /** @return whether the regime is {@link Kind#ORDINARY} */
    public boolean ordinary() {
        return kind() == Kind.ORDINARY;
    }

    /**
     * One line for a results column: the regime's name, then the figures.
     *
     * @return e.g. {@code sparse: 3.2 informative games of 200, skewness 7.1}
     */
    public String describe() {
        return String.format(Locale.ROOT, "%s: %.3g informative games of %d, skewness %.3g",
            kind().name().toLowerCase(Locale.ROOT), informativeGames(), games, skewness);
    }

    /**
     * The warnings for this regime: one per sparse state (the rare-state rule), and one when few games
     * carry the variation.
     *
     * @return the lines, empty when the regime is ordinary and no state is sparse
     */
    public List<String> warnings() {
        List<String> out = new ArrayList<>(sparseStateWarnings(expectedStateCounts));
        if (kind() == Kind.SPARSE) {
            out.add(String.format(Locale.ROOT, "only %.3g of %d games are expected to differ from the most "
                + "frequent value (skewness %.3g): the normal approximation is not trusted, a finite-sample "
                + "interval is used", informativeGames(), games, skewness));
        } else if (kind() == Kind.SKEWED) {
            out.add(String.format(Locale.ROOT, "the per-game values are skewed (skewness %.3g over %d games): the "
                + "t-interval under-covers, an effective-size interval is used for proportions", skewness, games));
        }
        return out;
    }

    /**
     * The rare-state rule of calibrate: one line per state whose expected tallied count over the games is
     * positive and below {@link #SPARSE_STATE_COUNT}.
     *
     * @param expectedCounts G E[N_s] per state CC, CD, DC, DD
     * @return the lines, in state order
     */
    public static List<String> sparseStateWarnings(double[] expectedCounts) {
        double[] e = Checks.finiteVector("expected state counts", expectedCounts, 4);
        List<String> w = new ArrayList<>();
        for (int s = 0; s < 4; s++) {
            if (e[s] > 0 && e[s] < SPARSE_STATE_COUNT) {
                w.add(String.format(Locale.ROOT, "state %s: expected %.3g tallied rounds over the games (below %d); "
                    + "tests that involve it rest on a poor normal approximation, use more games", NAMES[s], e[s],
                    (int) SPARSE_STATE_COUNT));
            }
        }
        return w;
    }

    private static double modalFraction(double[] v) {
        double[] sorted = v.clone();
        Arrays.sort(sorted);
        int best = 0;
        int run = 0;
        for (int i = 0; i < sorted.length; i++) {
            run = i > 0 && sorted[i] == sorted[i - 1] ? run + 1 : 1;
            best = Math.max(best, run);
        }
        return best / (double) sorted.length;
    }

    private static double skewness(double[] v) {
        double mean = 0;
        for (double x : v) {
            mean += x;
        }
        mean /= v.length;
        double m2 = 0;
        double m3 = 0;
        for (double x : v) {
            double d = x - mean;
            m2 += d * d;
            m3 += d * d * d;
        }
        m2 /= v.length;
        m3 /= v.length;
        return m2 <= 0 ? 0 : m3 / Math.pow(m2, 1.5);
    }
}
