package reprise.stats;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import reprise.game.Player;

/**
 * Anderson &amp; Goodman (1957), "Statistical inference about Markov chains", Ann. Math. Statist. 28(1):89-110:
 * check values of the project's REFERENCES item 8 (recomputed there in exact arithmetic; the statistic's
 * form is from memory). Tolerance 1e-9 relative, as item 8 states: the sums are a dozen terms in double.
 */
class TransitionTestTest {

    /** The memory-one chain of REFERENCES item 7: X = (0.9, 0.2, 0.7, 0.1), Y own view (0.8, 0.3, 0.6, 0.2). */
    static final double[][] M = {
        {18 / 25.0, 9 / 50.0, 2 / 25.0, 1 / 50.0},
        {3 / 25.0, 2 / 25.0, 12 / 25.0, 8 / 25.0},
        {21 / 100.0, 49 / 100.0, 9 / 100.0, 21 / 100.0},
        {1 / 50.0, 2 / 25.0, 9 / 50.0, 18 / 25.0}};

    static final long[][] TABLE_A = {{170, 55, 20, 6}, {28, 12, 85, 60}, {40, 100, 15, 38}, {5, 35, 70, 261}};
    static final long[][] TABLE_B = {{150, 60, 30, 11}, {30, 20, 80, 55}, {45, 90, 25, 33}, {10, 40, 80, 241}};
    static final long[][] TABLE_C = {{180, 50, 18, 3}, {20, 15, 90, 60}, {40, 95, 20, 38}, {8, 28, 65, 270}};

    static Stream<Arguments> published() {
        // REFERENCES item 8: X^2 for tables A, B, C; G^2 for A and B; p-values where given (NaN: not given).
        return Stream.of(
            Arguments.of("A", TABLE_A, TransitionTest.Form.PEARSON, 447911387975.0 / 55858073124.0, 0.7836641757),
            Arguments.of("A", TABLE_A, TransitionTest.Form.LIKELIHOOD_RATIO, 7.865883869, 0.7955213162),
            Arguments.of("B", TABLE_B, TransitionTest.Form.PEARSON, 42.96621045, 2.287919595e-5),
            Arguments.of("B", TABLE_B, TransitionTest.Form.LIKELIHOOD_RATIO, 39.09706574, Double.NaN),
            Arguments.of("C", TABLE_C, TransitionTest.Form.PEARSON, 2.577074949, Double.NaN));
    }

    @ParameterizedTest(name = "table {0} {2}")
    @MethodSource("published")
    void reproducesReferenceValues(String name, long[][] table, TransitionTest.Form form, double statistic,
                                   double p) {
        TestResult r = TransitionTest.withDefaults().with(form).test(table, M);
        assertEquals(statistic, r.statistic(), 1e-9 * statistic);
        assertEquals(12, r.degreesOfFreedom());
        if (!Double.isNaN(p)) {
            // 1e-9 relative at 10 printed digits; the survival function of Commons Statistics is far better.
            assertEquals(p, r.pValue(), 1e-9 * p);
        }
    }

    @Test
    void tableBRejectsAtFivePercentAndTableADoesNot() {
        // REFERENCES item 8: 42.97 > 21.026, the 0.95 quantile of chi-square with 12 df.
        assertTrue(TransitionTest.withDefaults().test(TABLE_B, M).reject(0.05));
        assertTrue(!TransitionTest.withDefaults().test(TABLE_A, M).reject(0.05));
    }

    @Test
    void perRowValuesOfTableC() {
        // REFERENCES item 8, table C per-row values; tolerance 1e-9 relative.
        double[] expected = {1.545374059, 0.2477477477, 0.5650253193, 0.2189278227};
        double[] rows = TransitionTest.withDefaults().rowStatistics(TABLE_C, M);
        for (int i = 0; i < 4; i++) {
            assertEquals(expected[i], rows[i], 1e-9 * expected[i], "row " + i);
        }
    }

    @Test
    void xMovesOnlyOnTableC() {
        // REFERENCES item 8: test of X's moves only, 4 binomials with 4 df, on table C.
        TestResult r = TransitionTest.withDefaults().testMove(TABLE_C, M, Player.X);
        assertEquals(0.9157548335, r.statistic(), 1e-9);
        assertEquals(4, r.degreesOfFreedom());
    }

    @Test
    void zeroCellsAreLeftOutAndReduceDegreesOfFreedom() {
        // Computed by hand from the definition: row 0 has p0 = (1/2, 1/2, 0), counts (6, 4, 0):
        // X^2 = (6-5)^2/5 + (4-5)^2/5 = 0.4, d_0 - 1 = 1; row 1 is deterministic (1, 0, 0) with counts (3, 0, 0):
        // contributes 0 and 0 df; row 2 has no transitions and contributes nothing.
        double[][] p0 = {{0.5, 0.5, 0}, {1, 0, 0}, {0.2, 0.3, 0.5}};
        long[][] n = {{6, 4, 0}, {3, 0, 0}, {0, 0, 0}};
        TestResult r = TransitionTest.withDefaults().test(n, p0);
        assertEquals(0.4, r.statistic(), 1e-15);
        assertEquals(1, r.degreesOfFreedom());
        // LR form by hand: 2 (6 ln(6/5) + 4 ln(4/5)).
        double g2 = 2 * (6 * Math.log(1.2) + 4 * Math.log(0.8));
        assertEquals(g2, TransitionTest.withDefaults().with(TransitionTest.Form.LIKELIHOOD_RATIO).statistic(n, p0),
            1e-14);
    }

    @Test
    void aCountInAnImpossibleCellGivesPZero() {
        double[][] p0 = {{0.5, 0.5, 0}, {1, 0, 0}, {0.2, 0.3, 0.5}};
        long[][] n = {{6, 4, 1}, {3, 0, 0}, {0, 0, 0}};
        TestResult r = TransitionTest.withDefaults().test(n, p0);
        assertEquals(0, r.pValue());
        assertEquals(Double.POSITIVE_INFINITY, r.statistic());
        assertTrue(r.note().contains("0 -> 2"), r.note());
    }

    @Test
    void badInputsAreRejected() {
        TransitionTest t = TransitionTest.withDefaults();
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
            () -> t.test(TABLE_A, new double[][] {{0.5, 0.6, 0, 0}, M[1], M[2], M[3]}));
        assertTrue(e.getMessage().contains("must sum to 1"), e.getMessage());
        e = assertThrows(IllegalArgumentException.class,
            () -> t.test(new long[][] {{1, -1, 0, 0}, {0, 0, 0, 0}, {0, 0, 0, 0}, {0, 0, 0, 0}}, M));
        assertTrue(e.getMessage().contains("-1"), e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> t.test(TABLE_A, new double[][] {M[0], M[1], M[2]}));
    }
}
