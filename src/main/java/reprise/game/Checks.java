package reprise.game;

/** Validation helpers that return the checked value, so they can be used inside constructors. */
final class Checks {
    private Checks() {
    }

    static double probability(String name, double p) {
        if (!(p >= 0 && p <= 1)) {
            throw new IllegalArgumentException(name + " must be a probability in [0, 1]: " + p);
        }
        return p;
    }

    static double finite(String name, double v) {
        if (!Double.isFinite(v)) {
            throw new IllegalArgumentException(name + " must be a finite number: " + v);
        }
        return v;
    }

    static double[] probabilities(String name, double[] p, int expectedLength) {
        if (p == null || p.length != expectedLength) {
            throw new IllegalArgumentException(name + " must have " + expectedLength + " entries: "
                + (p == null ? "none" : p.length));
        }
        for (int i = 0; i < p.length; i++) {
            probability(name + "[" + i + "]", p[i]);
        }
        return p.clone();
    }
}
