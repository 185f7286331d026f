package reprise.chain;

/**
 * Stationary distribution of an irreducible stochastic matrix by GTH state reduction.
 *
 * <p>Implementation note. Grassmann, Taksar &amp; Heyman's algorithm eliminates states one by one;
 * the pivot of state n is the sum of its off-diagonal probabilities to the states still present,
 * formed by additions only, never as 1 - (diagonal). Every operation is a sum or product of
 * non-negative numbers, so each entry of the result carries a relative error of a small multiple of
 * k * 2^-53 regardless of how nearly reducible the chain is (noise 1e-8 or smaller). Cost k^3/3.
 *
 * <p>References:
 * Grassmann, W.K., Taksar, M.I. &amp; Heyman, D.P. (1985). Regenerative analysis and steady state
 * distributions for Markov chains. Operations Research 33(5), 1107-1116.
 */
final class Gth {
    private Gth() {
    }

    /**
     * The stationary distribution of an irreducible stochastic matrix.
     *
     * @param p the matrix (not modified)
     * @return pi with pi P = pi, summing to 1
     * @throws IllegalStateException if a pivot vanishes (the matrix is not irreducible)
     */
    static double[] stationary(double[][] p) {
        int k = p.length;
        double[][] a = Dense.copy(p);
        for (int n = k - 1; n > 0; n--) {
            double[] an = a[n];
            double s = 0;
            for (int j = 0; j < n; j++) {
                s += an[j];
            }
            if (!(s > 0)) {
                throw new IllegalStateException("GTH pivot vanished at state " + n + ": the chain is not irreducible");
            }
            for (int i = 0; i < n; i++) {
                double[] ai = a[i];
                double f = ai[n] / s;
                ai[n] = f;
                if (f != 0) {
                    for (int j = 0; j < n; j++) {
                        ai[j] += f * an[j];
                    }
                }
            }
        }
        double[] pi = new double[k];
        pi[0] = 1;
        double total = 1;
        for (int j = 1; j < k; j++) {
            double x = 0;
            for (int i = 0; i < j; i++) {
                x += pi[i] * a[i][j];
            }
            pi[j] = x;
            total += x;
        }
        for (int j = 0; j < k; j++) {
            pi[j] /= total;
        }
        return pi;
    }
}
