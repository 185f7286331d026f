package reprise.evolution;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import reprise.game.Horizon;
import reprise.game.Noise;
import reprise.game.Population;
import reprise.game.StageGame;
import reprise.game.Strategies;
import reprise.game.MemoryStrategy;
import reprise.game.Player;

/** Fixation probabilities against published closed forms. */
class ClosedFormFixationTest {

    static Stream<Arguments> games() {
        // Payoff matrices (a, b, c, d) chosen by hand: a coordination game, a prisoner's dilemma, a
        // snowdrift and a game with A dominant.
        return Stream.of(
            Arguments.of(3.0, 0.0, 2.0, 1.0),
            Arguments.of(3.0, 0.0, 5.0, 1.0),
            Arguments.of(3.0, 1.0, 4.0, 0.0),
            Arguments.of(2.0, 1.5, 1.0, 0.5));
    }

    private static PayoffBasis.Matrix matrix(double a, double b, double c, double d) {
        return new PayoffBasis.Matrix(new double[][] {{a, b}, {c, d}});
    }

    /**
     * Neutral drift: rho = 1/N for both rules when selection is off (Nowak 2006, Evolutionary Dynamics,
     * ch. 6; Moran 1958), with a matrix, with sampled co-players and with realised payoffs.
     */
    @ParameterizedTest
    @MethodSource("games")
    void neutralDriftIsOneOverN(double a, double b, double c, double d) {
        for (int n : new int[] {2, 7, 50}) {
            PayoffBasis m = matrix(a, b, c, d);
            assertEquals(1.0 / n, Fixation.probability(m, Population.pairwise(n, 0), 0, 1).probability(), 1e-13 / n);
            assertEquals(1.0 / n, Fixation.probability(m, Population.moran(n, 0, Population.Fitness.LINEAR), 0, 1)
                .probability(), 1e-13 / n);
            assertEquals(1.0 / n, Fixation.probability(m, Population.moran(n, 0, Population.Fitness.EXPONENTIAL)
                .withCoPlayers(1), 0, 1).probability(), 1e-13 / n);
        }
        StageGame g = StageGame.DEFAULT;
        PayoffBasis.Realised r = new PayoffBasis.Realised(g, List.of(strategy("tft"), strategy("alld")),
            Noise.symmetric(0.05, 0.02), Horizon.rounds(5));
        assertEquals(1.0 / 10, Fixation.probability(r, Population.pairwise(10, 0), 0, 1).probability(), 1e-11);
        assertEquals(1.0 / 10, Fixation.probability(r, Population.moran(10, 0, Population.Fitness.EXPONENTIAL), 0, 1)
            .probability(), 1e-12);
        // Identical strategies at strong selection are neutral too.
        PayoffBasis.Realised same = new PayoffBasis.Realised(g, List.of(strategy("wsls"), strategy("wsls")),
            Noise.symmetric(0.05, 0), Horizon.rounds(4));
        assertEquals(1.0 / 6, Fixation.probability(same, Population.pairwise(6, 2), 0, 1).probability(), 1e-11);
    }

    static MemoryStrategy strategy(String spec) {
        return (MemoryStrategy) Strategies.parse(spec, StageGame.DEFAULT, Player.X);
    }

    /**
     * Traulsen, Nowak &amp; Pacheco (2006), Stochastic dynamics of invasion and fixation, Phys. Rev. E 74,
     * 011909, eq. (8): for the pairwise comparison (Fermi) process T-/T+ = exp(-beta (pi_A - pi_B)) and
     * pi_A(j) - pi_B(j) = u j + v with u = (a - b - c + d)/(N - 1), v = (-a + b N - d N + d)/(N - 1), so
     * rho_A = 1 / (1 + sum_{k=1}^{N-1} exp(-beta (u k (k + 1)/2 + v k))).
     */
    @ParameterizedTest
    @MethodSource("games")
    void pairwiseComparisonMatchesTraulsenClosedForm(double a, double b, double c, double d) {
        for (int n : new int[] {2, 5, 20, 100}) {
            for (double beta : new double[] {0.01, 0.3, 1, 5}) {
                double u = (a - b - c + d) / (n - 1);
                double v = (-a + b * n - d * n + d) / (n - 1);
                double sum = 1;
                for (int k = 1; k < n; k++) {
                    sum += Math.exp(-beta * (u * k * (k + 1) / 2.0 + v * k));
                }
                double expected = 1 / sum;
                double got = Fixation.probability(matrix(a, b, c, d), Population.pairwise(n, beta), 0, 1).probability();
                assertEquals(expected, got, 1e-11 * expected, "N = " + n + ", beta = " + beta);
            }
        }
    }

    /**
     * Nowak, Sasaki, Taylor &amp; Fudenberg (2004), Nature 428, 646-650: rho_A = 1 / (1 + sum_k prod_i g_i/f_i)
     * with f_i = 1 - w + w [a (i - 1) + b (N - i)]/(N - 1), g_i = 1 - w + w [c i + d (N - i - 1)]/(N - 1);
     * evaluated here by direct products (an independent evaluation from the stated formula).
     */
    @ParameterizedTest
    @MethodSource("games")
    void moranMatchesNowakClosedForm(double a, double b, double c, double d) {
        for (int n : new int[] {2, 4, 30}) {
            for (double w : new double[] {0.05, 0.5, 1}) {
                double sum = 1;
                double prod = 1;
                for (int k = 1; k < n; k++) {
                    double f = 1 - w + w * (a * (k - 1) + b * (n - k)) / (n - 1);
                    double g = 1 - w + w * (c * k + d * (n - k - 1)) / (n - 1);
                    prod *= g / f;
                    sum += prod;
                }
                double got = Fixation.probability(matrix(a, b, c, d), Population.moran(n, w, Population.Fitness.LINEAR),
                    0, 1).probability();
                assertEquals(1 / sum, got, 1e-12 / sum, "N = " + n + ", w = " + w);
            }
        }
    }

    /**
     * Nowak et al. (2004), weak selection: rho_A ~ (1/N) / (1 - (alpha N - beta) w / 6) with
     * alpha = a + 2b - c - 2d, beta = 2a + b + c - 4d, so d rho_A / dw at 0 is (alpha N - beta)/(6N).
     * Checked by a symmetric difference at w = 1e-5: negating the payoffs negates the first-order term and
     * leaves an O(w^2) remainder, so a relative tolerance of 1e-4 is ample.
     */
    @ParameterizedTest
    @MethodSource("games")
    void weakSelectionSlope(double a, double b, double c, double d) {
        for (int n : new int[] {3, 10, 60}) {
            double w = 1e-5;
            double up = Fixation.probability(matrix(a, b, c, d), Population.moran(n, w, Population.Fitness.LINEAR),
                0, 1).probability();
            double down = Fixation.probability(matrix(-a, -b, -c, -d), Population.moran(n, w, Population.Fitness.LINEAR),
                0, 1).probability();
            double slope = (up - down) / (2 * w);
            double alpha = a + 2 * b - c - 2 * d;
            double beta = 2 * a + b + c - 4 * d;
            double expected = (alpha * n - beta) / (6.0 * n);
            assertEquals(expected, slope, 1e-4 * Math.max(Math.abs(expected), 0.1 / n), "N = " + n);
        }
    }

    /**
     * The one-third law (Nowak et al. 2004): in a coordination game (a &gt; c, b &lt; d) with large N and
     * weak selection, rho_A &gt; 1/N iff the unstable mixed equilibrium x* = (d - b)/(a - b - c + d) is
     * below 1/3. Cases either side of 1/3 (x* = 0.25 and 0.4), N = 1000, w = 0.001.
     */
    @Test
    void oneThirdLaw() {
        int n = 1000;
        Population p = Population.moran(n, 0.001, Population.Fitness.LINEAR);
        double[][] below = {{4, 1}, {1.5, 2}};   // x* = (2 - 1)/(4 - 1 - 1.5 + 2) = 1/3.5 = 0.2857
        double[][] above = {{4, 1}, {3, 2}};     // x* = (2 - 1)/(4 - 1 - 3 + 2) = 0.5
        assertTrue(Fixation.probability(new PayoffBasis.Matrix(below), p, 0, 1).relativeToNeutral() > 1);
        assertTrue(Fixation.probability(new PayoffBasis.Matrix(above), p, 0, 1).relativeToNeutral() < 1);
        // And the pairwise comparison process obeys the same law under weak selection (Traulsen et al. 2006).
        Population q = Population.pairwise(n, 0.001);
        assertTrue(Fixation.probability(new PayoffBasis.Matrix(below), q, 0, 1).relativeToNeutral() > 1);
        assertTrue(Fixation.probability(new PayoffBasis.Matrix(above), q, 0, 1).relativeToNeutral() < 1);
    }

    /**
     * With m = N - 1 sampled co-players every member is sampled, so the rates equal those of every
     * co-player for the Moran rule (common practice, no source: a consistency check).
     */
    @Test
    void fullSampleIsEveryCoPlayerForMoran() {
        PayoffBasis m = matrix(3, 0, 5, 1);
        for (Population.Fitness f : Population.Fitness.values()) {
            Population all = Population.moran(8, 0.2, f);
            assertEquals(Fixation.probability(m, all, 0, 1).probability(),
                Fixation.probability(m, all.withCoPlayers(7), 0, 1).probability(), 1e-14);
        }
    }
}
