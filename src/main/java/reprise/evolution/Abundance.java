package reprise.evolution;

import reprise.game.Population;

/**
 * Long-run abundance of strategies under mutation.
 *
 * <p><b>Rare mutations</b> (Fudenberg &amp; Imhof 2006): when mutants arise so rarely that each is fixed or
 * lost before the next appears, the population is almost always homogeneous, and its resident strategy
 * follows the embedded chain on the k strategies with T[r][m] = rho[m][r] / (k - 1) for m &ne; r (a
 * mutant of one of the other k - 1 strategies, uniformly, fixes with probability rho) and
 * T[r][r] = 1 - sum_{m &ne; r} T[r][m]. The abundance of each strategy is the stationary distribution of
 * T, computed by the GTH elimination (no subtractions, so accurate even for nearly reducible chains).
 *
 * <p><b>Explicit mutation</b> with two strategies: the stationary distribution of the birth-death chain
 * of {@link Fixation#chain}, and the mean fraction of the counted strategy.
 *
 * <p>References:
 * <ul>
 *   <li>Fudenberg, D. &amp; Imhof, L.A. (2006). Imitation processes with small mutations. Journal of Economic
 *       Theory 131, 251-262.</li>
 *   <li>Grassmann, W.K., Taksar, M.I. &amp; Heyman, D.P. (1985). Regenerative analysis and steady state
 *       distributions for Markov chains. Operations Research 33, 1107-1116.</li>
 * </ul>
 */
public final class Abundance {
    private Abundance() {
    }

    /**
     * The rare-mutation abundances from a matrix of fixation probabilities.
     *
     * @param fixation fixation[m][r], the probability that one m mutant fixes among r residents (k x k,
     *     diagonal ignored)
     * @return the stationary distribution of the embedded chain over the k strategies
     */
    public static double[] rareMutation(double[][] fixation) {
        return stationary(embeddedChain(fixation));
    }

    /**
     * The embedded chain of homogeneous states: T[r][m] = fixation[m][r] / (k - 1).
     *
     * @param fixation k x k fixation probabilities
     * @return the k x k transition matrix
     */
    public static double[][] embeddedChain(double[][] fixation) {
        int k = fixation.length;
        if (k < 2) {
            throw new IllegalArgumentException("abundance needs at least 2 strategies: " + k);
        }
        double[][] t = new double[k][k];
        for (int r = 0; r < k; r++) {
            if (fixation[r].length != k) {
                throw new IllegalArgumentException("fixation matrix row " + r + " must have " + k + " entries");
            }
            double out = 0;
            for (int m = 0; m < k; m++) {
                if (m != r) {
                    double p = fixation[m][r];
                    if (!(p >= 0 && p <= 1)) {
                        throw new IllegalArgumentException("fixation probability of " + m + " among " + r
                            + " must be in [0, 1]: " + p);
                    }
                    t[r][m] = p / (k - 1);
                    out += t[r][m];
                }
            }
            t[r][r] = 1 - out;
        }
        return t;
    }

    /**
     * The rare-mutation abundances of every strategy of a basis.
     *
     * @param basis the payoffs
     * @param population the population
     * @return the abundances (summing to 1)
     */
    public static double[] rareMutation(PayoffBasis basis, Population population) {
        return rareMutation(Fixation.matrix(basis, population));
    }

    /**
     * The exact stationary distribution of the number of A individuals with mutation probability mu.
     *
     * @param basis the payoffs
     * @param population the population
     * @param a the counted strategy
     * @param b the other strategy
     * @param mu in (0, 1]
     * @return pi_0..pi_N
     */
    public static double[] explicitMutation(PayoffBasis basis, Population population, int a, int b, double mu) {
        if (!(mu > 0 && mu <= 1)) {
            throw new IllegalArgumentException("explicit mutation needs a probability in (0, 1]: " + mu);
        }
        return Fixation.chain(basis, population, a, b, mu).stationaryDistribution();
    }

    /**
     * The long-run mean fraction sum_i pi_i i / N of A under explicit mutation.
     *
     * @param basis the payoffs
     * @param population the population
     * @param a the counted strategy
     * @param b the other strategy
     * @param mu in (0, 1]
     * @return the abundance of A
     */
    public static double explicitMutationAbundance(PayoffBasis basis, Population population, int a, int b, double mu) {
        double[] pi = explicitMutation(basis, population, a, b, mu);
        double s = 0;
        for (int i = 0; i < pi.length; i++) {
            s += pi[i] * i;
        }
        return s / (pi.length - 1);
    }

    /** GTH stationary distribution of a row-stochastic matrix. */
    static double[] stationary(double[][] p) {
        int k = p.length;
        double[][] a = new double[k][];
        for (int i = 0; i < k; i++) {
            a[i] = p[i].clone();
        }
        for (int n = k - 1; n > 0; n--) {
            double s = 0;
            for (int j = 0; j < n; j++) {
                s += a[n][j];
            }
            if (!(s > 0)) {
                throw new IllegalArgumentException("the embedded chain is reducible: strategy " + n
                    + " cannot be left (every fixation probability into it from the others is 0)");
            }
            for (int i = 0; i < n; i++) {
                a[i][n] /= s;
            }
            for (int i = 0; i < n; i++) {
                for (int j = 0; j < n; j++) {
                    a[i][j] += a[i][n] * a[n][j];
                }
            }
        }
        double[] pi = new double[k];
        pi[0] = 1;
        double total = 1;
        for (int j = 1; j < k; j++) {
            double v = 0;
            for (int i = 0; i < j; i++) {
                v += pi[i] * a[i][j];
            }
            pi[j] = v;
            total += v;
        }
        for (int j = 0; j < k; j++) {
            pi[j] /= total;
        }
        return pi;
    }
}
