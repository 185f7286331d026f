package reprise.experiment;

import java.util.Locale;
import java.util.Map;

/**
 * An equivalence margin h for "agrees within +-h": absolute (a number on the quantity's own scale) or
 * relative (a percentage of the magnitude of the value compared with: the exact, stationary or claimed
 * value). A relative margin around a reference value of 0 is the smallest positive double, so such a
 * comparison can only disagree or stay inconclusive; use an absolute margin for quantities near 0 (such as
 * a zero-determinant residual).
 *
 * @param amount the margin (absolute) or the fraction (relative, 0.05 for 5%), positive and finite
 * @param relative whether the margin is relative
 */
public record Tolerance(double amount, boolean relative) {

    /**
     * Checks the amount.
     *
     * @throws IllegalArgumentException unless positive and finite
     */
    public Tolerance {
        if (!(amount > 0 && amount < Double.POSITIVE_INFINITY)) {
            throw new IllegalArgumentException("a tolerance must be a positive margin: " + amount);
        }
    }

    /**
     * The margin around a reference value.
     *
     * @param reference the value compared with
     * @return h (for a relative tolerance, amount * |reference|)
     */
    public double margin(double reference) {
        return relative ? Math.max(Double.MIN_VALUE, amount * Math.abs(reference)) : amount;
    }

    /**
     * Parses "0.02" (absolute) or "5%" (relative).
     *
     * @param text the text
     * @return the tolerance
     * @throws IllegalArgumentException naming the text
     */
    public static Tolerance parse(String text) {
        String t = text.trim();
        boolean relative = t.endsWith("%");
        String number = relative ? t.substring(0, t.length() - 1).trim() : t;
        double v;
        try {
            v = Double.parseDouble(number);
        } catch (NumberFormatException e) {
            throw new IllegalArgumentException("must be a positive number (absolute) or a percentage such as 5% "
                + "(relative): '" + text + "'", e);
        }
        if (!(v > 0 && v < Double.POSITIVE_INFINITY) || YamlReader.NumberText.of(number)
            != YamlReader.NumberText.FINITE) {
            throw new IllegalArgumentException("must be a positive finite margin: '" + text + "'");
        }
        return new Tolerance(relative ? v / 100 : v, relative);
    }

    /**
     * The tolerance of a quantity in an experiment: its own entry in {@code tolerances:} (by name), else its
     * group's (states, cooperation, payoffs, derived), else the experiment's {@code tolerance:}.
     *
     * @param e the experiment
     * @param q the quantity
     * @return the tolerance
     */
    public static Tolerance of(Experiment e, Quantity q) {
        Map<String, Tolerance> t = e.tolerances();
        Tolerance own = t.get(q.label());
        if (own != null) {
            return own;
        }
        Tolerance group = t.get(q.group().name().toLowerCase(Locale.ROOT));
        return group != null ? group : new Tolerance(e.tolerance(), false);
    }

    /** @return "0.02" or "5%" */
    public String describe() {
        return relative ? Comparisons.fmt(amount * 100) + "%" : Comparisons.fmt(amount);
    }
}
