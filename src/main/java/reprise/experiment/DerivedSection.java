package reprise.experiment;

import java.util.ArrayList;
import java.util.List;
import org.yaml.snakeyaml.nodes.MappingNode;
import org.yaml.snakeyaml.nodes.Node;
import org.yaml.snakeyaml.nodes.NodeTuple;

/**
 * The {@code derived:} section of an experiment file: a mapping of name to expression (see
 * {@link DerivedExpression}), in report order. Each problem is reported at the definition's line with
 * the field {@code derived.NAME}.
 */
final class DerivedSection {

    private DerivedSection() {
    }

    /**
     * Reads the section.
     *
     * @param node the section's node, or null when absent
     * @param problems where problems go
     * @return the derived quantities that parsed, in file order
     */
    static List<DerivedQuantity> read(Node node, Problems problems) {
        List<DerivedQuantity> out = new ArrayList<>();
        if (node == null) {
            return out;
        }
        if (!(node instanceof MappingNode m) || m.getValue().isEmpty()) {
            problems.add(YamlReader.line(node), "derived", "must be a mapping of name: expression, such as "
                + "'gap: payoff_x - payoff_y'");
            return out;
        }
        List<String> names = new ArrayList<>();
        for (NodeTuple t : m.getValue()) {
            String name = YamlReader.scalarText(t.getKeyNode());
            int line = YamlReader.line(t.getKeyNode());
            String field = "derived." + name;
            if (name == null || !DerivedQuantity.NAME.matcher(name).matches()) {
                problems.add(line, "derived", "names are a letter, then letters, digits and '_': '" + name + "'");
                continue;
            }
            if (isBaseName(name)) {
                problems.add(line, field, "is the name of a base quantity; choose another name");
                continue;
            }
            if (isReserved(name)) {
                problems.add(line, field, "is reserved (a results.csv subject or a quantity group: states, "
                    + "transitions, snapshot_N, cooperation, payoffs, derived); choose another name");
                continue;
            }
            if (names.contains(name)) {
                problems.add(line, field, "is given twice");
                continue;
            }
            names.add(name);
            String expression = YamlReader.scalarText(t.getValueNode());
            if (expression == null || expression.isBlank()) {
                problems.add(YamlReader.line(t.getValueNode()), field, "must be an expression such as "
                    + "'payoff_x - payoff_y' or 'ratio(payoff_x, payoff_y)'");
                continue;
            }
            try {
                out.add(DerivedQuantity.parse(name, expression, line));
            } catch (IllegalArgumentException e) {
                problems.add(YamlReader.line(t.getValueNode()), field, e.getMessage());
            }
        }
        return out;
    }

    private static boolean isReserved(String name) {
        for (Subject.Joint j : Subject.Joint.values()) {
            if (j.label().equals(name)) {
                return true;
            }
        }
        for (Experiment.Quantity g : Experiment.Quantity.values()) {
            if (g.name().equalsIgnoreCase(name)) {
                return true;
            }
        }
        return name.startsWith(Subject.Snapshot.PREFIX);
    }

    private static boolean isBaseName(String name) {
        for (BaseQuantity q : BaseQuantity.values()) {
            if (q.label().equals(name)) {
                return true;
            }
        }
        return false;
    }
}
