package reprise.experiment;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.regex.Pattern;
import org.yaml.snakeyaml.nodes.MappingNode;
import org.yaml.snakeyaml.nodes.Node;
import org.yaml.snakeyaml.nodes.NodeTuple;
import org.yaml.snakeyaml.nodes.SequenceNode;
import reprise.game.Horizon;
import reprise.game.StageGame;

/**
 * The experiment file's schema: walks the node tree section by section (name, game, grid, pairs,
 * numbers, snapshots, comparisons, files) and fills an {@link Experiment.Builder}, reporting each
 * field's own problems (type, range, unknown keys and values). Rules that join several fields are
 * {@link ExperimentRules}'; the format is documented in README.md ("Experiment files").
 */
final class ExperimentSchema {

    /** The top-level keys, in the order README lists them. */
    static final List<String> TOP_KEYS = List.of("experiment", "description", "game", "pairs", "strategy_set",
        "grid", "replicates", "seed", "alpha", "tolerance", "tolerances", "burn_in", "snapshots", "quantities",
        "derived", "tests", "correction", "claims", "output");
    static final List<String> GRID_KEYS = List.of("noise", "misperception", "rounds", "continuation", "parameters");
    static final List<String> PAIR_KEYS = List.of("name", "x", "y");
    private static final Pattern NAME = Pattern.compile("[A-Za-z0-9][A-Za-z0-9._-]*");
    /** The most games per case. */
    static final long MAX_REPLICATES = 1L << 40;
    /**
     * The longest experiment name: it names the output folder (results/NAME), and file systems allow
     * 255 bytes per name; a hundred characters is more than any readable name needs.
     */
    static final int MOST_NAME_LENGTH = 100;

    private final Problems problems;
    private final Map<String, Node> top;
    private final Experiment.Builder builder = new Experiment.Builder();

    private ExperimentSchema(Map<String, Node> top, Problems problems) {
        this.top = top;
        this.problems = problems;
    }

    /**
     * Reads every section of a composed experiment file.
     *
     * @param file the file (claims are resolved against its folder)
     * @param root the root node, or null for an empty file
     * @param problems where problems go; thrown at once if the root is not a mapping
     * @return the schema with its filled builder
     */
    static ExperimentSchema read(Path file, Node root, Problems problems) {
        if (!(root instanceof MappingNode)) {
            problems.add(root == null ? 0 : YamlReader.line(root), "file", root == null ? "is empty"
                : "must be a mapping of keys such as experiment:, pairs:, grid:");
            problems.throwIfAny();
        }
        ExperimentSchema s = new ExperimentSchema(YamlReader.mapping((MappingNode) root, "", TOP_KEYS, problems),
            problems);
        s.builder.file = file;
        s.name();
        s.game();
        s.grid();
        s.builder.strategySet = StrategySetSection.read(s.top.get("strategy_set"), problems);
        if (s.top.containsKey("pairs") || !s.top.containsKey("strategy_set")) {
            s.builder.pairs = pairs(s.top.get("pairs"), problems);
        }
        s.builder.derived = DerivedSection.read(s.top.get("derived"), problems);
        s.numbers();
        s.builder.tolerances = ToleranceSection.read(s.top.get("tolerances"), s.builder.derived, problems);
        s.snapshots();
        s.comparisons();
        s.files(file);
        return s;
    }

    /** @return the builder filled from the file */
    Experiment.Builder builder() {
        return builder;
    }

    /** @return the line of a top-level key's value, 0 when absent */
    int line(String key) {
        return YamlReader.line(top.get(key));
    }

    /** @return whether the file gives the top-level key */
    boolean given(String key) {
        return top.containsKey(key);
    }

    private void name() {
        String name = YamlReader.string(top, "experiment", null, problems);
        if (name == null) {
            problems.add(0, "experiment", "is required: a short name such as 'quota-demo'");
        } else if (!NAME.matcher(name).matches()) {
            problems.add(line("experiment"), "experiment",
                "must be letters, digits, '.', '_' or '-' (it names the output folder): '" + name + "'");
        } else if (name.length() > MOST_NAME_LENGTH) {
            problems.add(line("experiment"), "experiment", "is " + name.length() + " characters long; at most "
                + MOST_NAME_LENGTH + " (it names the output folder)");
        }
        builder.name = name;
        builder.description = YamlReader.string(top, "description", "", problems);
    }

    private void game() {
        builder.gameText = gameText(top.get("game"));
        try {
            builder.game = StageGame.parse(builder.gameText);
        } catch (IllegalArgumentException e) {
            problems.add(line("game"), "game", e.getMessage());
        }
    }

    private String gameText(Node node) {
        if (node == null) {
            return "3,0,5,1";
        }
        if (node instanceof SequenceNode) {
            List<String> parts = new ArrayList<>();
            for (YamlReader.Scalar s : YamlReader.scalars(node, "game", problems)) {
                parts.add(s.text());
            }
            return String.join(",", parts);
        }
        String t = YamlReader.scalarText(node);
        if (t == null) {
            problems.add(YamlReader.line(node), "game", "must be text such as 3,0,5,1 or donation:3,1");
            return "3,0,5,1";
        }
        return t;
    }

    private void grid() {
        Node gridNode = top.get("grid");
        if (gridNode == null) {
            problems.add(0, "grid", "is required, with rounds: or continuation:");
            return;
        }
        if (!(gridNode instanceof MappingNode gm)) {
            problems.add(YamlReader.line(gridNode), "grid", "must be a mapping with noise:, misperception:, rounds: or "
                + "continuation:, parameters:");
            return;
        }
        Map<String, Node> grid = YamlReader.mapping(gm, "grid.", GRID_KEYS, problems);
        builder.noise = errorValues(grid.get("noise"), "grid.noise");
        builder.misperception = errorValues(grid.get("misperception"), "grid.misperception");
        horizons(grid, gridNode);
        Node paramNode = grid.get("parameters");
        if (paramNode instanceof MappingNode pm) {
            parameters(pm);
        } else if (paramNode != null) {
            problems.add(YamlReader.line(paramNode), "grid.parameters", "must be a mapping of name: [values]");
        }
    }

    private void horizons(Map<String, Node> grid, Node gridNode) {
        readHorizons(grid, gridNode, Long.MAX_VALUE, builder.horizons, problems);
    }

    /**
     * Reads a grid's {@code rounds:} or {@code continuation:} list (exactly one of them) into horizons,
     * reporting bad values and repeats with their lines. Shared by pair and population experiments.
     *
     * @param grid the grid's entries
     * @param gridNode the grid node (for its line)
     * @param mostRounds the largest fixed length allowed ({@link Long#MAX_VALUE}: no limit but 1 at least)
     * @param horizons where the horizons go, in file order
     * @param problems where problems go
     */
    static void readHorizons(Map<String, Node> grid, Node gridNode, long mostRounds, List<Horizon> horizons,
        Problems problems) {
        Node rounds = grid.get("rounds");
        Node cont = grid.get("continuation");
        if (rounds != null && cont != null) {
            problems.add(YamlReader.line(cont), "grid.continuation", "give either rounds: or continuation:, not both");
        } else if (rounds == null && cont == null) {
            problems.add(YamlReader.line(gridNode), "grid", "needs rounds: (fixed game lengths) or continuation: "
                + "(probabilities of another round)");
        } else if (rounds != null) {
            for (YamlReader.Scalar s : YamlReader.scalars(rounds, "grid.rounds", problems)) {
                Long n = YamlReader.asLong(s, "grid.rounds", problems);
                if (n != null && (n < 1 || n > mostRounds)) {
                    problems.add(s.line(), "grid.rounds", mostRounds == Long.MAX_VALUE ? "must be at least 1: " + n
                        : "must be 1 to " + mostRounds + " rounds: " + n);
                } else if (n != null) {
                    horizons.add(Horizon.rounds(n));
                }
            }
        } else {
            for (YamlReader.Scalar s : YamlReader.scalars(cont, "grid.continuation", problems)) {
                Double d = YamlReader.asDouble(s, "grid.continuation", problems);
                if (d != null && !(d >= 0 && d < 1)) {
                    problems.add(s.line(), "grid.continuation", "must be a probability in [0, 1) (1 would never "
                        + "end): " + ExperimentFile.num(d));
                } else if (d != null) {
                    horizons.add(Horizon.continuation(d));
                }
            }
        }
        YamlReader.duplicates(horizons.stream().map(Horizon::describe).toList(), YamlReader.line(gridNode), "grid",
            problems);
    }

    private void parameters(MappingNode pm) {
        Map<String, List<Double>> parameters = builder.parameters;
        for (NodeTuple t : pm.getValue()) {
            String key = YamlReader.scalarText(t.getKeyNode());
            if (key == null || !Grid.PLACEHOLDER.matcher("{" + key + "}").matches()) {
                problems.add(YamlReader.line(t.getKeyNode()), "grid.parameters", "parameter names are letters, digits "
                    + "and '_': '" + key + "'");
                continue;
            }
            List<Double> values = new ArrayList<>();
            for (YamlReader.Scalar s : YamlReader.scalars(t.getValueNode(), "grid.parameters." + key, problems)) {
                Double d = YamlReader.asDouble(s, "grid.parameters." + key, problems);
                if (d != null) {
                    values.add(d);
                }
            }
            YamlReader.duplicates(values.stream().map(ExperimentFile::num).toList(), YamlReader.line(t.getValueNode()),
                "grid.parameters." + key, problems);
            if (parameters.containsKey(key)) {
                problems.add(YamlReader.line(t.getKeyNode()), "grid.parameters." + key, "is given twice");
            }
            parameters.put(key, values);
        }
    }

    private List<String> errorValues(Node node, String field) {
        if (node == null) {
            return List.of("0");
        }
        List<String> out = new ArrayList<>();
        for (YamlReader.Scalar s : YamlReader.scalars(node, field, problems)) {
            try {
                double[] v = ExperimentFile.pair(s.text());
                out.add(v[0] == v[1] ? ExperimentFile.num(v[0])
                    : ExperimentFile.num(v[0]) + "," + ExperimentFile.num(v[1]));
            } catch (IllegalArgumentException e) {
                problems.add(s.line(), field, e.getMessage());
            }
        }
        YamlReader.duplicates(out, YamlReader.line(node), field, problems);
        return out;
    }

    private static List<Experiment.Pair> pairs(Node node, Problems problems) {
        List<Experiment.Pair> pairs = new ArrayList<>();
        if (node == null) {
            problems.add(0, "pairs", "is required: a list of {name, x, y} (or a strategy_set:)");
            return pairs;
        }
        if (!(node instanceof SequenceNode seq) || seq.getValue().isEmpty()) {
            problems.add(YamlReader.line(node), "pairs", "must be a non-empty list of {name, x, y}");
            return pairs;
        }
        List<String> names = new ArrayList<>();
        for (Node item : seq.getValue()) {
            if (!(item instanceof MappingNode m)) {
                problems.add(YamlReader.line(item), "pairs", "each pair is a mapping with name:, x: and y:");
                continue;
            }
            Experiment.Pair p = pair(item, YamlReader.mapping(m, "pairs.", PAIR_KEYS, problems), names, problems);
            if (p != null) {
                pairs.add(p);
            }
        }
        return pairs;
    }

    /** One pair's fields; the name is added to {@code names}; null if a field is missing. */
    private static Experiment.Pair pair(Node item, Map<String, Node> f, List<String> names, Problems problems) {
        String name = YamlReader.string(f, "name", null, problems);
        String x = YamlReader.string(f, "x", null, problems);
        String y = YamlReader.string(f, "y", null, problems);
        String where = "pairs." + (name == null ? "?" : name);
        if (name == null) {
            problems.add(YamlReader.line(item), "pairs.name", "is required");
        } else if (!NAME.matcher(name).matches()) {
            problems.add(YamlReader.line(f.get("name")), "pairs.name", "must be letters, digits, '.', '_' or '-': '"
                + name + "'");
        } else if (name.length() > MOST_NAME_LENGTH) {
            problems.add(YamlReader.line(f.get("name")), "pairs.name", "is " + name.length() + " characters long; at "
                + "most " + MOST_NAME_LENGTH + " (it names the case's figures)");
        } else if (names.contains(name)) {
            problems.add(YamlReader.line(f.get("name")), "pairs.name", "duplicate case name '" + name + "'");
        }
        if (x == null) {
            problems.add(YamlReader.line(item), where + ".x", "is required (X's strategy)");
        }
        if (y == null) {
            problems.add(YamlReader.line(item), where + ".y", "is required (Y's strategy)");
        }
        if (name != null) {
            names.add(name);
        }
        return name != null && x != null && y != null ? new Experiment.Pair(name, x, y, YamlReader.line(item),
            YamlReader.line(f.get("x")), YamlReader.line(f.get("y"))) : null;
    }

    private void numbers() {
        builder.replicates = YamlReader.longValue(top, "replicates", 1000, 1, MAX_REPLICATES, problems);
        builder.seed = YamlReader.longValue(top, "seed", 1, Long.MIN_VALUE, Long.MAX_VALUE, problems);
        double alpha = YamlReader.doubleValue(top, "alpha", 0.05, problems);
        if (!(alpha > 0 && alpha < 0.5)) {
            problems.add(line("alpha"), "alpha", "must be in (0, 0.5): " + ExperimentFile.num(alpha));
        }
        builder.alpha = alpha;
        double tolerance = YamlReader.doubleValue(top, "tolerance", 0.01, problems);
        if (!(tolerance > 0)) {
            problems.add(line("tolerance"), "tolerance", "must be a positive margin: " + ExperimentFile.num(tolerance));
        }
        builder.tolerance = tolerance;
        builder.burnIn = YamlReader.longValue(top, "burn_in", 0, 0, Long.MAX_VALUE, problems);
    }

    private void snapshots() {
        if (!top.containsKey("snapshots")) {
            return;
        }
        List<Long> snapshots = builder.snapshots;
        for (YamlReader.Scalar s : YamlReader.scalars(top.get("snapshots"), "snapshots", problems)) {
            Long t = YamlReader.asLong(s, "snapshots", problems);
            if (t != null && t < 1) {
                problems.add(s.line(), "snapshots", "rounds are counted from 1: " + t);
            } else if (t != null) {
                snapshots.add(t);
            }
        }
        YamlReader.duplicates(snapshots.stream().map(String::valueOf).toList(), line("snapshots"), "snapshots",
            problems);
    }

    private void comparisons() {
        builder.quantities = YamlReader.enumSet(top.get("quantities"), "quantities", Experiment.Quantity.class,
            problems);
        builder.tests = YamlReader.enumSet(top.get("tests"), "tests", Experiment.Comparison.class, problems);
        if (top.containsKey("correction")) {
            String c = YamlReader.string(top, "correction", "holm", problems);
            try {
                builder.correction = Experiment.Correction.valueOf(c.trim().toUpperCase(Locale.ROOT));
            } catch (IllegalArgumentException e) {
                problems.add(line("correction"), "correction", "must be holm, bh or none: '" + c + "'");
            }
        }
    }

    private void files(Path file) {
        Path base = file.toAbsolutePath().getParent();
        String claimsText = YamlReader.string(top, "claims", null, problems);
        if (claimsText != null) {
            Path claims = base.resolve(claimsText).normalize();
            if (Files.isDirectory(claims)) {
                problems.add(line("claims"), "claims", "is a folder, not a claims file: " + claims);
            } else if (!Files.exists(claims)) {
                problems.add(line("claims"), "claims", "no such file: " + claims);
            } else if (!Files.isRegularFile(claims)) {
                problems.add(line("claims"), "claims", "is not a regular file (a device or pipe?), not a claims file: "
                    + claims);
            }
            builder.claims = claims;
        }
        // a path written in the file is relative to the file (like claims:); the default, which the file does
        // not mention, is relative to the working directory, as is --out
        String outText = YamlReader.string(top, "output", null, problems);
        if (outText != null && outText.isBlank()) {
            problems.add(line("output"), "output", "must name a folder, not be empty (without output:, results "
                + "go to results/NAME)");
            outText = null;
        }
        builder.output = outText != null ? base.resolve(outText).normalize()
            : Path.of("results/" + (builder.name == null ? "experiment" : builder.name));
    }
}
