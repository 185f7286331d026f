package reprise.sim;

import reprise.game.Noise;

/**
 * The literal path for any agents (custom agents, or table agents when asked): the same events and
 * draw order as {@link LiteralTableKernel}, with the intended moves asked of the {@link Agent}s, which
 * draw from the replicate's stream themselves (X first, then Y).
 */
final class AgentKernel extends Kernel {
    private final Agent x;
    private final Agent y;
    private final int maskTrue;
    private final double ex;
    private final double ey;
    private final double hx;
    private final double hy;
    private int history;

    AgentKernel(Plan plan, Accumulator acc, Agent x, Agent y, Noise noise) {
        super(plan, acc);
        this.x = x;
        this.y = y;
        maskTrue = acc.historySize - 1;
        ex = noise.executionX();
        ey = noise.executionY();
        hx = noise.perceptionX();
        hy = noise.perceptionY();
    }

    @Override
    void beginGame() {
        x.startGame();
        y.startGame();
        history = 0;
    }

    private boolean event(double p) {
        return p >= 1 || (p > 0 && rng.nextDouble() < p);
    }

    @Override
    void play(long count, int mode, long offset) {
        final long[] counts = acc.states;
        final long[] steps = acc.steps;
        final long[] time = acc.timeCounts;
        int h = history;
        int s = lastState;
        for (long t = offset, end = offset + count; t < end; t++) {
            boolean xc = x.intendsToCooperate(rng);
            boolean yc = y.intendsToCooperate(rng);
            if (event(ex)) {
                xc = !xc;
            }
            if (event(ey)) {
                yc = !yc;
            }
            boolean ySeenByX = event(hx) != yc;
            boolean xSeenByY = event(hy) != xc;
            x.record(xc, ySeenByX);
            y.record(yc, xSeenByY);
            s = (xc ? 0 : 2) | (yc ? 0 : 1);
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
        history = h;
        lastState = s;
    }
}
