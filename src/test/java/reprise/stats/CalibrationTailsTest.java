package reprise.stats;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.apache.commons.statistics.distribution.BinomialDistribution;
import org.junit.jupiter.api.Test;

/** Rejection rates at 0.05, 0.01, 0.001 and the lower-tail warning; deterministic p-value sets. */
class CalibrationTailsTest {

    @Test
    void uniformPValuesRaiseNoWarning() {
        // The grid (i + 0.5) / K is as uniform as K values can be: 5000 values give 250, 50 and 5 below the levels.
        double[] p = new double[5000];
        for (int i = 0; i < p.length; i++) {
            p[i] = (i + 0.5) / p.length;
        }
        Calibration.TailSummary t = Calibration.tails(p, 0.95);
        assertEquals(250, t.rejections()[0]);
        assertEquals(50, t.rejections()[1]);
        assertEquals(5, t.rejections()[2]);
        assertFalse(t.lowerTailDeparts());
        assertEquals(0, t.warnings().size(), t.warnings().toString());
    }

    @Test
    void aHeavyLowerTailIsReported() {
        // Issue 12 item 3 in numbers: 2000 p-values with 94 below 0.05, 56 below 0.01 and 45 below 0.001 (the
        // measured asymptotic Wald p-values of tf2t vs stft, 0.005, 40 rounds, 300 games): calibrated at 0.05,
        // far too liberal at 0.001.
        double[] p = new double[2000];
        for (int i = 0; i < p.length; i++) {
            p[i] = i < 45 ? 1e-4 : i < 56 ? 0.005 : i < 94 ? 0.03 : 0.05 + 0.95 * (i - 94 + 0.5) / (2000 - 94);
        }
        Calibration.TailSummary t = Calibration.tails(p, 0.95);
        assertEquals(94, t.rejections()[0]);
        assertEquals(45, t.rejections()[2]);
        // One-sided excess at 0.001: P(X >= 45), X ~ Binomial(2000, 0.001), from Commons Statistics'
        // BinomialDistribution (a different code path from the BinomialTest used by the summary).
        double expected = BinomialDistribution.of(2000, 0.001).survivalProbability(44);
        assertEquals(expected, t.excessPValues()[2], 1e-12 + 1e-9 * expected);
        assertTrue(t.lowerTailDeparts());
        assertFalse(t.excessPValues()[0] < 0.01 / 3, "at 0.05 the rate is nominal");
        assertTrue(t.warnings().stream().anyMatch(w -> w.startsWith("p < 0.001 in 45 of 2000 repetitions")),
            t.warnings().toString());
    }

    @Test
    void tooFewRepetitionsToCheckATailAreSaidSo() {
        double[] p = new double[100];
        for (int i = 0; i < p.length; i++) {
            p[i] = (i + 0.5) / p.length;
        }
        Calibration.TailSummary t = Calibration.tails(p, 0.95);
        assertEquals(2, t.warnings().size());
        assertEquals("p < 0.01: 100 repetitions expect 1.0 rejections, too few to check the tail there",
            t.warnings().get(0));
    }
}
