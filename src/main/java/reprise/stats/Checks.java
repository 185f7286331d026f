package reprise.stats;

/** Validation helpers that return the checked value, so they can be used inside constructors. */
final class Checks {
    private Checks() {
    }

    static double finite(String name, double v) {
        if (!Double.isFinite(v)) {
            throw new IllegalArgumentException(name + " must be a finite number: " + v);
        }
        return v;
    }

    static double nonNegative(String name, double v) {
        if (!(v >= 0 && v < Double.POSITIVE_INFINITY)) {
            throw new IllegalArgumentException(name + " must be a finite number >= 0: " + v);
        }
        return v;
    }

    static double positive(String name, double v) {
        if (!(v > 0 && v < Double.POSITIVE_INFINITY)) {
            throw new IllegalArgumentException(name + " must be a finite number > 0: " + v);
        }
        return v;
    }

    static double probability(String name, double p) {
        if (!(p >= 0 && p <= 1)) {
            throw new IllegalArgumentException(name + " must be a probability in [0, 1]: " + p);
        }
        return p;
    }

    /** A level strictly inside (0, 1), such as a confidence level, alpha or a power. */
    static double level(String name, double p) {
        if (!(p > 0 && p < 1)) {
            throw new IllegalArgumentException(name + " must be in (0, 1): " + p);
        }
        return p;
    }

    static double[] finiteVector(String name, double[] v, int length) {
        if (v == null || (length >= 0 && v.length != length) || v.length == 0) {
            throw new IllegalArgumentException(name + " must have " + (length >= 0 ? length : "at least 1")
                + " entries: " + (v == null ? "none" : v.length));
        }
        for (int i = 0; i < v.length; i++) {
            finite(name + "[" + i + "]", v[i]);
        }
        return v.clone();
    }

    /** Copies a square matrix, checking finiteness and symmetry (relative 1e-9), and symmetrises it. */
    static double[][] symmetricMatrix(String name, double[][] m, int size) {
        if (m == null || m.length != size) {
            throw new IllegalArgumentException(name + " must be " + size + " x " + size + ": "
                + (m == null ? "none" : m.length + " rows"));
        }
        double scale = 0;
        double[][] c = new double[size][];
        for (int i = 0; i < size; i++) {
            if (m[i] == null || m[i].length != size) {
                throw new IllegalArgumentException(name + " row " + i + " must have " + size + " entries: "
                    + (m[i] == null ? "none" : m[i].length));
            }
            c[i] = finiteVector(name + "[" + i + "]", m[i], size);
            for (double d : c[i]) {
                scale = Math.max(scale, Math.abs(d));
            }
        }
        for (int i = 0; i < size; i++) {
            for (int j = 0; j < i; j++) {
                if (!(Math.abs(c[i][j] - c[j][i]) <= 1e-9 * scale)) {
                    throw new IllegalArgumentException(name + " must be symmetric: [" + i + "][" + j + "] = "
                        + c[i][j] + " but [" + j + "][" + i + "] = " + c[j][i]);
                }
                double mean = 0.5 * (c[i][j] + c[j][i]);
                c[i][j] = mean;
                c[j][i] = mean;
            }
            if (c[i][i] < 0) {
                throw new IllegalArgumentException(name + " must have variances >= 0 on its diagonal: [" + i
                    + "][" + i + "] = " + c[i][i]);
            }
        }
        return c;
    }

    static long[] counts(String name, long[] v, int length) {
        if (v == null || (length >= 0 && v.length != length) || v.length == 0) {
            throw new IllegalArgumentException(name + " must have " + (length >= 0 ? length : "at least 1")
                + " entries: " + (v == null ? "none" : v.length));
        }
        for (int i = 0; i < v.length; i++) {
            if (v[i] < 0) {
                throw new IllegalArgumentException(name + "[" + i + "] must be a count >= 0: " + v[i]);
            }
        }
        return v.clone();
    }

    /** A probability vector: entries in [0, 1] summing to 1 within 1e-9. */
    static double[] distribution(String name, double[] p, int length) {
        double[] c = finiteVector(name, p, length);
        double sum = 0;
        for (int i = 0; i < c.length; i++) {
            probability(name + "[" + i + "]", c[i]);
            sum += c[i];
        }
        if (!(Math.abs(sum - 1) <= 1e-9)) {
            throw new IllegalArgumentException(name + " must sum to 1: " + sum);
        }
        return c;
    }

    static int state(String name, int s) {
        if (s < 0 || s > 3) {
            throw new IllegalArgumentException(name + " must be a state index 0 (CC) to 3 (DD): " + s);
        }
        return s;
    }
}
