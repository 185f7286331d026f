package reprise.sim;

/**
 * The fast path for two memory-one players (reactive strategies included): one 64-bit draw per round.
 *
 * <p>Implementation note. A memory-one player's next intention depends only on its perception of the
 * last round, and a perception is a fresh independent misreading of the true last round. So, given the
 * true state s (X's view) of the last round, X cooperates with probability
 * c_X(s) = (1 - e_X) q_X(s) + e_X (1 - q_X(s)), q_X(s) = (1 - h_X) p_X(s) + h_X p_X(s xor 1), and Y,
 * whose own view of s is m = mirror(s), with c_Y(s) = (1 - e_Y) q_Y(m) + e_Y (1 - q_Y(m)),
 * q_Y(m) = (1 - h_Y) p_Y(m) + h_Y p_Y(m xor 1); the two moves are independent given s. These are the
 * same events as the literal path, summed over the unobserved intention and perception. Each round
 * takes one {@code nextLong()}; X cooperates iff its high 32 bits, read unsigned, are below
 * round(c_X(s) 2^32), and Y iff the low 32 bits are below round(c_Y(s) 2^32). Probabilities are thus
 * quantised to multiples of 2^-32 (error at most 2^-33; 0 and 1 exactly). Round 1 uses the folded first
 * moves (1 - e) p0 + e (1 - p0). No allocation, boxing or virtual call per round.
 *
 * <p>Speed: the only loop-carried dependency is the state, so the round loop is built around a short
 * chain. Each threshold T is stored as the limit T - 1, and a player defects iff limit - draw is
 * negative, so the state is two sign bits with no branch (u &lt; T iff T - 1 - u &gt;= 0 for integers
 * 0 &lt;= u &lt; 2^32 and 0 &lt;= T &lt;= 2^32, the same decision as before). The generator state lives in
 * locals. Tallied rounds after the first count one transition each, in a padded kernel-owned array
 * indexed 4 previous + current; at the end of each call the transitions are added to the step tallies
 * and their column sums to the state counts (every such round's state is the current state of exactly
 * one transition). The padding keeps the counters of two workers off shared cache lines.
 */
final class FusedMemoryOneKernel extends Kernel {
    /** Padding (in longs) either side of the transition counters, two 64-byte cache lines. */
    private static final int PAD = 16;

    private final long[] limitX;
    private final long[] limitY;
    private final long firstLimitX;
    private final long firstLimitY;
    /** Transitions of the current call at PAD + 4 previous + current; zero between calls. */
    private final long[] transitions = new long[16 + 2 * PAD];
    private int state;
    private boolean fresh;

    FusedMemoryOneKernel(Plan plan, Accumulator acc, FusedTables tables) {
        super(plan, acc);
        limitX = tables.limitX().clone();
        limitY = tables.limitY().clone();
        firstLimitX = tables.firstLimitX();
        firstLimitY = tables.firstLimitY();
    }

    @Override
    void beginGame() {
        fresh = true;
    }

    @Override
    void play(long count, int mode, long offset) {
        long s0 = rng.state0;
        long s1 = rng.state1;
        int s = state;
        final long[] lx = limitX;
        final long[] ly = limitY;
        final long[] counts = acc.states;
        final long[] time = acc.timeCounts;
        long left = count;
        long t = offset;
        if (fresh) {
            fresh = false;
            long r = Long.rotateLeft(s0 + s1, 17) + s0;
            s1 ^= s0;
            s0 = Long.rotateLeft(s0, 49) ^ s1 ^ (s1 << 21);
            s1 = Long.rotateLeft(s1, 28);
            int ns = (int) (((firstLimitX - (r >>> 32)) >>> 63) << 1) | (int) ((firstLimitY - (r & 0xFFFFFFFFL)) >>> 63);
            if ((mode & TALLY) != 0) {
                counts[ns]++;
            }
            if ((mode & TIME) != 0) {
                time[(int) (4 * t + ns)]++;
            }
            s = ns;
            left--;
            t++;
        }
        if (mode == (TALLY | STEP)) {
            final long[] tr = transitions;
            while (left > 0) {
                int block = (int) Math.min(left, 1 << 30);
                for (int i = 0; i < block; i++) {
                    long r = Long.rotateLeft(s0 + s1, 17) + s0;
                    s1 ^= s0;
                    s0 = Long.rotateLeft(s0, 49) ^ s1 ^ (s1 << 21);
                    s1 = Long.rotateLeft(s1, 28);
                    int ns = (int) (((lx[s] - (r >>> 32)) >>> 63) << 1) | (int) ((ly[s] - (r & 0xFFFFFFFFL)) >>> 63);
                    tr[PAD + ((s << 2) | ns)]++;
                    s = ns;
                }
                left -= block;
            }
            flushTransitions();
        } else {
            final long[] steps = acc.steps;
            for (; left > 0; left--, t++) {
                long r = Long.rotateLeft(s0 + s1, 17) + s0;
                s1 ^= s0;
                s0 = Long.rotateLeft(s0, 49) ^ s1 ^ (s1 << 21);
                s1 = Long.rotateLeft(s1, 28);
                int ns = (int) (((lx[s] - (r >>> 32)) >>> 63) << 1) | (int) ((ly[s] - (r & 0xFFFFFFFFL)) >>> 63);
                if ((mode & TALLY) != 0) {
                    counts[ns]++;
                }
                if ((mode & STEP) != 0) {
                    steps[(s << 2) | ns]++;
                }
                if ((mode & TIME) != 0) {
                    time[(int) (4 * t + ns)]++;
                }
                s = ns;
            }
        }
        state = s;
        lastState = s;
        rng.state0 = s0;
        rng.state1 = s1;
    }

    private void flushTransitions() {
        final long[] tr = transitions;
        final long[] steps = acc.steps;
        final long[] counts = acc.states;
        for (int i = 0; i < 16; i++) {
            long n = tr[PAD + i];
            steps[i] += n;
            counts[i & 3] += n;
            tr[PAD + i] = 0;
        }
    }
}
