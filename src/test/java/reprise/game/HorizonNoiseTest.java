package reprise.game;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

class HorizonNoiseTest {

    @Test
    void expectedLengths() {
        assertEquals(200, Horizon.rounds(200).expectedLength());
        // Geometric on {1, 2, ...} with P(N > t) = delta^t has mean 1 / (1 - delta) (common practice, no source).
        assertEquals(10, Horizon.continuation(0.9).expectedLength(), 1e-12);
        assertEquals(1, Horizon.continuation(0).expectedLength());
    }

    @ParameterizedTest
    @ValueSource(doubles = {1, -0.1, Double.NaN, 1.5})
    void continuationOutsideTheUnitIntervalIsRefused(double delta) {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> Horizon.continuation(delta));
        assertTrue(e.getMessage().startsWith("continuation probability must be in [0, 1)"), e.getMessage());
    }

    @Test
    void roundsMustBePositive() {
        assertThrows(IllegalArgumentException.class, () -> Horizon.rounds(0));
    }

    @ParameterizedTest
    @ValueSource(doubles = {-0.01, 1.01, Double.NaN, Double.POSITIVE_INFINITY})
    void noiseMustBeAProbability(double e) {
        IllegalArgumentException ex = assertThrows(IllegalArgumentException.class, () -> Noise.symmetric(e, 0));
        assertTrue(ex.getMessage().contains("must be a probability in [0, 1]"), ex.getMessage());
    }

    @Test
    void swappingAMatchSwapsRolesAndMirrorsPayoffs() {
        StageGame g = StageGame.parse("4,0,6,1,3,-1,5,2");
        Match m = new Match(g, Strategies.parse("tft", g, Player.X), Strategies.parse("alld", g, Player.Y),
            new Noise(0.01, 0.02, 0.03, 0.04));
        Match s = m.swapped();
        assertEquals("alld", s.x().label());
        assertEquals(0.02, s.noise().executionX());
        assertEquals(0.04, s.noise().perceptionX());
        assertEquals(g.ownView(Player.Y)[1], s.game().payoffX(1));
        assertEquals(State.DC, State.CD.mirror());
        assertEquals(2, State.mirror(1));
    }
}
