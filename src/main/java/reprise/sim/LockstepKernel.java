package reprise.sim;

/**
 * The fused memory-one path for a fixed horizon, played by a block of games in lockstep: round t of
 * every game in the block, then round t + 1. Each game makes exactly the draws and decisions of
 * {@link FusedMemoryOneKernel} (one {@code nextLong()} of its own stream per round, the same
 * {@link FusedTables} limits), so results are bit-identical to that kernel's; only the order of work
 * differs.
 *
 * <p>Implementation note. Games are laid out one per array slot ("lane"): the two generator words, and
 * each player's last move as a mask (0 cooperated, -1 defected). A round is up to three loops over the
 * lanes without branches, calls or cross-lane dependencies, which the JIT compiles to SIMD instructions; a
 * single game's round loop cannot be, because each round depends on the last.
 * <ol>
 * <li>Draw (every other round): step each lane's XoRoShiRo128++ words twice, keeping this round's and the
 * next round's outputs.</li>
 * <li>Decide: pick the limits of the last state s = 2 xD + yD from the masks,
 * L(s) = L0 + (my &amp; (L1 - L0)) + (mx &amp; (L2 - L0 + (my &amp; (L3 - L2 - L1 + L0)))), exact in
 * 64-bit integers since limits lie in [-1, 2^32 - 1]; a player defects iff L(s) - u &lt; 0 for its 32
 * bits u of the draw, and the sign, spread by an arithmetic shift, is its new mask. When no limit is -1
 * the two players' limits are packed in one word and selected once ({@link DecidePacked}).</li>
 * <li>Count: a tallied transition from s to s' adds 1 &lt;&lt; 4 (4 s + s') to the lane's 64-bit word
 * of sixteen 4-bit counters ({@link LaneCounters}, which spills them and turns them into the block's
 * tallies). The shift is built from the four masks by conditional constant shifts (a branch-free choice
 * of v or v &lt;&lt; k per mask), because a per-lane variable shift does not vectorise here.</li>
 * </ol>
 * Burn-in rounds are decided but not counted; snapshot and time-resolved rounds are counted from the
 * masks by a plain loop over the lanes.
 */
final class LockstepKernel extends Worker {
    /** Games per block: the lane arrays (about 12 longs per lane) stay in a 32 KiB L1 data cache. */
    static final int LANES = 256;
    private static final long LOW32 = 0xFFFFFFFFL;

    private final Plan plan;
    private final long limitX0;
    private final long limitX1;
    private final long limitX2;
    private final long limitX3;
    private final long limitY0;
    private final long limitY1;
    private final long limitY2;
    private final long limitY3;
    /** Packed selection coefficients of {@link DecidePacked}, when {@link #packs()}. */
    private final long packed0;
    private final long packed1;
    private final long packed2;
    private final long packed3;
    private final boolean packs;
    private final long firstX;
    private final long firstY;

    private final long[] word0 = new long[LANES];
    private final long[] word1 = new long[LANES];
    /** This round's output of each lane's generator. */
    private long[] draws = new long[LANES];
    /** The next round's, when {@link #drawn}. */
    private long[] ahead = new long[LANES];
    private long[] lastX = new long[LANES];
    private long[] lastY = new long[LANES];
    private long[] nextX = new long[LANES];
    private long[] nextY = new long[LANES];
    private final ReplicateStream seeder = new ReplicateStream();
    private final LaneCounters counters;
    private final Pass[] drawCountRound;
    private final Pass[] drawDecideRound;
    private final Pass[] countRound;
    private final Pass[] decideRound;
    /** Whether {@code ahead} holds every lane's draw for the next round. */
    private boolean drawn;

    LockstepKernel(Plan plan, Accumulator acc, FusedTables tables) {
        this(plan, acc, tables, LaneCounters.BLOCK_STATISTICS_LENGTH);
    }

    /** With another limit for per-block statistics (a testing hook for the per-game branch). */
    LockstepKernel(Plan plan, Accumulator acc, FusedTables tables, long blockStatisticsLength) {
        super(acc);
        counters = new LaneCounters(LANES, blockStatisticsLength);
        if (!(plan.fixedRounds() > 0)) {
            throw new IllegalArgumentException("the lockstep kernel needs a fixed horizon: " + plan.fixedRounds());
        }
        this.plan = plan;
        long[] lx = tables.limitX();
        long[] ly = tables.limitY();
        limitX0 = lx[0];
        limitX1 = lx[1] - lx[0];
        limitX2 = lx[2] - lx[0];
        limitX3 = lx[3] - lx[2] - lx[1] + lx[0];
        limitY0 = ly[0];
        limitY1 = ly[1] - ly[0];
        limitY2 = ly[2] - ly[0];
        limitY3 = ly[3] - ly[2] - ly[1] + ly[0];
        boolean nonNegative = true;
        long[] w = new long[4];
        for (int k = 0; k < 4; k++) {
            nonNegative &= lx[k] >= 0 && ly[k] >= 0;
            w[k] = (lx[k] << 32) + ly[k];
        }
        packs = nonNegative;
        packed0 = w[0];
        packed1 = w[1] - w[0];
        packed2 = w[2] - w[0];
        packed3 = w[3] - w[2] - w[1] + w[0];
        Pass draw = new Draw();
        Pass decide = packs ? new DecidePacked() : new Decide();
        Pass count = new Count();
        drawCountRound = new Pass[] {draw, decide, count};
        drawDecideRound = new Pass[] {draw, decide};
        countRound = new Pass[] {decide, count};
        decideRound = new Pass[] {decide};
        firstX = tables.firstLimitX();
        firstY = tables.firstLimitY();
    }

    /** Whether both players' limits fit in 32 unsigned bits, so that {@link DecidePacked} applies. */
    boolean packs() {
        return packs;
    }

    @Override
    long run(long from, long to) {
        long rounds = 0;
        for (long start = from; start < to; start += LANES) {
            int lanes = (int) Math.min(LANES, to - start);
            playBlock(start, lanes);
            rounds = Math.addExact(rounds, Math.multiplyExact(lanes, plan.fixedRounds()));
        }
        return rounds;
    }

    private void playBlock(long start, int lanes) {
        long seedBase = ReplicateStream.mix64(plan.seed());
        for (int j = 0; j < lanes; j++) {
            seeder.seedFromBase(seedBase, start + j);
            word0[j] = seeder.state0;
            word1[j] = seeder.state1;
        }
        counters.begin(lanes);
        long n = plan.fixedRounds();
        long burnIn = plan.burnIn();
        long timeRounds = plan.timeRounds();
        long[] snaps = plan.snapshotRounds();
        int k = 0;
        for (long t = 1; t <= n; t++) {
            if (t == 1) {
                firstRound(lanes);
            } else {
                boolean counted = t > burnIn + 1;
                playRound(lanes, counted);
                if (counted) {
                    counters.counted(lanes);
                }
            }
            if (t == burnIn + 1) {
                for (int j = 0; j < lanes; j++) {
                    counters.first(j, state(j));
                }
            }
            if (t <= timeRounds) {
                long[] time = acc.timeCounts;
                int base = (int) (4 * (t - 1));
                for (int j = 0; j < lanes; j++) {
                    time[base + state(j)]++;
                }
            }
            while (k < snaps.length && snaps[k] == t) {
                long[] snap = acc.snapshotCounts;
                for (int j = 0; j < lanes; j++) {
                    snap[4 * k + state(j)]++;
                }
                k++;
            }
        }
        counters.finish(lanes, n, burnIn, acc);
    }

    /** The state (X's view) of lane j's last round. */
    private int state(int j) {
        return (int) ((lastX[j] & 2) | (lastY[j] & 1));
    }

    private void firstRound(int lanes) {
        drawCountRound[0].run(lanes);
        drawn = true;
        final long[] d = draws;
        final long[] mx = lastX;
        final long[] my = lastY;
        final long fx = firstX;
        final long fy = firstY;
        for (int j = 0; j < lanes; j++) {
            long r = d[j];
            mx[j] = (fx - (r >>> 32)) >> 63;
            my[j] = (fy - (r & LOW32)) >> 63;
        }
    }

    /** One loop over the lanes: a stage of a round. */
    private interface Pass {
        void run(int lanes);
    }

    /**
     * Plays one round after the first in every lane: draws, decisions, and (if counted) the transition
     * counts; then the new masks become the last ones. The stages are called through one call site with
     * three receiver classes, which C2 does not inline, so each loop is compiled on its own: there its
     * loops were vectorised in every run, while inlined into the block loop they were left scalar in some
     * runs (half the speed). The call costs a few nanoseconds per stage of 256 lanes.
     */
    private void playRound(int lanes, boolean counted) {
        Pass[] stages;
        if (drawn) {
            long[] swap = draws;
            draws = ahead;
            ahead = swap;
            drawn = false;
            stages = counted ? countRound : decideRound;
        } else {
            drawn = true;
            stages = counted ? drawCountRound : drawDecideRound;
        }
        for (Pass p : stages) {
            p.run(lanes);
        }
        long[] swap = lastX;
        lastX = nextX;
        nextX = swap;
        swap = lastY;
        lastY = nextY;
        nextY = swap;
    }

    /**
     * Steps every lane's generator twice: the first output goes to {@code draws} (this round), the second
     * to {@code ahead} (the next round, which then skips this stage). Two steps per pass load and store
     * the generator words half as often.
     */
    private final class Draw implements Pass {
        @Override
        public void run(int lanes) {
            final long[] a = word0;
            final long[] b = word1;
            final long[] d = draws;
            final long[] e = ahead;
            for (int j = 0; j < lanes; j++) {
                long p = a[j];
                long q = b[j];
                d[j] = Long.rotateLeft(p + q, 17) + p;
                q ^= p;
                p = Long.rotateLeft(p, 49) ^ q ^ (q << 21);
                q = Long.rotateLeft(q, 28);
                e[j] = Long.rotateLeft(p + q, 17) + p;
                q ^= p;
                a[j] = Long.rotateLeft(p, 49) ^ q ^ (q << 21);
                b[j] = Long.rotateLeft(q, 28);
            }
        }
    }

    /** The new masks from the draws and the last masks. */
    private final class Decide implements Pass {
        @Override
        public void run(int lanes) {
            final long[] d = draws;
            final long[] px = lastX;
            final long[] py = lastY;
            final long[] nx = nextX;
            final long[] ny = nextY;
            final long a0 = limitX0;
            final long a1 = limitX1;
            final long a2 = limitX2;
            final long a3 = limitX3;
            final long b0 = limitY0;
            final long b1 = limitY1;
            final long b2 = limitY2;
            final long b3 = limitY3;
            for (int j = 0; j < lanes; j++) {
                long r = d[j];
                long mx = px[j];
                long my = py[j];
                long lx = a0 + (my & a1) + (mx & (a2 + (my & a3)));
                long ly = b0 + (my & b1) + (mx & (b2 + (my & b3)));
                nx[j] = (lx - (r >>> 32)) >> 63;
                ny[j] = (ly - (r & LOW32)) >> 63;
            }
        }
    }

    /**
     * {@link Decide} for players whose limits are all at least 0 (every folded cooperation probability
     * above 2^-33, as with any execution error): each limit then fits in 32 unsigned bits, so X's and Y's
     * limits of a state are packed as X 2^32 + Y and one selection serves both players. The selection
     * adds 64-bit differences of packed words, exact modulo 2^64, so it yields the packed word itself.
     */
    private final class DecidePacked implements Pass {
        @Override
        public void run(int lanes) {
            final long[] d = draws;
            final long[] px = lastX;
            final long[] py = lastY;
            final long[] nx = nextX;
            final long[] ny = nextY;
            final long c0 = packed0;
            final long c1 = packed1;
            final long c2 = packed2;
            final long c3 = packed3;
            for (int j = 0; j < lanes; j++) {
                long r = d[j];
                long mx = px[j];
                long my = py[j];
                long w = c0 + (my & c1) + (mx & (c2 + (my & c3)));
                nx[j] = ((w >>> 32) - (r >>> 32)) >> 63;
                ny[j] = ((w & LOW32) - (r & LOW32)) >> 63;
            }
        }
    }

    /** Adds each lane's transition from the last masks to the new ones to its 4-bit counters. */
    private final class Count implements Pass {
        @Override
        public void run(int lanes) {
            final long[] px = lastX;
            final long[] py = lastY;
            final long[] nx = nextX;
            final long[] ny = nextY;
            final long[] c = counters.nibbles;
            for (int j = 0; j < lanes; j++) {
                long v = blend(ny[j], 1, 1L << 4);
                v = blend(nx[j], v, v << 8);
                v = blend(py[j], v, v << 16);
                c[j] += blend(px[j], v, v << 32);
            }
        }
    }

    /** {@code m == 0 ? a : b} for a mask m of 0 or -1, without a branch (one ternary-logic instruction). */
    private static long blend(long m, long a, long b) {
        return (a & ~m) | (b & m);
    }

}
