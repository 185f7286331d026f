package reprise.sim;

import reprise.game.MemoryStrategy;
import reprise.game.Noise;

/**
 * Exact expected per-game tallies by forward recursion of the joint distribution of both players'
 * records and the true last state, enumerating the 2^6 event combinations of each round (two intended
 * moves, two execution errors, two perception errors). Written for the tests only, independently of
 * the engine's kernels: it shares no code with them and never forms a transition matrix.
 *
 * <p>Expected per-game values: E[N_s] = sum_t w_t P(s_t = s) and E[N_{s->r}] = sum_t w_t
 * P(s_{t-1} = s, s_t = r) (rounds t &gt; b, resp. t &gt; b + 1), where w_t = 1 for t &le; n (fixed length n)
 * and w_t = delta^(t-1) = P(N &ge; t) for a geometric length, summed until delta^(t-1) &lt; 1e-15.
 */
final class ExactEnumeration {
    final double[] states = new double[4];
    final double[][] transitions = new double[4][4];

    ExactEnumeration(MemoryStrategy x, MemoryStrategy y, Noise noise, long fixedRounds, double delta, long burnIn) {
        int sizeX = x.size();
        int sizeY = y.size();
        // joint index: (rx * sizeY + ry) * 4 + last true state
        double[] p = new double[sizeX * sizeY * 4];
        double[] q = new double[p.length];
        double ex = noise.executionX();
        double ey = noise.executionY();
        double hx = noise.perceptionX();
        double hy = noise.perceptionY();
        p[0] = 1;
        for (long t = 1;; t++) {
            double w;
            if (fixedRounds > 0) {
                if (t > fixedRounds) {
                    break;
                }
                w = 1;
            } else {
                w = Math.pow(delta, t - 1);
                if (w < 1e-15) {
                    break;
                }
            }
            java.util.Arrays.fill(q, 0);
            for (int rx = 0; rx < sizeX; rx++) {
                for (int ry = 0; ry < sizeY; ry++) {
                    for (int last = 0; last < 4; last++) {
                        double mass = p[(rx * sizeY + ry) * 4 + last];
                        if (mass == 0) {
                            continue;
                        }
                        double cx = t == 1 ? x.initial() : x.cooperation(rx);
                        double cy = t == 1 ? y.initial() : y.cooperation(ry);
                        for (int e = 0; e < 64; e++) {
                            boolean intendX = (e & 1) == 0;
                            boolean intendY = (e & 2) == 0;
                            boolean flipX = (e & 4) != 0;
                            boolean flipY = (e & 8) != 0;
                            boolean misX = (e & 16) != 0;
                            boolean misY = (e & 32) != 0;
                            double pr = mass * (intendX ? cx : 1 - cx) * (intendY ? cy : 1 - cy)
                                * (flipX ? ex : 1 - ex) * (flipY ? ey : 1 - ey) * (misX ? hx : 1 - hx)
                                * (misY ? hy : 1 - hy);
                            if (pr == 0) {
                                continue;
                            }
                            boolean xc = intendX != flipX;
                            boolean yc = intendY != flipY;
                            boolean ySeen = yc != misX;
                            boolean xSeen = xc != misY;
                            int s = (xc ? 0 : 2) | (yc ? 0 : 1);
                            int nrx = ((rx << 2) | (xc ? 0 : 2) | (ySeen ? 0 : 1)) & (sizeX - 1);
                            int nry = ((ry << 2) | (yc ? 0 : 2) | (xSeen ? 0 : 1)) & (sizeY - 1);
                            q[(nrx * sizeY + nry) * 4 + s] += pr;
                            if (t > burnIn) {
                                states[s] += w * pr;
                            }
                            if (t > burnIn + 1) {
                                transitions[last][s] += w * pr;
                            }
                        }
                    }
                }
            }
            double[] tmp = p;
            p = q;
            q = tmp;
        }
    }
}
