package reprise.stats;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/**
 * Issue 12 item 7a: a snapshot state never seen got a Wilson interval whose lower end rounded to just above
 * 0 (1.16e-17 for about a fifth of game counts: 5, 10, 15, 17, 20, 30, ...), above its estimate 0, and
 * drawing the figure failed. In exact arithmetic the plain score interval (Wilson 1927) has lower end 0 at
 * x = 0 and upper end 1 at x = n; deterministic test.
 */
class WilsonEndsTest {

    @Test
    void endsAreExactAtZeroAndAllSuccesses() {
        for (long n = 1; n <= 500; n++) {
            for (double conf : new double[] {0.9, 0.95, 0.99, 0.999}) {
                Interval none = WilsonInterval.of(0, n, conf, WilsonInterval.Correction.NONE);
                assertEquals(0, none.lower(), 0, "n = " + n + ", confidence " + conf);
                Interval all = WilsonInterval.of(n, n, conf, WilsonInterval.Correction.NONE);
                assertEquals(1, all.upper(), 0, "n = " + n + ", confidence " + conf);
                for (long x = 0; x <= Math.min(n, 12); x++) {
                    Interval i = WilsonInterval.of(x, n, conf, WilsonInterval.Correction.NONE);
                    assertTrue(i.lower() <= i.estimate() && i.estimate() <= i.upper(), i + " for " + x + " of " + n);
                }
            }
        }
    }
}
