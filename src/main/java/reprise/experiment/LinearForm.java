package reprise.experiment;

import java.util.EnumMap;
import java.util.Map;
import reprise.game.StageGame;

/**
 * An affine combination of the base quantities, c + sum_q a_q q, as written in a derived quantity's
 * expression.
 *
 * <p>Because every base quantity is w_q . N / L and the four state counts of a game sum to its tallied
 * length (1 . N = L), the combination is again a linear function of the counts over the length:
 * (sum_q a_q w_q + c 1) . N / L. So a derived quantity has weights like a base quantity, and every
 * analysis of a quantity (exact value, exact standard error, replicate interval) applies unchanged.
 *
 * @param coefficients a_q for the base quantities that appear (others are 0)
 * @param constant c
 */
public record LinearForm(Map<BaseQuantity, Double> coefficients, double constant) {

    /** Copies the coefficients. */
    public LinearForm {
        Map<BaseQuantity, Double> copy = new EnumMap<>(BaseQuantity.class);
        copy.putAll(coefficients);
        coefficients = java.util.Collections.unmodifiableMap(copy);
    }

    /** @return the form 0 */
    static LinearForm zero() {
        return new LinearForm(Map.of(), 0);
    }

    /**
     * @param v a number
     * @return the constant form v
     */
    static LinearForm constant(double v) {
        return new LinearForm(Map.of(), v);
    }

    /**
     * @param q a base quantity
     * @return the form 1 q
     */
    static LinearForm of(BaseQuantity q) {
        return new LinearForm(Map.of(q, 1.0), 0);
    }

    /** @return whether no quantity appears with a non-zero coefficient */
    boolean isConstant() {
        return coefficients.values().stream().allMatch(a -> a == 0);
    }

    /**
     * @param other another form
     * @param sign +1 to add, -1 to subtract
     * @return this + sign * other
     */
    LinearForm plus(LinearForm other, double sign) {
        Map<BaseQuantity, Double> c = new EnumMap<>(BaseQuantity.class);
        c.putAll(coefficients);
        other.coefficients.forEach((q, a) -> c.merge(q, sign * a, Double::sum));
        return new LinearForm(c, constant + sign * other.constant);
    }

    /**
     * @param k a number
     * @return k times this form
     */
    LinearForm times(double k) {
        Map<BaseQuantity, Double> c = new EnumMap<>(BaseQuantity.class);
        coefficients.forEach((q, a) -> c.put(q, k * a));
        return new LinearForm(c, k * constant);
    }

    /**
     * The weights over CC, CD, DC, DD: sum_q a_q w_q + c (1, 1, 1, 1).
     *
     * @param game the stage game
     * @return a new array
     */
    double[] weights(StageGame game) {
        double[] w = {constant, constant, constant, constant};
        coefficients.forEach((q, a) -> {
            double[] wq = q.weights(game);
            for (int s = 0; s < 4; s++) {
                w[s] += a * wq[s];
            }
        });
        return w;
    }
}
