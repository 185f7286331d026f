package reprise.stats;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.stream.Stream;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.junit.jupiter.api.Test;
import reprise.chain.MarkovChain;
import reprise.game.Match;
import reprise.game.Noise;
import reprise.game.Player;
import reprise.game.StageGame;
import reprise.game.Strategies;

/**
 * Regression tests for pooling sparse transition cells (Cochran 1954's rule of 5 applied per row), including
 * the crash of issue 12 item 7b: pooled probabilities summing to 1.0000000000000002. Deterministic tests (no
 * false-failure budget needed).
 */
class SparseCellsTest {

    static Stream<Arguments> crashingCases() {
        // Issue 12, item 7b: the matches for which check and calibrate failed with "hypothesised transition
        // matrix row 3[0] must be a probability in [0, 1]".
        return Stream.of(
            Arguments.of("tft", "gtft", 0.0025),
            Arguments.of("tft", "gtft", 0.1),
            Arguments.of("gtft", "gtft", 0.002));
    }

    @ParameterizedTest(name = "{0} vs {1} at noise {2}")
    @MethodSource("crashingCases")
    void poolingSparseRowsOfTheExactMatrixGivesValidProbabilities(String x, String y, double noise) {
        StageGame g = StageGame.DEFAULT;
        Match match = new Match(g, Strategies.parse(x, g, Player.X), Strategies.parse(y, g, Player.Y),
            Noise.symmetric(noise, 0));
        double[][] p0 = MarkovChain.of(match).observableTransitionMatrix();
        // Every row total from 0 to 40 transitions: small totals pool a whole row into one cell.
        for (long total = 0; total <= 40; total++) {
            long[][] counts = new long[4][4];
            for (int i = 0; i < 4; i++) {
                counts[i][i == 3 ? 0 : i] = total;
            }
            SparseCells.Pooled pooled = SparseCells.pool(counts, p0, SparseCells.COCHRAN_MINIMUM);
            for (int i = 0; i < 4; i++) {
                double sum = 0;
                for (double v : pooled.hypothesis()[i]) {
                    assertTrue(v >= 0 && v <= 1, "entry " + v + " of row " + i);
                    sum += v;
                }
                assertEquals(1, sum, 1e-15);
            }
            TestResult r = TransitionTest.withDefaults().test(pooled.counts(), pooled.hypothesis());
            assertTrue(r.pValue() >= 0 && r.pValue() <= 1);
        }
    }

    @Test
    void aRowSumJustAboveOneByRoundingIsAccepted() {
        // (0.33 + 0.56) + 0.11 is 1 + 2^-52 in double (checked in Python, the same IEEE arithmetic), as when a
        // player's moves are grouped; rows summing to 1 within 1e-9 were always meant to pass.
        double a = 0.33;
        double b = 0.56;
        double c = 0.11;
        double over = (a + b) + c;
        assertTrue(over > 1, "the rounding example must exceed 1: " + over);
        double[][] p = {{over, 0}, {0.5, 0.5}};
        TestResult r = TransitionTest.withDefaults().test(new long[][] {{3, 0}, {2, 2}}, p);
        assertEquals(0, r.statistic(), 0);
        assertEquals(1, r.degreesOfFreedom());
    }

    @Test
    void poolsTheCellsOfAHandWorkedRow() {
        // Worked by hand: row total 20, p = (0.05, 0.1, 0.25, 0.6): expected 1, 2, 5, 12. Ascending, groups
        // {0, 1, 2} (1 + 2 + 5 = 8 >= 5) and {3} (12); the first group sits in cell 0.
        long[][] n = {{1, 3, 6, 10}, {5, 5, 5, 5}, {5, 5, 5, 5}, {5, 5, 5, 5}};
        double[][] p = {{0.05, 0.1, 0.25, 0.6}, {0.25, 0.25, 0.25, 0.25}, {0.25, 0.25, 0.25, 0.25},
            {0.25, 0.25, 0.25, 0.25}};
        SparseCells.Pooled pooled = SparseCells.pool(n, p, 5);
        assertArrayEquals(new long[] {10, 0, 0, 10}, pooled.counts()[0]);
        assertArrayEquals(new double[] {0.4, 0, 0, 0.6}, pooled.hypothesis()[0], 1e-15);
        // Rows with total 20 and p = 1/4 have expected 5 per cell: nothing to pool there.
        assertEquals(2, pooled.merged());
        // Smallest expected count kept: row 0 has 20 * 0.4 = 8 and 12, the others 5.
        assertEquals(5, pooled.smallestExpectedCount(), 1e-12);
    }
}
