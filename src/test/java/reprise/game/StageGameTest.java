package reprise.game;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

class StageGameTest {

    @Test
    void symmetricGameMirrorsYsPayoffs() {
        StageGame g = StageGame.parse("3,0,5,1");
        assertArrayEquals(new double[] {3, 0, 5, 1}, g.payoffX());
        // Y's payoffs in X's order CC, CD, DC, DD: in CD (X cooperates, Y defects) Y gets T.
        assertArrayEquals(new double[] {3, 5, 0, 1}, g.payoffY());
        assertArrayEquals(new double[] {3, 0, 5, 1}, g.ownView(Player.Y));
        assertTrue(g.isSymmetric());
    }

    @Test
    void asymmetricGameTakesEachPlayersOwnView() {
        StageGame g = StageGame.parse("4,0,6,1,3,-1,5,2");
        assertArrayEquals(new double[] {4, 0, 6, 1}, g.payoffX());
        assertArrayEquals(new double[] {3, 5, -1, 2}, g.payoffY());
        assertArrayEquals(new double[] {3, -1, 5, 2}, g.ownView(Player.Y));
        assertArrayEquals(new double[] {4, 6, 0, 1}, g.coPlayerInView(Player.Y));
    }

    static Stream<Arguments> presets() {
        // Textbook definitions (common practice, no source): donation R = b - c, S = -c, T = b, P = 0;
        // snowdrift R = b - c/2, S = b - c, T = b, P = 0.
        return Stream.of(
            Arguments.of("pd", new double[] {3, 0, 5, 1}),
            Arguments.of("pd:4,0,6,1", new double[] {4, 0, 6, 1}),
            Arguments.of("donation:3,1", new double[] {2, -1, 3, 0}),
            Arguments.of("snowdrift:4,2", new double[] {3, 2, 4, 0}),
            Arguments.of("staghunt:4,0,3,2", new double[] {4, 0, 3, 2}));
    }

    @ParameterizedTest
    @MethodSource("presets")
    void presetsGiveTheRowPlayersPayoffs(String text, double[] rowPayoffs) {
        assertArrayEquals(rowPayoffs, StageGame.parse(text).payoffX(), 0);
    }

    static Stream<Arguments> badGames() {
        return Stream.of(
            Arguments.of("pd:3,0,2,1", "T > R > P > S"),
            Arguments.of("pd:3,0,7,1", "2R > T + S"),
            Arguments.of("donation:1,2", "b > c > 0"),
            Arguments.of("staghunt:3,0,5,1", "R > T >= P > S"),
            Arguments.of("3,0,5", "4 numbers"),
            Arguments.of("3,0,x,1", "not a number"),
            Arguments.of("3,0,NaN,1", "finite"),
            Arguments.of("3,,5,1", "empty entry"),
            Arguments.of("chicken", "unknown game"),
            Arguments.of("", "empty"));
    }

    @ParameterizedTest
    @MethodSource("badGames")
    void badGamesAreRefusedWithAMessageNamingTheProblem(String text, String fragment) {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> StageGame.parse(text));
        assertTrue(e.getMessage().contains(fragment), e.getMessage());
        assertEquals(-1, e.getMessage().indexOf('\n'), "one line");
    }

    /**
     * The payoff range, 0 or magnitudes in [1e-100, 1e100], at its edges: the tool's own bound (see
     * StageGame.MOST_PAYOFF_MAGNITUDE for why), no external source. Eight-number and preset games go
     * through the same check.
     */
    @Test
    void payoffsBeyondTheRangeOfTheirSquaresAreRefused() {
        StageGame.symmetric(1e100, 0, -1e100, 1e-100);
        StageGame.parse("donation:1e100,1e-100");
        for (String text : new String[] {"1.0000001e100,0,2,1", "3,0,5,9e-101", "1,2,3,4,5,6,7,-2e100",
            "donation:2e100,1"}) {
            IllegalArgumentException ex = assertThrows(IllegalArgumentException.class, () -> StageGame.parse(text));
            assertTrue(ex.getMessage().contains("must be 0 or of magnitude between 1e-100 and 1e100"), ex.getMessage());
        }
    }
}
