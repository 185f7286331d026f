package reprise.experiment;

import java.util.Objects;
import java.util.regex.Pattern;
import reprise.game.StageGame;

/**
 * A quantity an experiment defines from the base quantities: an affine combination such as
 * {@code zd_residual: payoff_x - 1 - 3 * (payoff_y - 1)}, or a ratio {@code ratio(A, B)} of two.
 *
 * <p>A combination is again of the form w . N / L (see {@link LinearForm}), so its exact value, exact
 * standard error, replicate interval, tests, verdicts and claims are those of any quantity: per game, so
 * the replicate interval stays valid for autocorrelated rounds. A ratio A / B is estimated by
 * sum_g A_g L_g / sum_g B_g L_g (the ratio of the two per-game totals), which converges to the ratio of
 * the exact expectations E[A L] / E[B L]; its exact value is that ratio and its standard error is the
 * delta-method one over games (Cochran 1977, ch. 6).
 *
 * <p>References: Cochran, W.G. (1977). Sampling Techniques, 3rd ed. Wiley.
 *
 * @param name the name used in results.csv, matrix.csv and claims files
 * @param expression the expression as written
 * @param numerator the combination (a ratio's numerator)
 * @param denominator a ratio's denominator, or null for a combination
 * @param line the line of the definition in the experiment file
 */
public record DerivedQuantity(String name, String expression, LinearForm numerator, LinearForm denominator, int line)
    implements Quantity {

    /** Derived names: a letter, then letters, digits and '_' (so they cannot be read as numbers). */
    static final Pattern NAME = Pattern.compile("[A-Za-z][A-Za-z0-9_]*");

    /**
     * Checks the components.
     *
     * @throws IllegalArgumentException for a bad name
     */
    public DerivedQuantity {
        Objects.requireNonNull(name, "name");
        Objects.requireNonNull(expression, "expression");
        Objects.requireNonNull(numerator, "numerator");
        if (!NAME.matcher(name).matches()) {
            throw new IllegalArgumentException("a derived quantity's name is a letter, then letters, digits and '_': '"
                + name + "'");
        }
    }

    /**
     * Parses a definition.
     *
     * @param name its name
     * @param expression its expression
     * @param line its line
     * @return the quantity
     * @throws IllegalArgumentException for a bad expression, naming the position
     */
    static DerivedQuantity parse(String name, String expression, int line) {
        DerivedExpression.Parsed p = DerivedExpression.parse(expression);
        return new DerivedQuantity(name, expression.trim(), p.numerator(), p.denominator(), line);
    }

    /**
     * A derived quantity known by its name only, as read back from results.csv (which does not hold the
     * expression): its weights are those of the form 0.
     *
     * @param name the name
     * @return the stand-in
     */
    public static DerivedQuantity named(String name) {
        return new DerivedQuantity(name, "", LinearForm.zero(), null, 0);
    }

    @Override
    public String label() {
        return name;
    }

    @Override
    public Experiment.Quantity group() {
        return Experiment.Quantity.DERIVED;
    }

    /** @return whether this is a ratio (which is not of the form w . N / L) */
    public boolean isRatio() {
        return denominator != null;
    }

    /**
     * The weights of a combination, or of a ratio's numerator (per-game total A L = w . N).
     *
     * @param game the stage game
     * @return w, a new array
     */
    @Override
    public double[] weights(StageGame game) {
        return numerator.weights(game);
    }

    /**
     * The weights of a ratio's denominator (per-game total B L = v . N); (1, 1, 1, 1) for a combination,
     * whose denominator is the tallied length.
     *
     * @param game the stage game
     * @return v, a new array
     */
    public double[] denominatorWeights(StageGame game) {
        return denominator == null ? new double[] {1, 1, 1, 1} : denominator.weights(game);
    }
}
