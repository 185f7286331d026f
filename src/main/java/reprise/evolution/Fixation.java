package reprise.evolution;

import reprise.game.Population;

/**
 * Fixation of one mutant in a resident population, and the population chain it comes from.
 *
 * <p>For a mutant strategy A among residents B, the number i of A individuals is a birth-death chain
 * (one update changes at most one individual); {@link BirthDeathChain} gives its fixation probability.
 * The chain's probabilities come from the update rule of the {@link Population} and a
 * {@link PayoffBasis}: a payoff matrix (bases a and b) or the exact law of realised payoffs of fresh finite
 * games (basis c), which is the exact answer for the process that the simulator plays.
 *
 * <p>Under neutrality (beta = 0 or w = 0, or identical strategies) the probability is 1/N for both rules.
 *
 * <p>References:
 * <ul>
 *   <li>Nowak, M.A., Sasaki, A., Taylor, C. &amp; Fudenberg, D. (2004). Emergence of cooperation and
 *       evolutionary stability in finite populations. Nature 428, 646-650.</li>
 *   <li>Taylor, C., Fudenberg, D., Sasaki, A. &amp; Nowak, M.A. (2004). Evolutionary game dynamics in finite
 *       populations. Bulletin of Mathematical Biology 66, 1621-1644.</li>
 *   <li>Traulsen, A., Nowak, M.A. &amp; Pacheco, J.M. (2006). Stochastic dynamics of invasion and fixation.
 *       Physical Review E 74, 011909.</li>
 * </ul>
 */
public final class Fixation {
    private Fixation() {
    }

    /** How the update probabilities were obtained. */
    public enum Method {
        /** From a deterministic payoff matrix (bases a and b): exact for that matrix. */
        MATRIX,
        /** From the exact law of realised payoffs of fixed-length games (basis c). */
        EXACT,
        /** From the law of realised payoffs of continuation games truncated with a stated error bound. */
        TRUNCATED,
        /** An approximation: payoffs not on a small lattice were rounded to one (stated error bound). */
        ROUNDED
    }

    /**
     * A fixation probability.
     *
     * @param probability rho, the probability that one mutant takes over
     * @param relativeError a first-order bound on |rho_computed / rho - 1| from the update probabilities'
     *     errors (0 for a matrix basis, apart from rounding)
     * @param method how the update probabilities were obtained
     * @param chain the population chain without mutation
     */
    public record Result(double probability, double relativeError, Method method, BirthDeathChain chain) {
        /** @return 1/N, the neutral fixation probability */
        public double neutral() {
            return 1.0 / chain.size();
        }

        /** @return rho N: above 1 when selection favours the mutant */
        public double relativeToNeutral() {
            return probability * chain.size();
        }
    }

    /**
     * The fixation probability of one mutant.
     *
     * @param basis the payoffs
     * @param population the population and update rule
     * @param mutant the mutant's strategy index
     * @param resident the resident's strategy index
     * @return the result
     */
    public static Result probability(PayoffBasis basis, Population population, int mutant, int resident) {
        Rates rates = rates(basis, population, mutant, resident);
        BirthDeathChain chain = rates.chain(0);
        return new Result(chain.fixationProbability(), rates.relativeFixationError(), rates.method(), chain);
    }

    /**
     * The population chain of the number of mutants with mutation probability mu per update (see
     * {@link Rates#chain(double)} for the transition probabilities).
     *
     * @param basis the payoffs
     * @param population the population
     * @param mutant strategy A (counted)
     * @param resident strategy B
     * @param mu in [0, 1]
     * @return the chain on 0..N
     */
    public static BirthDeathChain chain(PayoffBasis basis, Population population, int mutant, int resident, double mu) {
        if (!(mu >= 0 && mu <= 1)) {
            throw new IllegalArgumentException("mutation probability must be in [0, 1]: " + mu);
        }
        return rates(basis, population, mutant, resident).chain(mu);
    }

    /**
     * The k x k matrix of fixation probabilities, entry [m][r] for mutant m in resident r (diagonal 1/N).
     *
     * @param basis the payoffs
     * @param population the population
     * @return the matrix
     */
    public static double[][] matrix(PayoffBasis basis, Population population) {
        int k = basis.strategyCount();
        double[][] rho = new double[k][k];
        for (int m = 0; m < k; m++) {
            for (int r = 0; r < k; r++) {
                rho[m][r] = m == r ? 1.0 / population.size() : probability(basis, population, m, r).probability();
            }
        }
        return rho;
    }

    /**
     * The expected payoff per round of x against y in a fresh finite game (basis b), exactly from the chain.
     *
     * @param basis realised payoffs
     * @param x focal strategy
     * @param y co-player's strategy
     * @return the payoff
     */
    public static double expectedPayoff(PayoffBasis.Realised basis, int x, int y) {
        return RealisedRates.meanPayoff(basis, x, y);
    }

    /**
     * The matrix of expected payoffs of fresh finite games (basis b).
     *
     * @param basis realised payoffs
     * @return basis b as a matrix
     */
    public static PayoffBasis.Matrix expectedPayoffs(PayoffBasis.Realised basis) {
        int k = basis.strategyCount();
        double[][] m = new double[k][k];
        for (int x = 0; x < k; x++) {
            for (int y = 0; y < k; y++) {
                m[x][y] = expectedPayoff(basis, x, y);
            }
        }
        return new PayoffBasis.Matrix(m);
    }

    static Rates rates(PayoffBasis basis, Population population, int mutant, int resident) {
        int k = basis.strategyCount();
        if (mutant < 0 || mutant >= k || resident < 0 || resident >= k) {
            throw new IllegalArgumentException("strategy indexes must be 0 to " + (k - 1) + ": mutant " + mutant
                + ", resident " + resident);
        }
        if (basis instanceof PayoffBasis.Matrix m) {
            return MatrixRates.of(m, population, mutant, resident);
        }
        return RealisedRates.of((PayoffBasis.Realised) basis, population, mutant, resident);
    }
}
