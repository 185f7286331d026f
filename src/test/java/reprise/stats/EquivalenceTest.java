package reprise.stats;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * TOST decisions (Schuirmann 1987) on constructed cases with a normal reference (infinite degrees of
 * freedom), target 0.5, tolerance h = 0.05, alpha = 0.05, z_{0.95} = 1.6449 (so the 90% interval is
 * estimate +- 1.6449 se); the expected verdicts follow from where that interval lies, worked out by hand.
 */
class EquivalenceTest {

    static final double INF = Double.POSITIVE_INFINITY;

    static Stream<Arguments> cases() {
        return Stream.of(
            // [0.4836, 0.5164] inside (0.45, 0.55)
            Arguments.of(0.50, 0.01, Equivalence.Verdict.AGREES),
            // [0.5836, 0.6164] entirely above 0.55
            Arguments.of(0.60, 0.01, Equivalence.Verdict.DISAGREES),
            // [0.3836, 0.4164] entirely below 0.45
            Arguments.of(0.40, 0.01, Equivalence.Verdict.DISAGREES),
            // [0.5236, 0.5564] straddles 0.55
            Arguments.of(0.54, 0.01, Equivalence.Verdict.INCONCLUSIVE),
            // [0.5436, 0.5764] straddles 0.55 from outside
            Arguments.of(0.56, 0.01, Equivalence.Verdict.INCONCLUSIVE),
            // significant difference (z = 10) yet well within tolerance: agreement, not a failure
            Arguments.of(0.51, 0.001, Equivalence.Verdict.AGREES),
            // deterministic quantities
            Arguments.of(0.52, 0.0, Equivalence.Verdict.AGREES),
            Arguments.of(0.58, 0.0, Equivalence.Verdict.DISAGREES));
    }

    @ParameterizedTest(name = "estimate {0}, se {1} -> {2}")
    @MethodSource("cases")
    void verdicts(double estimate, double se, Equivalence.Verdict verdict) {
        Equivalence.Result r = Equivalence.assess(new Estimate(estimate, se, INF, 100), 0.5, 0.05, 0.05);
        assertEquals(verdict, r.verdict());
        assertEquals(verdict == Equivalence.Verdict.INCONCLUSIVE, r.additionalGamesNeeded().isPresent());
    }

    @Test
    void differenceTestRejectsWhileTostAgrees() {
        Equivalence.Result r = Equivalence.assess(new Estimate(0.51, 0.001, INF, 100), 0.5, 0.05, 0.05);
        assertTrue(r.differencePValue() < 1e-10);
        assertTrue(r.equivalencePValue() < 1e-10);
    }

    @Test
    void additionalGamesSettleTheQuestion() {
        // By hand: margin h - |d| = 0.01, needed G' = 100 (1.6449 * 0.01 / 0.01)^2 = 270.6, so 271 games,
        // 171 more; with se scaled by sqrt(100 / 271) the verdict becomes AGREES, and with one game fewer it
        // does not.
        Equivalence.Result r = Equivalence.assess(new Estimate(0.54, 0.01, INF, 100), 0.5, 0.05, 0.05);
        assertEquals(171, r.additionalGamesNeeded().getAsLong());
        long total = 100 + r.additionalGamesNeeded().getAsLong();
        Equivalence.Result after = Equivalence.assess(new Estimate(0.54, 0.01 * Math.sqrt(100.0 / total), INF, total),
            0.5, 0.05, 0.05);
        assertEquals(Equivalence.Verdict.AGREES, after.verdict());
        Equivalence.Result before = Equivalence.assess(new Estimate(0.54, 0.01 * Math.sqrt(100.0 / (total - 1)), INF,
            total - 1), 0.5, 0.05, 0.05);
        assertEquals(Equivalence.Verdict.INCONCLUSIVE, before.verdict());
    }

    @Test
    void tostPValueByHand() {
        // By hand: d = 0.01, se = 0.02: max(P(Z > 3), P(Z > 2)) = P(Z > 2) = 0.02275013195 (normal table).
        Equivalence.Result r = Equivalence.assess(new Estimate(0.51, 0.02, INF, 10), 0.5, 0.05, 0.05);
        assertEquals(0.02275013195, r.equivalencePValue(), 1e-10);
        assertEquals(0.9, r.interval().confidence(), 1e-15);
    }

    @Test
    void biasReportSeparatesBiasFromNoise() {
        // REFERENCES item 3: TFT vs TFT with eps = 0.01 averages 2.621669259 over 100 rounds against the
        // stationary 2.25; with se 0.01 the bias is 37 standard errors.
        Equivalence.BiasReport b = Equivalence.biasReport(2.621669259, 2.25, new Estimate(2.62, 0.01, 99, 100));
        assertEquals(0.371669259, b.bias(), 1e-12);
        assertEquals(37.1669259, b.biasInStandardErrors(), 1e-9);
        assertTrue(b.explanation().contains("longer games"), b.explanation());
        Equivalence.BiasReport small = Equivalence.biasReport(2.2501, 2.25, new Estimate(2.25, 0.01, 99, 100));
        assertTrue(small.explanation().contains("small against the sampling error"), small.explanation());
    }

    @Test
    void badInputs() {
        Estimate e = new Estimate(0.5, 0.01, INF, 10);
        IllegalArgumentException x = assertThrows(IllegalArgumentException.class,
            () -> Equivalence.assess(e, 0.5, 0, 0.05));
        assertEquals("tolerance h must be a finite number > 0: 0.0", x.getMessage());
        assertThrows(IllegalArgumentException.class, () -> Equivalence.assess(e, 0.5, 0.1, 0.5));
        assertThrows(IllegalArgumentException.class, () -> new Estimate(0.5, -1, INF, 10));
    }
}
