package reprise.game;

import java.math.BigDecimal;

/** Parsing and formatting of the numbers in command-line and file specs. */
final class Numbers {
    private Numbers() {
    }

    static double parse(String what, String token) {
        String t = token.trim();
        String lower = t.toLowerCase(java.util.Locale.ROOT);
        if (lower.contains("nan") || lower.contains("inf")) {
            throw new IllegalArgumentException(what + " must be a finite number: " + t);
        }
        try {
            double v;
            int slash = t.indexOf('/');
            if (slash > 0) {
                v = Double.parseDouble(t.substring(0, slash)) / Double.parseDouble(t.substring(slash + 1));
            } else {
                v = Double.parseDouble(t);
            }
            if (!Double.isFinite(v)) {
                throw new IllegalArgumentException(what + " must be a finite number: " + token.trim());
            }
            return v;
        } catch (NumberFormatException e) {
            throw new IllegalArgumentException(what + " is not a number: '" + t + "'", e);
        }
    }

    static double[] parseList(String what, String text) {
        String t = text.trim();
        if (t.isEmpty()) {
            throw new IllegalArgumentException(what + " needs comma-separated numbers, got nothing");
        }
        String[] parts = t.split(",", -1);
        double[] v = new double[parts.length];
        for (int i = 0; i < parts.length; i++) {
            if (parts[i].isBlank()) {
                throw new IllegalArgumentException(what + " has an empty entry at position " + (i + 1) + ": '"
                    + text + "'");
            }
            v[i] = parse(what + " entry " + (i + 1), parts[i]);
        }
        return v;
    }

    static double[] parseList(String what, String text, int expected) {
        double[] v = parseList(what, text);
        if (v.length != expected) {
            throw new IllegalArgumentException(what + " needs " + expected + " numbers, got " + v.length + ": '"
                + text.trim() + "'");
        }
        return v;
    }

    static String format(double v) {
        if (v == Math.rint(v) && Math.abs(v) < 1e15) {
            return Long.toString((long) v);
        }
        return BigDecimal.valueOf(v).stripTrailingZeros().toPlainString();
    }
}
