package reprise.experiment;

import java.io.IOException;
import java.io.Reader;
import java.io.StringReader;
import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.EnumSet;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
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

/**
 * A small YAML reader that keeps line numbers: it composes a document into SnakeYAML nodes (no object
 * construction, duplicate keys refused) and reads scalars, lists of scalars, mappings with known keys,
 * numbers and enum sets from them. Every problem goes to {@link Problems} with its line and field;
 * a reader returns the default (or skips the entry) after reporting, so that all problems of a file are
 * found in one pass. Knows nothing about experiments.
 */
final class YamlReader {

    private YamlReader() {
    }

    /** A scalar with its line. */
    record Scalar(String text, int line) {
    }

    /**
     * Composes the text into a node tree; a syntax error is reported and thrown at once.
     *
     * @return the root node, or null for an empty document
     */
    static Node compose(String text, Problems problems) {
        try (Reader r = new StringReader(text)) {
            LoaderOptions options = new LoaderOptions();
            options.setAllowDuplicateKeys(false);
            return new Yaml(new SafeConstructor(options)).compose(r);
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
    }

    /** The entries of a mapping whose keys are among {@code known}, in file order; others are reported. */
    static Map<String, Node> mapping(MappingNode node, String prefix, List<String> known, Problems problems) {
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

    /** One value or a list of values, each with its line. */
    static List<Scalar> scalars(Node node, String field, Problems problems) {
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

    static String string(Map<String, Node> map, String key, String dflt, Problems problems) {
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

    /** A whole number in [min, max] (max = Long.MAX_VALUE reads "at least min"), or the default. */
    static long longValue(Map<String, Node> map, String key, long dflt, long min, long max, Problems problems) {
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

    /** A finite number, or the default. */
    static double doubleValue(Map<String, Node> map, String key, double dflt, Problems problems) {
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

    /** A whole number (underscores allowed, "1e3" too), or null after reporting. */
    static Long asLong(Scalar s, String field, Problems problems) {
        BigDecimal d;
        try {
            d = new BigDecimal(s.text().trim().replace("_", ""));
        } catch (NumberFormatException e) {
            problems.add(s.line(), field, "must be a whole number: '" + s.text() + "'");
            return null;
        }
        try {
            return d.longValueExact();
        } catch (ArithmeticException e) {
            boolean whole = d.signum() == 0 || d.stripTrailingZeros().scale() <= 0;
            problems.add(s.line(), field, whole ? "is out of the 64-bit range [" + Long.MIN_VALUE + ", " + Long.MAX_VALUE
                + "]: '" + s.text() + "'" : "must be a whole number: '" + s.text() + "'");
            return null;
        }
    }

    /** How a text reads as a number. */
    enum NumberText {
        /** A finite double. */
        FINITE,
        /** NaN or infinite: it names NaN or infinity, or overflows. */
        NOT_FINITE,
        /** Not a number at all. */
        NOT_A_NUMBER;

        /**
         * The one finite-number check of experiment files (values, probability pairs).
         *
         * @param t the text, trimmed
         * @return its kind
         */
        static NumberText of(String t) {
            try {
                return Double.isFinite(Double.parseDouble(t)) ? FINITE : NOT_FINITE;
            } catch (NumberFormatException e) {
                String lower = t.toLowerCase(Locale.ROOT);
                return lower.contains("nan") || lower.contains("inf") ? NOT_FINITE : NOT_A_NUMBER;
            }
        }
    }

    /** A finite number, or null after reporting. */
    static Double asDouble(Scalar s, String field, Problems problems) {
        String t = s.text().trim();
        switch (NumberText.of(t)) {
            case FINITE:
                return Double.parseDouble(t);
            case NOT_FINITE:
                problems.add(s.line(), field, "must be a finite number: '" + t + "'");
                return null;
            default:
                problems.add(s.line(), field, "must be a number: '" + t + "'");
                return null;
        }
    }

    /** The constants named (case-insensitively) by a value or list, or all of them when the node is absent. */
    static <E extends Enum<E>> Set<E> enumSet(Node node, String field, Class<E> type, Problems problems) {
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
            String t = s.text().trim().toLowerCase(Locale.ROOT);
            if (!known.contains(t)) {
                problems.add(s.line(), field, "unknown value '" + s.text() + "'" + Problems.didYouMean(t, known)
                    + "; known: " + String.join(", ", known));
            } else {
                set.add(Enum.valueOf(type, t.toUpperCase(Locale.ROOT)));
            }
        }
        return set;
    }

    /** Reports once each value that appears more than once, at the list's line (linear time, for long lists). */
    static void duplicates(List<String> values, int line, String field, Problems problems) {
        Set<String> seen = new HashSet<>();
        Set<String> reported = new HashSet<>();
        for (String v : values) {
            if (!seen.add(v) && reported.add(v)) {
                problems.add(line, field, "value " + v + " is listed twice");
            }
        }
    }

    /** @return the text of a scalar node, or null for any other node */
    static String scalarText(Node n) {
        return n instanceof ScalarNode s ? s.getValue() : null;
    }

    /** @return the 1-based line where the node starts, 0 for none */
    static int line(Node n) {
        return n == null ? 0 : n.getStartMark().getLine() + 1;
    }

    private static String oneLine(String s) {
        return s == null ? "" : s.replaceAll("\\s+", " ").trim();
    }
}
