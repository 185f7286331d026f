package reprise.sim;

/**
 * The mutable integer tallies of one worker. Every field is a count or an exact 128-bit sum, so
 * {@link #merge(Accumulator)} is associative and commutative and a merged result does not depend on
 * how the replicates were split. Per-round counters are plain long increments (2^63 rounds would take
 * centuries at 10^9 rounds/s); every per-game and merge addition is overflow-checked.
 */
final class Accumulator {
    final int historyMemory;
    final int historySize;
    /** Tallied rounds per state, CC, CD, DC, DD. */
    final long[] states = new long[4];
    /** Tallied steps h -> s, index 4 h + s, h the true history (X's view) before the round. */
    final long[] steps;
    final long[] snapshotRounds;
    /** Index 4 k + s: games whose round snapshotRounds[k] was in state s. */
    final long[] snapshotCounts;
    final int timeRounds;
    /** Index 4 (t - 1) + s: games whose round t was in state s. */
    final long[] timeCounts;

    long games;
    long gamesTallied;
    long lengthSum;
    long lengthMin = Long.MAX_VALUE;
    long lengthMax;
    final long[] lengthSquares = new long[2];
    long talliedSum;
    final long[] talliedSquares = new long[2];
    /** 16 slots, index 4 s + r: sum over games of N_s N_r. */
    final long[] productSums = new long[32];
    /** 4 slots: sum over games of L N_s. */
    final long[] lengthStateSums = new long[8];

    /** The state counts when the current game began; reused by endGame for the game's own counts. */
    private final long[] before = new long[4];

    Accumulator(int historyMemory, long[] snapshotRounds, int timeRounds) {
        this.historyMemory = historyMemory;
        this.historySize = 1 << (2 * historyMemory);
        this.steps = new long[historySize * 4];
        this.snapshotRounds = snapshotRounds.clone();
        this.snapshotCounts = new long[4 * snapshotRounds.length];
        this.timeRounds = timeRounds;
        this.timeCounts = new long[4 * timeRounds];
    }

    void beginGame() {
        System.arraycopy(states, 0, before, 0, 4);
    }

    /** Ends the game begun by {@link #beginGame()}: its state counts are the growth of {@link #states}. */
    void endGame(long length) {
        long[] n = before;
        for (int s = 0; s < 4; s++) {
            n[s] = states[s] - n[s];
        }
        recordGame(length, n);
    }

    /**
     * Adds one game's per-game statistics (not its rounds: those are in {@link #states} already).
     *
     * @param length the game's length
     * @param n its tallied rounds per state
     */
    void recordGame(long length, long[] n) {
        games = Math.addExact(games, 1);
        lengthSum = Math.addExact(lengthSum, length);
        lengthMin = Math.min(lengthMin, length);
        lengthMax = Math.max(lengthMax, length);
        Wide.addProduct(lengthSquares, 0, length, length);
        long tallied = 0;
        for (int s = 0; s < 4; s++) {
            tallied += n[s];
        }
        if (tallied == 0) {
            return;
        }
        gamesTallied = Math.addExact(gamesTallied, 1);
        talliedSum = Math.addExact(talliedSum, tallied);
        Wide.addProduct(talliedSquares, 0, tallied, tallied);
        for (int s = 0; s < 4; s++) {
            if (n[s] == 0) {
                continue;
            }
            Wide.addProduct(lengthStateSums, s, tallied, n[s]);
            for (int r = s; r < 4; r++) {
                if (n[r] != 0) {
                    Wide.addProduct(productSums, 4 * s + r, n[s], n[r]);
                    if (r != s) {
                        Wide.addProduct(productSums, 4 * r + s, n[s], n[r]);
                    }
                }
            }
        }
    }

    /**
     * Adds the per-game statistics of games that all have the same length and the same number of
     * tallied rounds (a fixed horizon); the same sums as {@link #recordGame} once per game.
     *
     * @param count the number of games, at least 1
     * @param length their length
     * @param tallied their tallied rounds each
     * @param stateSums the sum over the games of their tallied rounds per state
     * @param pairSums index 4 s + r: the sum over the games of N_s N_r, each at least 0 (no overflow)
     */
    void recordGames(long count, long length, long tallied, long[] stateSums, long[] pairSums) {
        games = Math.addExact(games, count);
        lengthSum = Math.addExact(lengthSum, Math.multiplyExact(count, length));
        lengthMin = Math.min(lengthMin, length);
        lengthMax = Math.max(lengthMax, length);
        Wide.addProduct(lengthSquares, 0, Math.multiplyExact(count, length), length);
        if (tallied == 0) {
            return;
        }
        gamesTallied = Math.addExact(gamesTallied, count);
        talliedSum = Math.addExact(talliedSum, Math.multiplyExact(count, tallied));
        Wide.addProduct(talliedSquares, 0, Math.multiplyExact(count, tallied), tallied);
        for (int s = 0; s < 4; s++) {
            Wide.addProduct(lengthStateSums, s, tallied, stateSums[s]);
        }
        for (int i = 0; i < 16; i++) {
            Wide.add(productSums, i, 0, pairSums[i]);
        }
    }

    /**
     * Adds the per-game statistics of games of varying length that tallied every round (no burn-in):
     * the same sums as {@link #recordGame} once per game.
     *
     * @param count the number of games, at least 1
     * @param lengthSum the sum of their lengths
     * @param lengthMin the shortest length, at least 1
     * @param lengthMax the longest
     * @param lengthSquares the sum of their squared lengths (no overflow)
     * @param lengthStates index s: the sum over the games of L N_s
     * @param pairSums index 4 s + r: the sum over the games of N_s N_r
     */
    void recordWholeGames(long count, long lengthSum, long lengthMin, long lengthMax, long lengthSquares,
        long[] lengthStates, long[] pairSums) {
        games = Math.addExact(games, count);
        this.lengthSum = Math.addExact(this.lengthSum, lengthSum);
        this.lengthMin = Math.min(this.lengthMin, lengthMin);
        this.lengthMax = Math.max(this.lengthMax, lengthMax);
        Wide.add(this.lengthSquares, 0, 0, lengthSquares);
        gamesTallied = Math.addExact(gamesTallied, count);
        talliedSum = Math.addExact(talliedSum, lengthSum);
        Wide.add(talliedSquares, 0, 0, lengthSquares);
        for (int s = 0; s < 4; s++) {
            Wide.add(lengthStateSums, s, 0, lengthStates[s]);
        }
        for (int i = 0; i < 16; i++) {
            Wide.add(productSums, i, 0, pairSums[i]);
        }
    }

    void merge(Accumulator o) {
        addAll(states, o.states);
        addAll(steps, o.steps);
        addAll(snapshotCounts, o.snapshotCounts);
        addAll(timeCounts, o.timeCounts);
        games = Math.addExact(games, o.games);
        gamesTallied = Math.addExact(gamesTallied, o.gamesTallied);
        lengthSum = Math.addExact(lengthSum, o.lengthSum);
        lengthMin = Math.min(lengthMin, o.lengthMin);
        lengthMax = Math.max(lengthMax, o.lengthMax);
        Wide.addAll(lengthSquares, o.lengthSquares);
        talliedSum = Math.addExact(talliedSum, o.talliedSum);
        Wide.addAll(talliedSquares, o.talliedSquares);
        Wide.addAll(productSums, o.productSums);
        Wide.addAll(lengthStateSums, o.lengthStateSums);
    }

    private static void addAll(long[] a, long[] b) {
        for (int i = 0; i < a.length; i++) {
            a[i] = Math.addExact(a[i], b[i]);
        }
    }

    /** Approximate heap bytes of one accumulator with these arrays. */
    static long estimateBytes(int historyMemory, int snapshots, long timeRounds) {
        long longs = 4L * (1L << (2 * historyMemory)) + 5L * snapshots + 4L * timeRounds + 64;
        return 8 * longs + 512;
    }
}
