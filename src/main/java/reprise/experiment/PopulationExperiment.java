package reprise.experiment;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import reprise.game.Horizon;
import reprise.game.MemoryStrategy;
import reprise.game.Noise;
import reprise.game.Population;
import reprise.game.StageGame;

/**
 * A validated population experiment: an experiment file with a {@code population:} section (README.md,
 * "Population experiments"). Its grid is expanded into {@link Point}s; at each point every ordered
 * (mutant, resident) pair of the strategy set is a fixation question.
 *
 * @param file the experiment file
 * @param sha256 the SHA-256 of the file's bytes
 * @param name the experiment name
 * @param description free text
 * @param gameText the stage game as written
 * @param game the (symmetric) stage game
 * @param strategyNames the strategies' specs as written, in file order
 * @param strategies the parsed memory-one strategies, in the same order
 * @param update the update rule
 * @param fitness the Moran fitness map (read by the Moran rule only)
 * @param coPlayers 0 for every other member, else the sample size m
 * @param mutation none, rare or an explicit rate
 * @param mu the explicit mutation rate (0 unless {@code mutation} is RATE)
 * @param invasions independent simulated invasions per grid point and ordered pair (0: exact only)
 * @param updates the length in updates of the one simulated run with mutation per grid point (explicit rate
 *     only; 0: none)
 * @param tolerance the relative error |rho / rho_c - 1| up to which a basis is said to describe the population
 * @param sizes the grid of population sizes N
 * @param selections the grid of selection strengths (beta or w)
 * @param noise the grid of execution errors
 * @param misperception the grid of perception errors
 * @param horizons the grid of game lengths
 * @param seed the master seed
 * @param alpha the level of every test
 * @param correction the multiple-testing correction over the (c) tests of the file
 * @param output the output folder
 * @param claimsFile the claims file ({@code population.claims}, resolved against the experiment's folder), or null
 * @param claims the claims read from it, one per matched grid point and question or strategy (empty without)
 */
public record PopulationExperiment(Path file, String sha256, String name, String description, String gameText,
    StageGame game, List<String> strategyNames, List<MemoryStrategy> strategies, Population.Update update,
    Population.Fitness fitness, int coPlayers, Mutation mutation, double mu, long invasions, long updates, double tolerance,
    List<Integer> sizes, List<Double> selections, List<Double> noise, List<Double> misperception,
    List<Horizon> horizons, long seed, double alpha, Experiment.Correction correction, Path output, Path claimsFile,
    List<PopulationClaims.Claim> claims) {

    /**
     * An experiment without claims.
     *
     * @param file the experiment file
     * @param sha256 its SHA-256
     * @param name the name
     * @param description free text
     * @param gameText the stage game as written
     * @param game the stage game
     * @param strategyNames the strategies as written
     * @param strategies the strategies
     * @param update the update rule
     * @param fitness the Moran fitness map
     * @param coPlayers 0 for all, else m
     * @param mutation the mutation
     * @param mu the rate
     * @param invasions invasions per question
     * @param updates updates of the run with mutation
     * @param tolerance the relative tolerance
     * @param sizes N
     * @param selections beta or w
     * @param noise execution errors
     * @param misperception perception errors
     * @param horizons game lengths
     * @param seed the master seed
     * @param alpha the level
     * @param correction the correction
     * @param output the output folder
     */
    public PopulationExperiment(Path file, String sha256, String name, String description, String gameText,
        StageGame game, List<String> strategyNames, List<MemoryStrategy> strategies, Population.Update update,
        Population.Fitness fitness, int coPlayers, Mutation mutation, double mu, long invasions, long updates,
        double tolerance, List<Integer> sizes, List<Double> selections, List<Double> noise, List<Double> misperception,
        List<Horizon> horizons, long seed, double alpha, Experiment.Correction correction, Path output) {
        this(file, sha256, name, description, gameText, game, strategyNames, strategies, update, fitness, coPlayers,
            mutation, mu, invasions, updates, tolerance, sizes, selections, noise, misperception, horizons, seed, alpha,
            correction, output, null, List.of());
    }

    /**
     * @param file the claims file
     * @param read its claims
     * @return this experiment with those claims
     */
    public PopulationExperiment withClaims(Path file, List<PopulationClaims.Claim> read) {
        return new PopulationExperiment(this.file, sha256, name, description, gameText, game, strategyNames, strategies,
            update, fitness, coPlayers, mutation, mu, invasions, updates, tolerance, sizes, selections, noise,
            misperception, horizons, seed, alpha, correction, output, file, read);
    }

    /** How mutation enters the population. */
    public enum Mutation {
        /** No mutation: fixation of one mutant only. */
        NONE,
        /** The limit of rare mutations: also the abundances of the embedded chain (Fudenberg &amp; Imhof 2006). */
        RARE,
        /** An explicit rate mu per update (two strategies): also the exact stationary abundance. */
        RATE;

        /** @return the name used in files */
        public String label() {
            return name().toLowerCase(java.util.Locale.ROOT);
        }
    }

    /** Copies the lists. */
    public PopulationExperiment {
        strategyNames = List.copyOf(strategyNames);
        strategies = List.copyOf(strategies);
        sizes = List.copyOf(sizes);
        selections = List.copyOf(selections);
        noise = List.copyOf(noise);
        misperception = List.copyOf(misperception);
        horizons = List.copyOf(horizons);
        claims = List.copyOf(claims);
    }

    /**
     * One grid point: a population, the errors of every game and the length of a game.
     *
     * @param index the point's position in the expansion (from 0)
     * @param population the population and update rule
     * @param noise the (symmetric) errors
     * @param horizon the length of a game
     */
    public record Point(int index, Population population, Noise noise, Horizon horizon) {
        /** @return a name such as {@code N=10/selection=1/noise=0.01/rounds=20} */
        public String name() {
            String s = "N=" + population.size() + "/selection=" + ExperimentFile.num(population.selection()) + "/noise="
                + ExperimentFile.num(noise.executionX());
            if (noise.perceptionX() > 0) {
                s += "/misperception=" + ExperimentFile.num(noise.perceptionX());
            }
            return s + "/" + horizon.describe();
        }
    }

    /** @return the grid expanded: size, then selection, noise, misperception, horizon (the last varies fastest) */
    public List<Point> points() {
        List<Point> out = new ArrayList<>();
        for (int n : sizes) {
            for (double s : selections) {
                for (double e : noise) {
                    for (double p : misperception) {
                        for (Horizon h : horizons) {
                            out.add(new Point(out.size(), population(n, s), Noise.symmetric(e, p), h));
                        }
                    }
                }
            }
        }
        return out;
    }

    /**
     * The population of one size and selection strength.
     *
     * @param size N
     * @param selection beta or w
     * @return the population
     * @throws IllegalArgumentException if the values do not make a population
     */
    Population population(int size, double selection) {
        return new Population(size, update, selection, fitness, coPlayers);
    }
}
