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
 * of sixteen 4-bit counters. The shift is built from the four masks by conditional constant shifts
 * (a branch-free choice of v or v &lt;&lt; k per mask), because a per-lane variable shift does not
 * vectorise here. Every 15 counted rounds, before a 4-bit counter can overflow, the word is split
 * into two words of 8-bit counters (even and odd transitions), and before those can pass 255 they are
 * added into per-lane long counts.</li>
 * </ol>
 * At the end of the block each lane's transition counts give its state counts (the first tallied
 * round's state plus the column sums); the per-game statistics are summed over the block (in plain longs
 * for games of at most 2^27 rounds) and added to the accumulator once. Burn-in rounds are decided but
 * not counted; snapshot and time-resolved rounds are counted from the masks by a plain loop over the
 * lanes.
 */
final class LockstepKernel extends Worker {
    /** Games per block: the lane arrays (about 12 longs per lane) stay in a 32 KiB L1 data cache. */
    static final int LANES = 256;
    /** Counted rounds a 4-bit counter absorbs before it is spilled. */
    private static final int NIBBLE_ROUNDS = 15;
    /** Counted rounds an 8-bit counter absorbs before it is spilled. */
    private static final int BYTE_ROUNDS = 255;
    private static final long LOW_NIBBLES = 0x0F0F0F0F0F0F0F0FL;
    private static final long LOW32 = 0xFFFFFFFFL;
    /**
     * Longest game whose per-game statistics are summed per block in plain longs: a block's sum of
     * products N_s N_r is at most LANES n^2 &lt; 2^63 for n &lt;= 2^27. Longer games add theirs one by one.
     */
    static final long BLOCK_STATISTICS_LENGTH = 1L << 27;

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
    private final long[] nibbles = new long[LANES];
    private final long[] evenBytes = new long[LANES];
    private final long[] oddBytes = new long[LANES];
    /**
     * Index 16 j + 4 s + s': lane j's counted transitions from s to s' spilled from its 8-bit counters
     * (only in games of more than 255 counted rounds); the rest are still in the 8-bit counters.
     */
    private final long[] laneSteps = new long[16 * LANES];
    private boolean laneStepsUsed;
    /** The state of each lane's first tallied round, or -1. */
    private final int[] firstState = new int[LANES];
    private final ReplicateStream seeder = new ReplicateStream();
    private final Pass[] drawCountRound;
    private final Pass[] drawDecideRound;
    private final Pass[] countRound;
    private final Pass[] decideRound;
    /** Whether {@code ahead} holds every lane's draw for the next round. */
    private boolean drawn;
    private final long[] gameCounts = new long[4];
    private final long[] blockSteps = new long[16];
    private final long[] stateSums = new long[4];
    private final long[] pairSums = new long[16];
    private int nibbleLoad;
    private int byteLoad;

    private final long blockStatisticsLength;

    LockstepKernel(Plan plan, Accumulator acc, FusedTables tables) {
        this(plan, acc, tables, BLOCK_STATISTICS_LENGTH);
    }

    /** With another limit for per-block statistics (a testing hook for the per-game branch). */
    LockstepKernel(Plan plan, Accumulator acc, FusedTables tables, long blockStatisticsLength) {
        super(acc);
        this.blockStatisticsLength = Math.min(blockStatisticsLength, BLOCK_STATISTICS_LENGTH);
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
            nibbles[j] = 0;
            evenBytes[j] = 0;
            oddBytes[j] = 0;
            firstState[j] = -1;
        }
        if (laneStepsUsed) {
            java.util.Arrays.fill(laneSteps, 0);
            laneStepsUsed = false;
        }
        nibbleLoad = 0;
        byteLoad = 0;
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
                if (counted && ++nibbleLoad == NIBBLE_ROUNDS) {
                    spillNibbles(lanes);
                }
            }
            if (t == burnIn + 1) {
                for (int j = 0; j < lanes; j++) {
                    firstState[j] = state(j);
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
        spillNibbles(lanes);
        finishBlock(lanes, n);
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
            final long[] c = nibbles;
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

    private void spillNibbles(int lanes) {
        if (nibbleLoad == 0) {
            return;
        }
        if (byteLoad + nibbleLoad > BYTE_ROUNDS) {
            spillBytes(lanes);
        }
        final long[] c = nibbles;
        final long[] even = evenBytes;
        final long[] odd = oddBytes;
        for (int j = 0; j < lanes; j++) {
            long v = c[j];
            even[j] += v & LOW_NIBBLES;
            odd[j] += (v >>> 4) & LOW_NIBBLES;
            c[j] = 0;
        }
        byteLoad += nibbleLoad;
        nibbleLoad = 0;
    }

    private void spillBytes(int lanes) {
        if (byteLoad == 0) {
            return;
        }
        laneStepsUsed = true;
        for (int j = 0; j < lanes; j++) {
            long even = evenBytes[j];
            long odd = oddBytes[j];
            int base = 16 * j;
            for (int f = 0; f < 8; f++) {
                laneSteps[base + 2 * f] += (even >>> (8 * f)) & 0xFF;
                laneSteps[base + 2 * f + 1] += (odd >>> (8 * f)) & 0xFF;
            }
            evenBytes[j] = 0;
            oddBytes[j] = 0;
        }
        byteLoad = 0;
    }

    private void finishBlock(int lanes, long n) {
        if (!laneStepsUsed && n <= blockStatisticsLength) {
            finishShortBlock(lanes, n);
            return;
        }
        long[] sums = blockSteps;
        java.util.Arrays.fill(sums, 0);
        java.util.Arrays.fill(stateSums, 0);
        java.util.Arrays.fill(pairSums, 0);
        long[] g = gameCounts;
        boolean perGame = n > blockStatisticsLength;
        for (int j = 0; j < lanes; j++) {
            java.util.Arrays.fill(g, 0);
            if (firstState[j] >= 0) {
                g[firstState[j]] = 1;
            }
            int base = 16 * j;
            long even = evenBytes[j];
            long odd = oddBytes[j];
            for (int f = 0; f < 8; f++) {
                long me = ((even >>> (8 * f)) & 0xFF) + (laneStepsUsed ? laneSteps[base + 2 * f] : 0);
                long mo = ((odd >>> (8 * f)) & 0xFF) + (laneStepsUsed ? laneSteps[base + 2 * f + 1] : 0);
                g[(2 * f) & 3] += me;
                g[(2 * f + 1) & 3] += mo;
                sums[2 * f] += me;
                sums[2 * f + 1] += mo;
            }
            if (perGame) {
                addCounts(g);
                acc.recordGame(n, g);
                continue;
            }
            for (int s = 0; s < 4; s++) {
                stateSums[s] += g[s];
                for (int r = s; r < 4; r++) {
                    long p = g[s] * g[r];
                    pairSums[4 * s + r] += p;
                    if (r != s) {
                        pairSums[4 * r + s] += p;
                    }
                }
            }
        }
        for (int i = 0; i < 16; i++) {
            acc.steps[i] = Math.addExact(acc.steps[i], sums[i]);
        }
        if (!perGame) {
            addCounts(stateSums);
            long tallied = Math.max(0, n - plan.burnIn());
            acc.recordGames(lanes, n, tallied, stateSums, pairSums);
        }
    }

    /**
     * {@link #finishBlock} when every count is still in the 8-bit counters: byte f of a lane's even word
     * counts transition 2 f (to state 2 f mod 4, so to 0 for even f and to 2 for odd f), byte f of its odd
     * word transition 2 f + 1. Masking alternate bytes gives four 16-bit fields, which one multiplication
     * by 0x0001000100010001 sums into the top field; and the block's sums of each byte, at most
     * LANES 255 &lt; 2^16, add up in 16-bit fields without carries.
     */
    private void finishShortBlock(int lanes, long n) {
        final long alternate = 0x00FF00FF00FF00FFL;
        final long fold = 0x0001000100010001L;
        long evenLow = 0;
        long evenHigh = 0;
        long oddLow = 0;
        long oddHigh = 0;
        long n0 = 0;
        long n1 = 0;
        long n2 = 0;
        long n3 = 0;
        long p00 = 0;
        long p01 = 0;
        long p02 = 0;
        long p03 = 0;
        long p11 = 0;
        long p12 = 0;
        long p13 = 0;
        long p22 = 0;
        long p23 = 0;
        long p33 = 0;
        for (int j = 0; j < lanes; j++) {
            long e0 = evenBytes[j] & alternate;
            long e1 = (evenBytes[j] >>> 8) & alternate;
            long o0 = oddBytes[j] & alternate;
            long o1 = (oddBytes[j] >>> 8) & alternate;
            evenLow += e0;
            evenHigh += e1;
            oddLow += o0;
            oddHigh += o1;
            int first = firstState[j];
            long g0 = ((e0 * fold) >>> 48) + (first == 0 ? 1 : 0);
            long g1 = ((o0 * fold) >>> 48) + (first == 1 ? 1 : 0);
            long g2 = ((e1 * fold) >>> 48) + (first == 2 ? 1 : 0);
            long g3 = ((o1 * fold) >>> 48) + (first == 3 ? 1 : 0);
            n0 += g0;
            n1 += g1;
            n2 += g2;
            n3 += g3;
            p00 += g0 * g0;
            p01 += g0 * g1;
            p02 += g0 * g2;
            p03 += g0 * g3;
            p11 += g1 * g1;
            p12 += g1 * g2;
            p13 += g1 * g3;
            p22 += g2 * g2;
            p23 += g2 * g3;
            p33 += g3 * g3;
        }
        long[] steps = acc.steps;
        for (int f = 0; f < 8; f++) {
            long even = f % 2 == 0 ? evenLow : evenHigh;
            long odd = f % 2 == 0 ? oddLow : oddHigh;
            int field = 16 * (f / 2);
            steps[2 * f] = Math.addExact(steps[2 * f], (even >>> field) & 0xFFFF);
            steps[2 * f + 1] = Math.addExact(steps[2 * f + 1], (odd >>> field) & 0xFFFF);
        }
        long[] st = stateSums;
        st[0] = n0;
        st[1] = n1;
        st[2] = n2;
        st[3] = n3;
        long[] pairs = pairSums;
        pairs[0] = p00;
        pairs[1] = p01;
        pairs[2] = p02;
        pairs[3] = p03;
        pairs[4] = p01;
        pairs[5] = p11;
        pairs[6] = p12;
        pairs[7] = p13;
        pairs[8] = p02;
        pairs[9] = p12;
        pairs[10] = p22;
        pairs[11] = p23;
        pairs[12] = p03;
        pairs[13] = p13;
        pairs[14] = p23;
        pairs[15] = p33;
        addCounts(st);
        acc.recordGames(lanes, n, Math.max(0, n - plan.burnIn()), st, pairs);
    }

    private void addCounts(long[] counts) {
        for (int s = 0; s < 4; s++) {
            acc.states[s] = Math.addExact(acc.states[s], counts[s]);
        }
    }
}
