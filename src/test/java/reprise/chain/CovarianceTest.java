package reprise.chain;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import reprise.game.Match;
import reprise.game.Noise;

/** Kemeny &amp; Snell fundamental matrix, asymptotic covariances and exact count moments. */
class CovarianceTest {

    private static final double[][] OZ = {{0.5, 0.25, 0.25}, {0.5, 0, 0.5}, {0.25, 0.25, 0.5}};
    private static final double[] OZ_PI = {0.4, 0.2, 0.4};

    private static Match example() {
        return Support.match(new double[] {0.9, 0.2, 0.7, 0.1}, new double[] {0.8, 0.3, 0.6, 0.2}, Noise.NONE);
    }

    // Kemeny & Snell (1960), Finite Markov Chains, ch. 4, Land of Oz example (REFERENCES.md item 7):
    // 75 Z, 375 C and the mean first-passage times; tolerance 1e-12 (closed forms).
    @Test
    void landOfOz() {
        MarkovChain oz = new MarkovChain(null, MarkovChain.Kind.ROUND_STATES, 1, OZ, new double[] {1, 0, 0},
            new int[] {0, 1, 2}, new String[] {"R", "N", "S"});
        Support.assertVector(OZ_PI, oz.structure().stationary(), 1e-15, "pi");
        double[][] z = FundamentalMatrix.fundamental(OZ, OZ_PI);
        double[][] z75 = {{86, 3, -14}, {6, 63, 6}, {-14, 3, 86}};
        double[][] c375 = {{134, -18, -116}, {-18, 36, -18}, {-116, -18, 134}};
        Support.assertMatrix(scale(z75, 1 / 75.0), z, 1e-12, "Z");
        Support.assertMatrix(scale(c375, 1 / 375.0), FundamentalMatrix.occupationCovariance(OZ, OZ_PI), 1e-12, "C");
        double[][] mfpt = {{5 / 2.0, 4, 10 / 3.0}, {8 / 3.0, 5, 8 / 3.0}, {10 / 3.0, 4, 5 / 2.0}};
        Support.assertMatrix(mfpt, FundamentalMatrix.meanFirstPassageTimes(OZ, OZ_PI), 1e-12, "mean first passage");
        assertThrows(IllegalArgumentException.class, () -> FundamentalMatrix.fundamental(OZ, new double[] {1}));
    }

    // REFERENCES.md item 7, memory-one example (Kemeny & Snell 1960 formulas; values recomputed there in
    // exact arithmetic): pi, diag Z, c_jj, payoff and cooperation variances. Tolerance 1e-12 (1e-9 for the
    // 10-digit decimals: half a unit in the last printed digit).
    @Test
    void memoryOneExampleAsymptoticCovariance() {
        MarkovChain chain = MarkovChain.of(example());
        double[] pi = chain.structure().stationary();
        double d = 1483;
        Support.assertVector(new double[] {371 / d, 273 / d, 286 / d, 553 / d}, pi, 1e-12, "pi");
        double[][] z = FundamentalMatrix.fundamental(chain.transitionMatrix(), pi);
        double[] diag = {2.441604082, 0.9862091794, 0.9914285935, 1.985343445};
        for (int j = 0; j < 4; j++) {
            assertEquals(diag[j], z[j][j], 1e-9, "z_jj");
        }
        double[][] c = FundamentalMatrix.roundStateCovariance(chain);
        double d3 = d * d * d;
        double[] cjj = {2964328584.0 / d3, 473319210.0 / d3, 496910414.0 / d3, 3159454900.0 / d3};
        for (int j = 0; j < 4; j++) {
            assertEquals(cjj[j], c[j][j], 1e-12, "c_jj");
        }
        double[][] pay = FundamentalMatrix.payoffCovariance(chain, Support.PD);
        assertEquals(13586586090.0 / d3, pay[0][0], 1e-12);
        assertEquals(4.165689465, pay[0][0], 5e-10);
        assertEquals(4.658337878, pay[1][1], 5e-10);
        assertEquals(2.549052220, pay[0][1], 5e-10);
        assertEquals(2.087660148, Payoffs.of(Support.PD, chain.project(pi)).x(), 5e-10);
        double coop = c[0][0] + c[0][1] + c[1][0] + c[1][1];
        assertEquals(0.8910069672, coop, 5e-11);
    }

    static Stream<Arguments> varianceTable() {
        // REFERENCES.md item 7 brute-force table: exact Var(N_CC(n))/n from a stationary start. Its n = 1e5 entry
        // (0.9088495751) disagrees with c - K/n = 0.9088495577 built from its own c and K; an independent
        // 30-digit recursion (mpmath, O(n) sum of E[1(X_t=CC) 1(X_s=CC)]) gives 0.908849557725437807585988, which
        // is used here (computed independently in 30-digit arithmetic).
        return Stream.of(Arguments.of(10L, 0.6865558603), Arguments.of(100L, 0.8860856772),
            Arguments.of(1000L, 0.9065936777), Arguments.of(10_000L, 0.9086444777),
            Arguments.of(100_000L, 0.9088495577254378));
    }

    // Tolerance 5e-11: half a unit in the 10th printed digit.
    @ParameterizedTest
    @MethodSource("varianceTable")
    void exactCountVarianceFromStationaryStart(long n, double expected) {
        MarkovChain chain = MarkovChain.of(example());
        CountMoments m = CountMoments.rounds(chain, chain.structure().stationary(), n);
        assertEquals(expected, m.covariance()[0][0] / n, 5e-11);
        double c = FundamentalMatrix.roundStateCovariance(chain)[0][0];
        // REFERENCES.md item 7: |Var/n - c| <= 3/n
        assertTrue(Math.abs(m.covariance()[0][0] / n - c) <= 3.0 / n);
    }

    // Payoff variance of X over n rounds, Var/n. REFERENCES.md item 7 prints 4.165619841 (n = 1e5, stationary
    // start) and 4.165537157 (CC start); both disagree in the 6th digit with an independent 30-digit recursion
    // (mpmath), which gives 4.165622175314976 and 4.165539491996696 (n = 1e5) and 4.158960538481011 (n = 1000,
    // stationary); those are used (computed independently in 30-digit arithmetic). Relative tolerance 1e-11.
    @Test
    void exactPayoffVariance() {
        MarkovChain chain = MarkovChain.of(example());
        double[] u = Support.PD.payoffX();
        double[] pi = chain.structure().stationary();
        assertEquals(4.158960538481011, CountMoments.rounds(chain, pi, 1000).quadraticForm(u) / 1e3, 5e-11);
        assertEquals(4.165622175314976, CountMoments.rounds(chain, pi, 100_000).quadraticForm(u) / 1e5, 5e-11);
        assertEquals(4.165539491996696, CountMoments.rounds(chain, 1, 100_000).quadraticForm(u) / 1e5, 5e-11);
    }

    // Long games by doubling: n = 1e9 agrees with the asymptotic c_jj up to the O(1/n) term
    // (K/n = 2.3e-9 for CC, REFERENCES.md item 7; the other K_ab are of the same order, |K_ab| < 20), so 2e-8;
    // the K of CC is checked itself below to 1e-6 (the printed 10 digits); mean counts sum to n up to rounding
    // (30 doubling levels, 1e-14 relative).
    @Test
    void billionRounds() {
        MarkovChain chain = MarkovChain.of(example());
        long n = 1_000_000_000L;
        CountMoments m = CountMoments.rounds(chain, 1, n);
        double[][] c = FundamentalMatrix.roundStateCovariance(chain);
        for (int a = 0; a < 4; a++) {
            for (int b = 0; b < 4; b++) {
                assertEquals(c[a][b], m.covariance()[a][b] / n, 2e-8, "c_" + a + b);
            }
        }
        assertEquals(n, m.lengthMean(), 1e-14 * n);
        assertEquals(0, m.lengthVariance(), 1e-12 * n);
        // K itself (REFERENCES.md item 7: K = 2 pi_CC [(P - A) Z^2]_CC = 2.278666715 from a stationary start)
        double[] pi = chain.structure().stationary();
        double k = (c[0][0] - CountMoments.rounds(chain, pi, n).covariance()[0][0] / n) * n;
        assertEquals(2.278666715, k, 1e-6);
    }

    static Stream<Arguments> windows() {
        return Stream.of(
            Arguments.of(example(), 1L, 6L),
            Arguments.of(Support.match("wsls", "gtft", new Noise(0.05, 0.1, 0.02, 0.2)), 3L, 7L),
            Arguments.of(Support.match("tft@0.5", "tft@0.5", Noise.NONE), 1L, 6L),
            Arguments.of(Support.match("tf2t", "memory1:0.9,0.2,0.7,0.1", Noise.symmetric(0.05, 0)), 2L, 6L),
            Arguments.of(Support.match("tf2t", "wsls", Noise.symmetric(0.05, 0.1)), 2L, 4L));
    }

    // Exact moments against explicit enumeration of every chain path (all 4^t ... 16^t paths);
    // tolerance 1e-10 absolute on counts of at most 7 rounds: the enumeration adds up to 1e6 path terms
    // of size up to 49 one by one.
    @ParameterizedTest
    @MethodSource("windows")
    void countMomentsMatchPathEnumeration(Match match, long from, long to) {
        MarkovChain chain = MarkovChain.of(match);
        double[][] m = chain.transitionMatrix();
        double[] v = chain.initialDistribution();
        double[] mean = new double[4];
        double[][] second = new double[4][4];
        int[] counts = new int[4];
        for (int s = 0; s < v.length; s++) {
            paths(chain, m, s, v[s], 1, from, to, counts, mean, second);
        }
        CountMoments cm = CountMoments.rounds(chain, from, to);
        Support.assertVector(mean, cm.mean(), 1e-10, "mean");
        for (int a = 0; a < 4; a++) {
            for (int b = 0; b < 4; b++) {
                assertEquals(second[a][b] - mean[a] * mean[b], cm.covariance()[a][b], 1e-10, "cov " + a + b);
            }
        }
        Support.assertVector(mean, Frequencies.expectedCounts(chain, from, to), 1e-10, "expected counts");
    }

    private static void paths(MarkovChain chain, double[][] m, int state, double p, long t, long from, long to,
        int[] counts, double[] mean, double[][] second) {
        if (p == 0) {
            return;
        }
        int r = chain.roundState(state);
        if (t >= from) {
            counts[r]++;
        }
        if (t == to) {
            for (int a = 0; a < 4; a++) {
                mean[a] += p * counts[a];
                for (int b = 0; b < 4; b++) {
                    second[a][b] += p * counts[a] * counts[b];
                }
            }
        } else {
            for (int j = 0; j < m.length; j++) {
                paths(chain, m, j, p * m[state][j], t + 1, from, to, counts, mean, second);
            }
        }
        if (t >= from) {
            counts[r]--;
        }
    }

    // Medium window against the direct double sum over round pairs (t, s) with explicit matrix powers
    // (computed independently, O(n^2)). The direct sum forms E[N_a N_b] ~ n^2 from 8e4 summands and subtracts
    // the squared mean, so it is itself only good to about 1e-13 n^2: that is the tolerance.
    @Test
    void countMomentsMatchDirectDoubleSum() {
        MarkovChain chain = MarkovChain.of(Support.match("wsls", "memory1:0.9,0.5,0.2,0.1@0.7",
            new Noise(0.01, 0.03, 0.02, 0.0)));
        long from = 5;
        int n = 400;
        double[][] m = chain.transitionMatrix();
        double[][][] pow = new double[n][][];
        pow[0] = identity();
        for (int d = 1; d < n; d++) {
            pow[d] = multiply(pow[d - 1], m);
        }
        double[][] v = new double[n][];
        v[0] = chain.distributionAt(from);
        for (int t = 1; t < n; t++) {
            v[t] = Support.times(v[t - 1], m);
        }
        double[] mean = new double[4];
        double[][] second = new double[4][4];
        for (int t = 0; t < n; t++) {
            for (int a = 0; a < 4; a++) {
                mean[a] += v[t][a];
                second[a][a] += v[t][a];
            }
            for (int s = t + 1; s < n; s++) {
                for (int a = 0; a < 4; a++) {
                    for (int b = 0; b < 4; b++) {
                        double joint = v[t][a] * pow[s - t][a][b];
                        second[a][b] += joint;
                        second[b][a] += joint;
                    }
                }
            }
        }
        CountMoments cm = CountMoments.rounds(chain, from, from + n - 1);
        for (int a = 0; a < 4; a++) {
            assertEquals(mean[a], cm.mean()[a], 1e-12 * n);
            for (int b = 0; b < 4; b++) {
                double cov = second[a][b] - mean[a] * mean[b];
                assertEquals(cov, cm.covariance()[a][b], 1e-13 * n * n, "cov " + a + b);
            }
        }
    }

    static Stream<Arguments> geometric() {
        return Stream.of(Arguments.of(0.9, 0L), Arguments.of(0.9, 3L), Arguments.of(0.5, 1L), Arguments.of(0.0, 0L));
    }

    // Geometric length: E[N_a N_b] = sum_{t,s>b} delta^(max(t,s)-1) P(X_t = a, X_s = b), truncated at 700 rounds
    // (delta^700 < 1e-32), computed independently by the direct double sum; length moments from
    // P(L' = 0) = 1 - delta^b, P(L' = j) = delta^(b+j-1) (1 - delta) (computed independently in exact arithmetic).
    @ParameterizedTest
    @MethodSource("geometric")
    void geometricLengthMoments(double delta, long burnIn) {
        MarkovChain chain = MarkovChain.of(Support.match("wsls", "memory1:0.9,0.5,0.2,0.1@0.7",
            new Noise(0.01, 0.03, 0.02, 0.0)));
        int horizon = 700;
        double[][] m = chain.transitionMatrix();
        double[][][] pow = new double[horizon + 1][][];
        pow[0] = identity();
        for (int d = 1; d <= horizon; d++) {
            pow[d] = multiply(pow[d - 1], m);
        }
        double[] mean = new double[4];
        double[][] second = new double[4][4];
        double[] vt = chain.initialDistribution();
        for (int t = 1; t <= horizon; t++) {
            if (t > burnIn) {
                double wt = Math.pow(delta, t - 1);
                for (int a = 0; a < 4; a++) {
                    mean[a] += wt * vt[a];
                    second[a][a] += wt * vt[a];
                }
                for (int s = t + 1; s <= horizon; s++) {
                    double ws = Math.pow(delta, s - 1);
                    if (ws == 0) {
                        break;
                    }
                    for (int a = 0; a < 4; a++) {
                        for (int b = 0; b < 4; b++) {
                            double joint = ws * vt[a] * pow[s - t][a][b];
                            second[a][b] += joint;
                            second[b][a] += joint;
                        }
                    }
                }
            }
            vt = Support.times(vt, m);
        }
        CountMoments cm = CountMoments.continuation(chain, delta, burnIn);
        double scale = 1 / ((1 - delta) * (1 - delta));
        for (int a = 0; a < 4; a++) {
            assertEquals(mean[a], cm.mean()[a], 1e-12 * scale);
            for (int b = 0; b < 4; b++) {
                assertEquals(second[a][b] - mean[a] * mean[b], cm.covariance()[a][b], 1e-12 * scale, "cov " + a + b);
            }
        }
        double db = Math.pow(delta, burnIn);
        assertEquals(db / (1 - delta), cm.lengthMean(), 1e-12 * scale);
        assertEquals(db * (1 + delta) * scale - db * db * scale, cm.lengthVariance(), 1e-11 * scale);
    }

    @Test
    void nonErgodicChainsHaveNoAsymptoticCovariance() {
        MarkovChain chain = MarkovChain.of(Support.match("tft", "tft", Noise.NONE));
        assertNull(FundamentalMatrix.roundStateCovariance(chain));
        assertNull(FundamentalMatrix.payoffCovariance(chain, Support.PD));
        assertThrows(IllegalArgumentException.class, () -> CountMoments.rounds(chain, 3, 2));
        assertThrows(IllegalArgumentException.class, () -> CountMoments.continuation(chain, 1.0, 0));
        assertThrows(IllegalArgumentException.class, () -> CountMoments.continuation(chain, 0.5, -1));
        assertThrows(IllegalArgumentException.class, () -> CountMoments.rounds(chain, new double[3], 5));
    }

    private static double[][] scale(double[][] a, double f) {
        double[][] out = new double[a.length][a.length];
        for (int i = 0; i < a.length; i++) {
            for (int j = 0; j < a.length; j++) {
                out[i][j] = a[i][j] * f;
            }
        }
        return out;
    }

    private static double[][] identity() {
        double[][] id = new double[4][4];
        for (int i = 0; i < 4; i++) {
            id[i][i] = 1;
        }
        return id;
    }

    private static double[][] multiply(double[][] a, double[][] b) {
        double[][] out = new double[4][4];
        for (int i = 0; i < 4; i++) {
            for (int j = 0; j < 4; j++) {
                for (int l = 0; l < 4; l++) {
                    out[i][j] += a[i][l] * b[l][j];
                }
            }
        }
        return out;
    }
}
