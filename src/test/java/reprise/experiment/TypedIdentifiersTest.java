package reprise.experiment;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Optional;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import reprise.game.StageGame;
import reprise.stats.TestResult;

/**
 * The typed identifiers of quantities, row subjects, comparison kinds and tests: their names in the files
 * and their weights.
 *
 * <p>The expected names are the project's own file format as documented in README (tables of
 * {@code results.csv} and the claims file): no outside source exists for them, and these tests pin them so
 * that a change of spelling, which would break every reader of old output, cannot pass unnoticed.
 */
class TypedIdentifiersTest {

    static Stream<Arguments> subjectLabels() {
        return Stream.of(Arguments.of(BaseQuantity.CC, "CC"), Arguments.of(BaseQuantity.CD, "CD"),
            Arguments.of(BaseQuantity.DC, "DC"), Arguments.of(BaseQuantity.DD, "DD"),
            Arguments.of(BaseQuantity.COOPERATION_X, "coop_x"), Arguments.of(BaseQuantity.COOPERATION_Y, "coop_y"),
            Arguments.of(BaseQuantity.PAYOFF_X, "payoff_x"), Arguments.of(BaseQuantity.PAYOFF_Y, "payoff_y"),
            Arguments.of(Subject.Joint.STATES, "states"), Arguments.of(Subject.Joint.TRANSITIONS, "transitions"),
            Arguments.of(new Subject.Snapshot(12), "snapshot_12"));
    }

    @ParameterizedTest
    @MethodSource("subjectLabels")
    void subjectsHaveTheirFileNamesAndReadBack(Subject s, String label) {
        assertEquals(label, s.label());
        assertEquals(s, Subject.ofLabel(label));
    }

    static Stream<Arguments> testLabels() {
        return Stream.of(Arguments.of(TestId.Standard.FREQUENCIES_WALD, "frequencies (Wald)"),
            Arguments.of(TestId.Standard.TRANSITIONS_PEARSON, "transitions (Pearson)"),
            Arguments.of(TestId.Standard.TRANSITIONS_LR, "transitions (LR)"),
            Arguments.of(TestId.Standard.POOLED_ROUNDS_ILLUSTRATION, "pooled rounds chi-square (ILLUSTRATION, invalid)"),
            Arguments.of(new TestId.AtRound(3), "snapshot t=3"),
            Arguments.of(new TestId.ZScore(BaseQuantity.PAYOFF_Y), "z payoff_y"));
    }

    @ParameterizedTest
    @MethodSource("testLabels")
    void testsHaveTheirFileNamesAndReadBack(TestId t, String label) {
        assertEquals(label, t.label());
        assertEquals(Optional.of(t), TestId.ofLabel(label));
        assertEquals(t == TestId.Standard.POOLED_ROUNDS_ILLUSTRATION, t.illustration());
    }

    @Test
    void unknownNamesAreRefusedOrLeftUnknown() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
            () -> BaseQuantity.ofLabel("coop_z"));
        assertEquals("unknown quantity 'coop_z'; known: CC, CD, DC, DD, coop_x, coop_y, payoff_x, payoff_y",
            e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> Subject.ofLabel("snapshot_x"));
        assertThrows(IllegalArgumentException.class, () -> Subject.ofLabel("snapshot_0"));
        assertThrows(IllegalArgumentException.class, () -> ComparisonKind.ofLabel("claim"));
        assertEquals(Optional.empty(), TestId.ofLabel("z nothing"));
        assertEquals(Optional.empty(), TestId.ofLabel("snapshot t=soon"));
    }

    @Test
    void comparisonKindsHaveTheirFileNamesAndRoles() {
        assertEquals(List.of("exact", "stationary", "claim-vs-simulation", "claim-vs-exact",
            "long-run-claim-vs-simulation"), Stream.of(ComparisonKind.values()).map(ComparisonKind::label).toList());
        for (ComparisonKind k : ComparisonKind.values()) {
            assertEquals(k, ComparisonKind.ofLabel(k.label()));
            assertEquals(k != ComparisonKind.STATIONARY && k != ComparisonKind.LONG_RUN_CLAIM_VS_SIMULATION,
                k.countsTowardsExit(), k.label());
            assertEquals(k.label().contains("claim"), k.isClaim(), k.label());
        }
    }

    @Test
    void figuresHaveTheirFileNames() {
        assertEquals(List.of("convergence", "error", "payoff", "distribution", "deviation", "verdicts", "calibration"),
            Stream.of(FigureKind.values()).map(FigureKind::label).toList());
        for (FigureKind k : FigureKind.values()) {
            assertEquals(Optional.of(k), FigureKind.ofLabel(k.label()));
        }
        assertEquals(Optional.empty(), FigureKind.ofLabel("histogram"));
    }

    /**
     * Weights for the stage game R, S, T, P = 3, 0, 5, 1 (Axelrod, R. (1984). The Evolution of Cooperation.
     * Basic Books, the payoff matrix of chapter 1): X's payoffs in CC, CD, DC, DD are R, S, T, P and Y's are
     * R, T, S, P; the cooperation rates count the states in which that player cooperates (definition).
     */
    @Test
    void weightsFollowTheStageGameAndTheStateOrder() {
        StageGame g = StageGame.DEFAULT;
        assertArrayEquals(new double[] {3, 0, 5, 1}, BaseQuantity.PAYOFF_X.weights(g));
        assertArrayEquals(new double[] {3, 5, 0, 1}, BaseQuantity.PAYOFF_Y.weights(g));
        assertArrayEquals(new double[] {1, 1, 0, 0}, BaseQuantity.COOPERATION_X.weights(g));
        assertArrayEquals(new double[] {1, 0, 1, 0}, BaseQuantity.COOPERATION_Y.weights(g));
        for (int s = 0; s < 4; s++) {
            double[] w = BaseQuantity.STATES.get(s).weights(g);
            for (int j = 0; j < 4; j++) {
                assertEquals(s == j ? 1 : 0, w[j]);
            }
        }
        assertFalse(BaseQuantity.PAYOFF_X.isFrequency());
        assertTrue(BaseQuantity.COOPERATION_Y.isFrequency());
        assertEquals(Experiment.Quantity.COOPERATION, BaseQuantity.COOPERATION_X.group());
    }

    @Test
    void rowsStartEmptyAndCarryATestsSmallSampleMethod() {
        TestResult t = new TestResult(2.5, 3, 0.4, "x", TestResult.SmallSample.pooled(2));
        ResultRow row = ResultRow.builder(4, "c", Subject.Joint.TRANSITIONS, ComparisonKind.EXACT).test(t)
            .verdict(Verdict.CONSISTENT).build();
        assertTrue(Double.isNaN(row.predicted()) && Double.isNaN(row.observed()) && Double.isNaN(row.lower())
            && Double.isNaN(row.upper()) && Double.isNaN(row.adjustedP()));
        assertEquals(2.5, row.statistic());
        assertEquals(3, row.degreesOfFreedom());
        assertEquals(0.4, row.pValue());
        assertEquals("", row.note(), "the test's note is not the row's note");
        assertEquals(TestResult.SmallSample.pooled(2), row.smallSample());
        ResultRow adjusted = row.adjusted(0.8, Verdict.DISAGREES);
        assertEquals(0.8, adjusted.adjustedP());
        assertEquals(Verdict.DISAGREES, adjusted.verdict());
        assertEquals(row.smallSample(), adjusted.smallSample());
        assertEquals(row.subject(), adjusted.subject());
    }

    @Test
    void invalidRowsAreRefused() {
        ResultRow.Builder b = ResultRow.builder(0, "c", BaseQuantity.CC, ComparisonKind.EXACT);
        assertThrows(IllegalArgumentException.class, () -> b.test(1, 1, 1.5).build());
        assertThrows(IllegalArgumentException.class,
            () -> ResultRow.builder(0, "c", BaseQuantity.CC, ComparisonKind.EXACT).interval(0.6, 0.4).build());
        assertThrows(IllegalArgumentException.class,
            () -> ResultRow.builder(-1, "c", BaseQuantity.CC, ComparisonKind.EXACT).build());
        assertThrows(NullPointerException.class,
            () -> ResultRow.builder(0, "c", BaseQuantity.CC, ComparisonKind.EXACT).note(null).build());
        assertThrows(IllegalArgumentException.class, () -> TestResult.SmallSample.pooled(0));
        assertThrows(IllegalArgumentException.class,
            () -> new TestResult.SmallSample(TestResult.SmallSample.Method.EXACT, 2));
    }

    @Test
    void poolingPhraseIsTheOneInTheNotes() {
        assertEquals("3 sparse cells (expected count below 5) pooled within their rows",
            CaseAnalysis.pooledCellsPhrase(3));
    }
}
