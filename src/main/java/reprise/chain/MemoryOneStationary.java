package reprise.chain;

import reprise.game.Noise;
import reprise.game.StageGame;

/**
 * Allocation-free stationary distribution and payoffs of two memory-one players, for dense parameter
 * sweeps. One instance holds its own scratch space: reuse it, one per thread (not thread-safe).
 *
 * <p>Same model as {@link MarkovChain} for memory-one players: X cooperates after round state s (X's view)
 * with c_X(s) = (1 - h_X) p(s) + h_X p(s with Y's move flipped), Y likewise with q in Y's own view (state
 * mirrored), then execution errors. The result is the unique stationary distribution; the first round
 * does not matter.
 *
 * <p>Implementation note. The 4 x 4 transition matrix is built in a reused array and solved by GTH state
 * reduction unrolled over 4 states (about 60 floating-point operations, no subtraction, so nearly
 * reducible chains keep full relative precision). If a GTH pivot vanishes (a closed set among the states
 * eliminated first, as with noise-free play), the rare slow path analyses the class structure with
 * allocation; when there is more than one closed class the stationary distribution is not unique and the
 * results are NaN.
 *
 * <p>References:
 * Grassmann, W.K., Taksar, M.I. &amp; Heyman, D.P. (1985). Regenerative analysis and steady state
 * distributions for Markov chains. Operations Research 33(5), 1107-1116.
 */
public final class MemoryOneStationary {
    private static final String[] LABELS = {"CC", "CD", "DC", "DD"};

    private final double[] built = new double[16];
    private final double[] a = new double[16];
    private final double[] pi = new double[4];

    /** Creates a solver with its scratch space. */
    public MemoryOneStationary() {
        // scratch arrays only
    }

    /**
     * Solves for the stationary distribution.
     *
     * @param p X's cooperation probabilities after CC, CD, DC, DD, X's own view (4)
     * @param q Y's cooperation probabilities after CC, CD, DC, DD, Y's own view (4)
     * @param executionX X's execution error
     * @param executionY Y's execution error
     * @param perceptionX X's perception error
     * @param perceptionY Y's perception error
     * @return true when the stationary distribution is unique; false leaves NaN results
     */
    public boolean solve(double[] p, double[] q, double executionX, double executionY, double perceptionX,
        double perceptionY) {
        transition(built, p, q, executionX, executionY, perceptionX, perceptionY);
        System.arraycopy(built, 0, a, 0, 16);
        return gth(a, pi) || slowPath();
    }

    /**
     * Writes the 4 x 4 transition matrix of two memory-one players, row-major, states CC, CD, DC, DD from
     * X's view (see the class description).
     */
    static void transition(double[] m, double[] p, double[] q, double executionX, double executionY,
        double perceptionX, double perceptionY) {
        double kx = 1 - perceptionX;
        double ky = 1 - perceptionY;
        double gx = 1 - executionX;
        double gy = 1 - executionY;
        for (int s = 0; s < 4; s++) {
            int t = s ^ 1;
            double cx = kx * p[s] + perceptionX * p[t];
            double dx = kx * (1 - p[s]) + perceptionX * (1 - p[t]);
            int my = ((s & 1) << 1) | (s >> 1);
            int ty = my ^ 1;
            double cy = ky * q[my] + perceptionY * q[ty];
            double dy = ky * (1 - q[my]) + perceptionY * (1 - q[ty]);
            double xc = gx * cx + executionX * dx;
            double xd = gx * dx + executionX * cx;
            double yc = gy * cy + executionY * dy;
            double yd = gy * dy + executionY * cy;
            int r = 4 * s;
            m[r] = xc * yc;
            m[r + 1] = xc * yd;
            m[r + 2] = xd * yc;
            m[r + 3] = xd * yd;
        }
    }

    /**
     * GTH on a 4 x 4 row-major stochastic matrix (overwritten); writes the stationary distribution to pi.
     *
     * @return false, leaving pi untouched, when a pivot vanishes
     */
    static boolean gth(double[] m, double[] pi) {
        for (int n = 3; n > 0; n--) {
            int rn = 4 * n;
            double s = 0;
            for (int j = 0; j < n; j++) {
                s += m[rn + j];
            }
            if (!(s > 0)) {
                return false;
            }
            for (int i = 0; i < n; i++) {
                int ri = 4 * i;
                double f = m[ri + n] / s;
                m[ri + n] = f;
                for (int j = 0; j < n; j++) {
                    m[ri + j] += f * m[rn + j];
                }
            }
        }
        double x1 = m[1];
        double x2 = m[2] + x1 * m[6];
        double x3 = m[3] + x1 * m[7] + x2 * m[11];
        double total = 1 + x1 + x2 + x3;
        pi[0] = 1 / total;
        pi[1] = x1 / total;
        pi[2] = x2 / total;
        pi[3] = x3 / total;
        return true;
    }

    private boolean slowPath() {
        double[][] m = new double[4][4];
        for (int i = 0; i < 16; i++) {
            m[i >> 2][i & 3] = built[i];
        }
        double[] stationary = ChainStructure.analyze(m, new double[] {0.25, 0.25, 0.25, 0.25}, LABELS).stationary();
        if (stationary == null) {
            java.util.Arrays.fill(pi, Double.NaN);
            return false;
        }
        System.arraycopy(stationary, 0, pi, 0, 4);
        return true;
    }

    /**
     * The stationary probability of a round state (after a successful {@link #solve}).
     *
     * @param state 0 to 3 (CC, CD, DC, DD)
     * @return the probability, NaN if the last solve failed
     */
    public double frequency(int state) {
        return pi[state];
    }

    /**
     * The expected payoff sum_s pi_s u_s.
     *
     * @param u payoffs in X's state order CC, CD, DC, DD (for example {@link StageGame#payoffX()})
     * @return the stationary payoff, NaN if the last solve failed
     */
    public double payoff(double[] u) {
        return pi[0] * u[0] + pi[1] * u[1] + pi[2] * u[2] + pi[3] * u[3];
    }

    /**
     * Convenience form (allocates the result).
     *
     * @param game the stage game
     * @param p X's vector, own view
     * @param q Y's vector, own view
     * @param noise errors
     * @return stationary payoffs, NaN when the stationary distribution is not unique
     */
    public static Payoffs payoffs(StageGame game, double[] p, double[] q, Noise noise) {
        MemoryOneStationary s = new MemoryOneStationary();
        s.solve(p, q, noise.executionX(), noise.executionY(), noise.perceptionX(), noise.perceptionY());
        return new Payoffs(s.payoff(game.payoffX()), s.payoff(game.payoffY()));
    }
}
