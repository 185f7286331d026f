package reprise.stats;

/**
 * The mean of a function of the state along one long chain, with a standard error that accounts for
 * autocorrelation: by non-overlapping batch means, or from a supplied exact asymptotic variance.
 *
 * <p><b>Batch rule.</b> For n values, batch size b = floor(sqrt(n)) and a = floor(n / b) batches made
 * of the first a b values (the last n - a b &lt; b values enter the mean but no batch). With batch means
 * Y_1..Y_a and their average Ybar, sigma^2 is estimated by b / (a - 1) sum_k (Y_k - Ybar)^2; the
 * estimate is the mean of all n values with standard error sqrt(sigma^2 / n) and a - 1 degrees of
 * freedom (Student t reference). b = floor(sqrt(n)) is the choice studied by Flegal &amp; Jones (2010),
 * under whose conditions (geometric ergodicity and moments; every finite irreducible chain qualifies)
 * the estimator is consistent. Needs n &ge; 4.
 *
 * <p><b>Exact route.</b> With sigma^2 = lim Var(sum_t f(S_t)) / n from the exact engine (Kemeny &amp;
 * Snell's fundamental matrix), the interval is mean &plusmn; z sqrt(sigma^2 / n).
 *
 * <p>References:
 * <ul>
 *   <li>Flegal, J.M. &amp; Jones, G.L. (2010). Batch means and spectral variance estimators in Markov chain
 *       Monte Carlo. Annals of Statistics 38(2), 1034-1070.</li>
 *   <li>Kemeny, J.G. &amp; Snell, J.L. (1960). Finite Markov Chains. Van Nostrand, ch. 4.</li>
 * </ul>
 */
public final class BatchMeans {

    private BatchMeans() {
    }

    /**
     * The batch-means estimate for a sequence of values f(S_1), ..., f(S_n) of one chain.
     *
     * @param values the values in time order, n &ge; 4, finite
     * @return mean, standard error, a - 1 degrees of freedom, a replicates (batches)
     */
    public static Estimate estimate(double[] values) {
        if (values == null || values.length < 4) {
            throw new IllegalArgumentException("batch means need at least 4 values: "
                + (values == null ? "none" : values.length));
        }
        int n = values.length;
        int b = (int) Math.floor(Math.sqrt(n));
        int a = n / b;
        double total = 0;
        for (int t = 0; t < n; t++) {
            total += Checks.finite("value " + t, values[t]);
        }
        double mean = total / n;
        double[] batch = new double[a];
        double batchTotal = 0;
        for (int k = 0; k < a; k++) {
            double s = 0;
            for (int t = k * b; t < (k + 1) * b; t++) {
                s += values[t];
            }
            batch[k] = s / b;
            batchTotal += batch[k];
        }
        double batchMean = batchTotal / a;
        double ss = 0;
        for (double y : batch) {
            ss += (y - batchMean) * (y - batchMean);
        }
        double sigma2 = b * ss / (a - 1);
        return new Estimate(mean, Math.sqrt(sigma2 / n), a - 1, a);
    }

    /**
     * The batch-means estimate for f evaluated along a state sequence.
     *
     * @param states the state indices S_1..S_n in time order (0..m-1; CC, CD, DC, DD for m = 4)
     * @param f the function value of each state, f[s]
     * @return the estimate of the mean of f(S_t)
     */
    public static Estimate estimate(int[] states, double[] f) {
        double[] w = Checks.finiteVector("function of the state", f, -1);
        if (states == null) {
            throw new IllegalArgumentException("state sequence must not be null");
        }
        double[] v = new double[states.length];
        for (int t = 0; t < states.length; t++) {
            if (states[t] < 0 || states[t] >= w.length) {
                throw new IllegalArgumentException("state at position " + t + " must be in [0, " + w.length + "): "
                    + states[t]);
            }
            v[t] = w[states[t]];
        }
        return estimate(v);
    }

    /**
     * The estimate with a known asymptotic variance: standard error sqrt(sigma^2 / n), normal reference.
     *
     * @param mean the observed mean over the chain
     * @param asymptoticVariance sigma^2 = lim Var(sum_t f(S_t)) / n, &ge; 0
     * @param rounds n, at least 1
     * @return the estimate (infinite degrees of freedom)
     */
    public static Estimate fromAsymptoticVariance(double mean, double asymptoticVariance, long rounds) {
        Checks.nonNegative("asymptotic variance", asymptoticVariance);
        if (rounds < 1) {
            throw new IllegalArgumentException("number of rounds must be at least 1: " + rounds);
        }
        return new Estimate(mean, Math.sqrt(asymptoticVariance / rounds), Double.POSITIVE_INFINITY, rounds);
    }
}
