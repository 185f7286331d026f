package reprise.stats;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;

/** The regime diagnosis: hand-worked values (common practice, no source beyond the moment definitions). */
class RegimeTest {

    @Test
    void modalProbabilityAndSkewnessOfAHandWorkedSample() {
        // Per-game CC frequencies 1, 1, 1, 0.5 (4 games of 2 rounds): modal value 1 in 3 of 4 games. Mean 0.875,
        // deviations 0.125 (x3), -0.375: m2 = 0.046875, m3 = -0.0390625, skewness m3 / m2^1.5 = -1.1547 (-2/sqrt 3).
        long[][] g = {{2, 0, 0, 0}, {2, 0, 0, 0}, {2, 0, 0, 0}, {1, 1, 0, 0}};
        Regime r = Regime.fromModelGames(g, new double[] {1, 0, 0, 0}, 100);
        assertEquals(0.75, r.modalProbability(), 0);
        assertEquals(25, r.informativeGames(), 1e-12);
        assertEquals(-2 / Math.sqrt(3), r.skewness(), 1e-12);
        // Expected counts over 100 games: 100 * (7/4, 1/4, 0, 0).
        assertEquals(175, r.expectedStateCounts()[0], 1e-12);
        assertEquals(25, r.expectedStateCounts()[1], 1e-12);
        // gamma^2 / G = (4/3) / 100 = 0.0133 <= 0.02 with 25 informative games: ordinary; with 60 games
        // gamma^2 / G = 0.022 and 15 informative games: sparse; 1000 games of a skewness-10 value: skewed.
        assertEquals(Regime.Kind.ORDINARY, r.kind());
        assertEquals(Regime.Kind.SPARSE, Regime.fromModelGames(g, new double[] {1, 0, 0, 0}, 60).kind());
        assertEquals(Regime.Kind.SKEWED, new Regime(1000, 0.5, 10, new double[4]).kind());
        Regime exact = Regime.fromModelGames(g, new double[] {1, 0, 0, 0}, 100, new double[] {1.9, 0.1, 0, 0});
        assertEquals(190, exact.expectedStateCounts()[0], 1e-12);
        assertEquals(r.skewness(), exact.skewness(), 0);
    }

    @Test
    void warningsFollowTheRareStateRuleOfCalibrate() {
        Regime r = new Regime(50, 0.97, 7.6, new double[] {1900, 30, 30, 12.5});
        List<String> w = r.warnings();
        assertEquals(2, w.size());
        assertEquals("state DD: expected 12.5 tallied rounds over the games (below 20); tests that involve it rest on "
            + "a poor normal approximation, use more games", w.get(0));
        assertTrue(w.get(1).startsWith("only 1.50 of 50 games are expected to differ"), w.get(1));
        assertEquals("sparse: 1.50 informative games of 50, skewness 7.60", r.describe());
        // A state the model never visits (expected 0) is not "rare": it is impossible, and other tests say so.
        assertEquals(List.of(), Regime.sparseStateWarnings(new double[] {100, 20, 20, 0}));
    }
}
