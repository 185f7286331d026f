package reprise.sim;

import java.util.Arrays;
import java.util.Objects;
import reprise.game.Horizon;
import reprise.game.Match;

/**
 * Everything that defines a Monte Carlo run. Build with {@link #of(Match, Horizon, long, long)} and the
 * {@code with...} methods.
 *
 * <p>Burn-in: the first {@code burnIn} rounds of every game are played (they shape the records) but
 * left out of all tallies except the played-length statistics, the snapshots and the time-resolved
 * counts, which refer to absolute round numbers. A game with N &le; burnIn rounds (possible only with a
 * geometric length) contributes nothing to the state, transition and per-game sufficient statistics
 * (its tallied length is L = 0); it still counts in {@link SimulationResult#replicates()} and the
 * played-length statistics, and {@link SimulationResult#gamesTallied()} counts the games with L &gt; 0.
 *
 * @param match the stage game, strategies and noise
 * @param horizon fixed rounds or a continuation probability
 * @param replicates the number of games, at least 1
 * @param seed the master seed; replicate i's stream depends only on (seed, i)
 * @param burnIn rounds at the start of each game left out of the tallies, at least 0 and below a fixed
 *     game length
 * @param snapshotRounds rounds (at least 1, within a fixed horizon) whose state is counted across games;
 *     stored sorted without repeats
 * @param timeResolvedRounds T: count the state of each round 1..T across games (0 for none; at most a
 *     fixed horizon)
 * @param threads worker threads, at least 1
 * @param enactment fast path when possible, or always literal
 */
public record SimulationSpec(Match match, Horizon horizon, long replicates, long seed, long burnIn,
    long[] snapshotRounds, int timeResolvedRounds, int threads, Enactment enactment) {

    /**
     * Validates the spec with one-line messages.
     *
     * @param match the match
     * @param horizon the horizon
     * @param replicates at least 1
     * @param seed any
     * @param burnIn see the class description
     * @param snapshotRounds see the class description
     * @param timeResolvedRounds see the class description
     * @param threads at least 1
     * @param enactment the path choice
     */
    public SimulationSpec {
        Objects.requireNonNull(match, "match");
        Objects.requireNonNull(horizon, "horizon");
        Objects.requireNonNull(enactment, "enactment");
        if (replicates < 1) {
            throw new IllegalArgumentException("replicates must be at least 1: " + replicates);
        }
        if (burnIn < 0) {
            throw new IllegalArgumentException("burn-in must be at least 0 rounds: " + burnIn);
        }
        long fixed = horizon instanceof Horizon.Rounds r ? r.count() : -1;
        if (fixed > 0 && burnIn >= fixed) {
            throw new IllegalArgumentException("burn-in must be shorter than the game (" + fixed + " rounds): "
                + burnIn);
        }
        long[] snaps = Arrays.stream(Objects.requireNonNull(snapshotRounds, "snapshot rounds")).sorted()
            .distinct().toArray();
        for (long t : snaps) {
            if (t < 1) {
                throw new IllegalArgumentException("snapshot rounds must be at least 1: " + t);
            }
            if (fixed > 0 && t > fixed) {
                throw new IllegalArgumentException("snapshot round is beyond the game's " + fixed + " rounds: " + t);
            }
        }
        snapshotRounds = snaps;
        if (timeResolvedRounds < 0) {
            throw new IllegalArgumentException("time-resolved rounds must be at least 0: " + timeResolvedRounds);
        }
        if (fixed > 0 && timeResolvedRounds > fixed) {
            throw new IllegalArgumentException("time-resolved rounds exceed the game's " + fixed + " rounds: "
                + timeResolvedRounds);
        }
        if (timeResolvedRounds > (Integer.MAX_VALUE - 16) / 4) {
            throw new IllegalArgumentException("time-resolved rounds are too many for one array (at most "
                + (Integer.MAX_VALUE - 16) / 4 + "): " + timeResolvedRounds);
        }
        if (threads < 1 || threads > MAX_THREADS) {
            throw new IllegalArgumentException("threads must be between 1 and " + MAX_THREADS + ": " + threads);
        }
        double squares = squaredCountBound(replicates, horizon);
        if (squares > SQUARED_COUNT_LIMIT) {
            throw new IllegalArgumentException(squaredCountMessage(replicates, horizon));
        }
    }

    /**
     * The most worker threads a run may ask for. Results do not depend on the thread count, so more
     * threads than this only cost memory (each worker holds its own kernel and tallies).
     */
    public static final int MAX_THREADS = 1024;

    /**
     * The largest allowed value of {@link #squaredCountBound}: the per-game sums of squared counts are
     * 64-bit integers, and a quarter of their range leaves room for the cross products.
     */
    public static final double SQUARED_COUNT_LIMIT = Long.MAX_VALUE / 4.0;

    /**
     * An upper bound (in expectation, for random lengths) of the sum over the games of a game's squared
     * length, G max(n^2) for fixed n and G E[L^2] = G (1 + delta) / (1 - delta)^2 for a continuation
     * probability delta: the size of the largest per-game sum of squares the tallies will hold.
     *
     * @param replicates the number of games
     * @param horizon the horizon
     * @return the bound, possibly infinite
     */
    public static double squaredCountBound(long replicates, Horizon horizon) {
        double secondMoment;
        if (horizon instanceof Horizon.Rounds r) {
            secondMoment = (double) r.count() * r.count();
        } else {
            double delta = ((Horizon.Continuation) horizon).probability();
            secondMoment = (1 + delta) / ((1 - delta) * (1 - delta));
        }
        return replicates * secondMoment;
    }

    /**
     * @param replicates the number of games
     * @param horizon the horizon
     * @return the one-line refusal of a run whose per-game sums of squares would overflow
     */
    public static String squaredCountMessage(long replicates, Horizon horizon) {
        return String.format(java.util.Locale.ROOT, "%d game%s of %s would overflow the per-game sums of squared "
            + "counts (about %.3g, the limit is %.3g): use fewer games or shorter games", replicates,
            replicates == 1 ? "" : "s",
            horizon instanceof Horizon.Rounds r ? r.count() + " rounds" : "random length (continuation "
                + ((Horizon.Continuation) horizon).probability() + ")",
            squaredCountBound(replicates, horizon), SQUARED_COUNT_LIMIT);
    }

    /**
     * A spec with no burn-in, no snapshots, no time-resolved counts, one thread per available
     * processor and the fastest path.
     *
     * @param match the match
     * @param horizon the horizon
     * @param replicates the number of games
     * @param seed the master seed
     * @return the spec
     */
    public static SimulationSpec of(Match match, Horizon horizon, long replicates, long seed) {
        return new SimulationSpec(match, horizon, replicates, seed, 0, new long[0], 0,
            Runtime.getRuntime().availableProcessors(), Enactment.FASTEST);
    }

    /**
     * @param b burn-in rounds
     * @return a copy with this burn-in
     */
    public SimulationSpec withBurnIn(long b) {
        return new SimulationSpec(match, horizon, replicates, seed, b, snapshotRounds, timeResolvedRounds, threads,
            enactment);
    }

    /**
     * @param rounds snapshot rounds
     * @return a copy with these snapshot rounds
     */
    public SimulationSpec withSnapshots(long... rounds) {
        return new SimulationSpec(match, horizon, replicates, seed, burnIn, rounds, timeResolvedRounds, threads,
            enactment);
    }

    /**
     * @param t the number of rounds to resolve in time (0 for none)
     * @return a copy
     */
    public SimulationSpec withTimeResolved(int t) {
        return new SimulationSpec(match, horizon, replicates, seed, burnIn, snapshotRounds, t, threads, enactment);
    }

    /**
     * @param n worker threads
     * @return a copy
     */
    public SimulationSpec withThreads(int n) {
        return new SimulationSpec(match, horizon, replicates, seed, burnIn, snapshotRounds, timeResolvedRounds, n,
            enactment);
    }

    /**
     * @param e the enactment
     * @return a copy
     */
    public SimulationSpec withEnactment(Enactment e) {
        return new SimulationSpec(match, horizon, replicates, seed, burnIn, snapshotRounds, timeResolvedRounds,
            threads, e);
    }

    /**
     * @param n the number of games
     * @return a copy
     */
    public SimulationSpec withReplicates(long n) {
        return new SimulationSpec(match, horizon, n, seed, burnIn, snapshotRounds, timeResolvedRounds, threads,
            enactment);
    }

    /**
     * @param s the master seed
     * @return a copy
     */
    public SimulationSpec withSeed(long s) {
        return new SimulationSpec(match, horizon, replicates, s, burnIn, snapshotRounds, timeResolvedRounds, threads,
            enactment);
    }

    /** @return the snapshot rounds (a copy), sorted */
    @Override
    public long[] snapshotRounds() {
        return snapshotRounds.clone();
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof SimulationSpec s && match.equals(s.match) && horizon.equals(s.horizon)
            && replicates == s.replicates && seed == s.seed && burnIn == s.burnIn
            && Arrays.equals(snapshotRounds, s.snapshotRounds) && timeResolvedRounds == s.timeResolvedRounds
            && threads == s.threads && enactment == s.enactment;
    }

    @Override
    public int hashCode() {
        return Objects.hash(match, horizon, replicates, seed, burnIn, Arrays.hashCode(snapshotRounds),
            timeResolvedRounds, threads, enactment);
    }

    @Override
    public String toString() {
        return "SimulationSpec[x=" + match.x().label() + ", y=" + match.y().label() + ", " + match.noise() + ", "
            + horizon.describe() + ", replicates=" + replicates + ", seed=" + seed + ", burnIn=" + burnIn
            + ", snapshots=" + Arrays.toString(snapshotRounds) + ", timeResolved=" + timeResolvedRounds
            + ", threads=" + threads + ", " + enactment + "]";
    }
}
