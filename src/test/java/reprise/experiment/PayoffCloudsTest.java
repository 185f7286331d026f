package reprise.experiment;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import java.util.List;
import org.junit.jupiter.api.Test;
import reprise.game.Horizon;
import reprise.game.Noise;
import reprise.game.StageGame;

/**
 * The simulated per-game payoffs of the payoff-plane figure, against the exact engine (an independent
 * implementation: the simulator enacts each round, the chain engine sums matrix powers).
 */
class PayoffCloudsTest {

    private static final StageGame PD = StageGame.parse("3,0,5,1");
    private static final Noise NOISE = new Noise(0.02, 0.02, 0, 0);
    private static final List<String> CO = List.of("tft", "allc");
    private static final List<Horizon> LENGTHS = Arrays.asList(null, Horizon.rounds(10), Horizon.continuation(0.9));

    /**
     * Each cloud's mean payoff per round matches the exact expectation for its length (for a continuation
     * probability, the exact expectation of the ratio of sums is what the chain gives; a single game's
     * payoff per round has the same mean only approximately, so only fixed lengths are compared). 2 co-players
     * x 2 players, |z| &lt; 4.5 with 2000 games each: false-failure probability at most 4 x 6.8e-6 (normal
     * approximation of a mean of 2000 bounded values; common practice, no source).
     */
    @Test
    void cloudMeansMatchTheExactPayoffs() {
        PayoffPlane exact = PayoffPlane.of(PD, "extort:chi=3", CO, NOISE, LENGTHS);
        PayoffClouds clouds = PayoffClouds.play(PD, "extort:chi=3", CO, NOISE, LENGTHS, 2000, 7);
        assertEquals(List.of(Horizon.rounds(10), Horizon.continuation(0.9)), clouds.lengths());
        for (int j = 0; j < CO.size(); j++) {
            assertWithin(clouds.payoffX()[0][j], exact.payoffX()[1][j], "pi_X vs " + CO.get(j));
            assertWithin(clouds.payoffY()[0][j], exact.payoffY()[1][j], "pi_Y vs " + CO.get(j));
        }
    }

    private static void assertWithin(double[] values, double expected, String what) {
        double mean = Arrays.stream(values).average().orElseThrow();
        double var = Arrays.stream(values).map(v -> (v - mean) * (v - mean)).sum() / (values.length - 1);
        double z = (mean - expected) / Math.sqrt(var / values.length);
        assertTrue(Math.abs(z) < 4.5, what + ": mean " + mean + ", exact " + expected + ", z = " + z);
    }

    @Test
    void everyGameIsInsideTheStagePayoffRangeAndTheSeedFixesTheClouds() {
        PayoffClouds a = PayoffClouds.play(PD, "extort:chi=2", CO, NOISE, LENGTHS, 50, 3);
        PayoffClouds b = PayoffClouds.play(PD, "extort:chi=2", CO, NOISE, LENGTHS, 50, 3);
        PayoffClouds c = PayoffClouds.play(PD, "extort:chi=2", CO, NOISE, LENGTHS, 50, 4);
        for (int k = 0; k < 2; k++) {
            for (int j = 0; j < 2; j++) {
                assertArrayEquals(a.payoffX()[k][j], b.payoffX()[k][j]);
                assertFalse(Arrays.equals(a.payoffX()[k][j], c.payoffX()[k][j]));
                for (int g = 0; g < 50; g++) {
                    double x = a.payoffX()[k][j][g];
                    double y = a.payoffY()[k][j][g];
                    // a game's payoff per round is a convex combination of the stage payoffs (3,3), (0,5), (5,0), (1,1)
                    assertTrue(x >= 0 && x <= 5 && y >= 0 && y <= 5 && x + y <= 6 + 1e-12, x + ", " + y);
                }
            }
        }
    }

    @Test
    void theNumberOfGamesIsBounded() {
        assertThrows(IllegalArgumentException.class,
            () -> PayoffClouds.play(PD, "extort:chi=2", CO, NOISE, LENGTHS, 0, 1));
        assertThrows(IllegalArgumentException.class,
            () -> PayoffClouds.play(PD, "extort:chi=2", CO, NOISE, LENGTHS, PayoffClouds.MOST_GAMES + 1, 1));
    }
}
