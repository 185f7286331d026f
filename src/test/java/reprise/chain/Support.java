package reprise.chain;

import static org.junit.jupiter.api.Assertions.assertEquals;

import reprise.game.Match;
import reprise.game.MemoryStrategy;
import reprise.game.Noise;
import reprise.game.Player;
import reprise.game.StageGame;
import reprise.game.Strategies;
import reprise.game.Strategy;

/** Shared helpers for the chain tests. */
final class Support {
    static final StageGame PD = StageGame.DEFAULT;

    private Support() {
    }

    static Match match(String x, String y, Noise noise) {
        return new Match(PD, Strategies.parse(x, PD, Player.X), Strategies.parse(y, PD, Player.Y), noise);
    }

    static Match match(double[] p, double[] q, Noise noise) {
        return new Match(PD, MemoryStrategy.memoryOne("x", p, 1), MemoryStrategy.memoryOne("y", q, 1), noise);
    }

    static Match match(Strategy x, Strategy y, Noise noise) {
        return new Match(PD, x, y, noise);
    }

    static void assertVector(double[] expected, double[] actual, double tol, String what) {
        assertEquals(expected.length, actual.length, what + ": length");
        for (int i = 0; i < expected.length; i++) {
            assertEquals(expected[i], actual[i], tol, what + "[" + i + "]");
        }
    }

    static void assertMatrix(double[][] expected, double[][] actual, double tol, String what) {
        assertEquals(expected.length, actual.length, what + ": rows");
        for (int i = 0; i < expected.length; i++) {
            assertVector(expected[i], actual[i], tol, what + "[" + i + "]");
        }
    }

    static double[] times(double[] v, double[][] m) {
        double[] out = new double[m[0].length];
        for (int i = 0; i < v.length; i++) {
            for (int j = 0; j < out.length; j++) {
                out[j] += v[i] * m[i][j];
            }
        }
        return out;
    }

    /**
     * Independent event-by-event enumeration of the first {@code rounds} rounds of a match: each player
     * keeps an explicit list of (own realised move, perceived co-player move), reads its table with
     * pre-game rounds as CC, and every branch of intention, execution flip and misperception is followed.
     * Returns P(round t is in state s) for t = 1..rounds as rows.
     */
    static double[][] enumerate(Match match, int rounds) {
        MemoryStrategy x = (MemoryStrategy) match.x();
        MemoryStrategy y = (MemoryStrategy) match.y();
        double[][] out = new double[rounds][4];
        branch(x, y, match.noise(), new int[rounds][2], new int[rounds][2], 0, rounds, 1.0, out);
        return out;
    }

    /** rec[t] = {ownDefected, perceivedCoPlayerDefected} of round t. */
    private static void branch(MemoryStrategy x, MemoryStrategy y, Noise n, int[][] recX, int[][] recY, int t,
        int rounds, double prob, double[][] out) {
        if (t == rounds || prob == 0) {
            return;
        }
        double cx = t == 0 ? x.initial() : x.cooperation(index(recX, t, x.memory()));
        double cy = t == 0 ? y.initial() : y.cooperation(index(recY, t, y.memory()));
        for (int ix = 0; ix < 2; ix++) {
            double pix = ix == 0 ? cx : 1 - cx;
            for (int iy = 0; iy < 2; iy++) {
                double piy = iy == 0 ? cy : 1 - cy;
                for (int fx = 0; fx < 2; fx++) {
                    double pfx = fx == 0 ? 1 - n.executionX() : n.executionX();
                    for (int fy = 0; fy < 2; fy++) {
                        double pfy = fy == 0 ? 1 - n.executionY() : n.executionY();
                        int ax = ix ^ fx;
                        int ay = iy ^ fy;
                        for (int mx = 0; mx < 2; mx++) {
                            double pmx = mx == 0 ? 1 - n.perceptionX() : n.perceptionX();
                            for (int my = 0; my < 2; my++) {
                                double pmy = my == 0 ? 1 - n.perceptionY() : n.perceptionY();
                                double p = prob * pix * piy * pfx * pfy * pmx * pmy;
                                if (p == 0) {
                                    continue;
                                }
                                out[t][2 * ax + ay] += p;
                                recX[t][0] = ax;
                                recX[t][1] = ay ^ mx;
                                recY[t][0] = ay;
                                recY[t][1] = ax ^ my;
                                branch(x, y, n, recX, recY, t + 1, rounds, p, out);
                            }
                        }
                    }
                }
            }
        }
    }

    /** Table index from the explicit record before round t: latest round in the low bits, pre-game = CC. */
    private static int index(int[][] rec, int t, int memory) {
        int idx = 0;
        for (int back = 0; back < memory; back++) {
            int r = t - 1 - back;
            int code = r < 0 ? 0 : 2 * rec[r][0] + rec[r][1];
            idx += code << (2 * back);
        }
        return idx;
    }
}
