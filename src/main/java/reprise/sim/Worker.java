package reprise.sim;

/**
 * One worker's engine: plays ranges of replicates into its own {@link Accumulator}. The simulator
 * merges the accumulators of its workers at the end.
 */
abstract class Worker {
    final Accumulator acc;

    Worker(Accumulator acc) {
        this.acc = acc;
    }

    /**
     * Plays the replicates [from, to).
     *
     * @return the rounds played
     */
    abstract long run(long from, long to);
}
