package reprise.cli;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;

/** Small helpers for the JSON the commands print: non-finite numbers become null, never invalid JSON. */
final class Json {
    static final ObjectMapper MAPPER = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT);
    private static final JsonNodeFactory F = JsonNodeFactory.instance;

    private Json() {
    }

    static ObjectNode object() {
        return F.objectNode();
    }

    static void put(ObjectNode o, String key, double v) {
        if (Double.isFinite(v)) {
            o.put(key, v);
        } else {
            o.putNull(key);
        }
    }

    static ArrayNode array(double[] v) {
        ArrayNode a = F.arrayNode();
        for (double d : v) {
            if (Double.isFinite(d)) {
                a.add(d);
            } else {
                a.addNull();
            }
        }
        return a;
    }

    static ArrayNode array(long[] v) {
        ArrayNode a = F.arrayNode();
        for (long d : v) {
            a.add(d);
        }
        return a;
    }

    static ArrayNode matrix(double[][] m) {
        ArrayNode a = F.arrayNode();
        for (double[] row : m) {
            a.add(array(row));
        }
        return a;
    }

    static ArrayNode matrix(long[][] m) {
        ArrayNode a = F.arrayNode();
        for (long[] row : m) {
            a.add(array(row));
        }
        return a;
    }

    static ArrayNode strings(String... v) {
        ArrayNode a = F.arrayNode();
        for (String s : v) {
            a.add(s);
        }
        return a;
    }

    static String write(Object node) {
        try {
            return MAPPER.writeValueAsString(node);
        } catch (com.fasterxml.jackson.core.JsonProcessingException e) {
            throw new IllegalStateException("JSON output failed", e);
        }
    }
}
