package reprise.experiment;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import reprise.evolution.Fixation;

/**
 * The population experiment's exact side through the experiment layer: file to grid points to the three
 * bases' fixation probabilities and abundances, checked against published closed forms computed here
 * independently of {@code reprise.evolution}.
 */
class PopulationAnalysisTest {

    @TempDir
    Path tmp;

    private PopulationExperiment read(String yaml) throws Exception {
        Path f = tmp.resolve("p.yaml");
        Files.writeString(f, yaml);
        return PopulationFile.read(f);
    }

    /**
     * Pairwise comparison with deterministic payoffs: ALLC and ALLD without errors play the stage game
     * every round, so all three bases are the matrix R = 3, S = 0, T = 5, P = 1, and rho is Traulsen,
     * Nowak &amp; Pacheco (2006), "Stochastic dynamics of invasion and fixation", Phys. Rev. E 74, 011909,
     * Eq. (4): rho_A = 1 / (1 + sum_{k=1}^{N-1} prod_{j=1}^{k} exp(-beta (pi_A(j) - pi_B(j)))) with
     * pi_A(j) = ((j - 1) a + (N - j) b) / (N - 1), pi_B(j) = (j c + (N - j - 1) d) / (N - 1).
     */
    @Test
    void deterministicPayoffsGiveTraulsensClosedFormForEveryBasis() throws Exception {
        PopulationExperiment e = read("experiment: t\npopulation:\n  strategies: [allc, alld]\n  invasions: 0\n"
            + "grid:\n  size: [7]\n  selection: [0.3]\n  rounds: [4]\n");
        PopulationExperiment.Point p = e.points().get(0);
        PopulationAnalysis.PointExact x = PopulationAnalysis.exact(e, p);
        double[][] m = {{3, 0}, {5, 1}};
        for (int mutant = 0; mutant < 2; mutant++) {
            int res = 1 - mutant;
            double expected = traulsen(m[mutant][mutant], m[mutant][res], m[res][mutant], m[res][res], 7, 0.3);
            for (PopulationAnalysis.Basis b : PopulationAnalysis.Basis.values()) {
                assertEquals(expected, x.fixation()[b.ordinal()][mutant][res], 1e-12, b + " mutant " + mutant);
            }
        }
    }

    /**
     * The Moran birth-death rule with linear fitness and deterministic payoffs (ALLC, ALLD, no errors): Nowak,
     * Sasaki, Taylor &amp; Fudenberg (2004), "Emergence of cooperation and evolutionary stability in finite
     * populations", Nature 428, 646-650, Eq. (1): rho_A = 1 / (1 + sum_{k=1}^{N-1} prod_{j=1}^{k} g_j / f_j),
     * f_j = 1 - w + w pi_A(j), g_j = 1 - w + w pi_B(j), with the payoffs of the pairwise test above.
     */
    @Test
    void moranLinearFitnessGivesNowaksClosedFormForEveryBasis() throws Exception {
        PopulationExperiment e = read("experiment: t\npopulation:\n  strategies: [allc, alld]\n  update: moran\n"
            + "  fitness: linear\n  invasions: 0\ngrid:\n  size: [8]\n  selection: [0.2]\n  rounds: [3]\n");
        PopulationAnalysis.PointExact x = PopulationAnalysis.exact(e, e.points().get(0));
        double[][] m = {{3, 0}, {5, 1}};
        int n = 8;
        double w = 0.2;
        for (int mutant = 0; mutant < 2; mutant++) {
            int res = 1 - mutant;
            double sum = 0;
            double prod = 1;
            for (int k = 1; k <= n - 1; k++) {
                double piA = ((k - 1) * m[mutant][mutant] + (n - k) * m[mutant][res]) / (n - 1);
                double piB = (k * m[res][mutant] + (n - k - 1) * m[res][res]) / (n - 1);
                prod *= (1 - w + w * piB) / (1 - w + w * piA);
                sum += prod;
            }
            for (PopulationAnalysis.Basis b : PopulationAnalysis.Basis.values()) {
                assertEquals(1 / (1 + sum), x.fixation()[b.ordinal()][mutant][res], 1e-12, b + " mutant " + mutant);
            }
        }
    }

    private static double traulsen(double a, double b, double c, double d, int n, double beta) {
        double sum = 0;
        double prod = 1;
        for (int k = 1; k <= n - 1; k++) {
            double piA = ((k - 1) * a + (n - k) * b) / (n - 1);
            double piB = (k * c + (n - k - 1) * d) / (n - 1);
            prod *= Math.exp(-beta * (piA - piB));
            sum += prod;
        }
        return 1 / (1 + sum);
    }

    /**
     * Neutral drift: without selection every basis gives rho = 1/N (Moran 1958 / Nowak 2006,
     * "Evolutionary Dynamics", ch. 6), whatever the errors and length; and the rare-mutation abundances are
     * then uniform (the embedded chain of Fudenberg &amp; Imhof 2006 moves to each other strategy with
     * probability 1/N / (k - 1)).
     */
    @Test
    void neutralDriftForEveryBasisAndUniformAbundance() throws Exception {
        PopulationExperiment e = read("experiment: t\npopulation:\n  strategies: [tft, wsls, alld]\n  mutation: rare\n"
            + "  invasions: 0\ngrid:\n  size: [12]\n  selection: [0]\n  noise: [0.05]\n  rounds: [6]\n");
        PopulationAnalysis.PointExact x = PopulationAnalysis.exact(e, e.points().get(0));
        for (PopulationAnalysis.Basis b : PopulationAnalysis.Basis.values()) {
            for (int i = 0; i < 3; i++) {
                assertEquals(1.0 / 3, x.abundance()[b.ordinal()][i], 1e-12, b + " abundance");
                for (int j = 0; j < 3; j++) {
                    if (i != j) {
                        assertEquals(1.0 / 12, x.fixation()[b.ordinal()][i][j], 1e-12, b + " " + i + " in " + j);
                    }
                }
            }
        }
    }

    /**
     * Two strategies, rare mutations: the embedded chain of Fudenberg &amp; Imhof (2006), "Imitation processes
     * with small mutations", J. Econ. Theory 131, 251-262, has stationary abundance of A
     * rho_AB / (rho_AB + rho_BA) (worked by hand for k = 2).
     */
    @Test
    void twoStrategyRareMutationAbundanceIsTheRatioOfFixationProbabilities() throws Exception {
        PopulationExperiment e = read("experiment: t\npopulation:\n  strategies: [tft, alld]\n  mutation: rare\n"
            + "  invasions: 0\ngrid:\n  size: [9]\n  selection: [1]\n  noise: [0.02]\n  rounds: [8]\n");
        PopulationAnalysis.PointExact x = PopulationAnalysis.exact(e, e.points().get(0));
        for (PopulationAnalysis.Basis b : PopulationAnalysis.Basis.values()) {
            double[][] f = x.fixation()[b.ordinal()];
            assertEquals(f[0][1] / (f[0][1] + f[1][0]), x.abundance()[b.ordinal()][0], 1e-12, b.label());
        }
    }

    /**
     * Tit-for-tat with itself without errors has no unique stationary state (its long-run payoff depends on
     * the first moves), so the stationary basis has no prediction; the others do.
     */
    @Test
    void noUniqueStationaryPayoffMeansNoPredictionForBasisA() throws Exception {
        PopulationExperiment e = read("experiment: t\npopulation:\n  strategies: [tft, alld]\n  invasions: 0\n"
            + "grid:\n  size: [5]\n  selection: [1]\n  rounds: [3]\n");
        PopulationAnalysis.PointExact x = PopulationAnalysis.exact(e, e.points().get(0));
        assertNull(x.results()[PopulationAnalysis.Basis.STATIONARY.ordinal()][0][1]);
        PopulationAnalysis.Result r = PopulationAnalysis.analyse(e, List.of(x), Map.of());
        assertEquals(Verdict.NO_PREDICTION.word(), r.rows().get(0).verdict());
        assertEquals(Fixation.Method.EXACT, r.rows().get(2).result().method());
        assertTrue(r.rows().get(2).result().probability() > 0);
    }

    /** The grid expands size-major, horizon fastest, and names each point. */
    @Test
    void gridExpandsInTheDocumentedOrder() throws Exception {
        PopulationExperiment e = read("experiment: t\npopulation:\n  strategies: [tft, alld]\n"
            + "grid:\n  size: [5, 8]\n  selection: [0.5, 2]\n  noise: [0, 0.1]\n  continuation: [0.5, 0.9]\n");
        List<PopulationExperiment.Point> p = e.points();
        assertEquals(16, p.size());
        assertEquals("N=5/selection=0.5/noise=0/continuation=0.5", p.get(0).name());
        assertEquals("N=5/selection=0.5/noise=0/continuation=0.9", p.get(1).name());
        assertEquals("N=8/selection=2/noise=0.1/continuation=0.9", p.get(15).name());
        assertEquals(1000, e.invasions());
        assertEquals(PopulationExperiment.Mutation.NONE, e.mutation());
    }
}
