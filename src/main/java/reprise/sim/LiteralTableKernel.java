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
 *
 * <p>Implementation note. An event of probability p is coded once, at set-up, as
 * (L, draws): draws iff 0 &lt; p &lt; 1, and L = ceil(p 2^53) then, L = 2^53 for p &gt;= 1 and 0 otherwise.
 * For the 53-bit integer k = nextLong() &gt;&gt;&gt; 11 the test {@code nextDouble() < p}, i.e.
 * k 2^-53 &lt; p, is exactly k &lt; L (k 2^-53 and p 2^53 are exact in binary64), so every event is
 * decided as the sign bit of k - L without a branch, from the output the generator would give next;
 * the generator is advanced only if the event draws. Each round still makes the same draws in the same
 * order, so games are draw-for-draw those of the plain formulation. The generator state is kept in
 * locals during a call, and round 1 reads its first-move code from an extra table entry at index 4^n,
 * which the record update (shift by one round, masked to 4^n - 1) turns into the CC-padded history.
 */
final class LiteralTableKernel extends Kernel {
    /** The limit of an event that always happens: every 53-bit k is below it. */
    private static final long ALWAYS = 1L << 53;

    /** Per own-view history, then the first move at index 4^n: (L &lt;&lt; 1) | draws. */
    private final long[] codeX;
    private final long[] codeY;
    private final int maskX;
    private final int maskY;
    private final int maskTrue;
    private final long executionX;
    private final long executionY;
    private final long perceptionX;
    private final long perceptionY;
    private int recordX;
    private int recordY;
    private int history;

    LiteralTableKernel(Plan plan, Accumulator acc, MemoryStrategy x, MemoryStrategy y, Noise noise) {
        super(plan, acc);
        codeX = codes(x);
        codeY = codes(y);
        maskX = codeX.length - 2;
        maskY = codeY.length - 2;
        maskTrue = acc.historySize - 1;
        executionX = code(noise.executionX());
        executionY = code(noise.executionY());
        perceptionX = code(noise.perceptionX());
        perceptionY = code(noise.perceptionY());
    }

    private static long[] codes(MemoryStrategy m) {
        double[] table = m.table();
        long[] c = new long[table.length + 1];
        for (int i = 0; i < table.length; i++) {
            c[i] = code(table[i]);
        }
        c[table.length] = code(m.initial());
        return c;
    }

    /** The event code (L &lt;&lt; 1) | draws of a probability, as in the class note. */
    static long code(double p) {
        if (p >= 1) {
            return ALWAYS << 1;
        }
        if (!(p > 0)) {
            return 0;
        }
        return ((long) Math.ceil(p * 0x1p53) << 1) | 1;
    }

    @Override
    void beginGame() {
        recordX = maskX + 1;
        recordY = maskY + 1;
        history = 0;
    }

    @Override
    void play(long count, int mode, long offset) {
        final long[] cx = codeX;
        final long[] cy = codeY;
        final int mx = maskX;
        final int my = maskY;
        final int mt = maskTrue;
        final long ex = executionX;
        final long ey = executionY;
        final long hx = perceptionX;
        final long hy = perceptionY;
        final boolean tally = (mode & TALLY) != 0;
        final boolean step = (mode & STEP) != 0;
        final boolean timed = (mode & TIME) != 0;
        final long[] counts = acc.states;
        final long[] steps = acc.steps;
        final long[] time = acc.timeCounts;
        long s0 = rng.state0;
        long s1 = rng.state1;
        int rx = recordX;
        int ry = recordY;
        int h = history;
        int s = lastState;
        // Each event: r is the generator's next output; the state advances only if the event draws
        // (low bit of its code); the event happens iff (r >>> 11) < L, the sign bit of the difference.
        for (long t = offset, end = offset + count; t < end; t++) {
            long c = cx[rx];
            long r = Long.rotateLeft(s0 + s1, 17) + s0;
            if ((c & 1) != 0) {
                s1 ^= s0;
                s0 = Long.rotateLeft(s0, 49) ^ s1 ^ (s1 << 21);
                s1 = Long.rotateLeft(s1, 28);
            }
            int dx = (int) (((r >>> 11) - (c >>> 1)) >>> 63) ^ 1;
            c = cy[ry];
            r = Long.rotateLeft(s0 + s1, 17) + s0;
            if ((c & 1) != 0) {
                s1 ^= s0;
                s0 = Long.rotateLeft(s0, 49) ^ s1 ^ (s1 << 21);
                s1 = Long.rotateLeft(s1, 28);
            }
            int dy = (int) (((r >>> 11) - (c >>> 1)) >>> 63) ^ 1;
            r = Long.rotateLeft(s0 + s1, 17) + s0;
            if ((ex & 1) != 0) {
                s1 ^= s0;
                s0 = Long.rotateLeft(s0, 49) ^ s1 ^ (s1 << 21);
                s1 = Long.rotateLeft(s1, 28);
            }
            dx ^= (int) (((r >>> 11) - (ex >>> 1)) >>> 63);
            r = Long.rotateLeft(s0 + s1, 17) + s0;
            if ((ey & 1) != 0) {
                s1 ^= s0;
                s0 = Long.rotateLeft(s0, 49) ^ s1 ^ (s1 << 21);
                s1 = Long.rotateLeft(s1, 28);
            }
            dy ^= (int) (((r >>> 11) - (ey >>> 1)) >>> 63);
            r = Long.rotateLeft(s0 + s1, 17) + s0;
            if ((hx & 1) != 0) {
                s1 ^= s0;
                s0 = Long.rotateLeft(s0, 49) ^ s1 ^ (s1 << 21);
                s1 = Long.rotateLeft(s1, 28);
            }
            int ySeenDefectingByX = dy ^ (int) (((r >>> 11) - (hx >>> 1)) >>> 63);
            r = Long.rotateLeft(s0 + s1, 17) + s0;
            if ((hy & 1) != 0) {
                s1 ^= s0;
                s0 = Long.rotateLeft(s0, 49) ^ s1 ^ (s1 << 21);
                s1 = Long.rotateLeft(s1, 28);
            }
            int xSeenDefectingByY = dx ^ (int) (((r >>> 11) - (hy >>> 1)) >>> 63);
            s = (dx << 1) | dy;
            rx = ((rx << 2) | (dx << 1) | ySeenDefectingByX) & mx;
            ry = ((ry << 2) | (dy << 1) | xSeenDefectingByY) & my;
            if (tally) {
                counts[s]++;
            }
            if (step) {
                steps[(h << 2) | s]++;
            }
            if (timed) {
                time[(int) (4 * t + s)]++;
            }
            h = ((h << 2) | s) & mt;
        }
        rng.state0 = s0;
        rng.state1 = s1;
        recordX = rx;
        recordY = ry;
        history = h;
        lastState = s;
    }
}
