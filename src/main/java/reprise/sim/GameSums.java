package reprise.sim;

/**
 * Per-game statistics of a batch of whole games with every round tallied (no burn-in), summed in plain
 * longs and added to an {@link Accumulator} once per batch: the same sums as
 * {@link Accumulator#recordGame} once per game.
 *
 * <p>Implementation note. A game of length L &lt;= 2^27 has products L^2, L N_s and N_s N_r below 2^54,
 * so up to 256 such games sum below 2^62 in a long; a longer game is recorded on its own.
 */
final class GameSums {
    /** Longest game summed in plain longs. */
    private static final long SHORT = 1L << 27;
    /** Games per batch. */
    private static final int BATCH = 256;

    private final Accumulator acc;
    private int games;
    private long lengthSum;
    private long lengthMin = Long.MAX_VALUE;
    private long lengthMax;
    private long lengthSquares;
    private final long[] lengthStates = new long[4];
    private final long[] pairs = new long[16];

    GameSums(Accumulator acc) {
        this.acc = acc;
    }

    /**
     * Adds one game: its state counts to the accumulator's state tallies, its per-game statistics to the
     * batch.
     *
     * @param length the game's length, at least 1, equal to n0 + n1 + n2 + n3
     */
    void add(long length, long n0, long n1, long n2, long n3) {
        long[] states = acc.states;
        states[0] += n0;
        states[1] += n1;
        states[2] += n2;
        states[3] += n3;
        if (length > SHORT) {
            acc.recordGame(length, new long[] {n0, n1, n2, n3});
            return;
        }
        games++;
        lengthSum += length;
        lengthMin = Math.min(lengthMin, length);
        lengthMax = Math.max(lengthMax, length);
        lengthSquares += length * length;
        long[] ls = lengthStates;
        ls[0] += length * n0;
        ls[1] += length * n1;
        ls[2] += length * n2;
        ls[3] += length * n3;
        long[] p = pairs;
        p[0] += n0 * n0;
        p[1] += n0 * n1;
        p[2] += n0 * n2;
        p[3] += n0 * n3;
        p[5] += n1 * n1;
        p[6] += n1 * n2;
        p[7] += n1 * n3;
        p[10] += n2 * n2;
        p[11] += n2 * n3;
        p[15] += n3 * n3;
        if (games == BATCH) {
            flush();
        }
    }

    /** Adds the batch to the accumulator and empties it. */
    void flush() {
        if (games == 0) {
            return;
        }
        long[] p = pairs;
        p[4] = p[1];
        p[8] = p[2];
        p[9] = p[6];
        p[12] = p[3];
        p[13] = p[7];
        p[14] = p[11];
        acc.recordWholeGames(games, lengthSum, lengthMin, lengthMax, lengthSquares, lengthStates, p);
        games = 0;
        lengthSum = 0;
        lengthMin = Long.MAX_VALUE;
        lengthMax = 0;
        lengthSquares = 0;
        java.util.Arrays.fill(lengthStates, 0);
        java.util.Arrays.fill(p, 0);
    }
}
