package reprise.game;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.stream.Stream;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.junit.jupiter.api.Test;

class StrategyDescriptionTest {

    private static final StageGame PD = StageGame.DEFAULT;

    /**
     * Press &amp; Dyson (2012), Iterated Prisoner's Dilemma contains strategies that dominate any evolutionary
     * opponent, PNAS 109(26): with 5,3,1,0, chi = 3 and phi = 1/26 the extortioner is (11/13, 1/2, 7/26, 0) and
     * the largest allowed phi is 1/13 (values as recomputed in the team's reference list, section 4).
     */
    @Test
    void extortionerShowsItsTableFirstMoveAndPhiRange() {
        StrategyDescription d = StrategyDescription.of("extort:chi=3,phi=1/26", PD, Player.X);
        assertEquals("zero-determinant", d.kind());
        assertArrayEquals(new double[] {11.0 / 13, 0.5, 7.0 / 26, 0}, d.table(), 1e-15);
        assertEquals(0, d.firstMove());
        ZeroDeterminant.Parameters z = d.zeroDeterminant();
        assertEquals("extortionate", z.family());
        assertEquals(3, z.chi());
        assertTrue(Double.isNaN(z.score()));
        assertEquals(1.0 / 26, z.phi(), 1e-15);
        assertEquals(0, z.phiLow());
        assertEquals(1.0 / 13, z.phiHigh(), 1e-15);
        assertEquals(1, z.delta());
    }

    /** The default phi is half the largest (documented in Strategies); here 1/26, which gives the table above. */
    @Test
    void defaultPhiIsResolvedAndShown() {
        StrategyDescription d = StrategyDescription.of("extort:chi=3", PD, Player.Y);
        assertEquals(1.0 / 26, d.zeroDeterminant().phi(), 1e-15);
        assertArrayEquals(new double[] {11.0 / 13, 0.5, 7.0 / 26, 0}, d.table(), 1e-15);
        assertTrue(d.describe().contains("phi=0.03846153846"), d.describe());
    }

    /** The first move each constructor and named strategy uses (the README's table states the same). */
    static Stream<Arguments> firstMoves() {
        return Stream.of(Arguments.of("allc", 1.0), Arguments.of("alld", 0.0), Arguments.of("tft", 1.0),
            Arguments.of("stft", 0.0), Arguments.of("gtft", 1.0), Arguments.of("wsls", 1.0),
            Arguments.of("grim", 1.0), Arguments.of("tf2t", 1.0), Arguments.of("random", 0.5),
            Arguments.of("reactive:0.9,0.2", 1.0), Arguments.of("reactive:0.9,0.2@0.3", 0.3),
            Arguments.of("extort:chi=2", 0.0), Arguments.of("extort:chi=2,delta=0.9", 0.0),
            Arguments.of("generous:chi=2", 1.0), Arguments.of("equalizer:score=2", 1.0),
            Arguments.of("equalizer:score=2,delta=0.95,p0=0.5", 0.5));
    }

    @ParameterizedTest
    @MethodSource("firstMoves")
    void firstMove(String spec, double expected) {
        assertEquals(expected, StrategyDescription.of(spec, PD, Player.X).firstMove(), spec);
    }

    /**
     * Equalizer for 5,3,1,0 fixing the co-player at 2 (Press &amp; Dyson 2012 eqs. 8-9 as recomputed in the
     * reference list): the published vector (2/3, 0, 2/3, 1/3) is p_Rep + phi (2 - S_c) with phi = 1/3, the
     * top of the allowed range (0, 1/3]; the default phi is the midpoint 1/6, giving (5/6, 1/2, 1/3, 1/6).
     */
    @Test
    void equalizerRange() {
        StrategyDescription d = StrategyDescription.of("equalizer:score=2", PD, Player.X);
        assertEquals(1.0 / 3, d.zeroDeterminant().phiHigh(), 1e-15);
        assertEquals(2, d.zeroDeterminant().score());
        assertArrayEquals(new double[] {5.0 / 6, 0.5, 1.0 / 3, 1.0 / 6}, d.table(), 1e-15);
        assertArrayEquals(new double[] {2.0 / 3, 0, 2.0 / 3, 1.0 / 3},
            StrategyDescription.of("equalizer:score=2,phi=1/3", PD, Player.X).table(), 1e-15);
    }

    @Test
    void tablesAndAgents() {
        StrategyDescription t = StrategyDescription.of("tf2t", PD, Player.X);
        assertEquals(2, t.memory());
        assertEquals(16, t.table().length);
        assertNull(t.zeroDeterminant());
        StrategyDescription a = StrategyDescription.of("agent:runcap,2", PD, Player.X);
        assertEquals("agent", a.kind());
        assertTrue(Double.isNaN(a.firstMove()));
    }

    @Test
    void outOfRangePhiFailsAsTheConstructorDoes() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
            () -> StrategyDescription.of("extort:chi=3,phi=0.5", PD, Player.X));
        assertTrue(e.getMessage().startsWith("phi must be in (0, 0.0769"), e.getMessage());
    }
}
