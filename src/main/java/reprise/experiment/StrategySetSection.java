package reprise.experiment;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.regex.Pattern;
import org.yaml.snakeyaml.nodes.MappingNode;
import org.yaml.snakeyaml.nodes.Node;
import org.yaml.snakeyaml.nodes.NodeTuple;
import org.yaml.snakeyaml.nodes.SequenceNode;

/**
 * The {@code strategy_set:} section of an experiment file: {@code strategies:} (a mapping of name to
 * spec, in order), {@code matches:} ({@code all}, the default: every ordered pair with self-play; or a
 * list of {@code [row, column]} pairs) and {@code exact_continuation:} (continuation probabilities for
 * extra exact-only matrices). Reports each field's problems with its line; the rules that join the set to
 * the pairs and the game are {@link ExperimentRules}'.
 */
final class StrategySetSection {

    static final List<String> KEYS = List.of("strategies", "matches", "exact_continuation");
    private static final Pattern NAME = Pattern.compile("[A-Za-z0-9][A-Za-z0-9._]*");

    private StrategySetSection() {
    }

    /**
     * Reads the section.
     *
     * @param node the section's node, or null when absent
     * @param problems where problems go
     * @return the set, or null when absent or too broken to use (problems reported)
     */
    static StrategySet read(Node node, Problems problems) {
        if (node == null) {
            return null;
        }
        int line = YamlReader.line(node);
        if (!(node instanceof MappingNode m)) {
            problems.add(line, "strategy_set", "must be a mapping with strategies: (name: spec) and matches:");
            return null;
        }
        Map<String, Node> f = YamlReader.mapping(m, "strategy_set.", KEYS, problems);
        List<StrategySet.Entry> entries = strategies(f.get("strategies"), line, problems);
        List<StrategySet.Cell> cells = matches(f.get("matches"), entries, line, problems);
        List<Double> continuation = new ArrayList<>();
        if (f.containsKey("exact_continuation")) {
            for (YamlReader.Scalar s : YamlReader.scalars(f.get("exact_continuation"), "strategy_set.exact_continuation",
                problems)) {
                Double d = YamlReader.asDouble(s, "strategy_set.exact_continuation", problems);
                if (d != null && !(d >= 0 && d < 1)) {
                    problems.add(s.line(), "strategy_set.exact_continuation", "must be a probability in [0, 1): "
                        + ExperimentFile.num(d));
                } else if (d != null) {
                    continuation.add(d);
                }
            }
            YamlReader.duplicates(continuation.stream().map(ExperimentFile::num).toList(),
                YamlReader.line(f.get("exact_continuation")), "strategy_set.exact_continuation", problems);
        }
        if (entries.isEmpty() || cells.isEmpty()) {
            return null;
        }
        return new StrategySet(entries, cells, continuation, line);
    }

    private static List<StrategySet.Entry> strategies(Node node, int line, Problems problems) {
        List<StrategySet.Entry> out = new ArrayList<>();
        if (node == null) {
            problems.add(line, "strategy_set.strategies", "is required: a mapping of name: strategy spec");
            return out;
        }
        if (!(node instanceof MappingNode m) || m.getValue().isEmpty()) {
            problems.add(YamlReader.line(node), "strategy_set.strategies", "must be a non-empty mapping of name: "
                + "strategy spec, such as 'tft: tft'");
            return out;
        }
        List<String> names = new ArrayList<>();
        for (NodeTuple t : m.getValue()) {
            String name = YamlReader.scalarText(t.getKeyNode());
            String spec = YamlReader.scalarText(t.getValueNode());
            int at = YamlReader.line(t.getKeyNode());
            if (name == null || !NAME.matcher(name).matches()) {
                problems.add(at, "strategy_set.strategies", "strategy names are letters, digits, '.' and '_' (they "
                    + "name pairs as ROW-vs-COLUMN): '" + name + "'");
                continue;
            }
            if (names.contains(name)) {
                problems.add(at, "strategy_set.strategies." + name, "is given twice");
                continue;
            }
            if (spec == null || spec.isBlank()) {
                problems.add(at, "strategy_set.strategies." + name, "must be a strategy spec such as tft or "
                    + "reactive:0.9,0.2");
                continue;
            }
            names.add(name);
            out.add(new StrategySet.Entry(name, spec.trim(), at));
        }
        return out;
    }

    private static List<StrategySet.Cell> matches(Node node, List<StrategySet.Entry> entries, int line,
        Problems problems) {
        List<StrategySet.Cell> out = new ArrayList<>();
        List<String> names = entries.stream().map(StrategySet.Entry::name).toList();
        String all = node == null ? "all" : YamlReader.scalarText(node);
        if (all != null) {
            if (!all.trim().equals("all")) {
                problems.add(YamlReader.line(node), "strategy_set.matches", "must be 'all' (every ordered pair, "
                    + "self-play included) or a list of [row, column] pairs: '" + all + "'");
                return out;
            }
            for (int i = 0; i < names.size(); i++) {
                for (int j = 0; j < names.size(); j++) {
                    out.add(new StrategySet.Cell(i, j, StrategySet.pairName(names.get(i), names.get(j)),
                        entries.get(i).line()));
                }
            }
            return out;
        }
        if (!(node instanceof SequenceNode seq) || seq.getValue().isEmpty()) {
            problems.add(YamlReader.line(node), "strategy_set.matches", "must be 'all' or a non-empty list of "
                + "[row, column] pairs");
            return out;
        }
        for (Node item : seq.getValue()) {
            int at = YamlReader.line(item);
            List<YamlReader.Scalar> two = item instanceof SequenceNode ? YamlReader.scalars(item,
                "strategy_set.matches", problems) : List.of();
            if (two.size() != 2) {
                problems.add(at, "strategy_set.matches", "each match is [row, column], two strategy names");
                continue;
            }
            int i = names.indexOf(two.get(0).text());
            int j = names.indexOf(two.get(1).text());
            for (YamlReader.Scalar s : two) {
                if (!names.contains(s.text()) && !entries.isEmpty()) {
                    problems.add(at, "strategy_set.matches", "'" + s.text() + "' is not in strategies:"
                        + Problems.didYouMean(s.text(), names) + "; known: " + String.join(", ", names));
                }
            }
            if (i < 0 || j < 0) {
                continue;
            }
            String pair = StrategySet.pairName(names.get(i), names.get(j));
            if (out.stream().anyMatch(c -> c.pairName().equals(pair))) {
                problems.add(at, "strategy_set.matches", "[" + names.get(i) + ", " + names.get(j) + "] is listed "
                    + "twice");
                continue;
            }
            out.add(new StrategySet.Cell(i, j, pair, at));
        }
        return out;
    }
}
