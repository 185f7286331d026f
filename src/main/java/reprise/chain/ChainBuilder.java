package reprise.chain;

import reprise.game.CustomStrategy;
import reprise.game.Match;
import reprise.game.MemoryStrategy;
import reprise.game.Noise;
import reprise.game.State;
import reprise.game.Strategy;

/**
 * Builds the transition matrix and first-round distribution of a match, following the event order of
 * {@link Noise}: intended move from the player's record, execution error, payoffs, then recording of the
 * own realised move and the (possibly misread) co-player move.
 *
 * <p>Implementation note. Every probability is formed as a sum of products of non-negative factors:
 * the probability of cooperating and of defecting are each computed directly, (1 - e) c + e (1 - c) and
 * (1 - e)(1 - c) + e c, never one as 1 minus the other, so tiny transition probabilities (noise 1e-8
 * and its squares) keep full relative precision, which the GTH reduction then preserves.
 */
final class ChainBuilder {
    private ChainBuilder() {
    }

    static MarkovChain build(Match match) {
        MemoryStrategy x = memoryStrategy(match.x(), "X");
        MemoryStrategy y = memoryStrategy(match.y(), "Y");
        Noise noise = match.noise();
        int n = Math.max(x.memory(), y.memory());
        boolean xRecord = noise.perceptionX() > 0 && x.memory() >= 2;
        boolean yRecord = noise.perceptionY() > 0 && y.memory() >= 2;
        if (xRecord || yRecord) {
            long size = 1L << (4 * n);
            if (size > MarkovChain.MAX_STATES) {
                throw new NoPredictionException("no exact prediction for " + x.label() + " vs " + y.label()
                    + " with perception errors: a memory-" + n + " player that misperceives must be tracked by "
                    + "both players' private records, " + size + " joint states, above the limit of "
                    + MarkovChain.MAX_STATES);
            }
            return records(match, x.extendTo(n), y.extendTo(n), n);
        }
        return histories(match, x.extendTo(n), y.extendTo(n), n);
    }

    private static MemoryStrategy memoryStrategy(Strategy s, String who) {
        if (s instanceof CustomStrategy c) {
            throw new NoPredictionException("no exact prediction for " + c.label()
                + ": user-written agents have no Markov chain (player " + who + ")");
        }
        return (MemoryStrategy) s;
    }

    /** {probability of cooperating, of defecting} after execution error e of intended cooperation (c, 1-c). */
    private static double[] execute(double c, double d, double e) {
        return new double[] {(1 - e) * c + e * d, (1 - e) * d + e * c};
    }

    /** Mirrors every round of a history index (X's view to Y's view and back). */
    static int mirrorHistory(int h, int n) {
        int out = 0;
        for (int r = 0; r < n; r++) {
            out |= State.mirror((h >> (2 * r)) & 3) << (2 * r);
        }
        return out;
    }

    /**
     * Intended {cooperate, defect} of a player reading the true history {@code own} (own view). A memory-one
     * player with perception error h reads the last round's co-player move wrongly with probability h.
     */
    private static double[] intended(MemoryStrategy s, int own, int memory, double h) {
        if (memory == 1 && h > 0) {
            int last = own & 3;
            int misread = last ^ 1;
            int hi = own & ~3;
            double c = (1 - h) * s.cooperation(hi | last) + h * s.cooperation(hi | misread);
            double d = (1 - h) * (1 - s.cooperation(hi | last)) + h * (1 - s.cooperation(hi | misread));
            return new double[] {c, d};
        }
        double c = s.cooperation(own);
        return new double[] {c, 1 - c};
    }

    private static MarkovChain histories(Match match, MemoryStrategy x, MemoryStrategy y, int n) {
        Noise noise = match.noise();
        int size = 1 << (2 * n);
        int mask = size - 1;
        int xMemory = ((MemoryStrategy) match.x()).memory();
        int yMemory = ((MemoryStrategy) match.y()).memory();
        double[][] m = new double[size][size];
        for (int h = 0; h < size; h++) {
            double[] ix = intended(x, h, xMemory, noise.perceptionX());
            double[] iy = intended(y, mirrorHistory(h, n), yMemory, noise.perceptionY());
            double[] ax = execute(ix[0], ix[1], noise.executionX());
            double[] ay = execute(iy[0], iy[1], noise.executionY());
            for (int s = 0; s < 4; s++) {
                m[h][((h << 2) | s) & mask] += ax[s >> 1] * ay[s & 1];
            }
        }
        double[] ax = execute(x.initial(), 1 - x.initial(), noise.executionX());
        double[] ay = execute(y.initial(), 1 - y.initial(), noise.executionY());
        double[] v = new double[size];
        for (int s = 0; s < 4; s++) {
            v[s] = ax[s >> 1] * ay[s & 1];
        }
        int[] round = new int[size];
        String[] labels = new String[size];
        for (int h = 0; h < size; h++) {
            round[h] = h & 3;
            StringBuilder sb = new StringBuilder();
            for (int r = n - 1; r >= 0; r--) {
                sb.append(sb.length() == 0 ? "" : " ").append(State.of((h >> (2 * r)) & 3));
            }
            labels[h] = sb.toString();
        }
        return new MarkovChain(match, n == 1 ? MarkovChain.Kind.ROUND_STATES : MarkovChain.Kind.TRUE_HISTORIES, n,
            m, v, round, labels);
    }

    private static MarkovChain records(Match match, MemoryStrategy x, MemoryStrategy y, int n) {
        Noise noise = match.noise();
        int rec = 1 << (2 * n);
        int mask = rec - 1;
        int size = rec * rec;
        double hx = noise.perceptionX();
        double hy = noise.perceptionY();
        double[] seeX = {1 - hx, hx};
        double[] seeY = {1 - hy, hy};
        double[][] m = new double[size][size];
        for (int xr = 0; xr < rec; xr++) {
            for (int yr = 0; yr < rec; yr++) {
                double cx = x.cooperation(xr);
                double cy = y.cooperation(yr);
                double[] ax = execute(cx, 1 - cx, noise.executionX());
                double[] ay = execute(cy, 1 - cy, noise.executionY());
                addOutcomes(m[xr + rec * yr], ax, ay, seeX, seeY, xr, yr, mask, rec);
            }
        }
        double[] ax = execute(x.initial(), 1 - x.initial(), noise.executionX());
        double[] ay = execute(y.initial(), 1 - y.initial(), noise.executionY());
        double[] v = new double[size];
        addOutcomes(v, ax, ay, seeX, seeY, 0, 0, mask, rec);
        int[] round = new int[size];
        String[] labels = new String[size];
        for (int i = 0; i < size; i++) {
            int xr = i % rec;
            int yr = i / rec;
            round[i] = (((xr >> 1) & 1) << 1) | ((yr >> 1) & 1);
            labels[i] = "x:" + record(xr, n) + " y:" + record(yr, n);
        }
        return new MarkovChain(match, MarkovChain.Kind.PLAYER_RECORDS, n, m, v, round, labels);
    }

    /** Adds the 16 outcomes (realised moves x perceptions) of one round to a row. */
    private static void addOutcomes(double[] row, double[] ax, double[] ay, double[] seeX, double[] seeY, int xr,
        int yr, int mask, int rec) {
        for (int dx = 0; dx < 2; dx++) {
            for (int dy = 0; dy < 2; dy++) {
                double moves = ax[dx] * ay[dy];
                for (int fx = 0; fx < 2; fx++) {
                    for (int fy = 0; fy < 2; fy++) {
                        int perceivedY = dy ^ fx;
                        int perceivedX = dx ^ fy;
                        int nx = ((xr << 2) | (dx << 1) | perceivedY) & mask;
                        int ny = ((yr << 2) | (dy << 1) | perceivedX) & mask;
                        row[nx + rec * ny] += moves * seeX[fx] * seeY[fy];
                    }
                }
            }
        }
    }

    private static String record(int r, int n) {
        StringBuilder sb = new StringBuilder();
        for (int i = n - 1; i >= 0; i--) {
            sb.append(sb.length() == 0 ? "" : ".").append(State.of((r >> (2 * i)) & 3));
        }
        return sb.toString();
    }
}
