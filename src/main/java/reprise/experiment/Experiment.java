package reprise.experiment;

import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.Set;
import reprise.game.Horizon;
import reprise.game.StageGame;

/**
 * A validated experiment: what to play, over which grid, how much, and which comparisons to make.
 *
 * <p>Built only by {@link ExperimentFile#read(Path)}, which checks every field and reports all problems
 * at once. The grid is expanded into {@link Case}s by {@link #cases()}.
 *
 * @param name a short name (used for the default output folder)
 * @param description free text for the report
 * @param file the experiment file
 * @param sha256 the SHA-256 of the file's bytes, hex
 * @param gameText the game as written
 * @param game the stage game
 * @param pairs the strategy pairs (specs may hold {param} placeholders)
 * @param noise execution-error values of the grid, each "E" or "EX,EY"
 * @param misperception perception-error values, each "H" or "HX,HY"
 * @param horizons the game lengths of the grid
 * @param parameters strategy-parameter axes, in file order
 * @param replicates independent games per case
 * @param seed the master seed
 * @param alpha the family-wise (Holm) or false-discovery (Benjamini-Hochberg) level
 * @param tolerance the equivalence margin h for "agrees within +-h"
 * @param burnIn rounds at the start of each game left out of the tallies
 * @param snapshots rounds at which the state is compared across games
 * @param quantities which quantities to report
 * @param tests which comparisons to make
 * @param correction the multiple-testing correction
 * @param claims the claims file, or null
 * @param output the output folder
 */
public record Experiment(String name, String description, Path file, String sha256, String gameText, StageGame game,
    List<Pair> pairs, List<String> noise, List<String> misperception, List<Horizon> horizons,
    Map<String, List<Double>> parameters, long replicates, long seed, double alpha, double tolerance, long burnIn,
    List<Long> snapshots, Set<Quantity> quantities, Set<Comparison> tests, Correction correction, Path claims,
    Path output) {

    /**
     * A named pair of strategy specs.
     *
     * @param name unique within the experiment
     * @param x X's spec
     * @param y Y's spec
     * @param line the line of the pair in the file (for messages)
     */
    public record Pair(String name, String x, String y, int line) {
    }

    /** What is estimated and compared. */
    public enum Quantity {
        /** The frequencies of CC, CD, DC, DD. */
        STATES,
        /** Each player's cooperation rate. */
        COOPERATION,
        /** Each player's payoff per round. */
        PAYOFFS
    }

    /** The comparisons between simulation and exact prediction. */
    public enum Comparison {
        /** Wald test of mean state frequencies with the exact covariance. */
        FREQUENCIES,
        /** Anderson and Goodman test of transition counts. */
        TRANSITIONS,
        /** State at chosen rounds across games against v1 M^(t-1). */
        SNAPSHOTS,
        /**
         * Whether the stationary (long-run) value describes games of this length within the tolerance:
         * descriptive rows that never change the exit code (write a claim to assert a value).
         */
        STATIONARY
    }

    /** Multiple-testing corrections. */
    public enum Correction {
        /** Holm (1979) step-down, controls the family-wise error rate. */
        HOLM,
        /** Benjamini and Hochberg (1995), controls the false discovery rate. */
        BH,
        /** No correction (a warning is given when many tests are made). */
        NONE
    }

    /** @return the grid expanded into cases, pair-major, then parameters, noise, misperception, horizon */
    public List<Case> cases() {
        return Grid.expand(this);
    }
}
