package reprise.chain;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.LUDecomposition;
import org.apache.commons.math3.linear.RealMatrix;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.junit.jupiter.api.Test;
import reprise.game.Horizon;
import reprise.game.Match;
import reprise.game.MemoryStrategy;
import reprise.game.Noise;

/**
 * Acceptance check: 200 random memory-one pairs with random execution and perception errors per player,
 * both horizon kinds, against an independent implementation written here.
 */
class AcceptanceTest {

    private static final long SEED = 20240611L;

    // Independent implementation: the 4x4 matrix from explicit enumeration of perceptions, intended moves
    // and execution flips (64 joint events per state), solved with Commons Math LU; agreement to 1e-9
    // (the acceptance criterion; both sides are accurate to about 1e-13 for errors >= 1e-3).
    @Test
    void randomMemoryOnePairsAgreeWithAnIndependentImplementation() {
        UniformRandomProvider rng = RandomSource.SPLIT_MIX_64.create(SEED);
        for (int trial = 0; trial < 200; trial++) {
            double[] p = randomVector(rng);
            double[] q = randomVector(rng);
            double px0 = rng.nextDouble();
            double qy0 = rng.nextDouble();
            Noise noise = new Noise(0.001 + 0.1 * rng.nextDouble(), 0.001 + 0.1 * rng.nextDouble(),
                0.001 + 0.1 * rng.nextDouble(), 0.001 + 0.1 * rng.nextDouble());
            Match match = Support.match(MemoryStrategy.memoryOne("x", p, px0), MemoryStrategy.memoryOne("y", q, qy0),
                noise);
            String where = "trial " + trial + " (seed " + SEED + ")";
            double[][] m = independentMatrix(p, q, noise);
            double[] v1 = independentFirstRound(px0, qy0, noise);
            MarkovChain chain = MarkovChain.of(match);
            Support.assertMatrix(m, chain.transitionMatrix(), 1e-12, where + " M");
            double[] pi = independentStationary(m);
            Prediction pr = Prediction.of(match, null);
            Support.assertVector(pi, pr.stationary(), 1e-9, where + " pi");
            assertEquals(dot(pi, Support.PD.payoffX()), pr.stationaryPayoffs().x(), 1e-9, where);
            // Press & Dyson (2012) determinant formula with the noise folded into the vectors (ClosedForms)
            Payoffs det = ClosedForms.pressDyson(Support.PD, p, q, noise);
            assertEquals(pr.stationaryPayoffs().x(), det.x(), 1e-9, where + " determinant");
            assertEquals(pr.stationaryPayoffs().y(), det.y(), 1e-9, where + " determinant");
            // Nowak & Sigmund (1990) on the reactive parts (p_CC, p_CD) and (q_CC, q_CD), with the same noise
            Match reactive = Support.match(MemoryStrategy.reactive("x", p[0], p[1], px0),
                MemoryStrategy.reactive("y", q[0], q[1], qy0), noise);
            assertEquals(ClosedForms.reactive(Support.PD, p[0], p[1], q[0], q[1], noise).payoffs().x(),
                Prediction.of(reactive, null).stationaryPayoffs().x(), 1e-9, where + " reactive");
            int n = 1 + rng.nextInt(300);
            double[] fn = new double[4];
            double[] vt = v1.clone();
            for (int t = 0; t < n; t++) {
                for (int s = 0; s < 4; s++) {
                    fn[s] += vt[s] / n;
                }
                vt = Support.times(vt, m);
            }
            Prediction finite = Prediction.of(match, Horizon.rounds(n));
            Support.assertVector(fn, finite.horizon().frequencies(), 1e-9, where + " f_" + n);
            assertEquals(dot(fn, Support.PD.payoffY()), finite.horizon().payoffs().y(), 1e-9, where);
            double delta = 0.5 + 0.49 * rng.nextDouble();
            RealMatrix a = new Array2DRowRealMatrix(4, 4);
            for (int i = 0; i < 4; i++) {
                for (int j = 0; j < 4; j++) {
                    a.setEntry(j, i, (i == j ? 1 : 0) - delta * m[i][j]);
                }
            }
            double[] w = new LUDecomposition(a).getSolver().solve(new ArrayRealVector(v1)).mapMultiply(1 - delta)
                .toArray();
            Prediction disc = Prediction.of(match, Horizon.continuation(delta));
            Support.assertVector(w, disc.horizon().frequencies(), 1e-9, where + " delta " + delta);
        }
    }

    private static double[] randomVector(UniformRandomProvider rng) {
        return new double[] {rng.nextDouble(), rng.nextDouble(), rng.nextDouble(), rng.nextDouble()};
    }

    /** From true state (x, y): perceptions, intended moves, execution flips, each branch enumerated. */
    private static double[][] independentMatrix(double[] p, double[] q, Noise n) {
        double[][] m = new double[4][4];
        for (int s = 0; s < 4; s++) {
            int xd = s >> 1;
            int yd = s & 1;
            for (int seenY = 0; seenY < 2; seenY++) {
                double pSeenY = seenY == yd ? 1 - n.perceptionX() : n.perceptionX();
                for (int seenX = 0; seenX < 2; seenX++) {
                    double pSeenX = seenX == xd ? 1 - n.perceptionY() : n.perceptionY();
                    double cx = p[2 * xd + seenY];
                    double cy = q[2 * yd + seenX];
                    for (int ix = 0; ix < 2; ix++) {
                        for (int iy = 0; iy < 2; iy++) {
                            double pi = (ix == 0 ? cx : 1 - cx) * (iy == 0 ? cy : 1 - cy);
                            for (int fx = 0; fx < 2; fx++) {
                                for (int fy = 0; fy < 2; fy++) {
                                    double pf = (fx == 1 ? n.executionX() : 1 - n.executionX())
                                        * (fy == 1 ? n.executionY() : 1 - n.executionY());
                                    m[s][2 * (ix ^ fx) + (iy ^ fy)] += pSeenY * pSeenX * pi * pf;
                                }
                            }
                        }
                    }
                }
            }
        }
        return m;
    }

    private static double[] independentFirstRound(double px0, double qy0, Noise n) {
        double cx = (1 - n.executionX()) * px0 + n.executionX() * (1 - px0);
        double cy = (1 - n.executionY()) * qy0 + n.executionY() * (1 - qy0);
        return new double[] {cx * cy, cx * (1 - cy), (1 - cx) * cy, (1 - cx) * (1 - cy)};
    }

    /** Solves pi (M - I) = 0 with the last equation replaced by sum pi = 1. */
    private static double[] independentStationary(double[][] m) {
        RealMatrix a = new Array2DRowRealMatrix(4, 4);
        double[] b = new double[4];
        for (int i = 0; i < 4; i++) {
            for (int j = 0; j < 4; j++) {
                a.setEntry(j, i, m[i][j] - (i == j ? 1 : 0));
            }
        }
        for (int i = 0; i < 4; i++) {
            a.setEntry(3, i, 1);
        }
        b[3] = 1;
        return new LUDecomposition(a).getSolver().solve(new ArrayRealVector(b)).toArray();
    }

    private static double dot(double[] a, double[] b) {
        double s = 0;
        for (int i = 0; i < a.length; i++) {
            s += a[i] * b[i];
        }
        return s;
    }
}
