package reprise.sim;

/**
 * Receives progress reports from a running simulation. Reports come after each finished chunk of
 * replicates, from worker threads, but never two at once (calls are serialised), so an implementation
 * needs no locking of its own. It should return quickly.
 */
@FunctionalInterface
public interface ProgressListener {

    /**
     * Reports progress.
     *
     * @param replicatesDone games finished so far in this run
     * @param replicates games in this run
     * @param roundsDone rounds played so far (burn-in included)
     * @param roundsExpected the expected number of rounds of the whole run (exact for fixed rounds, the
     *     mean for geometric lengths; capped at {@link Long#MAX_VALUE})
     */
    void progress(long replicatesDone, long replicates, long roundsDone, long roundsExpected);
}
