package reprise.chain;

import java.util.Arrays;
import java.util.OptionalLong;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.exception.MaxCountExceededException;
import org.apache.commons.math3.linear.EigenDecomposition;

/**
 * How fast a chain forgets its start: the second-largest eigenvalue modulus and a mixing time.
 *
 * <p><b>Second eigenvalue modulus</b>: sort the moduli of the eigenvalues of M in decreasing order and
 * drop one eigenvalue 1; the largest remaining modulus. It equals 1 when there are several closed
 * classes or a periodic class, and bounds the geometric rate |v_t - pi| = O(t^m |lambda_2|^t).
 *
 * <p><b>Mixing time</b>: the smallest t &ge; 1 with max_i TV(row i of M^t, pi) &le; 1/4, where
 * TV(mu, nu) = (1/2) sum_j |mu_j - nu_j| and i ranges over all chain states. It is undefined (empty)
 * without a unique stationary distribution and for periodic chains, and reported as empty when it exceeds
 * {@link #MIXING_CAP}.
 *
 * <p>Implementation note. Eigenvalues from Commons Math's EigenDecomposition (Hessenberg reduction and
 * the real Schur form; works for non-symmetric matrices), accurate to about 1e-15 times the matrix norm
 * for well separated eigenvalues; for defective eigenvalues (noise-free deterministic play) the modulus
 * may be off by the square root of that. On large sparse record chains the QR iteration can fail to
 * converge; the lazy chain (1 - s) M + s I, whose eigenvalues are (1 - s) lambda + s, is then tried. The mixing time uses repeated squaring to bracket t by powers of
 * two and then a binary descent on the stored powers, O(k^3 log t); d(t) is non-increasing in t, which
 * makes the descent valid.
 *
 * <p>References:
 * Levin, D.A., Peres, Y. &amp; Wilmer, E.L. (2009). Markov Chains and Mixing Times. American
 * Mathematical Society, ch. 4.
 */
public final class Spectrum {

    /** Mixing times above this are reported as empty: 2^40 rounds. */
    public static final long MIXING_CAP = 1L << 40;

    /** Shifts s of the lazy chain (1 - s) M + s I tried in turn when the QR iteration does not converge. */
    private static final double[] SHIFTS = {0, 0.5, 0.75};

    private Spectrum() {
    }

    /**
     * The second-largest eigenvalue modulus of a stochastic matrix.
     *
     * @param m the matrix (k x k)
     * @return |lambda_2| in [0, 1]; 0 for a 1 x 1 matrix; NaN if the eigenvalue iteration fails to converge
     *     even on the lazy chains (1 - s) M + s I (same eigenvectors, eigenvalues (1 - s) lambda + s)
     */
    public static double secondEigenvalueModulus(double[][] m) {
        int k = m.length;
        if (k == 1) {
            return 0;
        }
        double[] re = null;
        double[] im = null;
        for (double shift : SHIFTS) {
            double[][] a = new double[k][k];
            for (int i = 0; i < k; i++) {
                for (int j = 0; j < k; j++) {
                    a[i][j] = (1 - shift) * m[i][j] + (i == j ? shift : 0);
                }
            }
            try {
                EigenDecomposition e = new EigenDecomposition(new Array2DRowRealMatrix(a, false));
                re = e.getRealEigenvalues();
                im = e.getImagEigenvalues();
                for (int i = 0; i < k; i++) {
                    re[i] = (re[i] - shift) / (1 - shift);
                    im[i] = im[i] / (1 - shift);
                }
                break;
            } catch (MaxCountExceededException ex) {
                re = null;
            }
        }
        if (re == null) {
            return Double.NaN;
        }
        int closest = 0;
        double best = Double.POSITIVE_INFINITY;
        for (int i = 0; i < k; i++) {
            double d = Math.hypot(re[i] - 1, im[i]);
            if (d < best) {
                best = d;
                closest = i;
            }
        }
        double[] mod = new double[k - 1];
        int n = 0;
        for (int i = 0; i < k; i++) {
            if (i != closest) {
                mod[n++] = Math.hypot(re[i], im[i]);
            }
        }
        Arrays.sort(mod);
        return Math.min(1, mod[k - 2]);
    }

    /**
     * The second-largest eigenvalue modulus of a chain's transition matrix.
     *
     * @param chain the chain
     * @return |lambda_2|
     */
    public static double secondEigenvalueModulus(MarkovChain chain) {
        return secondEigenvalueModulus(chain.matrix());
    }

    /**
     * The mixing time of a chain (definition in the class description).
     *
     * @param chain the chain
     * @return t, or empty when undefined or above {@link #MIXING_CAP}
     */
    public static OptionalLong mixingTime(MarkovChain chain) {
        double[] pi = chain.structure().stationary();
        return pi == null ? OptionalLong.empty() : mixingTime(chain.matrix(), pi);
    }

    /**
     * The mixing time of a stochastic matrix with stationary distribution pi.
     *
     * @param m the matrix
     * @param pi its stationary distribution
     * @return t, or empty when d(t) &gt; 1/4 for all t up to {@link #MIXING_CAP}
     */
    public static OptionalLong mixingTime(double[][] m, double[] pi) {
        if (distance(m, pi) <= 0.25) {
            return OptionalLong.of(1);
        }
        int levels = Long.numberOfTrailingZeros(MIXING_CAP);
        double[][][] powers = new double[levels + 1][][];
        powers[0] = m;
        int top = -1;
        for (int j = 1; j <= levels; j++) {
            powers[j] = Dense.squareStochastic(powers[j - 1]);
            if (distance(powers[j], pi) <= 0.25) {
                top = j;
                break;
            }
        }
        if (top < 0) {
            return OptionalLong.empty();
        }
        double[][] q = powers[top - 1];
        long t = 1L << (top - 1);
        for (int j = top - 2; j >= 0; j--) {
            double[][] cand = Dense.multiply(q, powers[j]);
            if (distance(cand, pi) > 0.25) {
                q = cand;
                t += 1L << j;
            }
        }
        return OptionalLong.of(t + 1);
    }

    private static double distance(double[][] p, double[] pi) {
        double worst = 0;
        for (double[] row : p) {
            double s = 0;
            for (int j = 0; j < row.length; j++) {
                s += Math.abs(row[j] - pi[j]);
            }
            worst = Math.max(worst, 0.5 * s);
        }
        return worst;
    }
}
