package reprise.sim;

import reprise.game.MemoryStrategy;
import reprise.game.Noise;
import reprise.game.State;

/**
 * The decision limits of two memory-one players on the fused path, shared by {@link FusedMemoryOneKernel}
 * and {@link LockstepKernel} so that both decide every round from the same integers.
 *
 * <p>X cooperates in a round after true state s (X's view) iff the high 32 bits of the round's draw,
 * read unsigned, are at most {@code limitX[s]}, and Y iff the low 32 bits are at most {@code limitY[s]};
 * a limit is T - 1 for the threshold T = round(c 2^32) of the folded cooperation probability c (see
 * {@link FusedMemoryOneKernel}), so it lies in [-1, 2^32 - 1]. Round 1 uses {@code firstLimitX} and
 * {@code firstLimitY} the same way.
 */
record FusedTables(long[] limitX, long[] limitY, long firstLimitX, long firstLimitY) {

    static FusedTables of(MemoryStrategy x, MemoryStrategy y, Noise noise) {
        double ex = noise.executionX();
        double ey = noise.executionY();
        double hx = noise.perceptionX();
        double hy = noise.perceptionY();
        long[] lx = new long[4];
        long[] ly = new long[4];
        for (int s = 0; s < 4; s++) {
            double qx = (1 - hx) * x.cooperation(s) + hx * x.cooperation(s ^ 1);
            int m = State.mirror(s);
            double qy = (1 - hy) * y.cooperation(m) + hy * y.cooperation(m ^ 1);
            lx[s] = threshold(execute(qx, ex)) - 1;
            ly[s] = threshold(execute(qy, ey)) - 1;
        }
        return new FusedTables(lx, ly, threshold(execute(x.initial(), ex)) - 1,
            threshold(execute(y.initial(), ey)) - 1);
    }

    static double execute(double intended, double e) {
        return (1 - e) * intended + e * (1 - intended);
    }

    static long threshold(double p) {
        return Math.max(0, Math.min(1L << 32, Math.round(p * 0x1p32)));
    }
}
