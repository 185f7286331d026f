package reprise.experiment;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collections;
import java.util.EnumSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Set;
import reprise.game.Horizon;
import reprise.game.StageGame;

/**
 * A validated experiment: what to play, over which grid, how much, and which comparisons to make.
 *
 * <p>Built only by {@link ExperimentFile#read(Path)}, which checks every field and reports all problems
 * at once (through a {@link Builder}). The grid is expanded into {@link Case}s by {@link #cases()}.
 *
 * <p>Immutable: the constructor copies every collection (keeping file order) and checks the invariants
 * the file reader has established, so that an experiment built otherwise cannot be inconsistent.
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
 * @param strategySet the strategy set whose matches are among the pairs, or null
 * @param derived the derived quantities, in file order (names unique, none a base quantity's)
 * @param tolerances margins by quantity group, quantity or derived name, overriding {@code tolerance}
 */
public record Experiment(String name, String description, Path file, String sha256, String gameText, StageGame game,
    List<Pair> pairs, List<String> noise, List<String> misperception, List<Horizon> horizons,
    Map<String, List<Double>> parameters, long replicates, long seed, double alpha, double tolerance, long burnIn,
    List<Long> snapshots, Set<Quantity> quantities, Set<Comparison> tests, Correction correction, Path claims,
    Path output, StrategySet strategySet, List<DerivedQuantity> derived,
    Map<String, Tolerance> tolerances) {

    /**
     * Copies the collections and checks the invariants; messages name the component and show the value.
     *
     * @throws IllegalArgumentException if a component is out of range
     * @throws NullPointerException if a required component is null (only sha256 and claims may be null)
     */
    public Experiment {
        Objects.requireNonNull(name, "name");
        Objects.requireNonNull(description, "description");
        Objects.requireNonNull(file, "file");
        Objects.requireNonNull(gameText, "gameText");
        Objects.requireNonNull(game, "game");
        Objects.requireNonNull(correction, "correction");
        Objects.requireNonNull(output, "output");
        pairs = nonEmpty("pairs", pairs);
        derived = List.copyOf(derived);
        tolerances = Collections.unmodifiableMap(new LinkedHashMap<>(tolerances));
        if (strategySet != null) {
            for (StrategySet.Cell cell : strategySet.cells()) {
                if (pairs.stream().noneMatch(p -> p.name().equals(cell.pairName()))) {
                    throw new IllegalArgumentException("strategy set match " + cell.pairName() + " is not a pair");
                }
            }
        }
        noise = nonEmpty("noise", noise);
        misperception = nonEmpty("misperception", misperception);
        horizons = nonEmpty("horizons", horizons);
        snapshots = List.copyOf(snapshots);
        parameters = copyAxes(parameters);
        quantities = Collections.unmodifiableSet(copyEnums(Quantity.class, quantities));
        tests = Collections.unmodifiableSet(copyEnums(Comparison.class, tests));
        if (replicates < 1) {
            throw new IllegalArgumentException("replicates must be at least 1: " + replicates);
        }
        if (!(alpha > 0 && alpha < 0.5)) {
            throw new IllegalArgumentException("alpha must be in (0, 0.5): " + alpha);
        }
        if (!(tolerance > 0)) {
            throw new IllegalArgumentException("tolerance must be a positive margin: " + tolerance);
        }
        if (burnIn < 0) {
            throw new IllegalArgumentException("burn-in must be at least 0 rounds: " + burnIn);
        }
        for (long t : snapshots) {
            if (t < 1) {
                throw new IllegalArgumentException("snapshot rounds are counted from 1: " + t);
            }
        }
    }

    /**
     * An experiment without a strategy set (the form before strategy sets existed).
     *
     * @param name see the record
     * @param description see the record
     * @param file see the record
     * @param sha256 see the record
     * @param gameText see the record
     * @param game see the record
     * @param pairs see the record
     * @param noise see the record
     * @param misperception see the record
     * @param horizons see the record
     * @param parameters see the record
     * @param replicates see the record
     * @param seed see the record
     * @param alpha see the record
     * @param tolerance see the record
     * @param burnIn see the record
     * @param snapshots see the record
     * @param quantities see the record
     * @param tests see the record
     * @param correction see the record
     * @param claims see the record
     * @param output see the record
     */
    public Experiment(String name, String description, Path file, String sha256, String gameText, StageGame game,
        List<Pair> pairs, List<String> noise, List<String> misperception, List<Horizon> horizons,
        Map<String, List<Double>> parameters, long replicates, long seed, double alpha, double tolerance, long burnIn,
        List<Long> snapshots, Set<Quantity> quantities, Set<Comparison> tests, Correction correction, Path claims,
        Path output) {
        this(name, description, file, sha256, gameText, game, pairs, noise, misperception, horizons, parameters,
            replicates, seed, alpha, tolerance, burnIn, snapshots, quantities, tests, correction, claims, output, null, List.of(), Map.of());
    }

    private static <T> List<T> nonEmpty(String what, List<T> values) {
        List<T> copy = List.copyOf(values);
        if (copy.isEmpty()) {
            throw new IllegalArgumentException(what + " must not be empty");
        }
        return copy;
    }

    private static Map<String, List<Double>> copyAxes(Map<String, List<Double>> axes) {
        Map<String, List<Double>> copy = new LinkedHashMap<>();
        axes.forEach((k, v) -> copy.put(Objects.requireNonNull(k, "parameter name"), List.copyOf(v)));
        return Collections.unmodifiableMap(copy);
    }

    private static <E extends Enum<E>> Set<E> copyEnums(Class<E> type, Set<E> values) {
        Set<E> copy = EnumSet.noneOf(type);
        copy.addAll(values);
        return copy;
    }

    /**
     * Collects an experiment's components while a file is read; {@link #build()} makes the immutable
     * value. Unset fields keep the file format's defaults.
     */
    static final class Builder {
        String name;
        String description = "";
        Path file;
        String sha256;
        String gameText;
        StageGame game;
        List<Pair> pairs = new ArrayList<>();
        List<String> noise = List.of("0");
        List<String> misperception = List.of("0");
        List<Horizon> horizons = new ArrayList<>();
        Map<String, List<Double>> parameters = new LinkedHashMap<>();
        long replicates = 1000;
        long seed = 1;
        double alpha = 0.05;
        double tolerance = 0.01;
        long burnIn;
        List<Long> snapshots = new ArrayList<>();
        Set<Quantity> quantities = EnumSet.allOf(Quantity.class);
        Set<Comparison> tests = EnumSet.allOf(Comparison.class);
        Correction correction = Correction.HOLM;
        Path claims;
        Path output;
        StrategySet strategySet;
        List<DerivedQuantity> derived = new ArrayList<>();
        Map<String, Tolerance> tolerances = new LinkedHashMap<>();

        /** @return whether the horizons are continuation probabilities (random game lengths) */
        boolean continuation() {
            return !horizons.isEmpty() && horizons.get(0) instanceof Horizon.Continuation;
        }

        /** @return the experiment */
        Experiment build() {
            List<Pair> all = new ArrayList<>(pairs);
            if (strategySet != null) {
                all.addAll(strategySet.pairs());
            }
            return new Experiment(name, description, file, sha256, gameText, game, all, noise, misperception,
                horizons, parameters, replicates, seed, alpha, tolerance, burnIn, snapshots, quantities, tests,
                correction, claims, output, strategySet, derived, tolerances);
        }
    }

    /**
     * A named pair of strategy specs.
     *
     * @param name unique within the experiment
     * @param x X's spec
     * @param y Y's spec
     * @param line the line of the pair in the file (for messages)
     * @param xLine the line of its {@code x:} field (for messages about X's strategy)
     * @param yLine the line of its {@code y:} field
     */
    public record Pair(String name, String x, String y, int line, int xLine, int yLine) {
        /**
         * A pair whose fields are all on its first line (as in {@code - {name: a, x: tft, y: tft}}).
         *
         * @param name the name
         * @param x X's spec
         * @param y Y's spec
         * @param line the line of the pair
         */
        public Pair(String name, String x, String y, int line) {
            this(name, x, y, line, line, line);
        }

        /** @param field "x" or "y"; @return the line of that field */
        int lineOf(String field) {
            return field.equals("x") ? xLine : field.equals("y") ? yLine : line;
        }

        /** Checks that the name and specs are present. */
        public Pair {
            Objects.requireNonNull(name, "name");
            Objects.requireNonNull(x, "x");
            Objects.requireNonNull(y, "y");
        }
    }

    /** What is estimated and compared. */
    public enum Quantity {
        /** The frequencies of CC, CD, DC, DD. */
        STATES,
        /** Each player's cooperation rate. */
        COOPERATION,
        /** Each player's payoff per round. */
        PAYOFFS,
        /** The experiment's derived quantities (of its {@code derived:} section). */
        DERIVED
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
