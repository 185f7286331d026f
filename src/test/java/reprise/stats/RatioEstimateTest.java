package reprise.stats;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.junit.jupiter.api.Test;

/**
 * {@link ReplicateInference#ratio}: the ratio estimator of E[a . N] / E[b . N] and its delta-method
 * standard error (Cochran, W.G. 1977, Sampling Techniques, 3rd ed., Wiley, ch. 6, eq. 6.9 in the form
 * se^2 = sum (A_g - R B_g)^2 / (G (G - 1) Bbar^2)), against the textbook formula evaluated directly from the
 * per-game totals in this test.
 */
class RatioEstimateTest {

    private static final long[][] GAMES = {{7, 2, 1, 0}, {3, 3, 3, 1}, {0, 5, 2, 3}, {9, 0, 0, 1}, {4, 4, 1, 1},
        {2, 1, 6, 1}};

    @Test
    void ratioEqualsTheTextbookFormula() {
        double[] a = {1, 1, 0, 0};
        double[] b = {1, 0, 1, 0.5};
        GameSummary s = GameSummary.of(GAMES);
        int g = GAMES.length;
        double sa = 0;
        double sb = 0;
        double[] ag = new double[g];
        double[] bg = new double[g];
        for (int k = 0; k < g; k++) {
            for (int st = 0; st < 4; st++) {
                ag[k] += a[st] * GAMES[k][st];
                bg[k] += b[st] * GAMES[k][st];
            }
            sa += ag[k];
            sb += bg[k];
        }
        double r = sa / sb;
        double sq = 0;
        for (int k = 0; k < g; k++) {
            sq += (ag[k] - r * bg[k]) * (ag[k] - r * bg[k]);
        }
        double bbar = sb / g;
        double se = Math.sqrt(sq / (g * (g - 1.0) * bbar * bbar));
        Estimate est = ReplicateInference.ratio(s, a, b);
        assertEquals(r, est.value(), 1e-15);
        assertEquals(se, est.standardError(), 1e-14);
        assertEquals(g - 1, est.degreesOfFreedom());
        // with b = (1, 1, 1, 1) the ratio is the per-round mean of a
        Estimate mean = ReplicateInference.mean(s, a);
        Estimate same = ReplicateInference.ratio(s, a, new double[] {1, 1, 1, 1});
        assertEquals(mean.value(), same.value(), 1e-15);
        assertEquals(mean.standardError(), same.standardError(), 1e-15);
    }

    @Test
    void aDenominatorThatIsZeroInEveryGameIsRefused() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
            () -> ReplicateInference.ratio(GameSummary.of(new long[][] {{1, 2, 0, 0}, {3, 0, 0, 0}}),
                new double[] {1, 0, 0, 0}, new double[] {0, 0, 0, 1}));
        assertEquals("the ratio's denominator is 0 in every game: the ratio is undefined", e.getMessage());
    }
}
