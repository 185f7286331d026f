package reprise.sim;

import reprise.game.MemoryStrategy;
import reprise.game.Noise;

/**
 * The literal path for two lookup-table players of any memory, with the records kept as ints.
 *
 * <p>Each round enacts the events one by one, each with its own uniform draw {@code nextDouble()}, in
 * this order: X's intended move, Y's intended move, X's execution error, Y's execution error, X's
 * perception of Y, Y's perception of X. An event whose probability is exactly 0 or 1 takes no draw.
 * X's record is its own-view history index (own realised move, Y's move as X perceived it), likewise
 * Y's; both are padded with CC before round 1. The true history from X's view is kept separately for
 * the history tallies. {@link AgentKernel} with table agents makes exactly the same draws.
 */
final class LiteralTableKernel extends Kernel {
    private final double[] tableX;
    private final double[] tableY;
    private final double initialX;
    private final double initialY;
    private final int maskX;
    private final int maskY;
    private final int maskTrue;
    private final double ex;
    private final double ey;
    private final double hx;
    private final double hy;
    private int recordX;
    private int recordY;
    private int history;
    private boolean fresh;

    LiteralTableKernel(Plan plan, Accumulator acc, MemoryStrategy x, MemoryStrategy y, Noise noise) {
        super(plan, acc);
        tableX = x.table();
        tableY = y.table();
        initialX = x.initial();
        initialY = y.initial();
        maskX = tableX.length - 1;
        maskY = tableY.length - 1;
        maskTrue = acc.historySize - 1;
        ex = noise.executionX();
        ey = noise.executionY();
        hx = noise.perceptionX();
        hy = noise.perceptionY();
    }

    @Override
    void beginGame() {
        recordX = 0;
        recordY = 0;
        history = 0;
        fresh = true;
    }

    private boolean event(double p) {
        return p >= 1 || (p > 0 && rng.nextDouble() < p);
    }

    @Override
    void play(long count, int mode, long offset) {
        final ReplicateStream g = rng;
        final double[] tx = tableX;
        final double[] ty = tableY;
        final long[] counts = acc.states;
        final long[] steps = acc.steps;
        final long[] time = acc.timeCounts;
        int rx = recordX;
        int ry = recordY;
        int h = history;
        int s = lastState;
        for (long t = offset, end = offset + count; t < end; t++) {
            double px = fresh ? initialX : tx[rx];
            double py = fresh ? initialY : ty[ry];
            fresh = false;
            boolean xc = px >= 1 || (px > 0 && g.nextDouble() < px);
            boolean yc = py >= 1 || (py > 0 && g.nextDouble() < py);
            if (event(ex)) {
                xc = !xc;
            }
            if (event(ey)) {
                yc = !yc;
            }
            boolean ySeenByX = event(hx) != yc;
            boolean xSeenByY = event(hy) != xc;
            s = (xc ? 0 : 2) | (yc ? 0 : 1);
            rx = ((rx << 2) | (xc ? 0 : 2) | (ySeenByX ? 0 : 1)) & maskX;
            ry = ((ry << 2) | (yc ? 0 : 2) | (xSeenByY ? 0 : 1)) & maskY;
            if ((mode & TALLY) != 0) {
                counts[s]++;
            }
            if ((mode & STEP) != 0) {
                steps[(h << 2) | s]++;
            }
            if ((mode & TIME) != 0) {
                time[(int) (4 * t + s)]++;
            }
            h = ((h << 2) | s) & maskTrue;
        }
        recordX = rx;
        recordY = ry;
        history = h;
        lastState = s;
    }
}
