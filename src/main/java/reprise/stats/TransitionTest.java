package reprise.stats;

import java.util.Locale;
import org.apache.commons.statistics.distribution.ChiSquaredDistribution;
import reprise.game.Player;

/**
 * Anderson &amp; Goodman (1957) test that observed transition counts come from a hypothesised transition
 * matrix p0.
 *
 * <p>With n_ij the number of observed transitions from state i to state j and n_i = sum_j n_ij:
 * <ul>
 *   <li>Pearson form X^2 = sum_i sum_j (n_ij - n_i p0_ij)^2 / (n_i p0_ij);</li>
 *   <li>likelihood-ratio form G^2 = 2 sum_i sum_j n_ij ln(n_ij / (n_i p0_ij)) (with 0 ln 0 = 0).</li>
 * </ul>
 * Both are asymptotically chi-square with sum_i (d_i - 1) degrees of freedom over the rows with
 * n_i &gt; 0, where d_i is the number of positive p0_ij in row i (12 for a full 4 x 4 matrix). Cells with
 * p0_ij = 0 are left out of the sums; a positive count in such a cell makes the hypothesis impossible
 * and the test returns p = 0 with a note. p = P(chi2 &gt; statistic) from the survival function.
 *
 * <p><b>Why this is valid for autocorrelated play.</b> The test assumes that the observed sequence is a
 * Markov chain with transition matrix p0 (under the hypothesis). It conditions on the previous state, so
 * the dependence between rounds is part of the model rather than a violation of it; transitions may be
 * pooled over rounds and over independent games. It is not valid if the true process is not Markov on
 * these states (for example with perception errors, whose private memories make the observed states a
 * hidden Markov chain, or with memory longer than the state).
 *
 * <p>Implementation note: a hypothesised probability outside [0, 1] by rounding alone (at most 1e-14,
 * as when pooled or grouped cells are summed in floating point) is read as the nearest end of [0, 1];
 * rows must still sum to 1 within 1e-9. The row sums are formed directly (not with the library's goodness-of-fit
 * tests) because the paper's zero-cell rule needs cells with p0_ij = 0 left out per row, and rows with a
 * single possible successor contribute nothing.
 *
 * <p>References:
 * <ul>
 *   <li>Anderson, T.W. &amp; Goodman, L.A. (1957). Statistical inference about Markov chains. Annals of
 *       Mathematical Statistics 28(1), 89-110.</li>
 * </ul>
 */
public final class TransitionTest {

    /** Which statistic to compute. */
    public enum Form {
        /** Pearson's X^2. */
        PEARSON,
        /** The likelihood-ratio G^2. */
        LIKELIHOOD_RATIO
    }

    /** How far outside [0, 1] a hypothesised probability may lie by rounding alone (about 45 ulps of 1). */
    static final double ROUNDING = 1e-14;

    private final Form form;

    private TransitionTest(Form form) {
        this.form = form;
    }

    /** @return the Pearson form */
    public static TransitionTest withDefaults() {
        return new TransitionTest(Form.PEARSON);
    }

    /**
     * The same test with another statistic.
     *
     * @param f PEARSON or LIKELIHOOD_RATIO
     * @return the configured test
     */
    public TransitionTest with(Form f) {
        if (f == null) {
            throw new IllegalArgumentException("statistic form must not be null");
        }
        return new TransitionTest(f);
    }

    /**
     * The statistic.
     *
     * @param counts n_ij, m x m (row = previous state, column = next state; states CC, CD, DC, DD for
     *     m = 4), counts &ge; 0
     * @param hypothesis p0, m x m, each row a probability vector
     * @return X^2 or G^2, +infinity if a count falls in a cell with p0_ij = 0
     */
    public double statistic(long[][] counts, double[][] hypothesis) {
        return test(counts, hypothesis).statistic();
    }

    /**
     * The test (see the class description).
     *
     * @param counts n_ij, m x m, previous state by next state
     * @param hypothesis p0, m x m row-stochastic
     * @return statistic, degrees of freedom sum_i (d_i - 1), p-value, and a note
     */
    public TestResult test(long[][] counts, double[][] hypothesis) {
        return rectangular(counts, validated(counts, hypothesis));
    }

    private TestResult rectangular(long[][] counts, double[][] hypothesis) {
        int m = counts.length;
        double total = 0;
        int df = 0;
        for (int i = 0; i < m; i++) {
            double row = row(counts[i], hypothesis[i], i);
            if (Double.isInfinite(row)) {
                return TestResult.impossible(0, impossibleNote(counts[i], hypothesis[i], i));
            }
            total += row;
            df += rowDegreesOfFreedom(counts[i], hypothesis[i]);
        }
        if (df == 0) {
            return new TestResult(total, 0, 1, "no row with a free transition probability: p = 1");
        }
        return new TestResult(total, df, ChiSquaredDistribution.of(df).survivalProbability(total),
            form == Form.PEARSON ? "Pearson X^2" : "likelihood-ratio G^2");
    }

    /**
     * The contribution of each row to the statistic (each asymptotically chi-square with d_i - 1
     * degrees of freedom, independent across rows).
     *
     * @param counts n_ij, m x m
     * @param hypothesis p0, m x m
     * @return m values (0 for a row without transitions, +infinity for an impossible row)
     */
    public double[] rowStatistics(long[][] counts, double[][] hypothesis) {
        double[][] p0 = validated(counts, hypothesis);
        int m = p0.length;
        double[] out = new double[m];
        for (int i = 0; i < m; i++) {
            out[i] = row(counts[i], p0[i], i);
        }
        return out;
    }

    /**
     * The test restricted to one player's next move: for 4 x 4 counts in the order CC, CD, DC, DD, the
     * next states are grouped by that player's move (X cooperates in CC and CD, Y in CC and DC), giving
     * one binomial per previous state (degrees of freedom 4 when all probabilities are in (0, 1)). It
     * checks a player's strategy without involving the co-player's.
     *
     * @param counts n_ij, 4 x 4
     * @param hypothesis p0, 4 x 4
     * @param player whose move to test
     * @return the test on the 4 x 2 grouped table
     */
    public TestResult testMove(long[][] counts, double[][] hypothesis, Player player) {
        double[][] p0 = validated(counts, hypothesis);
        if (p0.length != 4) {
            throw new IllegalArgumentException("a move test needs 4 x 4 state transitions: " + counts.length);
        }
        long[][] c = new long[4][2];
        double[][] p = new double[4][2];
        for (int i = 0; i < 4; i++) {
            for (int j = 0; j < 4; j++) {
                boolean cooperates = player == Player.X ? j < 2 : (j & 1) == 0;
                int k = cooperates ? 0 : 1;
                c[i][k] += counts[i][j];
                p[i][k] += p0[i][j];
            }
            p[i] = roundingClamped(p[i]);
        }
        return rectangular(c, p);
    }

    private double row(long[] n, double[] p, int i) {
        long ni = 0;
        for (long v : n) {
            ni += v;
        }
        if (ni == 0) {
            return 0;
        }
        double sum = 0;
        for (int j = 0; j < n.length; j++) {
            if (p[j] == 0) {
                if (n[j] > 0) {
                    return Double.POSITIVE_INFINITY;
                }
                continue;
            }
            double e = ni * p[j];
            if (form == Form.PEARSON) {
                double d = n[j] - e;
                sum += d * d / e;
            } else if (n[j] > 0) {
                sum += 2 * n[j] * Math.log(n[j] / e);
            }
        }
        return sum;
    }

    private static int rowDegreesOfFreedom(long[] n, double[] p) {
        long ni = 0;
        for (long v : n) {
            ni += v;
        }
        if (ni == 0) {
            return 0;
        }
        int d = 0;
        for (double v : p) {
            if (v > 0) {
                d++;
            }
        }
        return d - 1;
    }

    private static String impossibleNote(long[] n, double[] p, int i) {
        for (int j = 0; j < n.length; j++) {
            if (p[j] == 0 && n[j] > 0) {
                return String.format(Locale.ROOT, "%d observed transitions %d -> %d, which the hypothesis "
                    + "gives probability 0: the hypothesis is impossible", n[j], i, j);
            }
        }
        return "impossible";
    }

    /**
     * Entries above 1 by no more than {@link #ROUNDING} (sums of probabilities formed in floating point,
     * such as 0.9975 + 0.0025 = 1.0000000000000002) are read as 1, and entries below 0 by no more than it
     * as 0; anything further out is an error.
     */
    private static double[] roundingClamped(double[] p) {
        double[] c = p.clone();
        for (int j = 0; j < c.length; j++) {
            if (c[j] > 1 && c[j] <= 1 + ROUNDING) {
                c[j] = 1;
            } else if (c[j] < 0 && c[j] >= -ROUNDING) {
                c[j] = 0;
            }
        }
        return c;
    }

    private static double[][] validated(long[][] counts, double[][] hypothesis) {
        if (counts == null || counts.length < 2) {
            throw new IllegalArgumentException("transition counts must be a square matrix with at least 2 rows: "
                + (counts == null ? "none" : counts.length));
        }
        int m = counts.length;
        double[][] p0 = new double[m][];
        if (hypothesis == null || hypothesis.length != m) {
            throw new IllegalArgumentException("hypothesised transition matrix must have " + m + " rows: "
                + (hypothesis == null ? "none" : hypothesis.length));
        }
        for (int i = 0; i < m; i++) {
            Checks.counts("transition counts row " + i, counts[i], m);
            if (hypothesis[i] == null) {
                throw new IllegalArgumentException("hypothesised transition matrix row " + i + " must have " + m
                    + " entries: none");
            }
            p0[i] = Checks.distribution("hypothesised transition matrix row " + i, roundingClamped(hypothesis[i]), m);
        }
        return p0;
    }
}
