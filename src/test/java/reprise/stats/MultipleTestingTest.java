package reprise.stats;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.junit.jupiter.api.Test;

/** Holm (1979) and Benjamini &amp; Hochberg (1995) adjusted p-values. */
class MultipleTestingTest {

    /**
     * Computed by hand from the definitions (no published worked example is relied on):
     * p = (0.01, 0.04, 0.03, 0.005), m = 4; sorted 0.005, 0.01, 0.03, 0.04.
     * Holm: (4, 3, 2, 1) x sorted = 0.02, 0.03, 0.06, 0.04; running maximum 0.02, 0.03, 0.06, 0.06;
     * back in input order (0.03, 0.06, 0.06, 0.02).
     * BH: m p_(i) / i = 0.02, 0.02, 0.04, 0.04; running minimum from the top 0.02, 0.02, 0.04, 0.04;
     * in input order (0.02, 0.04, 0.04, 0.02).
     * Tolerance 1e-15: a few roundings of numbers of size 0.1.
     */
    @Test
    void workedExample() {
        double[] p = {0.01, 0.04, 0.03, 0.005};
        assertArrayEquals(new double[] {0.03, 0.06, 0.06, 0.02}, MultipleTesting.adjust(p), 1e-15);
        assertArrayEquals(new double[] {0.02, 0.04, 0.04, 0.02},
            MultipleTesting.adjust(p, MultipleTesting.Method.BENJAMINI_HOCHBERG), 1e-15);
        // At alpha = 0.05: Holm rejects the hypotheses with adjusted 0.03 and 0.02; BH rejects all four.
        assertArrayEquals(new boolean[] {true, false, false, true},
            MultipleTesting.reject(p, 0.05, MultipleTesting.Method.HOLM));
        assertArrayEquals(new boolean[] {true, true, true, true},
            MultipleTesting.reject(p, 0.05, MultipleTesting.Method.BENJAMINI_HOCHBERG));
    }

    /**
     * Computed by hand: p = (0.5, 0.8, 0.9, 0.2). Holm: sorted 0.2, 0.5, 0.8, 0.9 times (4, 3, 2, 1) =
     * 0.8, 1.5, 1.6, 0.9 -> capped 0.8, 1, 1, 0.9 -> monotone 0.8, 1, 1, 1. BH: 4 p_(i)/i = 0.8, 1, 1.0667, 0.9
     * -> capped and running minimum from the top: 0.9, 0.9, 0.9, 0.8.
     */
    @Test
    void capsAtOneAndStaysMonotone() {
        double[] p = {0.5, 0.8, 0.9, 0.2};
        assertArrayEquals(new double[] {1, 1, 1, 0.8}, MultipleTesting.adjust(p), 1e-15);
        assertArrayEquals(new double[] {0.9, 0.9, 0.9, 0.8},
            MultipleTesting.adjust(p, MultipleTesting.Method.BENJAMINI_HOCHBERG), 1e-15);
    }

    @Test
    void rejectsBadInput() {
        assertThrows(IllegalArgumentException.class, () -> MultipleTesting.adjust(new double[0]));
        assertThrows(IllegalArgumentException.class, () -> MultipleTesting.adjust(new double[] {0.1, Double.NaN}));
        assertThrows(IllegalArgumentException.class, () -> MultipleTesting.adjust(new double[] {1.5}));
    }
}
