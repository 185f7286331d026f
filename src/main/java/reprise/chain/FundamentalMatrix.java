package reprise.chain;

import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.LUDecomposition;
import org.apache.commons.math3.linear.RealMatrix;
import reprise.game.StageGame;
import reprise.game.State;

/**
 * Kemeny &amp; Snell's fundamental matrix and the asymptotic covariance of occupation frequencies.
 *
 * <p>For a stochastic matrix P with a unique stationary distribution pi (one closed class; periodic
 * chains included), Z = (I - P + A)^-1 with every row of A equal to pi. Then
 * <ul>
 *   <li>c_ij = lim (1/n) Cov(N_i(n), N_j(n)) = pi_i z_ij + pi_j z_ji - pi_i 1{i=j} - pi_i pi_j, whatever the
 *       start;</li>
 *   <li>for functions f, g of the state, lim (1/n) Cov(sum f, sum g) = f' C g;</li>
 *   <li>mean first-passage times m_ij = (z_jj - z_ij) / pi_j for i != j, and m_ii = 1 / pi_i.</li>
 * </ul>
 * The methods on a {@link MarkovChain} project chain states to the 4 round states. For several closed
 * classes the limits depend on the start and are random; those methods return null.
 *
 * <p>Implementation note. One LU solve of I - P + A (Commons Math, partial pivoting). Its condition number
 * grows like the inverse spectral gap, so for nearly reducible chains (noise e) the relative error is
 * about 1e-16 / e; the covariances themselves are of order 1/e there.
 *
 * <p>References:
 * Kemeny, J.G. &amp; Snell, J.L. (1960). Finite Markov Chains. Van Nostrand, ch. 4 (Theorem 4.6.1).
 */
public final class FundamentalMatrix {
    private FundamentalMatrix() {
    }

    /**
     * The fundamental matrix Z = (I - P + A)^-1.
     *
     * @param p a stochastic matrix (k x k)
     * @param pi its stationary distribution (k)
     * @return Z (k x k)
     */
    public static double[][] fundamental(double[][] p, double[] pi) {
        int k = p.length;
        if (pi == null || pi.length != k) {
            throw new IllegalArgumentException("stationary distribution must have " + k + " entries");
        }
        RealMatrix a = new Array2DRowRealMatrix(k, k);
        for (int i = 0; i < k; i++) {
            if (p[i].length != k) {
                throw new IllegalArgumentException("transition matrix must be square: row " + i + " has "
                    + p[i].length + " entries, expected " + k);
            }
            for (int j = 0; j < k; j++) {
                a.setEntry(i, j, (i == j ? 1 : 0) - p[i][j] + pi[j]);
            }
        }
        return new LUDecomposition(a).getSolver().getInverse().getData();
    }

    /**
     * The asymptotic covariance of the occupation counts, c_ij = lim (1/n) Cov(N_i(n), N_j(n)).
     *
     * @param p a stochastic matrix with one closed class
     * @param pi its stationary distribution
     * @return C (k x k), symmetric, zero row sums
     */
    public static double[][] occupationCovariance(double[][] p, double[] pi) {
        double[][] z = fundamental(p, pi);
        int k = p.length;
        double[][] c = new double[k][k];
        for (int i = 0; i < k; i++) {
            for (int j = 0; j < k; j++) {
                c[i][j] = pi[i] * z[i][j] + pi[j] * z[j][i] - (i == j ? pi[i] : 0) - pi[i] * pi[j];
            }
        }
        return c;
    }

    /**
     * Mean first-passage times: m_ij = expected number of steps from i to reach j (return time for i = j).
     *
     * @param p a stochastic matrix with one closed class
     * @param pi its stationary distribution (every entry positive, else that column is infinite)
     * @return k x k
     */
    public static double[][] meanFirstPassageTimes(double[][] p, double[] pi) {
        double[][] z = fundamental(p, pi);
        int k = p.length;
        double[][] m = new double[k][k];
        for (int i = 0; i < k; i++) {
            for (int j = 0; j < k; j++) {
                m[i][j] = i == j ? 1 / pi[j] : (z[j][j] - z[i][j]) / pi[j];
            }
        }
        return m;
    }

    /**
     * The asymptotic covariance of the 4 round-state frequencies of a chain,
     * c_ab = lim (1/n) Cov(N_a(n), N_b(n)) for a, b in CC, CD, DC, DD.
     *
     * @param chain the chain
     * @return 4x4, or null when the stationary distribution is not unique (or so nearly not unique that
     *     the fundamental matrix is numerically singular)
     */
    public static double[][] roundStateCovariance(MarkovChain chain) {
        double[] pi = chain.structure().stationary();
        if (pi == null) {
            return null;
        }
        double[][] c;
        try {
            c = occupationCovariance(chain.matrix(), pi);
        } catch (org.apache.commons.math3.linear.SingularMatrixException e) {
            // I - M + 1 pi is singular in floating point only when the chain is reducible up to rounding
            return null;
        }
        int[] r = chain.roundStates();
        double[][] out = new double[State.COUNT][State.COUNT];
        for (int i = 0; i < c.length; i++) {
            for (int j = 0; j < c.length; j++) {
                out[r[i]][r[j]] += c[i][j];
            }
        }
        return out;
    }

    /**
     * The asymptotic covariance matrix of the two players' total payoffs, lim (1/n) Cov, in the order
     * (payoff X, payoff Y).
     *
     * @param chain the chain
     * @param game the stage game (usually the match's)
     * @return 2x2 [[var X, cov], [cov, var Y]], or null when the stationary distribution is not unique
     */
    public static double[][] payoffCovariance(MarkovChain chain, StageGame game) {
        double[][] c = roundStateCovariance(chain);
        if (c == null) {
            return null;
        }
        double[][] u = {game.payoffX(), game.payoffY()};
        double[][] out = new double[2][2];
        for (int p = 0; p < 2; p++) {
            for (int q = 0; q < 2; q++) {
                double s = 0;
                for (int a = 0; a < 4; a++) {
                    for (int b = 0; b < 4; b++) {
                        s += u[p][a] * c[a][b] * u[q][b];
                    }
                }
                out[p][q] = s;
            }
        }
        return out;
    }
}
