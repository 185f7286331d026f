package reprise.game;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/** Zero-determinant vectors against REFERENCES.md items 4 and 5 (exact rationals there; 1e-12 here). */
class ZeroDeterminantTest {

    static Stream<Arguments> vectors() {
        return Stream.of(
            // Press & Dyson (2012), Iterated Prisoner's Dilemma contains strategies that dominate any evolutionary
            // opponent, PNAS 109: extortioner chi = 3, phi = 1/26 (vector from memory, reproduced exactly).
            Arguments.of("extort:chi=3,phi=1/26", new double[] {11.0 / 13, 0.5, 7.0 / 26, 0}, 0.0),
            // Press & Dyson (2012) equalizer setting the co-player's score to 2 (vector from memory).
            Arguments.of("equalizer:score=2,phi=1/3", new double[] {2.0 / 3, 0, 2.0 / 3, 1.0 / 3}, 1.0),
            // Hilbe, Traulsen & Sigmund (2015), Partners or rivals?, GEB 92: discounted forms, delta = 0.9
            // (REFERENCES item 5, formulas from memory, vectors computed independently in exact arithmetic).
            Arguments.of("extort:chi=2,phi=0.1,delta=0.9", new double[] {8.0 / 9, 1.0 / 9, 2.0 / 3, 0}, 0.0),
            Arguments.of("generous:chi=2,phi=0.1,delta=0.9", new double[] {1, 2.0 / 9, 7.0 / 9, 1.0 / 9}, 1.0),
            Arguments.of("equalizer:score=2,phi=0.15,delta=0.9,p0=0.5",
                new double[] {8.0 / 9, 5.0 / 9, 5.0 / 18, 1.0 / 9}, 0.5),
            // Existence threshold delta = 7/9 for chi = 2 (REFERENCES item 5, derived independently): the
            // allowed phi interval shrinks to the single point 1/9, giving (1, 0, 6/7, 0).
            Arguments.of("extort:chi=2,delta=7/9", new double[] {1, 0, 6.0 / 7, 0}, 0.0));
    }

    @ParameterizedTest
    @MethodSource("vectors")
    void vectorsMatchThePublishedOnes(String spec, double[] expected, double initial) {
        MemoryStrategy m = (MemoryStrategy) Strategies.parse(spec, StageGame.DEFAULT, Player.X);
        assertArrayEquals(expected, m.table(), 1e-12);
        assertEquals(initial, m.initial(), 0);
    }

    @Test
    void largestExtortionScaleIsOneThirteenthForChiThree() {
        // REFERENCES item 4: "The largest allowed phi is 1/13" for chi = 3 in 5,3,1,0 (derived independently).
        double[] own = StageGame.DEFAULT.ownView(Player.X);
        double[] co = StageGame.DEFAULT.coPlayerInView(Player.X);
        double[] bracket = new double[4];
        for (int i = 0; i < 4; i++) {
            bracket[i] = (own[i] - own[3]) - 3 * (co[i] - co[3]);
        }
        double[] range = ZeroDeterminant.phiRange(bracket, 1, 0);
        assertEquals(0, range[0], 0);
        assertEquals(1.0 / 13, range[1], 1e-15);
    }

    @Test
    void playerYUsesItsOwnView() {
        // In a symmetric game Y's extortioner has the same own-view vector as X's.
        MemoryStrategy x = ZeroDeterminant.extortionate(StageGame.DEFAULT, Player.X, 3, 1.0 / 26, 1);
        MemoryStrategy y = ZeroDeterminant.extortionate(StageGame.DEFAULT, Player.Y, 3, 1.0 / 26, 1);
        assertArrayEquals(x.table(), y.table(), 1e-15);
    }
}
