package reprise.experiment;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.yaml.snakeyaml.nodes.MappingNode;
import org.yaml.snakeyaml.nodes.Node;
import org.yaml.snakeyaml.nodes.NodeTuple;

/**
 * The {@code tolerances:} section of an experiment file: a mapping from a quantity group
 * ({@code states}, {@code cooperation}, {@code payoffs}, {@code derived}), a quantity's name
 * ({@code CC}, {@code payoff_x}, ...) or a derived quantity's name to a margin, absolute ({@code 0.05})
 * or relative ({@code 2%}); see {@link Tolerance}. Problems are reported at the entry's line with the
 * field {@code tolerances.KEY}.
 */
final class ToleranceSection {

    private ToleranceSection() {
    }

    /**
     * Reads the section.
     *
     * @param node the section's node, or null when absent
     * @param derived the experiment's derived quantities (their names are keys too)
     * @param problems where problems go
     * @return the tolerances by key, in file order
     */
    static Map<String, Tolerance> read(Node node, List<DerivedQuantity> derived, Problems problems) {
        Map<String, Tolerance> out = new LinkedHashMap<>();
        if (node == null) {
            return out;
        }
        if (!(node instanceof MappingNode m)) {
            problems.add(YamlReader.line(node), "tolerances", "must be a mapping such as 'payoffs: 0.05' or "
                + "'states: 2%'");
            return out;
        }
        List<String> known = new ArrayList<>();
        for (Experiment.Quantity g : Experiment.Quantity.values()) {
            known.add(g.name().toLowerCase(Locale.ROOT));
        }
        for (BaseQuantity q : BaseQuantity.values()) {
            known.add(q.label());
        }
        derived.forEach(d -> known.add(d.name()));
        for (NodeTuple t : m.getValue()) {
            String key = YamlReader.scalarText(t.getKeyNode());
            int line = YamlReader.line(t.getKeyNode());
            if (key == null || !known.contains(key)) {
                problems.add(line, "tolerances." + key, "is not a quantity group, quantity or derived quantity"
                    + (key == null ? "" : Problems.didYouMean(key, known)) + "; known: " + String.join(", ", known));
                continue;
            }
            String text = YamlReader.scalarText(t.getValueNode());
            try {
                if (text == null) {
                    throw new IllegalArgumentException("must be a number or a percentage such as 5%");
                }
                out.put(key, Tolerance.parse(text));
            } catch (IllegalArgumentException e) {
                problems.add(YamlReader.line(t.getValueNode()), "tolerances." + key, e.getMessage());
            }
        }
        return out;
    }
}
