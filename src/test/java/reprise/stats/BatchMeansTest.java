package reprise.stats;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.junit.jupiter.api.Test;

/** Batch means along one long chain. */
class BatchMeansTest {

    @Test
    void formulaByHand() {
        // Computed by hand: values 1..10, b = floor(sqrt(10)) = 3, a = 3 batches (1..9): means 2, 5, 8, their mean
        // 5, sum of squares 18, sigma^2 = 3 * 18 / 2 = 27; overall mean 5.5, se = sqrt(27 / 10); 2 df.
        double[] v = {1, 2, 3, 4, 5, 6, 7, 8, 9, 10};
        Estimate e = BatchMeans.estimate(v);
        assertEquals(5.5, e.value(), 1e-15);
        assertEquals(Math.sqrt(2.7), e.standardError(), 1e-15);
        assertEquals(2, e.degreesOfFreedom());
        Estimate s = BatchMeans.estimate(new int[] {0, 1, 2, 3, 0, 1, 2, 3, 0, 1}, new double[] {1, 2, 3, 4});
        assertEquals(2.3, s.value(), 1e-15);
    }

    @Test
    void batchVarianceNearTheExactAsymptoticVariance() {
        // Two-state chain, stay 0.9: for the indicator of state 0 the asymptotic variance is
        // pi (1 - pi) (1 + rho) / (1 - rho) with rho = 0.8, i.e. 0.25 * 9 = 2.25 (from the standard AR(1)
        // form of a two-state chain, derived by hand). With n = 10000 (100 batches of 100) the estimate's
        // sd is about 2.25 sqrt(2/99) = 0.32 and its bias about -0.05; fixed seed, tolerance 1.0 (3 sd).
        long seed = 404L;
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(seed);
        int n = 10_000;
        int[] states = new int[n];
        states[0] = rng.nextBoolean() ? 0 : 1;
        for (int t = 1; t < n; t++) {
            states[t] = rng.nextDouble() < 0.9 ? states[t - 1] : 1 - states[t - 1];
        }
        Estimate e = BatchMeans.estimate(states, new double[] {1, 0});
        double sigma2 = e.standardError() * e.standardError() * n;
        assertEquals(2.25, sigma2, 1.0, "seed " + seed);
        assertEquals(99, e.degreesOfFreedom());
        Estimate exact = BatchMeans.fromAsymptoticVariance(e.value(), 2.25, n);
        assertEquals(1.959963984540054 * 0.015, exact.interval(0.95).halfWidth(), 1e-12);
    }

    @Test
    void badInputs() {
        IllegalArgumentException x = assertThrows(IllegalArgumentException.class,
            () -> BatchMeans.estimate(new double[] {1, 2, 3}));
        assertEquals("batch means need at least 4 values: 3", x.getMessage());
        assertThrows(IllegalArgumentException.class,
            () -> BatchMeans.estimate(new int[] {0, 1, 5, 0}, new double[] {1, 2}));
    }
}
