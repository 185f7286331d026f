package reprise.experiment;

import java.io.IOException;
import java.io.Reader;
import java.io.StringReader;
import java.math.BigDecimal;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.ArrayList;
import java.util.EnumSet;
import java.util.HexFormat;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.regex.Pattern;
import org.yaml.snakeyaml.LoaderOptions;
import org.yaml.snakeyaml.Yaml;
import org.yaml.snakeyaml.constructor.SafeConstructor;
import org.yaml.snakeyaml.error.MarkedYAMLException;
import org.yaml.snakeyaml.error.YAMLException;
import org.yaml.snakeyaml.nodes.MappingNode;
import org.yaml.snakeyaml.nodes.Node;
import org.yaml.snakeyaml.nodes.NodeTuple;
import org.yaml.snakeyaml.nodes.ScalarNode;
import org.yaml.snakeyaml.nodes.SequenceNode;
import reprise.game.Horizon;
import reprise.game.Player;
import reprise.game.StageGame;
import reprise.game.Strategies;

/**
 * Reads and validates experiment files (YAML).
 *
 * <p>Every problem is collected and reported at once, one line each, as {@code file:line: field: message},
 * before anything is simulated. The format is documented in README.md ("Experiment files").
 */
public final class ExperimentFile {

    /** The top-level keys, in the order README lists them. */
    static final List<String> TOP_KEYS = List.of("experiment", "description", "game", "pairs", "grid", "replicates",
        "seed", "alpha", "tolerance", "burn_in", "snapshots", "quantities", "tests", "correction", "claims", "output");
    static final List<String> GRID_KEYS = List.of("noise", "misperception", "rounds", "continuation", "parameters");
    static final List<String> PAIR_KEYS = List.of("name", "x", "y");
    private static final Pattern NAME = Pattern.compile("[A-Za-z0-9][A-Za-z0-9._-]*");
    private static final long MAX_REPLICATES = 1L << 40;
    /**
     * The per-case sums of squared counts are kept in longs (at most 9.22e18); for games of random length
     * the expected sum must stay below a quarter of that, so that a long tail does not reach it.
     */
    private static final double SUM_OF_SQUARES_LIMIT = Long.MAX_VALUE / 4.0;

    private ExperimentFile() {
    }

    /**
     * Reads an experiment file.
     *
     * @param file the YAML file
     * @return the validated experiment
     * @throws InvalidExperimentException listing every problem with file, line and field
     */
    public static Experiment read(Path file) {
        Problems problems = new Problems(file.toString());
        byte[] bytes;
        try {
            if (Files.isDirectory(file)) {
                problems.add(0, "file", "is a folder, not an experiment file");
                problems.throwIfAny();
            }
            bytes = Files.readAllBytes(file);
        } catch (IOException e) {
            problems.add(0, "file", "cannot be read: " + e.getMessage());
            problems.throwIfAny();
            throw new IllegalStateException(e);
        }
        return parse(file, new String(bytes, StandardCharsets.UTF_8), sha256(bytes), problems);
    }

    static Experiment parse(Path file, String text, String hash, Problems problems) {
        Node root;
        try (Reader r = new StringReader(text)) {
            LoaderOptions options = new LoaderOptions();
            options.setAllowDuplicateKeys(false);
            root = new Yaml(new SafeConstructor(options)).compose(r);
        } catch (MarkedYAMLException e) {
            int line = e.getProblemMark() == null ? 0 : e.getProblemMark().getLine() + 1;
            problems.add(line, "syntax", "not valid YAML: " + oneLine(e.getProblem()));
            problems.throwIfAny();
            throw new IllegalStateException(e);
        } catch (YAMLException | IOException e) {
            problems.add(0, "syntax", "not valid YAML: " + oneLine(e.getMessage()));
            problems.throwIfAny();
            throw new IllegalStateException(e);
        }
        if (!(root instanceof MappingNode)) {
            problems.add(root == null ? 0 : line(root), "file", root == null ? "is empty"
                : "must be a mapping of keys such as experiment:, pairs:, grid:");
            problems.throwIfAny();
        }
        Map<String, Node> top = mapping((MappingNode) root, "", TOP_KEYS, problems);

        String name = string(top, "experiment", null, problems);
        if (name == null) {
            problems.add(0, "experiment", "is required: a short name such as 'quota-demo'");
        } else if (!NAME.matcher(name).matches()) {
            problems.add(line(top.get("experiment")), "experiment",
                "must be letters, digits, '.', '_' or '-' (it names the output folder): '" + name + "'");
        }
        String description = string(top, "description", "", problems);

        String gameText = gameText(top.get("game"), problems);
        StageGame game = null;
        try {
            game = StageGame.parse(gameText);
        } catch (IllegalArgumentException e) {
            problems.add(line(top.get("game")), "game", e.getMessage());
        }

        Map<String, List<Double>> parameters = new LinkedHashMap<>();
        List<String> noise = List.of("0");
        List<String> misperception = List.of("0");
        List<Horizon> horizons = new ArrayList<>();
        Node gridNode = top.get("grid");
        if (gridNode == null) {
            problems.add(0, "grid", "is required, with rounds: or continuation:");
        } else if (!(gridNode instanceof MappingNode)) {
            problems.add(line(gridNode), "grid", "must be a mapping with noise:, misperception:, rounds: or "
                + "continuation:, parameters:");
        } else {
            Map<String, Node> grid = mapping((MappingNode) gridNode, "grid.", GRID_KEYS, problems);
            noise = errorValues(grid.get("noise"), "grid.noise", problems);
            misperception = errorValues(grid.get("misperception"), "grid.misperception", problems);
            Node rounds = grid.get("rounds");
            Node cont = grid.get("continuation");
            if (rounds != null && cont != null) {
                problems.add(line(cont), "grid.continuation", "give either rounds: or continuation:, not both");
            } else if (rounds == null && cont == null) {
                problems.add(line(gridNode), "grid", "needs rounds: (fixed game lengths) or continuation: "
                    + "(probabilities of another round)");
            } else if (rounds != null) {
                for (Scalar s : scalars(rounds, "grid.rounds", problems)) {
                    Long n = asLong(s, "grid.rounds", problems);
                    if (n != null && n < 1) {
                        problems.add(s.line, "grid.rounds", "must be at least 1: " + n);
                    } else if (n != null) {
                        horizons.add(Horizon.rounds(n));
                    }
                }
            } else {
                for (Scalar s : scalars(cont, "grid.continuation", problems)) {
                    Double d = asDouble(s, "grid.continuation", problems);
                    if (d != null && !(d >= 0 && d < 1)) {
                        problems.add(s.line, "grid.continuation", "must be a probability in [0, 1) (1 would never "
                            + "end): " + num(d));
                    } else if (d != null) {
                        horizons.add(Horizon.continuation(d));
                    }
                }
            }
            duplicates(horizons.stream().map(Horizon::describe).toList(), line(gridNode), "grid", problems);
            Node paramNode = grid.get("parameters");
            if (paramNode instanceof MappingNode pm) {
                for (NodeTuple t : pm.getValue()) {
                    String key = scalarText(t.getKeyNode());
                    if (key == null || !Grid.PLACEHOLDER.matcher("{" + key + "}").matches()) {
                        problems.add(line(t.getKeyNode()), "grid.parameters", "parameter names are letters, digits "
                            + "and '_': '" + key + "'");
                        continue;
                    }
                    List<Double> values = new ArrayList<>();
                    for (Scalar s : scalars(t.getValueNode(), "grid.parameters." + key, problems)) {
                        Double d = asDouble(s, "grid.parameters." + key, problems);
                        if (d != null) {
                            values.add(d);
                        }
                    }
                    if (parameters.containsKey(key)) {
                        problems.add(line(t.getKeyNode()), "grid.parameters." + key, "is given twice");
                    }
                    parameters.put(key, values);
                }
            } else if (paramNode != null) {
                problems.add(line(paramNode), "grid.parameters", "must be a mapping of name: [values]");
            }
        }

        List<Experiment.Pair> pairs = pairs(top.get("pairs"), problems);

        long replicates = longValue(top, "replicates", 1000, 1, MAX_REPLICATES, problems);
        long seed = longValue(top, "seed", 1, Long.MIN_VALUE, Long.MAX_VALUE, problems);
        double alpha = doubleValue(top, "alpha", 0.05, problems);
        if (!(alpha > 0 && alpha < 0.5)) {
            problems.add(line(top.get("alpha")), "alpha", "must be in (0, 0.5): " + num(alpha));
        }
        double tolerance = doubleValue(top, "tolerance", 0.01, problems);
        if (!(tolerance > 0)) {
            problems.add(line(top.get("tolerance")), "tolerance", "must be a positive margin: " + num(tolerance));
        }
        long burnIn = longValue(top, "burn_in", 0, 0, Long.MAX_VALUE, problems);
        List<Long> snapshots = new ArrayList<>();
        if (top.containsKey("snapshots")) {
            for (Scalar s : scalars(top.get("snapshots"), "snapshots", problems)) {
                Long t = asLong(s, "snapshots", problems);
                if (t != null && t < 1) {
                    problems.add(s.line, "snapshots", "rounds are counted from 1: " + t);
                } else if (t != null) {
                    snapshots.add(t);
                }
            }
            duplicates(snapshots.stream().map(String::valueOf).toList(), line(top.get("snapshots")), "snapshots",
                problems);
        }
        long shortest = horizons.stream().filter(h -> h instanceof Horizon.Rounds)
            .mapToLong(h -> ((Horizon.Rounds) h).count()).min().orElse(Long.MAX_VALUE);
        if (burnIn > 0 && burnIn >= shortest) {
            problems.add(line(top.get("burn_in")), "burn_in", "must be shorter than the shortest game (" + shortest
                + " rounds): " + burnIn);
        }
        long longest = horizons.stream().filter(h -> h instanceof Horizon.Rounds)
            .mapToLong(h -> ((Horizon.Rounds) h).count()).max().orElse(0);
        double secondMoment = horizons.stream().filter(h -> h instanceof Horizon.Continuation)
            .mapToDouble(h -> geometricSecondMoment(((Horizon.Continuation) h).probability())).max().orElse(0);
        double squares = (double) replicates * Math.max((double) longest * longest, secondMoment);
        if (squares > SUM_OF_SQUARES_LIMIT) {
            problems.add(line(top.get("replicates")), "replicates", String.format(Locale.ROOT, "%d games of up to %s "
                + "rounds would overflow the per-case sums of squared counts (about %.3g, the limit is %.3g): use "
                + "fewer replicates or shorter games", replicates, longest > 0 ? Long.toString(longest)
                : "E[L^2] = " + num(secondMoment) + " squared", squares, SUM_OF_SQUARES_LIMIT));
        }
        for (long t : snapshots) {
            if (t > shortest) {
                problems.add(line(top.get("snapshots")), "snapshots", "round " + t + " is past the end of the shortest "
                    + "game (" + shortest + " rounds)");
            }
        }
        Set<Experiment.Quantity> quantities = enumSet(top.get("quantities"), "quantities", Experiment.Quantity.class,
            problems);
        Set<Experiment.Comparison> tests = enumSet(top.get("tests"), "tests", Experiment.Comparison.class, problems);
        if (tests.contains(Experiment.Comparison.SNAPSHOTS) && snapshots.isEmpty() && top.containsKey("tests")) {
            problems.add(line(top.get("tests")), "tests", "'snapshots' needs a snapshots: list of rounds");
        }
        if (!top.containsKey("tests") && snapshots.isEmpty()) {
            tests.remove(Experiment.Comparison.SNAPSHOTS);
        }
        Experiment.Correction correction = Experiment.Correction.HOLM;
        if (top.containsKey("correction")) {
            String c = string(top, "correction", "holm", problems);
            try {
                correction = Experiment.Correction.valueOf(c.trim().toUpperCase(Locale.ROOT));
            } catch (IllegalArgumentException e) {
                problems.add(line(top.get("correction")), "correction", "must be holm, bh or none: '" + c + "'");
            }
        }
        Path base = file.toAbsolutePath().getParent();
        Path claims = null;
        String claimsText = string(top, "claims", null, problems);
        if (claimsText != null) {
            claims = base.resolve(claimsText).normalize();
            if (Files.isDirectory(claims)) {
                problems.add(line(top.get("claims")), "claims", "is a folder, not a claims file: " + claims);
            } else if (!Files.isRegularFile(claims)) {
                problems.add(line(top.get("claims")), "claims", "no such file: " + claims);
            }
        }
        String outText = string(top, "output", null, problems);
        Path output = Path.of(outText != null ? outText : "results/" + (name == null ? "experiment" : name));

        boolean continuation = !horizons.isEmpty() && horizons.get(0) instanceof Horizon.Continuation;
        if (parameters.containsKey(Grid.CONTINUATION)) {
            problems.add(line(gridNode), "grid.parameters.continuation", "is a reserved name: {continuation} "
                + "stands for each case's continuation probability");
        }
        checkPlaceholders(pairs, parameters, continuation, line(gridNode), problems);
        if (game != null) {
            checkStrategies(game, pairs, parameters, horizons, problems);
        }
        problems.throwIfAny();

        return new Experiment(name, description, file, hash, gameText, game, List.copyOf(pairs),
            List.copyOf(noise), List.copyOf(misperception), List.copyOf(horizons), parameters, replicates, seed, alpha,
            tolerance, burnIn, List.copyOf(snapshots), quantities, tests, correction, claims, output);
    }

    /** E[L^2] for a game length L with P(L = k) = (1 - delta) delta^(k-1): (1 + delta) / (1 - delta)^2. */
    private static double geometricSecondMoment(double delta) {
        return (1 + delta) / ((1 - delta) * (1 - delta));
    }

    private static void checkPlaceholders(List<Experiment.Pair> pairs, Map<String, List<Double>> parameters,
        boolean continuation, int gridLine, Problems problems) {
        List<String> used = new ArrayList<>();
        for (Experiment.Pair p : pairs) {
            for (String ph : Grid.placeholders(p.x() + " " + p.y())) {
                if (ph.equals(Grid.CONTINUATION) && !continuation) {
                    problems.add(p.line(), "pairs." + p.name(), "uses {continuation} but the grid has no "
                        + "continuation: axis");
                } else if (!parameters.containsKey(ph) && !ph.equals(Grid.CONTINUATION)) {
                    problems.add(p.line(), "pairs." + p.name(), "uses {" + ph + "} but grid.parameters has no '" + ph
                        + "'" + Problems.didYouMean(ph, List.copyOf(parameters.keySet())));
                }
                used.add(ph);
            }
        }
        for (String k : parameters.keySet()) {
            if (!used.contains(k)) {
                problems.add(gridLine, "grid.parameters." + k, "is used by no pair (write {" + k + "} in a strategy)");
            }
        }
    }

    /**
     * Parses every strategy spec of every grid point, so that a bad spec is reported with the other
     * problems of the file; pairs whose placeholders lack a parameter are left to checkPlaceholders.
     */
    private static void checkStrategies(StageGame game, List<Experiment.Pair> pairs,
        Map<String, List<Double>> parameters, List<Horizon> horizons, Problems problems) {
        List<Map<String, Double>> points = Grid.parameterPoints(parameters);
        List<Horizon> hs = horizons.isEmpty() ? java.util.Collections.singletonList(null) : horizons;
        for (Experiment.Pair p : pairs) {
            boolean defined = Grid.placeholders(p.x() + " " + p.y()).stream()
                .allMatch(ph -> parameters.containsKey(ph) || ph.equals(Grid.CONTINUATION) && !horizons.isEmpty()
                    && horizons.get(0) instanceof Horizon.Continuation);
            if (!defined) {
                continue;
            }
            List<String> seen = new ArrayList<>();
            for (Map<String, Double> point : points) {
                for (Horizon h : hs) {
                    String xs = Grid.substitute(p.x(), Grid.withHorizon(point, h));
                    String ys = Grid.substitute(p.y(), Grid.withHorizon(point, h));
                    check(xs, game, Player.X, seen, p, "x", problems);
                    check(ys, game, Player.Y, seen, p, "y", problems);
                }
            }
        }
    }

    private static void check(String spec, StageGame game, Player player, List<String> seen, Experiment.Pair p,
        String field, Problems problems) {
        if (seen.contains(field + spec)) {
            return;
        }
        seen.add(field + spec);
        try {
            Strategies.parse(spec, game, player);
        } catch (IllegalArgumentException ex) {
            problems.add(p.line(), "pairs." + p.name() + "." + field, ex.getMessage());
        }
    }

    private static List<Experiment.Pair> pairs(Node node, Problems problems) {
        List<Experiment.Pair> pairs = new ArrayList<>();
        if (node == null) {
            problems.add(0, "pairs", "is required: a list of {name, x, y}");
            return pairs;
        }
        if (!(node instanceof SequenceNode seq) || seq.getValue().isEmpty()) {
            problems.add(line(node), "pairs", "must be a non-empty list of {name, x, y}");
            return pairs;
        }
        List<String> names = new ArrayList<>();
        for (Node item : seq.getValue()) {
            if (!(item instanceof MappingNode m)) {
                problems.add(line(item), "pairs", "each pair is a mapping with name:, x: and y:");
                continue;
            }
            Map<String, Node> f = mapping(m, "pairs.", PAIR_KEYS, problems);
            String name = string(f, "name", null, problems);
            String x = string(f, "x", null, problems);
            String y = string(f, "y", null, problems);
            String where = "pairs." + (name == null ? "?" : name);
            if (name == null) {
                problems.add(line(item), "pairs.name", "is required");
            } else if (!NAME.matcher(name).matches()) {
                problems.add(line(f.get("name")), "pairs.name", "must be letters, digits, '.', '_' or '-': '" + name
                    + "'");
            } else if (names.contains(name)) {
                problems.add(line(f.get("name")), "pairs.name", "duplicate case name '" + name + "'");
            }
            if (x == null) {
                problems.add(line(item), where + ".x", "is required (X's strategy)");
            }
            if (y == null) {
                problems.add(line(item), where + ".y", "is required (Y's strategy)");
            }
            if (name != null) {
                names.add(name);
            }
            if (name != null && x != null && y != null) {
                pairs.add(new Experiment.Pair(name, x, y, line(item)));
            }
        }
        return pairs;
    }

    private static String gameText(Node node, Problems problems) {
        if (node == null) {
            return "3,0,5,1";
        }
        if (node instanceof SequenceNode) {
            List<String> parts = new ArrayList<>();
            for (Scalar s : scalars(node, "game", problems)) {
                parts.add(s.text);
            }
            return String.join(",", parts);
        }
        String t = scalarText(node);
        if (t == null) {
            problems.add(line(node), "game", "must be text such as 3,0,5,1 or donation:3,1");
            return "3,0,5,1";
        }
        return t;
    }

    private static List<String> errorValues(Node node, String field, Problems problems) {
        if (node == null) {
            return List.of("0");
        }
        List<String> out = new ArrayList<>();
        for (Scalar s : scalars(node, field, problems)) {
            try {
                double[] v = pair(s.text);
                out.add(v[0] == v[1] ? num(v[0]) : num(v[0]) + "," + num(v[1]));
            } catch (IllegalArgumentException e) {
                problems.add(s.line, field, e.getMessage());
            }
        }
        duplicates(out, line(node), field, problems);
        return out;
    }

    /**
     * Parses "E" or "EX,EY" as a pair of probabilities.
     *
     * @param text the text
     * @return {X's, Y's}
     */
    static double[] pair(String text) {
        String[] parts = text.split(",", -1);
        if (parts.length > 2) {
            throw new IllegalArgumentException("takes one probability or two (X's,Y's): '" + text + "'");
        }
        double[] v = new double[2];
        for (int i = 0; i < parts.length; i++) {
            double d;
            String t = parts[i].trim();
            String lower = t.toLowerCase(Locale.ROOT);
            if (lower.contains("nan") || lower.contains("inf")) {
                throw new IllegalArgumentException("must be a finite probability: '" + t + "'");
            }
            try {
                d = Double.parseDouble(t);
            } catch (NumberFormatException e) {
                throw new IllegalArgumentException("is not a number: '" + t + "'", e);
            }
            if (!(d >= 0 && d <= 1)) {
                throw new IllegalArgumentException("must be a probability in [0, 1]: " + parts[i].trim());
            }
            v[i] = d;
        }
        if (parts.length == 1) {
            v[1] = v[0];
        }
        return v;
    }

    private static <E extends Enum<E>> Set<E> enumSet(Node node, String field, Class<E> type, Problems problems) {
        Set<E> set = EnumSet.allOf(type);
        if (node == null) {
            return set;
        }
        set = EnumSet.noneOf(type);
        List<String> known = new ArrayList<>();
        for (E c : type.getEnumConstants()) {
            known.add(c.name().toLowerCase(Locale.ROOT));
        }
        for (Scalar s : scalars(node, field, problems)) {
            String t = s.text.trim().toLowerCase(Locale.ROOT);
            if (!known.contains(t)) {
                problems.add(s.line, field, "unknown value '" + s.text + "'" + Problems.didYouMean(t, known) + "; known: "
                    + String.join(", ", known));
            } else {
                set.add(Enum.valueOf(type, t.toUpperCase(Locale.ROOT)));
            }
        }
        return set;
    }

    private static void duplicates(List<String> values, int line, String field, Problems problems) {
        List<String> seen = new ArrayList<>();
        for (String v : values) {
            if (seen.contains(v)) {
                problems.add(line, field, "value " + v + " is listed twice");
            }
            seen.add(v);
        }
    }

    /** A scalar with its line. */
    private record Scalar(String text, int line) {
    }

    private static List<Scalar> scalars(Node node, String field, Problems problems) {
        List<Scalar> out = new ArrayList<>();
        if (node instanceof SequenceNode seq) {
            for (Node n : seq.getValue()) {
                String t = scalarText(n);
                if (t == null) {
                    problems.add(line(n), field, "each entry must be a single value");
                } else {
                    out.add(new Scalar(t, line(n)));
                }
            }
            if (seq.getValue().isEmpty()) {
                problems.add(line(node), field, "is empty; give at least one value");
            }
        } else {
            String t = scalarText(node);
            if (t == null || t.isBlank()) {
                problems.add(line(node), field, "must be a value or a list of values");
            } else {
                out.add(new Scalar(t, line(node)));
            }
        }
        return out;
    }

    private static Map<String, Node> mapping(MappingNode node, String prefix, List<String> known, Problems problems) {
        Map<String, Node> map = new LinkedHashMap<>();
        for (NodeTuple t : node.getValue()) {
            String key = scalarText(t.getKeyNode());
            if (key == null) {
                problems.add(line(t.getKeyNode()), prefix.isEmpty() ? "key" : prefix + "key", "keys must be plain words");
                continue;
            }
            if (!known.contains(key)) {
                problems.add(line(t.getKeyNode()), prefix + key, "unknown key" + Problems.didYouMean(key, known)
                    + "; known: " + String.join(", ", known));
                continue;
            }
            if (map.containsKey(key)) {
                problems.add(line(t.getKeyNode()), prefix + key, "is given twice");
            }
            map.put(key, t.getValueNode());
        }
        return map;
    }

    private static String string(Map<String, Node> map, String key, String dflt, Problems problems) {
        Node n = map.get(key);
        if (n == null) {
            return dflt;
        }
        String t = scalarText(n);
        if (t == null) {
            problems.add(line(n), key, "must be a single value");
            return dflt;
        }
        return t;
    }

    private static long longValue(Map<String, Node> map, String key, long dflt, long min, long max,
        Problems problems) {
        Node n = map.get(key);
        if (n == null) {
            return dflt;
        }
        String t = scalarText(n);
        if (t == null) {
            problems.add(line(n), key, "must be a whole number");
            return dflt;
        }
        Long v = asLong(new Scalar(t, line(n)), key, problems);
        if (v == null) {
            return dflt;
        }
        if (v < min || v > max) {
            problems.add(line(n), key, "must be " + (max == Long.MAX_VALUE ? "at least " + min : "between " + min + " and "
                + max) + ": " + v);
            return dflt;
        }
        return v;
    }

    private static double doubleValue(Map<String, Node> map, String key, double dflt, Problems problems) {
        Node n = map.get(key);
        if (n == null) {
            return dflt;
        }
        String t = scalarText(n);
        if (t == null) {
            problems.add(line(n), key, "must be a number");
            return dflt;
        }
        Double v = asDouble(new Scalar(t, line(n)), key, problems);
        return v == null ? dflt : v;
    }

    private static Long asLong(Scalar s, String field, Problems problems) {
        try {
            return new BigDecimal(s.text.trim().replace("_", "")).longValueExact();
        } catch (NumberFormatException | ArithmeticException e) {
            problems.add(s.line, field, "must be a whole number: '" + s.text + "'");
            return null;
        }
    }

    private static Double asDouble(Scalar s, String field, Problems problems) {
        String t = s.text.trim();
        double d;
        try {
            d = Double.parseDouble(t);
        } catch (NumberFormatException e) {
            String lower = t.toLowerCase(Locale.ROOT);
            if (lower.contains("nan") || lower.contains("inf")) {
                problems.add(s.line, field, "must be a finite number: '" + t + "'");
            } else {
                problems.add(s.line, field, "must be a number: '" + t + "'");
            }
            return null;
        }
        if (!Double.isFinite(d)) {
            problems.add(s.line, field, "must be a finite number: '" + t + "'");
            return null;
        }
        return d;
    }

    private static String scalarText(Node n) {
        return n instanceof ScalarNode s ? s.getValue() : null;
    }

    private static int line(Node n) {
        return n == null ? 0 : n.getStartMark().getLine() + 1;
    }

    private static String oneLine(String s) {
        return s == null ? "" : s.replaceAll("\\s+", " ").trim();
    }

    static String num(double v) {
        if (v == Math.rint(v) && Math.abs(v) < 1e15) {
            return Long.toString((long) v);
        }
        return BigDecimal.valueOf(v).stripTrailingZeros().toPlainString();
    }

    static String sha256(byte[] bytes) {
        try {
            return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(bytes));
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("SHA-256 is missing from this Java runtime", e);
        }
    }
}
