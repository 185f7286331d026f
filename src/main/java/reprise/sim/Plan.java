package reprise.sim;

/**
 * What every kernel needs to know besides the players.
 *
 * @param seed the master seed
 * @param fixedRounds the fixed game length, or 0 for a geometric length
 * @param continuation the continuation probability when {@code fixedRounds == 0}
 * @param burnIn rounds left out of the tallies at the start of each game
 * @param snapshotRounds sorted distinct rounds whose state is counted
 * @param timeRounds the number of rounds counted in the time-resolved array
 */
record Plan(long seed, long fixedRounds, double continuation, long burnIn, long[] snapshotRounds, int timeRounds) {
}
