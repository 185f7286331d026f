package reprise.sim;

import jdk.incubator.vector.IntVector;
import jdk.incubator.vector.LongVector;
import jdk.incubator.vector.VectorOperators;
import jdk.incubator.vector.VectorSpecies;

/**
 * {@link LockstepKernel} written with the JDK's vector API: the same games, draws, decisions and
 * counters, so the same tallies bit for bit, with the lanes held in 512-bit vectors of 8 games.
 *
 * <p>Implementation note. Fixed horizon: a block of up to 256 games is played in stretches of at most
 * 15 rounds (one fill of the 4-bit transition counters of {@link LaneCounters}). {@link #drawBlock} steps
 * all lanes' generators through the stretch in a plain loop, which C2 compiles to 512-bit code with
 * single-instruction rotations, and writes the draws to a buffer per round; then, for each vector of 8
 * lanes, {@link #decideAndCount} decides and counts the stretch with the players' last moves (masks, 0
 * cooperated or -1 defected) and the lanes' counters held in registers. Per round and vector that is
 * about nine instructions for XoRoShiRo128++, four to select the packed limits X 2^32 + Y of the last
 * state, three for both decisions (the borrow of two 32-bit subtractions), three to widen them to masks
 * and six to add 1 &lt;&lt; 4 (4 s + s') to the counters with one per-lane variable shift. Random
 * lengths: 64 lanes, each vector on its own ({@link #runRefilled}). The work is split into methods of one
 * stage and one vector because C2 (JDK 17) stops inlining the vector API's methods once a compilation
 * holds about 18,000 nodes ({@code NodeCountInliningCutoff}), and a vector that is not inlined is
 * allocated: one loop with both stages, or with more than one vector, ran at a tenth of the speed.
 * Shuffles ({@code rearrange}, {@code selectFrom}) were slower than the bitwise selection, and lane masks
 * are avoided for the same reason. The kernel takes the common case: two players whose limits all fit in
 * 32 bits, no burn-in, no snapshot or time-resolved rounds; {@link Simulator} uses the other kernels
 * otherwise.
 */
final class SimdLockstepKernel extends Worker {
    /** The vector width the kernel is written for. */
    static final int VECTOR_BITS = 512;
    private static final VectorSpecies<Long> SPECIES = LongVector.SPECIES_512;
    private static final int WIDTH = 8;
    private static final int LANES = LaneCounters.MAX_LANES;
    /** Rounds of one stretch, at most: one fill of the 4-bit counters. */
    private static final int STRETCH = 15;
    private static final long LOW32 = 0xFFFFFFFFL;
    private static final long LOW_NIBBLES = 0x0F0F0F0F0F0F0F0FL;
    /** Lanes of the random-length kernel. */
    private static final int REFILL_LANES = 64;
    private static final long IDLE = Long.MAX_VALUE;

    private final Plan plan;
    /** Packed limits X 2^32 + Y of the states CC, CD, DC, DD. */
    private final long limits0;
    private final long limits1;
    private final long limits2;
    private final long limits3;
    private final long firstX;
    private final long firstY;
    private final long[] word0 = new long[LANES];
    private final long[] word1 = new long[LANES];
    private final long[] lastX = new long[LANES];
    private final long[] lastY = new long[LANES];
    /** Random lengths: the draws of one vector's stretch, round i at [i]. */
    private final long[][] draws = new long[STRETCH][WIDTH];
    /** Fixed horizon: the draws of a stretch of the whole block, round i of lane j at [i][j]. */
    private final long[][] blockDraws = new long[STRETCH][LANES];
    private final ReplicateStream seeder = new ReplicateStream();
    private final LaneCounters counters;

    /** Random lengths: rounds left in each lane's game, {@link #IDLE} when the lane has none. */
    private final long[] left = new long[REFILL_LANES];
    private final long[] length = new long[REFILL_LANES];
    private final int[] firstState = new int[REFILL_LANES];
    private final long[] evenBytes = new long[REFILL_LANES];
    private final long[] oddBytes = new long[REFILL_LANES];
    /** Index 16 j + 4 s + s': lane j's transitions spilled from its 8-bit counters. */
    private final long[] laneSteps = new long[16 * REFILL_LANES];
    private final int[] nibbleLoad = new int[REFILL_LANES / WIDTH];
    private final int[] byteLoad = new int[REFILL_LANES / WIDTH];
    /** Transitions of finished games, added to the accumulator at the end of a call. */
    private final long[] transitions = new long[16];
    private final long[] gameSteps = new long[16];
    private final GameSums sums;
    private long nextGame;
    private long endGame;
    private long roundsStarted;

    private SimdLockstepKernel(Plan plan, Accumulator acc, FusedTables tables) {
        super(acc);
        this.plan = plan;
        long[] lx = tables.limitX();
        long[] ly = tables.limitY();
        long[] w = new long[4];
        for (int k = 0; k < 4; k++) {
            w[k] = (lx[k] << 32) + ly[k];
        }
        limits0 = w[0];
        limits1 = w[1];
        limits2 = w[2];
        limits3 = w[3];
        firstX = tables.firstLimitX();
        firstY = tables.firstLimitY();
        counters = new LaneCounters(LANES, LaneCounters.BLOCK_STATISTICS_LENGTH);
        sums = new GameSums(acc);
    }

    /** The bits of the preferred vector species of this VM (loads the vector API). */
    static int preferredVectorBits() {
        return LongVector.SPECIES_PREFERRED.vectorBitSize();
    }

    /**
     * Whether this kernel plays the plan: every round tallied and nothing counted per round (a fixed
     * horizon or random lengths), and limits that fit in 32 unsigned bits.
     */
    static boolean supports(Plan plan, FusedTables tables) {
        if (!(plan.burnIn() == 0 && plan.snapshotRounds().length == 0 && plan.timeRounds() == 0)) {
            return false;
        }
        for (int k = 0; k < 4; k++) {
            if (tables.limitX()[k] < 0 || tables.limitY()[k] < 0) {
                return false;
            }
        }
        return true;
    }

    /**
     * The kernel for a plan it {@link #supports}; call only when {@link VectorModule#available()}.
     * Declared to return a {@link Worker} so that callers' bytecode never names this class's vector types.
     */
    static Worker create(Plan plan, Accumulator acc, FusedTables tables) {
        if (!supports(plan, tables)) {
            throw new IllegalArgumentException("the vector kernel does not play this plan");
        }
        warmUp();
        return new SimdLockstepKernel(plan, acc, tables);
    }

    /**
     * Once per VM: calls the stretch methods on a scratch kernel until the JIT has compiled them with the
     * vector intrinsics. Until then they run interpreted or in C1's code, where every vector is an object
     * and a round costs some fifty times more. C2 (JDK 17, tiered) queues a method once its invocations
     * and loop iterations pass 15,000 (at least 600 invocations), which 1,000 calls of 15 rounds do; the
     * compile itself takes a few hundred milliseconds, during which this thread sleeps instead of playing in
     * the slow code, checking every 5 ms whether a call has become fast (eight times faster than before,
     * at most 2 s in all). The warm-up runs in a holder's class initialiser, so a second worker waits for
     * it too. It only affects speed: the scratch kernel shares nothing with the real ones.
     */
    private static void warmUp() {
        WarmUp.done();
    }

    private static final class WarmUp {
        private static final int CALLS = 1_000;
        private static final long MAX_WAIT_NANOS = 2_000_000_000L;

        static {
            long half = 1L << 31;
            FusedTables tables = new FusedTables(new long[] {half, half, half, half},
                new long[] {half, half, half, half}, half, half);
            SimdLockstepKernel k = new SimdLockstepKernel(new Plan(0, 1, 0, 0, new long[0], 0),
                new Accumulator(1, new long[0], 0), tables);
            long[] scratch = new long[LANES];
            long slow = Long.MAX_VALUE;
            for (int i = 0; i < CALLS; i++) {
                long t = call(k, scratch);
                if (i >= CALLS - 10) {
                    slow = Math.min(slow, t);
                }
            }
            long start = System.nanoTime();
            while (System.nanoTime() - start < MAX_WAIT_NANOS && 8 * call(k, scratch) > slow) {
                try {
                    Thread.sleep(5);
                } catch (InterruptedException e) {
                    Thread.currentThread().interrupt();
                    break;
                }
            }
        }

        private WarmUp() {
        }

        /** One call of each stretch method; returns its time in nanoseconds. */
        private static long call(SimdLockstepKernel k, long[] scratch) {
            long t0 = System.nanoTime();
            k.drawBlock(STRETCH, WIDTH);
            k.draw(STRETCH, 0);
            k.decideAndCount(STRETCH, 0, scratch, k.draws, 0);
            return System.nanoTime() - t0;
        }

        /** Returns once the warm-up has run (the first call initialises the class and runs it). */
        static void done() {
        }
    }

    @Override
    long run(long from, long to) {
        if (plan.fixedRounds() == 0) {
            return runRefilled(from, to);
        }
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
        final long fx = firstX;
        final long fy = firstY;
        counters.begin(lanes);
        for (int j = 0; j < lanes; j++) {
            seeder.seedFromBase(seedBase, start + j);
            long p = seeder.state0;
            long q = seeder.state1;
            long r = Long.rotateLeft(p + q, 17) + p;
            q ^= p;
            word0[j] = Long.rotateLeft(p, 49) ^ q ^ (q << 21);
            word1[j] = Long.rotateLeft(q, 28);
            long mx = (fx - (r >>> 32)) >> 63;
            long my = (fy - (r & LOW32)) >> 63;
            lastX[j] = mx;
            lastY[j] = my;
            counters.first(j, (int) ((mx & 2) | (my & 1)));
        }
        // lanes past the block's games (up to the next multiple of 8) are played and never read
        int vectors = (lanes + WIDTH - 1) / WIDTH;
        long left = plan.fixedRounds() - 1;
        long[] nibbles = counters.nibbles;
        int width = WIDTH * vectors;
        while (left > 0) {
            int m = (int) Math.min(left, counters.roundsBeforeSpill());
            drawBlock(m, width);
            for (int v = 0; v < vectors; v++) {
                decideAndCount(m, WIDTH * v, nibbles, blockDraws, WIDTH * v);
            }
            counters.counted(lanes, m);
            left -= m;
        }
        counters.finish(lanes, plan.fixedRounds(), 0, acc);
    }

    /**
     * Random lengths: each lane plays games of [from, to) one after another, taking the next game when
     * its game ends. A vector's stretch ends at the first game end in its 8 lanes (or when its 4-bit
     * counters are full); the finished lanes' counts are read out as that game's tallies and the lane
     * starts afresh, so every game is played exactly as by itself. When no game is left, a lane idles
     * (played, never read) until its vector's other games end.
     */
    private long runRefilled(long from, long to) {
        nextGame = from;
        endGame = to;
        roundsStarted = 0;
        java.util.Arrays.fill(nibbleLoad, 0);
        java.util.Arrays.fill(byteLoad, 0);
        long[] nibbles = counters.nibbles;
        for (int j = 0; j < REFILL_LANES; j++) {
            clearLane(j, nibbles);
            start(j);
        }
        for (int v = 0; v < REFILL_LANES / WIDTH; v++) {
            playVector(v, nibbles);
        }
        sums.flush();
        long[] steps = acc.steps;
        for (int k = 0; k < 16; k++) {
            steps[k] = Math.addExact(steps[k], transitions[k]);
            transitions[k] = 0;
        }
        return roundsStarted;
    }

    private void playVector(int v, long[] nibbles) {
        int o = WIDTH * v;
        while (true) {
            long m = STRETCH - nibbleLoad[v];
            boolean active = false;
            for (int j = o; j < o + WIDTH; j++) {
                if (left[j] != IDLE) {
                    active = true;
                    m = Math.min(m, left[j]);
                }
            }
            if (!active) {
                return;
            }
            int rounds = (int) m;
            draw(rounds, o);
            decideAndCount(rounds, o, nibbles, draws, 0);
            nibbleLoad[v] += rounds;
            if (nibbleLoad[v] == STRETCH) {
                spill(v, nibbles);
            }
            for (int j = o; j < o + WIDTH; j++) {
                if (left[j] != IDLE) {
                    left[j] -= rounds;
                    if (left[j] == 0) {
                        finish(j, nibbles);
                        clearLane(j, nibbles);
                        start(j);
                    }
                }
            }
        }
    }

    /** Moves the 4-bit counters of vector v's lanes to their 8-bit counters (and those to longs when due). */
    private void spill(int v, long[] nibbles) {
        int o = WIDTH * v;
        if (byteLoad[v] + STRETCH > 255) {
            for (int j = o; j < o + WIDTH; j++) {
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
            byteLoad[v] = 0;
        }
        for (int j = o; j < o + WIDTH; j++) {
            long c = nibbles[j];
            evenBytes[j] += c & LOW_NIBBLES;
            oddBytes[j] += (c >>> 4) & LOW_NIBBLES;
            nibbles[j] = 0;
        }
        byteLoad[v] += nibbleLoad[v];
        nibbleLoad[v] = 0;
    }

    private void clearLane(int j, long[] nibbles) {
        nibbles[j] = 0;
        evenBytes[j] = 0;
        oddBytes[j] = 0;
        java.util.Arrays.fill(laneSteps, 16 * j, 16 * j + 16, 0);
    }

    /** Starts the next game in lane j (games of one round are played here), or idles the lane. */
    private void start(int j) {
        long seedBase = ReplicateStream.mix64(plan.seed());
        double delta = plan.continuation();
        while (nextGame < endGame) {
            seeder.seedFromBase(seedBase, nextGame++);
            long n = seeder.geometricLength(delta);
            roundsStarted = Math.addExact(roundsStarted, n);
            long r = seeder.nextLong();
            long mx = (firstX - (r >>> 32)) >> 63;
            long my = (firstY - (r & LOW32)) >> 63;
            int s = (int) ((mx & 2) | (my & 1));
            if (n == 1) {
                sums.add(1, s == 0 ? 1 : 0, s == 1 ? 1 : 0, s == 2 ? 1 : 0, s == 3 ? 1 : 0);
                continue;
            }
            word0[j] = seeder.state0;
            word1[j] = seeder.state1;
            lastX[j] = mx;
            lastY[j] = my;
            firstState[j] = s;
            length[j] = n;
            left[j] = n - 1;
            return;
        }
        left[j] = IDLE;
    }

    /** Adds the finished game of lane j to the tallies. */
    private void finish(int j, long[] nibbles) {
        long[] t = gameSteps;
        long c = nibbles[j];
        long even = evenBytes[j];
        long odd = oddBytes[j];
        int base = 16 * j;
        for (int f = 0; f < 8; f++) {
            t[2 * f] = ((c >>> (8 * f)) & 0xF) + ((even >>> (8 * f)) & 0xFF) + laneSteps[base + 2 * f];
            t[2 * f + 1] = ((c >>> (8 * f + 4)) & 0xF) + ((odd >>> (8 * f)) & 0xFF) + laneSteps[base + 2 * f + 1];
        }
        long[] tr = transitions;
        long n0 = 0;
        long n1 = 0;
        long n2 = 0;
        long n3 = 0;
        for (int k = 0; k < 16; k += 4) {
            n0 += t[k];
            n1 += t[k + 1];
            n2 += t[k + 2];
            n3 += t[k + 3];
        }
        for (int k = 0; k < 16; k++) {
            tr[k] += t[k];
        }
        int s = firstState[j];
        sums.add(length[j], n0 + (s == 0 ? 1 : 0), n1 + (s == 1 ? 1 : 0), n2 + (s == 2 ? 1 : 0),
            n3 + (s == 3 ? 1 : 0));
    }

    /**
     * Steps the generators of lanes [0, width) m times, round i's draws to {@code blockDraws[i][j]}:
     * plain loops over the lanes, two steps per pass, which C2 compiles to 512-bit code with single-instruction
     * rotations (the vector API's rotation is three instructions in JDK 17). C2 left these loops scalar when
     * it inlined the method into {@link #playBlock}; with the argument check the method's bytecode exceeds
     * 325 bytes, the most C2 inlines ({@code FreqInlineSize}), so it is always compiled on its own.
     */
    private void drawBlock(int m, int width) {
        if (!(m >= 1 && m <= STRETCH && width >= 1 && width <= LANES && width <= word0.length)) {
            throw new IllegalArgumentException("a stretch must have 1 to " + STRETCH + " rounds and 1 to " + LANES
                + " lanes: " + m + " rounds, " + width + " lanes");
        }
        final long[] a = word0;
        final long[] b = word1;
        int i = 0;
        for (; i + 1 < m; i += 2) {
            final long[] d0 = blockDraws[i];
            final long[] d1 = blockDraws[i + 1];
            for (int j = 0; j < width; j++) {
                long p = a[j];
                long q = b[j];
                d0[j] = Long.rotateLeft(p + q, 17) + p;
                q ^= p;
                p = Long.rotateLeft(p, 49) ^ q ^ (q << 21);
                q = Long.rotateLeft(q, 28);
                d1[j] = Long.rotateLeft(p + q, 17) + p;
                q ^= p;
                a[j] = Long.rotateLeft(p, 49) ^ q ^ (q << 21);
                b[j] = Long.rotateLeft(q, 28);
            }
        }
        if (i < m) {
            final long[] d0 = blockDraws[i];
            for (int j = 0; j < width; j++) {
                long p = a[j];
                long q = b[j];
                d0[j] = Long.rotateLeft(p + q, 17) + p;
                q ^= p;
                a[j] = Long.rotateLeft(p, 49) ^ q ^ (q << 21);
                b[j] = Long.rotateLeft(q, 28);
            }
        }
    }

    /** Random lengths: steps the generators of lanes [o, o + 8) m times, the draws to {@link #draws}. */
    private void draw(int m, int o) {
        final long[][] out = draws;
        LongVector a = LongVector.fromArray(SPECIES, word0, o);
        LongVector b = LongVector.fromArray(SPECIES, word1, o);
        for (int i = 0; i < m; i++) {
            a.add(b).lanewise(VectorOperators.ROL, 17).add(a).intoArray(out[i], 0);
            b = b.lanewise(VectorOperators.XOR, a);
            a = a.lanewise(VectorOperators.ROL, 49).lanewise(VectorOperators.XOR, b)
                .lanewise(VectorOperators.XOR, b.lanewise(VectorOperators.LSHL, 21));
            b = b.lanewise(VectorOperators.ROL, 28);
        }
        a.intoArray(word0, o);
        b.intoArray(word1, o);
    }

    /**
     * Decides and counts m rounds of lanes [o, o + 8), round i's draws at {@code in[i][base]}.
     * The packed limits of the last state are selected by bitwise choices, w0 ^ ((w0 ^ w1) &amp; my) and the
     * like, which the JIT fuses into one ternary-logic instruction each; the two decisions come from the
     * borrow of the 32-bit differences w - u (u &gt; w unsigned iff the subtraction borrows; the borrow is
     * bit 31 of t ^ ((t ^ u) &amp; (w ^ u)), t = w - u), spread over each half by an arithmetic shift.
     */
    private void decideAndCount(int m, int o, long[] nibbles, long[][] in, int base) {
        LongVector w0 = LongVector.broadcast(SPECIES, limits0);
        LongVector x01 = LongVector.broadcast(SPECIES, limits0 ^ limits1);
        LongVector w2 = LongVector.broadcast(SPECIES, limits2);
        LongVector x23 = LongVector.broadcast(SPECIES, limits2 ^ limits3);
        LongVector one = LongVector.broadcast(SPECIES, 1);
        LongVector mx = LongVector.fromArray(SPECIES, lastX, o);
        LongVector my = LongVector.fromArray(SPECIES, lastY, o);
        LongVector count = LongVector.fromArray(SPECIES, nibbles, o);
        LongVector previous = mx.and(32).or(my.and(16));
        for (int i = 0; i < m; i++) {
            LongVector r = LongVector.fromArray(SPECIES, in[i], base);
            LongVector lower = w0.lanewise(VectorOperators.XOR, x01.and(my));
            LongVector upper = w2.lanewise(VectorOperators.XOR, x23.and(my));
            LongVector w = lower.lanewise(VectorOperators.XOR, lower.lanewise(VectorOperators.XOR, upper).and(mx));
            IntVector wi = w.reinterpretAsInts();
            IntVector ui = r.reinterpretAsInts();
            IntVector t = wi.sub(ui);
            IntVector borrow = t.lanewise(VectorOperators.XOR, t.lanewise(VectorOperators.XOR, ui)
                .and(wi.lanewise(VectorOperators.XOR, ui)));
            LongVector d = borrow.lanewise(VectorOperators.ASHR, 31).reinterpretAsLongs();
            LongVector nx = d.lanewise(VectorOperators.ASHR, 63);
            LongVector ny = d.lanewise(VectorOperators.LSHL, 32).lanewise(VectorOperators.ASHR, 63);
            LongVector next = nx.and(8).or(ny.and(4));
            count = count.add(one.lanewise(VectorOperators.LSHL, previous.or(next)));
            previous = next.lanewise(VectorOperators.LSHL, 2);
            mx = nx;
            my = ny;
        }
        mx.intoArray(lastX, o);
        my.intoArray(lastY, o);
        count.intoArray(nibbles, o);
    }
}
