package reprise.experiment;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.yaml.snakeyaml.nodes.MappingNode;
import org.yaml.snakeyaml.nodes.Node;
import reprise.game.Horizon;
import reprise.game.MemoryStrategy;
import reprise.game.Player;
import reprise.game.Population;
import reprise.game.StageGame;
import reprise.game.Strategies;
import reprise.game.Strategy;

/**
 * The schema of a population experiment file (one with a top-level {@code population:} key): its own
 * sections beside {@link ExperimentSchema}'s, each field's problems reported as {@code file:line: field:
 * message}. The format is documented in README.md ("Population experiments").
 */
final class PopulationSchema {

    /** The top-level keys of a population experiment. */
    static final List<String> TOP_KEYS = List.of("experiment", "description", "game", "population", "grid", "seed",
        "alpha", "correction", "output");
    static final List<String> POPULATION_KEYS = List.of("strategies", "update", "fitness", "co_players", "mutation",
        "invasions", "updates", "tolerance", "claims");
    static final List<String> GRID_KEYS = List.of("size", "selection", "noise", "misperception", "rounds",
        "continuation");
    /** The most invasions per grid point and ordered pair (exact binomial tests take an int count). */
    static final long MOST_INVASIONS = 100_000_000L;
    /** The longest run with mutation, in updates (one record per update). */
    static final long MOST_UPDATES = 100_000_000L;
    /** The most grid points times ordered pairs. */
    static final long MOST_QUESTIONS = 10_000L;

    private final Problems problems;
    private final Map<String, Node> top;
    private final Path file;

    private String name;
    private String description;
    private String gameText = "3,0,5,1";
    private StageGame game;
    private final List<String> strategyNames = new ArrayList<>();
    private final List<MemoryStrategy> strategies = new ArrayList<>();
    private Population.Update update = Population.Update.PAIRWISE_COMPARISON;
    private Population.Fitness fitness = Population.Fitness.LINEAR;
    private int coPlayers;
    private PopulationExperiment.Mutation mutation = PopulationExperiment.Mutation.NONE;
    private double mu;
    private long invasions = 1000;
    private long updates;
    private double tolerance = 0.1;
    private final List<Integer> sizes = new ArrayList<>();
    private final List<Double> selections = new ArrayList<>();
    private final List<Double> noise = new ArrayList<>();
    private final List<Double> misperception = new ArrayList<>();
    private final List<Horizon> horizons = new ArrayList<>();
    private long seed;
    private double alpha;
    private Experiment.Correction correction = Experiment.Correction.HOLM;
    private Path output;
    private Path claims;
    private int selectionLine;
    private int continuationLine;
    private Map<String, Node> pop = Map.of();

    private PopulationSchema(Path file, Map<String, Node> top, Problems problems) {
        this.file = file;
        this.top = top;
        this.problems = problems;
    }

    /**
     * Whether a composed file is a population experiment.
     *
     * @param root the root node (may be null)
     * @return whether it is a mapping with a top-level {@code population:} key
     */
    static boolean declares(Node root) {
        if (root instanceof MappingNode m) {
            return m.getValue().stream().anyMatch(t -> "population".equals(YamlReader.scalarText(t.getKeyNode())));
        }
        return false;
    }

    /**
     * Reads and validates a population experiment.
     *
     * @param file the file
     * @param root its root node, a mapping with {@code population:}
     * @param hash the SHA-256 of its bytes
     * @param problems where problems go (thrown at the end if any)
     * @return the experiment
     */
    static PopulationExperiment read(Path file, Node root, String hash, Problems problems) {
        PopulationSchema s = new PopulationSchema(file,
            YamlReader.mapping((MappingNode) root, "", TOP_KEYS, problems), problems);
        s.name();
        s.game();
        s.population();
        s.grid();
        s.numbers();
        s.rules();
        problems.throwIfAny();
        return new PopulationExperiment(file, hash, s.name, s.description, s.gameText, s.game, s.strategyNames,
            s.strategies, s.update, s.fitness, s.coPlayers, s.mutation, s.mu, s.invasions, s.updates, s.tolerance, s.sizes,
            s.selections, s.noise, s.misperception, s.horizons, s.seed, s.alpha, s.correction, s.output, s.claims, List.of());
    }

    private int line(Map<String, Node> map, String key) {
        return YamlReader.line(map.get(key));
    }

    private void name() {
        name = YamlReader.string(top, "experiment", null, problems);
        if (name == null) {
            problems.add(0, "experiment", "is required: a short name such as 'quota-spread'");
        } else if (!name.matches("[A-Za-z0-9][A-Za-z0-9._-]*")) {
            problems.add(line(top, "experiment"), "experiment",
                "must be letters, digits, '.', '_' or '-' (it names the output folder): '" + name + "'");
        } else if (name.length() > ExperimentSchema.MOST_NAME_LENGTH) {
            problems.add(line(top, "experiment"), "experiment", "is " + name.length() + " characters long; at most "
                + ExperimentSchema.MOST_NAME_LENGTH + " (it names the output folder)");
        }
        description = YamlReader.string(top, "description", "", problems);
    }

    private void game() {
        Node n = top.get("game");
        if (n != null) {
            String t = YamlReader.scalarText(n);
            if (t == null) {
                problems.add(YamlReader.line(n), "game", "must be text such as pd:3,0,5,1 or donation:3,1");
            } else {
                gameText = t;
            }
        }
        try {
            game = StageGame.parse(gameText);
            double[] x = game.payoffX();
            double[] y = game.payoffY();
            if (x[0] != y[0] || x[3] != y[3] || x[1] != y[2] || x[2] != y[1]) {
                problems.add(line(top, "game"), "game", "a population needs a symmetric stage game: " + gameText);
                game = null;
            }
        } catch (IllegalArgumentException e) {
            problems.add(line(top, "game"), "game", e.getMessage());
        }
    }

    private void population() {
        Node node = top.get("population");
        if (!(node instanceof MappingNode pm)) {
            problems.add(YamlReader.line(node), "population", "must be a mapping with strategies:, update:, "
                + "invasions: ...");
            return;
        }
        Map<String, Node> p = pop = prefixed(YamlReader.mapping(pm, "population.", POPULATION_KEYS, problems), "population.");
        strategies(p.get("population.strategies"), YamlReader.line(node));
        String u = YamlReader.string(p, "population.update", "pairwise", problems).trim().toLowerCase(Locale.ROOT);
        switch (u) {
            case "pairwise" -> update = Population.Update.PAIRWISE_COMPARISON;
            case "moran" -> update = Population.Update.MORAN_BIRTH_DEATH;
            default -> problems.add(line(p, "population.update"), "population.update", "must be pairwise or moran: '" + u + "'");
        }
        String f = YamlReader.string(p, "population.fitness", "linear", problems).trim().toLowerCase(Locale.ROOT);
        switch (f) {
            case "linear" -> fitness = Population.Fitness.LINEAR;
            case "exponential" -> fitness = Population.Fitness.EXPONENTIAL;
            default -> problems.add(line(p, "population.fitness"), "population.fitness", "must be linear or exponential: '" + f
                + "'");
        }
        if (p.containsKey("population.fitness") && update != Population.Update.MORAN_BIRTH_DEATH) {
            problems.add(line(p, "population.fitness"), "population.fitness", "is read by the Moran rule only (update: moran)");
        }
        String c = YamlReader.string(p, "population.co_players", "all", problems).trim();
        if (!c.equals("all")) {
            Long m = YamlReader.asLong(new YamlReader.Scalar(c, line(p, "population.co_players")), "population.co_players", problems);
            if (m != null && (m < 1 || m > Population.MAX_SIZE)) {
                problems.add(line(p, "population.co_players"), "population.co_players", "must be 'all' or a sample size m of at "
                    + "least 1: " + m);
            } else if (m != null) {
                coPlayers = (int) (long) m;
            }
        }
        mutation(p);
        if (p.containsKey("population.invasions")) {
            invasions = YamlReader.longValue(p, "population.invasions", 1000, 0, MOST_INVASIONS, problems);
        }
        if (p.containsKey("population.updates")) {
            updates = YamlReader.longValue(p, "population.updates", 0, 0, MOST_UPDATES, problems);
            if (mutation != PopulationExperiment.Mutation.RATE) {
                problems.add(line(p, "population.updates"), "population.updates", "is the length of the simulated run "
                    + "with mutation: give mutation: a rate");
            } else if (updates > 0 && updates < 4) {
                problems.add(line(p, "population.updates"), "population.updates", "a run needs at least 4 updates "
                    + "(batch means): " + updates);
            }
        } else if (mutation == PopulationExperiment.Mutation.RATE) {
            updates = 100_000;
        }
        claims(p);
        tolerance = YamlReader.doubleValue(p, "population.tolerance", 0.1, problems);
        if (!(tolerance > 0)) {
            problems.add(line(p, "population.tolerance"), "population.tolerance", "must be a positive relative error: "
                + ExperimentFile.num(tolerance));
        }
    }

    private void strategies(Node node, int sectionLine) {
        if (node == null) {
            problems.add(sectionLine, "population.strategies", "is required: a list of at least two strategies, "
                + "such as [tft, wsls, alld]");
            return;
        }
        for (YamlReader.Scalar s : YamlReader.scalars(node, "population.strategies", problems)) {
            String spec = s.text().trim();
            if (strategyNames.contains(spec)) {
                problems.add(s.line(), "population.strategies", "'" + spec + "' is given twice");
                continue;
            }
            if (game == null) {
                strategyNames.add(spec);
                continue;
            }
            try {
                Strategy st = Strategies.parse(spec, game, Player.X);
                if (!(st instanceof MemoryStrategy ms) || ms.memory() != 1) {
                    problems.add(s.line(), "population.strategies", "'" + spec + "': population runs play memory-one "
                        + "strategies only");
                } else {
                    strategyNames.add(spec);
                    strategies.add(ms);
                }
            } catch (IllegalArgumentException e) {
                problems.add(s.line(), "population.strategies", e.getMessage());
            }
        }
        if (strategyNames.size() < 2) {
            problems.add(YamlReader.line(node), "population.strategies", "needs at least two strategies: "
                + strategyNames.size());
        }
    }

    private void mutation(Map<String, Node> p) {
        String m = YamlReader.string(p, "population.mutation", "none", problems).trim().toLowerCase(Locale.ROOT);
        switch (m) {
            case "none" -> mutation = PopulationExperiment.Mutation.NONE;
            case "rare" -> mutation = PopulationExperiment.Mutation.RARE;
            default -> {
                Double r = YamlReader.asDouble(new YamlReader.Scalar(m, line(p, "population.mutation")), "population.mutation",
                    problems);
                if (r != null && !(r > 0 && r < 1)) {
                    problems.add(line(p, "population.mutation"), "population.mutation", "must be none, rare or a rate in (0, 1): "
                        + ExperimentFile.num(r));
                } else if (r != null) {
                    mutation = PopulationExperiment.Mutation.RATE;
                    mu = r;
                }
            }
        }
    }

    private static Map<String, Node> prefixed(Map<String, Node> map, String prefix) {
        Map<String, Node> out = new java.util.LinkedHashMap<>();
        map.forEach((k, v) -> out.put(prefix + k, v));
        return out;
    }

    private void grid() {
        Node node = top.get("grid");
        if (!(node instanceof MappingNode gm)) {
            problems.add(YamlReader.line(node), "grid", node == null ? "is required, with size:, selection: and "
                + "rounds: or continuation:" : "must be a mapping with size:, selection:, noise:, rounds: ...");
            return;
        }
        Map<String, Node> g = YamlReader.mapping(gm, "grid.", GRID_KEYS, problems);
        if (!g.containsKey("size")) {
            problems.add(YamlReader.line(node), "grid.size", "is required: population sizes N, such as [10, 50]");
        } else {
            for (YamlReader.Scalar s : YamlReader.scalars(g.get("size"), "grid.size", problems)) {
                Long n = YamlReader.asLong(s, "grid.size", problems);
                if (n != null && (n < 2 || n > Population.MAX_SIZE)) {
                    problems.add(s.line(), "grid.size", "must be 2 to " + Population.MAX_SIZE + ": " + n);
                } else if (n != null) {
                    sizes.add((int) (long) n);
                }
            }
            YamlReader.duplicates(sizes.stream().map(String::valueOf).toList(), line(g, "size"), "grid.size", problems);
        }
        if (!g.containsKey("selection")) {
            problems.add(YamlReader.line(node), "grid.selection", "is required: selection strengths (beta, or w for "
                + "moran), such as [0.1, 1]");
        } else {
            selectionLine = line(g, "selection");
            numbers(g.get("selection"), "grid.selection", selections, 0, Double.MAX_VALUE);
        }
        if (g.containsKey("noise")) {
            numbers(g.get("noise"), "grid.noise", noise, 0, 1);
        } else {
            noise.add(0.0);
        }
        if (g.containsKey("misperception")) {
            numbers(g.get("misperception"), "grid.misperception", misperception, 0, 1);
        } else {
            misperception.add(0.0);
        }
        horizons(g, node);
    }

    private void numbers(Node node, String field, List<Double> out, double min, double max) {
        for (YamlReader.Scalar s : YamlReader.scalars(node, field, problems)) {
            Double d = YamlReader.asDouble(s, field, problems);
            if (d != null && !(d >= min && d <= max)) {
                problems.add(s.line(), field, "must be " + (max == 1 ? "a probability in [0, 1]" : "finite and at least "
                    + ExperimentFile.num(min)) + ": " + ExperimentFile.num(d));
            } else if (d != null) {
                out.add(d);
            }
        }
        YamlReader.duplicates(out.stream().map(ExperimentFile::num).toList(), YamlReader.line(node), field, problems);
    }

    private void horizons(Map<String, Node> g, Node gridNode) {
        continuationLine = YamlReader.line(g.get("continuation"));
        ExperimentSchema.readHorizons(g, gridNode, 1_000_000, horizons, problems);
    }

    private void numbers() {
        seed = YamlReader.longValue(top, "seed", 1, Long.MIN_VALUE, Long.MAX_VALUE, problems);
        alpha = YamlReader.doubleValue(top, "alpha", 0.05, problems);
        if (!(alpha > 0 && alpha < 0.5)) {
            problems.add(line(top, "alpha"), "alpha", "must be in (0, 0.5): " + ExperimentFile.num(alpha));
        }
        if (top.containsKey("correction")) {
            String c = YamlReader.string(top, "correction", "holm", problems);
            try {
                correction = Experiment.Correction.valueOf(c.trim().toUpperCase(Locale.ROOT));
            } catch (IllegalArgumentException e) {
                problems.add(line(top, "correction"), "correction", "must be holm, bh or none: '" + c + "'");
            }
        }
        String outText = YamlReader.string(top, "output", null, problems);
        if (outText != null && outText.isBlank()) {
            problems.add(line(top, "output"), "output", "must name a folder, not be empty (without output:, results "
                + "go to results/NAME)");
            outText = null;
        }
        output = Path.of(outText != null ? outText : "results/" + (name == null ? "experiment" : name));
    }

    /** Rules joining fields: populations that can be built, Moran's needs, mutation rates, the grid's size. */
    private void rules() {
        for (int n : sizes) {
            if (coPlayers > n - 1) {
                problems.add(line(pop, "population.co_players"), "population.co_players", "a sample of " + coPlayers + " co-players needs N of at "
                    + "least " + (coPlayers + 1) + ": N = " + n);
            }
        }
        if (update == Population.Update.MORAN_BIRTH_DEATH) {
            if (fitness == Population.Fitness.LINEAR) {
                for (double w : selections) {
                    if (w > 1) {
                        problems.add(selectionLine, "grid.selection", "linear fitness 1 - w + w P needs w in [0, 1]: "
                            + ExperimentFile.num(w));
                    } else if (game != null && 1 - w + w * min(game.payoffX()) < 0) {
                        problems.add(selectionLine, "grid.selection", "linear fitness 1 - w + w P is negative at the "
                            + "smallest payoff " + ExperimentFile.num(min(game.payoffX())) + " (w = "
                            + ExperimentFile.num(w) + ")");
                    }
                }
            }
            if (top.get("grid") instanceof MappingNode && horizons.stream().anyMatch(h -> h instanceof Horizon.Continuation)) {
                problems.add(continuationLine, "grid.continuation", "the Moran rule needs a fixed number of rounds "
                    + "(fitness must be bounded for the simulated proposal and acceptance)");
            }
        }
        if (mutation == PopulationExperiment.Mutation.RATE && strategyNames.size() > 2) {
            problems.add(line(pop, "population.mutation"), "population.mutation", "an explicit rate is for two strategies (the exact stationary "
                + "distribution of the two-strategy chain); use 'rare' for " + strategyNames.size());
        }
        long pairs = (long) strategyNames.size() * (strategyNames.size() - 1);
        long questions = (long) sizes.size() * selections.size() * noise.size() * misperception.size()
            * horizons.size() * pairs;
        if (questions > MOST_QUESTIONS) {
            problems.add(line(top, "grid"), "grid", "expands into " + questions + " fixation questions (grid points "
                + "times ordered pairs); at most " + MOST_QUESTIONS);
        }
    }

    private static double min(double[] v) {
        double m = Double.POSITIVE_INFINITY;
        for (double d : v) {
            m = Math.min(m, d);
        }
        return m;
    }

    /** population.claims: a claims file relative to the experiment's folder, which must exist. */
    private void claims(Map<String, Node> p) {
        String text = YamlReader.string(p, "population.claims", null, problems);
        if (text == null) {
            return;
        }
        Path base = file.toAbsolutePath().getParent();
        Path c = (base == null ? Path.of(text) : base.resolve(text)).normalize();
        if (java.nio.file.Files.isDirectory(c)) {
            problems.add(line(p, "population.claims"), "population.claims", "is a folder, not a claims file: " + c);
        } else if (!java.nio.file.Files.isRegularFile(c)) {
            problems.add(line(p, "population.claims"), "population.claims", "no such file: " + c);
        } else {
            claims = c;
        }
    }
}
