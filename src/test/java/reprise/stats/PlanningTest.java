package reprise.stats;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.stream.Stream;
import org.apache.commons.statistics.distribution.NormalDistribution;
import org.apache.commons.statistics.distribution.TDistribution;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/** Planning: inverse checks (the planned size achieves the target, one less does not) and the noncentral chi-square. */
class PlanningTest {

    static final NormalDistribution Z = NormalDistribution.of(0, 1);

    @ParameterizedTest(name = "variance {0}, half-width {1}")
    @MethodSource("halfWidths")
    void plannedGamesGiveTheTargetHalfWidth(double variance, double halfWidth) {
        long g = Planning.gamesForHalfWidth(variance, halfWidth, 0.95);
        double at = TDistribution.of(g - 1).inverseSurvivalProbability(0.025) * Math.sqrt(variance / g);
        double before = TDistribution.of(g - 2).inverseSurvivalProbability(0.025) * Math.sqrt(variance / (g - 1));
        assertTrue(at <= halfWidth, "G = " + g + " gives " + at);
        assertTrue(g == 2 || before > halfWidth, "G - 1 already gives " + before);
        // The achieved interval of an Estimate with that per-game variance has that half-width.
        Interval i = new Estimate(0, Math.sqrt(variance / g), g - 1, g).interval(0.95);
        assertEquals(at, i.halfWidth(), 1e-12 * at);
    }

    static Stream<Arguments> halfWidths() {
        return Stream.of(Arguments.of(0.25, 0.05), Arguments.of(0.25, 0.3), Arguments.of(4.165689465, 0.1),
            Arguments.of(1e-4, 1e-3));
    }

    @Test
    void gamesToDetectOneMean() {
        // Inverse check with the normal approximation the formula assumes: power Phi(delta sqrt(G)/sigma - z).
        double sigma2 = 0.2;
        double delta = 0.03;
        long g = Planning.gamesToDetect(sigma2, delta, 0.05, 0.8);
        double za = Z.inverseSurvivalProbability(0.025);
        double powerAt = Z.cumulativeProbability(delta * Math.sqrt(g / sigma2) - za);
        double powerBefore = Z.cumulativeProbability(delta * Math.sqrt((g - 1) / sigma2) - za);
        assertTrue(powerAt >= 0.8 && powerBefore < 0.8, g + ": " + powerAt + ", " + powerBefore);
        // By hand: ((1.959964 + 0.841621)^2 * 0.2 / 0.0009) = 1744.2 -> 1745.
        assertEquals(1745, g);
    }

    @Test
    void waldPlanningInverseCheck() {
        double[][] sigma = Chains.covariance(WaldHotellingTest.MOMENTS);
        double[] delta = {0.2, -0.1, -0.05, -0.05};
        long g = Planning.gamesToDetect(sigma, delta, 0.05, 0.9);
        assertTrue(Planning.waldPower(sigma, delta, g, 0.05) >= 0.9);
        assertTrue(Planning.waldPower(sigma, delta, g - 1, 0.05) < 0.9);
        // A deviation that breaks the fixed sum is seen by a single game.
        assertEquals(1, Planning.gamesToDetect(sigma, new double[] {0.2, 0, 0, 0}, 0.05, 0.9));
    }

    static Stream<Arguments> noncentral() {
        // Computed independently with SciPy 1.17.1, scipy.stats.ncx2.sf(x, df, nc).
        return Stream.of(
            Arguments.of(3.0, 1, 2.0, 0.3761310507217903),
            Arguments.of(10.0, 3, 5.0, 0.29335135222254816),
            Arguments.of(7.814727903, 3, 10.0, 0.7610630637515017),
            Arguments.of(21.0, 12, 30.0, 0.9771384181898053),
            Arguments.of(50.0, 4, 0.5, 2.9550858872044497e-09));
    }

    @ParameterizedTest(name = "x {0}, df {1}, lambda {2}")
    @MethodSource("noncentral")
    void noncentralChiSquaredSurvival(double x, int df, double lambda, double expected) {
        // 1e-10 relative: both are series of library-accurate terms; SciPy's own accuracy is about 1e-12.
        assertEquals(expected, Planning.noncentralChiSquaredSurvival(x, df, lambda), 1e-10 * expected);
    }

    @Test
    void noncentralWithOneDegreeIsAShiftedNormal() {
        // From the definition: chi2'_1(lambda) = (Z + sqrt(lambda))^2, so
        // P(> x) = Phi(-sqrt(x) - sqrt(lambda)) + Phi(sqrt(lambda) - sqrt(x)).
        for (double lambda : new double[] {0.3, 4, 40, 400}) {
            double x = 5;
            double exact = Z.cumulativeProbability(-Math.sqrt(x) - Math.sqrt(lambda))
                + Z.survivalProbability(Math.sqrt(x) - Math.sqrt(lambda));
            assertEquals(exact, Planning.noncentralChiSquaredSurvival(x, 1, lambda), 1e-12, "lambda " + lambda);
        }
    }

    @Test
    void roundsForOneLongChain() {
        // REFERENCES item 7: sigma^2 of X's payoff = 4.165689465; half-width 0.01 at 95%:
        // n = ceil(1.959964^2 * 4.165689465 / 1e-4) = ceil(160023.4...) computed by hand.
        long n = Planning.roundsForHalfWidth(4.165689465, 0.01, 0.95);
        double z = Z.inverseSurvivalProbability(0.025);
        assertTrue(z * Math.sqrt(4.165689465 / n) <= 0.01);
        assertTrue(z * Math.sqrt(4.165689465 / (n - 1)) > 0.01);
        Interval i = BatchMeans.fromAsymptoticVariance(2.087660148, 4.165689465, n).interval(0.95);
        assertTrue(i.halfWidth() <= 0.01);
    }

    @Test
    void badInputs() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
            () -> Planning.gamesForHalfWidth(0, 0.1, 0.95));
        assertEquals("per-game variance must be a finite number > 0: 0.0", e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> Planning.gamesToDetect(1, 0, 0.05, 0.8));
        assertThrows(IllegalArgumentException.class, () -> Planning.noncentralChiSquaredSurvival(1, 1, -1));
    }
}
