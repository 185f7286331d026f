package reprise.chain;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.OptionalLong;
import org.junit.jupiter.api.Test;
import reprise.game.Horizon;
import reprise.game.Match;
import reprise.game.Noise;

/** Horizon properties, spectrum, mixing, the fast path and the prediction record. */
class HorizonTest {

    private static final Match NOISY = Support.match("wsls", "memory1:0.9,0.5,0.2,0.1@0.7", new Noise(0.01, 0.03, 0.02, 0));

    /** (v_1 - pi) Z, the limit of both n (f_n - pi) and (f_delta - pi) / (1 - delta). */
    private static double[] offsetLimit(MarkovChain chain, double[] pi) {
        double[][] z = FundamentalMatrix.fundamental(chain.transitionMatrix(), pi);
        double[] v = chain.initialDistribution();
        double[] d = new double[4];
        for (int i = 0; i < 4; i++) {
            d[i] = v[i] - pi[i];
        }
        return Support.times(d, z);
    }

    // n (f_n - pi) -> (v_1 - pi) Z (Kemeny & Snell 1960, ch. 4: sum_t (v M^t - pi) = (v - pi) Z); the remainder
    // decays geometrically, so at n = 1e4 the agreement is to rounding, 1e-9 (n times 1e-13).
    @Test
    void finiteHorizonApproachesStationaryLikeOneOverN() {
        MarkovChain chain = MarkovChain.of(NOISY);
        double[] pi = chain.structure().stationary();
        double[] limit = offsetLimit(chain, pi);
        for (long n : new long[] {10_000, 1_000_000_000L}) {
            double[] f = Frequencies.rounds(chain, 1, n);
            for (int s = 0; s < 4; s++) {
                assertEquals(limit[s], n * (f[s] - pi[s]), n == 10_000 ? 1e-9 : 1e-5, "n = " + n);
            }
        }
    }

    // Discounted -> stationary as delta -> 1: (f_delta - pi)/(1 - delta) -> (v_1 - pi) Z (same identity with
    // Abel summation); error O(1 - delta) = 1e-6 relative to an O(1) limit, so 1e-4.
    @Test
    void discountedApproachesStationary() {
        MarkovChain chain = MarkovChain.of(NOISY);
        double[] pi = chain.structure().stationary();
        double[] limit = offsetLimit(chain, pi);
        double delta = 1 - 1e-6;
        double[] f = Frequencies.continuation(chain, delta, 0);
        for (int s = 0; s < 4; s++) {
            assertEquals(limit[s], (f[s] - pi[s]) / (1 - delta), 1e-4);
        }
    }

    // Windows and burn-in by definition: sums of the round distributions (computed directly here); 1e-13.
    @Test
    void windowsAndBurnIn() {
        MarkovChain chain = MarkovChain.of(Support.match("tf2t", "wsls", Noise.symmetric(0.05, 0.1)));
        double[][] m = chain.transitionMatrix();
        double[] sum = new double[4];
        for (long t = 4; t <= 9; t++) {
            double[] r = chain.roundStateDistributionAt(t);
            for (int s = 0; s < 4; s++) {
                sum[s] += r[s] / 6;
            }
        }
        Support.assertVector(sum, Frequencies.rounds(chain, 4, 9), 1e-13, "window");
        double delta = 0.8;
        double[] disc = new double[4];
        double w = 1 - delta;
        double[] vt = chain.distributionAt(4);
        for (long t = 4; t < 300; t++) {
            double[] r = chain.project(vt);
            for (int s = 0; s < 4; s++) {
                disc[s] += w * r[s];
            }
            w *= delta;
            vt = Support.times(vt, m);
        }
        Support.assertVector(disc, Frequencies.continuation(chain, delta, 3), 1e-13, "burn-in 3");
        assertThrows(IllegalArgumentException.class, () -> Frequencies.rounds(chain, 0, 5));
        assertThrows(IllegalArgumentException.class, () -> Frequencies.rounds(chain, 5, 4));
        assertThrows(IllegalArgumentException.class, () -> Frequencies.continuation(chain, Double.NaN, 0));
    }

    // TFT pair with execution error e: eigenvalues 1, a, -a, a^2 with a = 1 - 2e, so |lambda_2| = a
    // (computed independently in exact arithmetic); mixing time by direct iteration of M^t here.
    @Test
    void spectrumAndMixingTime() {
        double e = 0.1;
        MarkovChain chain = MarkovChain.of(Support.match("tft", "tft", Noise.symmetric(e, 0)));
        assertEquals(1 - 2 * e, Spectrum.secondEigenvalueModulus(chain), 1e-12);
        double[][] m = chain.transitionMatrix();
        double[] pi = chain.structure().stationary();
        double[][] p = m;
        long t = 1;
        while (tv(p, pi) > 0.25) {
            p = multiply(p, m);
            t++;
        }
        assertEquals(OptionalLong.of(t), Spectrum.mixingTime(chain));
        MarkovChain fixed = MarkovChain.of(Support.match("tft", "tft", Noise.NONE));
        assertEquals(1, Spectrum.secondEigenvalueModulus(fixed), 1e-12);
        assertEquals(OptionalLong.empty(), Spectrum.mixingTime(fixed));
        // nearly reducible chain: mixing time of order 1 / e
        MarkovChain slow = MarkovChain.of(Support.match("tft", "tft", Noise.symmetric(1e-8, 0)));
        long slowT = Spectrum.mixingTime(slow).getAsLong();
        assertTrue(slowT > 1e6 && slowT < 1e9, "mixing time " + slowT);
    }

    // Fast path vs the general chain path, including perception errors and a noise-free absorbing case.
    @Test
    void memoryOneFastPathAgreesWithGeneralPath() {
        MemoryOneStationary fast = new MemoryOneStationary();
        double[][] ps = {{0.9, 0.2, 0.7, 0.1}, {1, 0, 0, 1}, {11 / 13.0, 0.5, 7 / 26.0, 0}, {0.3, 0.3, 0.3, 0.3}};
        double[][] qs = {{0.8, 0.3, 0.6, 0.2}, {1, 0, 1, 0}, {0, 0, 0, 0}, {1, 1 / 3.0, 1, 1 / 3.0}};
        Noise[] noises = {Noise.NONE, new Noise(0.01, 0.02, 0.03, 0.04), Noise.symmetric(1e-8, 0)};
        for (double[] p : ps) {
            for (double[] q : qs) {
                for (Noise n : noises) {
                    Prediction general = Prediction.of(Support.match(p, q, n), null);
                    boolean ok = fast.solve(p, q, n.executionX(), n.executionY(), n.perceptionX(), n.perceptionY());
                    if (general.stationary() == null) {
                        assertTrue(!ok && Double.isNaN(fast.payoff(Support.PD.payoffX())));
                        continue;
                    }
                    assertTrue(ok);
                    // 1e-12: both GTH; 1e-10 for noise 1e-8 (nearly reducible, REFERENCES.md general rule)
                    double tol = n.executionX() < 1e-3 && n.executionX() > 0 ? 1e-10 : 1e-12;
                    for (int s = 0; s < 4; s++) {
                        assertEquals(general.stationary()[s], fast.frequency(s), tol);
                    }
                    assertEquals(general.stationaryPayoffs().y(), fast.payoff(Support.PD.payoffY()), tol);
                }
            }
        }
    }

    @Test
    void predictionRecordForTheCli() {
        Prediction p = Prediction.of(NOISY, Horizon.rounds(50));
        assertEquals(List.of("CC", "CD", "DC", "DD"), p.states());
        assertEquals("rounds", p.horizon().kind());
        assertEquals(50, p.horizon().value());
        assertEquals(4, p.asymptoticCovariance().length);
        assertNull(p.stationaryNote());
        assertEquals(List.of("{CC, CD, DC, DD}"), p.closedClasses());
        assertTrue(p.mixingTime().isPresent());
        Support.assertVector(p.stationary(), p.limitFrequencies(), 1e-15, "limit = stationary");
        Prediction tft = Prediction.of(Support.match("tft", "tft", Noise.NONE), Horizon.continuation(0.9));
        assertNull(tft.stationary());
        assertNull(tft.stationaryPayoffs());
        assertNull(tft.asymptoticCovariance());
        assertTrue(tft.stationaryNote().contains("{CC}, CD -> DC, {DD}"), tft.stationaryNote());
        assertEquals(3.0, tft.limitPayoffs().x(), 1e-15);
        assertEquals(3.0, tft.horizon().payoffs().x(), 1e-15);
        assertEquals(1.0, tft.horizon().cooperation().y(), 1e-15);
        // memory two with perception errors: the 256-state record chain
        Prediction rec = Prediction.of(Support.match("tf2t", "wsls", Noise.symmetric(0.02, 0.05)), Horizon.rounds(20));
        assertEquals(MarkovChain.Kind.PLAYER_RECORDS, rec.chainKind());
        assertEquals(256, rec.chainSize());
        assertEquals(1, sum(rec.stationary()), 1e-13);
        assertTrue(rec.secondEigenvalueModulus() > 0 && rec.secondEigenvalueModulus() < 1);
    }

    private static double sum(double[] v) {
        double s = 0;
        for (double x : v) {
            s += x;
        }
        return s;
    }

    private static double tv(double[][] p, double[] pi) {
        double worst = 0;
        for (double[] row : p) {
            double s = 0;
            for (int j = 0; j < row.length; j++) {
                s += Math.abs(row[j] - pi[j]);
            }
            worst = Math.max(worst, s / 2);
        }
        return worst;
    }

    private static double[][] multiply(double[][] a, double[][] b) {
        int k = a.length;
        double[][] out = new double[k][k];
        for (int i = 0; i < k; i++) {
            for (int l = 0; l < k; l++) {
                for (int j = 0; j < k; j++) {
                    out[i][j] += a[i][l] * b[l][j];
                }
            }
        }
        return out;
    }
}
