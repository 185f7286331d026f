package reprise.evolution;

/**
 * A birth-death chain on the number i = 0..N of individuals of one strategy: from i it moves to i + 1
 * with probability up[i], to i - 1 with probability down[i], and stays otherwise.
 *
 * <p><b>Fixation.</b> Without mutation (up[0] = down[N] = 0) the chain is absorbed at 0 or N. Starting
 * from j, it is absorbed at N with probability
 * rho_j = sum_{k=0}^{j-1} prod_{l=1}^{k} gamma_l / sum_{k=0}^{N-1} prod_{l=1}^{k} gamma_l, with
 * gamma_l = down[l] / up[l] (Karlin &amp; Taylor 1975; Nowak 2006, ch. 6). An interior up[l] = 0 makes
 * the products infinite from l on and rho_j = 0 for j &le; l.
 *
 * <p><b>Stationary distribution.</b> With up[i] &gt; 0 for i &lt; N and down[i] &gt; 0 for i &gt; 0 the
 * chain is irreducible and reversible; pi_{i+1} / pi_i = up[i] / down[i + 1].
 *
 * <p>Implementation note. Products are summed as logarithms and the sums formed by log-sum-exp, so
 * ratios far beyond the double range (strong selection in large populations) neither overflow nor
 * underflow; the relative error is a few units of 2^-53 times N.
 *
 * <p>References:
 * <ul>
 *   <li>Karlin, S. &amp; Taylor, H.M. (1975). A First Course in Stochastic Processes, 2nd ed. Academic
 *       Press, ch. 4.</li>
 *   <li>Nowak, M.A. (2006). Evolutionary Dynamics. Harvard University Press, ch. 6.</li>
 * </ul>
 *
 * @param up up[i] = P(i to i + 1), i = 0..N, up[N] = 0
 * @param down down[i] = P(i to i - 1), i = 0..N, down[0] = 0
 */
public record BirthDeathChain(double[] up, double[] down) {

    /**
     * Validates and copies the probabilities.
     *
     * @param up N + 1 probabilities, up[N] = 0
     * @param down N + 1 probabilities, down[0] = 0, up[i] + down[i] &le; 1
     */
    public BirthDeathChain {
        if (up == null || down == null || up.length != down.length || up.length < 3) {
            throw new IllegalArgumentException("a birth-death chain needs N + 1 >= 3 up and down probabilities");
        }
        up = up.clone();
        down = down.clone();
        int n = up.length - 1;
        for (int i = 0; i <= n; i++) {
            if (!(up[i] >= 0 && down[i] >= 0 && up[i] + down[i] <= 1 + 1e-12)) {
                throw new IllegalArgumentException("transition probabilities at i = " + i + " must be >= 0 with sum <= 1: up "
                    + up[i] + ", down " + down[i]);
            }
        }
        if (up[n] != 0 || down[0] != 0) {
            throw new IllegalArgumentException("the chain cannot leave 0..N: up[N] = " + up[n] + ", down[0] = " + down[0]);
        }
    }

    /** @return N, the largest state */
    public int size() {
        return up.length - 1;
    }

    /** @return up (a copy) */
    @Override
    public double[] up() {
        return up.clone();
    }

    /** @return down (a copy) */
    @Override
    public double[] down() {
        return down.clone();
    }

    /**
     * The probability of absorption at N from state 1 (fixation of one mutant).
     *
     * @return rho_1 in [0, 1]
     * @throws IllegalArgumentException if the chain has mutation (up[0] &gt; 0 or down[N] &gt; 0)
     */
    public double fixationProbability() {
        return fixationProbability(1);
    }

    /**
     * The probability of absorption at N from state j.
     *
     * @param j the start, 0 to N
     * @return rho_j
     */
    public double fixationProbability(int j) {
        int n = size();
        if (up[0] != 0 || down[n] != 0) {
            throw new IllegalArgumentException("fixation needs absorbing ends 0 and N (no mutation)");
        }
        if (j < 0 || j > n) {
            throw new IllegalArgumentException("start must be 0 to " + n + ": " + j);
        }
        double[] s = logPartialProducts();
        return Math.exp(logSumExp(s, 0, j) - logSumExp(s, 0, n));
    }

    /**
     * log of prod_{l=1}^{k} gamma_l for k = 0..N-1 (+infinity once some up[l] = 0).
     */
    double[] logPartialProducts() {
        int n = size();
        double[] s = new double[n];
        for (int k = 1; k < n; k++) {
            s[k] = s[k - 1] + (Math.log(down[k]) - Math.log(up[k]));
            if (Double.isNaN(s[k])) {
                s[k] = Double.POSITIVE_INFINITY;
            }
        }
        return s;
    }

    /**
     * The stationary distribution of an irreducible chain (with mutation).
     *
     * @return pi_0..pi_N, summing to 1
     * @throws IllegalArgumentException if some up[i] (i &lt; N) or down[i] (i &gt; 0) is 0
     */
    public double[] stationaryDistribution() {
        int n = size();
        double[] log = new double[n + 1];
        for (int i = 0; i < n; i++) {
            if (!(up[i] > 0 && down[i + 1] > 0)) {
                throw new IllegalArgumentException("the chain is not irreducible between " + i + " and " + (i + 1)
                    + " (a mutation rate above 0 is needed)");
            }
            log[i + 1] = log[i] + Math.log(up[i]) - Math.log(down[i + 1]);
        }
        double z = logSumExp(log, 0, n + 1);
        double[] pi = new double[n + 1];
        for (int i = 0; i <= n; i++) {
            pi[i] = Math.exp(log[i] - z);
        }
        return pi;
    }

    /**
     * The expected number of steps until absorption, conditional on absorption at N, from state 1.
     *
     * <p>With rho_j the fixation probability from j and the chain conditioned on fixation (a Doob
     * h-transform, up'_i = up_i rho_{i+1} / rho_i, down'_i = down_i rho_{i-1} / rho_i), the expected time
     * t_i solves t_i = 1 + up'_i t_{i+1} + down'_i t_{i-1} + (1 - up_i - down_i) t_i, t_N = 0; solved by
     * the standard forward recursion for birth-death chains (Antal &amp; Scheuring 2006).
     *
     * <p>References: Antal, T. &amp; Scheuring, I. (2006). Fixation of strategies for an evolutionary game
     * in finite populations. Bulletin of Mathematical Biology 68, 1923-1944.
     *
     * @return the conditional mean number of steps, or NaN if fixation from 1 is impossible
     */
    public double conditionalFixationTime() {
        int n = size();
        double[] rho = new double[n + 1];
        for (int j = 0; j <= n; j++) {
            rho[j] = fixationProbability(j);
        }
        if (!(rho[1] > 0)) {
            return Double.NaN;
        }
        // Conditioned chain: from 1 it never goes to 0. Let x_i = expected steps to go from i to i + 1
        // in the conditioned chain: x_1 = 1 / up'_1, x_i = (1 + down'_i x_{i-1}) / up'_i.
        double total = 0;
        double previous = 0;
        for (int i = 1; i < n; i++) {
            double upC = up[i] * rho[i + 1] / rho[i];
            double downC = i > 1 ? down[i] * rho[i - 1] / rho[i] : 0;
            double x = (1 + downC * previous) / upC;
            total += x;
            previous = x;
        }
        return total;
    }

    static double logSumExp(double[] v, int from, int to) {
        double max = Double.NEGATIVE_INFINITY;
        for (int i = from; i < to; i++) {
            max = Math.max(max, v[i]);
        }
        if (max == Double.POSITIVE_INFINITY || max == Double.NEGATIVE_INFINITY) {
            return max;
        }
        double sum = 0;
        for (int i = from; i < to; i++) {
            sum += Math.exp(v[i] - max);
        }
        return max + Math.log(sum);
    }
}
