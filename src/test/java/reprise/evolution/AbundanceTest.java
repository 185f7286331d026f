package reprise.evolution;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.LUDecomposition;
import org.apache.commons.math3.linear.RealMatrix;
import org.junit.jupiter.api.Test;
import reprise.game.Population;

/** Rare-mutation and explicit-mutation abundances. */
class AbundanceTest {

    /**
     * Fudenberg &amp; Imhof (2006), Imitation processes with small mutations, J. Econ. Theory 131: the embedded
     * chain T[r][m] = rho[m][r] / (k - 1). Worked by hand for a 3-strategy cycle 0 -> 1 -> 2 -> 0 with
     * rho[1][0] = 0.4, rho[2][1] = 0.2, rho[0][2] = 0.1 (all other fixation probabilities 0): the chain
     * moves 0 -> 1 at rate 0.2, 1 -> 2 at 0.1, 2 -> 0 at 0.05; stationary flow round a cycle is constant,
     * pi_0 0.2 = pi_1 0.1 = pi_2 0.05, so pi = (1, 2, 4) / 7.
     */
    @Test
    void embeddedChainWorkedByHand() {
        double[][] rho = {
            {0, 0, 0.1},
            {0.4, 0, 0},
            {0, 0.2, 0}};
        assertArrayEquals(new double[] {1 / 7.0, 2 / 7.0, 4 / 7.0}, Abundance.rareMutation(rho), 1e-15);
        double[][] t = Abundance.embeddedChain(rho);
        assertArrayEquals(new double[] {0.8, 0.2, 0}, t[0], 1e-15);
        assertArrayEquals(new double[] {0, 0.9, 0.1}, t[1], 1e-15);
        assertArrayEquals(new double[] {0.05, 0, 0.95}, t[2], 1e-15);
    }

    /**
     * A second hand-worked case with two-way flows (k = 3): rho[1][0] = rho[0][1] = 0.2 (0 and 1 exchange at
     * rate 0.1 each way), rho[2][0] = 0.3 (0 -> 2 at 0.15), rho[0][2] = 0.15 (2 -> 0 at 0.075), nothing else.
     * Detailed balance holds: pi_0 = pi_1, pi_2 = 2 pi_0, so pi = (1, 1, 2) / 4.
     */
    @Test
    void embeddedChainWithReversibleFlows() {
        double[][] rho = {
            {0, 0.2, 0.15},
            {0.2, 0, 0},
            {0.3, 0, 0}};
        assertArrayEquals(new double[] {0.25, 0.25, 0.5}, Abundance.rareMutation(rho), 1e-15);
    }

    /**
     * The explicit-mutation stationary distribution against a general linear solve of pi P = pi, sum pi = 1
     * (Commons Math LU on the full (N + 1) x (N + 1) matrix: an independent computation).
     */
    @Test
    void explicitMutationMatchesLinearSolve() {
        PayoffBasis m = new PayoffBasis.Matrix(new double[][] {{3, 0}, {5, 1}});
        for (Population p : new Population[] {Population.pairwise(12, 0.5),
            Population.moran(9, 0.3, Population.Fitness.LINEAR), Population.moran(9, 0.3, Population.Fitness.EXPONENTIAL)
                .withCoPlayers(3)}) {
            BirthDeathChain c = Fixation.chain(m, p, 0, 1, 0.02);
            int n = c.size();
            double[] up = c.up();
            double[] down = c.down();
            RealMatrix a = new Array2DRowRealMatrix(n + 1, n + 1);
            for (int i = 0; i <= n; i++) {
                // Row i of (P^T - I), except the last row, which is replaced by sum pi = 1.
                if (i > 0) {
                    a.addToEntry(i, i - 1, up[i - 1]);
                }
                if (i < n) {
                    a.addToEntry(i, i + 1, down[i + 1]);
                }
                a.addToEntry(i, i, -(up[i] + down[i]));
            }
            double[] rhs = new double[n + 1];
            for (int j = 0; j <= n; j++) {
                a.setEntry(n, j, 1);
            }
            rhs[n] = 1;
            double[] pi = new LUDecomposition(a).getSolver().solve(new ArrayRealVector(rhs)).toArray();
            assertArrayEquals(pi, Abundance.explicitMutation(m, p, 0, 1, 0.02), 1e-12);
        }
    }

    /**
     * Fudenberg &amp; Imhof (2006): as mu -&gt; 0 the stationary distribution concentrates on the homogeneous
     * states, with pi_N / pi_0 -&gt; rho_A / rho_B (both states are left at rate mu times the fixation
     * probability). Checked at mu = 1e-8, where the remainder is O(mu N) relative.
     */
    @Test
    void smallMutationLimitIsTheEmbeddedChain() {
        PayoffBasis m = new PayoffBasis.Matrix(new double[][] {{3, 0}, {5, 1}});
        for (Population p : new Population[] {Population.pairwise(20, 0.2),
            Population.moran(15, 0.1, Population.Fitness.LINEAR)}) {
            double[] pi = Abundance.explicitMutation(m, p, 0, 1, 1e-8);
            double rhoA = Fixation.probability(m, p, 0, 1).probability();
            double rhoB = Fixation.probability(m, p, 1, 0).probability();
            assertEquals(rhoA / rhoB, pi[p.size()] / pi[0], 1e-5 * rhoA / rhoB);
            double[] rare = Abundance.rareMutation(Fixation.matrix(m, p));
            assertEquals(rare[0], Abundance.explicitMutationAbundance(m, p, 0, 1, 1e-8), 1e-5);
        }
    }

    /**
     * The mean conditional fixation time of one neutral mutant in the Moran process is N (N - 1) steps when
     * the offspring replaces any individual, its parent included (Antal &amp; Scheuring 2006, Bull. Math.
     * Biol. 68, neutral case). Here the offspring replaces one of the other N - 1, which multiplies every
     * probability of change by N / (N - 1) and leaves the embedded jump chain unchanged, so the time is
     * N (N - 1) (N - 1) / N = (N - 1)^2 (for N = 2: one step, checked by hand).
     */
    @Test
    void neutralConditionalFixationTime() {
        PayoffBasis m = new PayoffBasis.Matrix(new double[][] {{1, 1}, {1, 1}});
        for (int n : new int[] {2, 5, 40}) {
            BirthDeathChain c = Fixation.probability(m, Population.moran(n, 0.5, Population.Fitness.LINEAR), 0, 1).chain();
            assertEquals((n - 1.0) * (n - 1.0), c.conditionalFixationTime(), 1e-9 * n * n);
        }
    }
}
