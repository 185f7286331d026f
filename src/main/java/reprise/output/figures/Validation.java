package reprise.output.figures;

import java.util.List;
import java.util.Objects;

/** Validation helpers that return the checked value, so they work inside record constructors. */
final class Validation {
    private Validation() {
    }

    static double[] nonEmpty(String name, double[] values) {
        if (values == null || values.length == 0) {
            throw new IllegalArgumentException(name + " must have at least one point: "
                + (values == null ? "none given" : "empty array"));
        }
        return values.clone();
    }

    static double[] sameLength(String name, double[] values, int expected) {
        if (values == null || values.length != expected) {
            throw new IllegalArgumentException(name + " must have " + expected + " entries: "
                + (values == null ? "none given" : values.length));
        }
        return values.clone();
    }

    static <T> List<T> exactly(String name, List<T> values, int expected) {
        if (values == null || values.size() != expected) {
            throw new IllegalArgumentException(name + " must have " + expected + " entries: "
                + (values == null ? "none given" : values.size()));
        }
        for (int i = 0; i < values.size(); i++) {
            Objects.requireNonNull(values.get(i), name + " entry " + i);
        }
        return List.copyOf(values);
    }

    static <T> List<T> nonEmpty(String name, List<T> values) {
        if (values == null || values.isEmpty()) {
            throw new IllegalArgumentException(name + " must have at least one entry: "
                + (values == null ? "none given" : "empty list"));
        }
        for (int i = 0; i < values.size(); i++) {
            Objects.requireNonNull(values.get(i), name + " entry " + i);
        }
        return List.copyOf(values);
    }

    static String label(String name, String value) {
        if (value == null) {
            throw new IllegalArgumentException(name + " must be given: null");
        }
        return value.strip();
    }
}
