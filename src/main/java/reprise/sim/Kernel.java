package reprise.sim;

/**
 * Plays games replicate by replicate into an {@link Accumulator}. The base class cuts each game into
 * segments of rounds with the same bookkeeping (burn-in, first tallied round, time-resolved rounds,
 * snapshot rounds) so that the subclasses' round loops test only loop-invariant mode bits.
 */
abstract class Kernel extends Worker {
    /** Count the round's state. */
    static final int TALLY = 1;
    /** Count the step from the previous true history to this round's state. */
    static final int STEP = 2;
    /** Count the state in the time-resolved array. */
    static final int TIME = 4;

    final ReplicateStream rng = new ReplicateStream();
    final Plan plan;
    /** True state (X's view) of the last round played, set by {@link #play}. */
    int lastState;

    Kernel(Plan plan, Accumulator acc) {
        super(acc);
        this.plan = plan;
    }

    /** Resets the players' records for a new game. */
    abstract void beginGame();

    /**
     * Plays the next {@code count} rounds of the current game.
     *
     * @param count at least 1
     * @param mode bits TALLY, STEP, TIME
     * @param offset the number of rounds of this game already played (for TIME)
     */
    abstract void play(long count, int mode, long offset);

    @Override
    final long run(long from, long to) {
        long rounds = 0;
        for (long i = from; i < to; i++) {
            rounds += playGame(i);
        }
        return rounds;
    }

    private long playGame(long replicate) {
        rng.seed(plan.seed(), replicate);
        long n = plan.fixedRounds() > 0 ? plan.fixedRounds() : rng.geometricLength(plan.continuation());
        long b = plan.burnIn();
        long time = plan.timeRounds();
        long[] snaps = plan.snapshotRounds();
        acc.beginGame();
        beginGame();
        long done = 0;
        int k = 0;
        while (done < n) {
            long next = n;
            if (done < b) {
                next = Math.min(next, b);
            } else if (done == b) {
                next = Math.min(next, b + 1);
            }
            if (done < time) {
                next = Math.min(next, time);
            }
            if (k < snaps.length) {
                next = Math.min(next, snaps[k]);
            }
            int mode = (done >= b ? TALLY : 0) | (done > b ? STEP : 0) | (done < time ? TIME : 0);
            play(next - done, mode, done);
            done = next;
            while (k < snaps.length && snaps[k] == done) {
                acc.snapshotCounts[4 * k + lastState]++;
                k++;
            }
        }
        acc.endGame(n);
        return n;
    }
}
