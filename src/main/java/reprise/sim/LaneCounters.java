package reprise.sim;

/**
 * The transition counters of the lanes of a {@link LockstepKernel} block, and their conversion into one
 * block's tallies. Each lane counts its transitions in a 64-bit word of sixteen 4-bit counters
 * ({@link #nibbles}, index 4 s + s' per 4 bits, filled by the kernel's count stage); every 15 counted
 * rounds, before a 4-bit counter can overflow, the word is split into two words of 8-bit counters (even
 * and odd transitions), and before those can pass 255 they are added into per-lane long counts. At the
 * end of the block each lane's transition counts give its state counts (the first tallied round's state
 * plus the column sums); the per-game statistics are summed over the block (in plain longs for games of
 * at most 2^27 rounds) and added to the accumulator once.
 */
final class LaneCounters {
    /**
     * Longest game whose per-game statistics are summed per block in plain longs: a block's sum of
     * products N_s N_r is at most 256 n^2 &lt; 2^63 for n &lt;= 2^27 (blocks have at most {@link #MAX_LANES}
     * lanes; that also keeps a block's sum of 8-bit counts below 2^16). Longer games add theirs one by one.
     */
    static final long BLOCK_STATISTICS_LENGTH = 1L << 27;
    /** Most lanes of a block. */
    static final int MAX_LANES = 256;
    /** Counted rounds a 4-bit counter absorbs before it is spilled. */
    private static final int NIBBLE_ROUNDS = 15;
    /** Counted rounds an 8-bit counter absorbs before it is spilled. */
    private static final int BYTE_ROUNDS = 255;
    private static final long LOW_NIBBLES = 0x0F0F0F0F0F0F0F0FL;

    /** Per lane, sixteen 4-bit transition counters; the kernel's count stage adds to them. */
    final long[] nibbles;
    private final long[] evenBytes;
    private final long[] oddBytes;
    /**
     * Index 16 j + 4 s + s': lane j's counted transitions from s to s' spilled from its 8-bit counters
     * (only in games of more than 255 counted rounds); the rest are still in the 8-bit counters.
     */
    private final long[] laneSteps;
    private boolean laneStepsUsed;
    /** The state of each lane's first tallied round, or -1. */
    private final int[] firstState;
    private final long blockStatisticsLength;
    private final long[] gameCounts = new long[4];
    private final long[] blockSteps = new long[16];
    private final long[] stateSums = new long[4];
    private final long[] pairSums = new long[16];
    private int nibbleLoad;
    private int byteLoad;

    LaneCounters(int lanes, long blockStatisticsLength) {
        if (!(lanes >= 1 && lanes <= MAX_LANES)) {
            throw new IllegalArgumentException("lanes must be in [1, " + MAX_LANES + "]: " + lanes);
        }
        nibbles = new long[lanes];
        evenBytes = new long[lanes];
        oddBytes = new long[lanes];
        laneSteps = new long[16 * lanes];
        firstState = new int[lanes];
        this.blockStatisticsLength = Math.min(blockStatisticsLength, BLOCK_STATISTICS_LENGTH);
    }

    /** Clears the counters of the first {@code lanes} lanes for a new block. */
    void begin(int lanes) {
        for (int j = 0; j < lanes; j++) {
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
    }

    /** Records the state of lane j's first tallied round. */
    void first(int j, int state) {
        firstState[j] = state;
    }

    /** Notes that the count stage has added one round to every lane's 4-bit counters. */
    void counted(int lanes) {
        if (++nibbleLoad == NIBBLE_ROUNDS) {
            spillNibbles(lanes);
        }
    }

    /** Counted rounds the 4-bit counters can still absorb before they must be spilled, 1 to 15. */
    int roundsBeforeSpill() {
        return NIBBLE_ROUNDS - nibbleLoad;
    }

    /**
     * Notes that m rounds, at most {@link #roundsBeforeSpill()}, have been added to every lane's 4-bit
     * counters.
     */
    void counted(int lanes, int m) {
        if (!(m >= 1 && m <= roundsBeforeSpill())) {
            throw new IllegalArgumentException("rounds must be in [1, " + roundsBeforeSpill() + "]: " + m);
        }
        nibbleLoad += m;
        if (nibbleLoad == NIBBLE_ROUNDS) {
            spillNibbles(lanes);
        }
    }

    /** Adds the block's tallies and per-game statistics (games of length n, burn-in as given) to acc. */
    void finish(int lanes, long n, long burnIn, Accumulator acc) {
        spillNibbles(lanes);
        finishBlock(lanes, n, burnIn, acc);
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

    private void finishBlock(int lanes, long n, long burnIn, Accumulator acc) {
        if (!laneStepsUsed && n <= blockStatisticsLength) {
            finishShortBlock(lanes, n, burnIn, acc);
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
                addCounts(acc, g);
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
            addCounts(acc, stateSums);
            long tallied = Math.max(0, n - burnIn);
            acc.recordGames(lanes, n, tallied, stateSums, pairSums);
        }
    }

    /**
     * {@link #finish} when every count is still in the 8-bit counters: byte f of a lane's even word
     * counts transition 2 f (to state 2 f mod 4, so to 0 for even f and to 2 for odd f), byte f of its odd
     * word transition 2 f + 1. Masking alternate bytes gives four 16-bit fields, which one multiplication
     * by 0x0001000100010001 sums into the top field; and the block's sums of each byte, at most
     * MAX_LANES 255 &lt; 2^16, add up in 16-bit fields without carries.
     */
    private void finishShortBlock(int lanes, long n, long burnIn, Accumulator acc) {
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
        addCounts(acc, st);
        acc.recordGames(lanes, n, Math.max(0, n - burnIn), st, pairs);
    }

    private static void addCounts(Accumulator acc, long[] counts) {
        for (int s = 0; s < 4; s++) {
            acc.states[s] = Math.addExact(acc.states[s], counts[s]);
        }
    }
}
