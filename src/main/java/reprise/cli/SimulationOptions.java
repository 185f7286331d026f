package reprise.cli;

import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import reprise.game.Horizon;
import reprise.game.Match;
import reprise.sim.SimulationSpec;

/**
 * The options that set up a round-by-round simulation (games, seed, threads, burn-in, snapshots, progress
 * line), with their checks and the construction of the {@link SimulationSpec}, shared by {@code simulate}
 * and {@code calibrate}.
 *
 * <p>The help texts below are worded for {@code simulate}. A command where the options mean something
 * more specific (in {@code calibrate} a replicate is one game of a repetition) words them in its own
 * resource bundle, keyed by the option's name without dashes (see {@link CalibrateCommand.Help}).
 */
final class SimulationOptions {

    @Option(names = "--replicates", paramLabel = "G", defaultValue = "1000",
        description = "Number of independent games. Default: ${DEFAULT-VALUE}.")
    long replicates;

    @Option(names = "--seed", paramLabel = "S", defaultValue = "1",
        description = "Master seed; game i's random stream depends only on (S, i). Default: ${DEFAULT-VALUE}.")
    long seed;

    @Option(names = "--threads", paramLabel = "N", description = "Worker threads. Default: all cores.")
    Integer threads;

    @Mixin
    BurnInOption burnIn;

    @Option(names = "--snapshots", paramLabel = "ROUND", split = ",",
        description = "Count the state at these rounds across games.")
    long[] snapshots;

    @Option(names = "--quiet", description = "No progress line on stderr.")
    boolean quiet;

    /**
     * Checks the values that need no match: the number of games, the threads and the burn-in.
     *
     * @param minimumReplicates the fewest games the command can use
     * @param why why the command needs that many, for the message, or empty
     * @throws IllegalArgumentException naming the option and the value
     */
    void check(long minimumReplicates, String why) {
        if (replicates < minimumReplicates) {
            throw new IllegalArgumentException("--replicates must be at least " + minimumReplicates
                + (why.isEmpty() ? "" : " (" + why + ")") + ": " + replicates);
        }
        if (threads != null && (threads < 1 || threads > SimulationSpec.MAX_THREADS)) {
            throw new IllegalArgumentException("--threads must be between 1 and " + SimulationSpec.MAX_THREADS
                + ": " + threads);
        }
        burnIn.checked();
    }

    /**
     * @param match the match to play
     * @param horizon the horizon of every game
     * @return the simulation these options describe (default enactment), after {@link #check}
     * @throws IllegalArgumentException when the burn-in or the snapshots do not fit the horizon
     */
    SimulationSpec spec(Match match, Horizon horizon) {
        if (SimulationSpec.squaredCountBound(replicates, horizon) > SimulationSpec.SQUARED_COUNT_LIMIT) {
            throw new IllegalArgumentException("--replicates and --rounds/--continuation: "
                + SimulationSpec.squaredCountMessage(replicates, horizon));
        }
        SimulationSpec s = SimulationSpec.of(match, horizon, replicates, seed).withBurnIn(burnIn.burnIn);
        if (threads != null) {
            s = s.withThreads(threads);
        }
        if (snapshots != null) {
            s = s.withSnapshots(snapshots);
        }
        return s;
    }

    /** @return whether the progress line and the closing summary on stderr are off */
    boolean quiet() {
        return quiet;
    }
}
