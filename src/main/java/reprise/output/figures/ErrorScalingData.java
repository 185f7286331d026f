package reprise.output.figures;

import java.util.Arrays;

/**
 * Data for the error-against-game-length figure (log-log axes) of one case.
 *
 * @param title a title drawn above the plot, or blank for none
 * @param quantity what the error is measured on, for the axis title, e.g. "CC frequency" or
 *     "total variation over states"
 * @param gameLengths the game lengths n in rounds, positive
 * @param absoluteError |observed - stationary| at each game length; zero, negative or NaN values cannot
 *     be drawn on a log axis and are dropped with a note
 * @param exactBias the exact bias |f_n - pi| against n (a dense curve), or null to leave it out; values
 *     that are zero, negative or NaN are dropped with a note
 */
public record ErrorScalingData(String title, String quantity, double[] gameLengths, double[] absoluteError,
    Curve exactBias) {

    /**
     * Validates the lengths and copies the arrays.
     *
     * @param title the title, may be blank
     * @param quantity non-blank
     * @param gameLengths at least one value
     * @param absoluteError as many values as {@code gameLengths}
     * @param exactBias a curve, or null
     */
    public ErrorScalingData {
        title = Validation.label("title", title);
        quantity = Validation.label("quantity", quantity);
        if (quantity.isEmpty()) {
            throw new IllegalArgumentException("quantity must name what the error is measured on: blank");
        }
        gameLengths = Validation.nonEmpty("game lengths", gameLengths);
        absoluteError = Validation.sameLength("absolute errors", absoluteError, gameLengths.length);
    }

    /** @return the game lengths (a copy) */
    @Override
    public double[] gameLengths() {
        return gameLengths.clone();
    }

    /** @return the absolute error (a copy) */
    @Override
    public double[] absoluteError() {
        return absoluteError.clone();
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof ErrorScalingData d && title.equals(d.title) && quantity.equals(d.quantity)
            && Arrays.equals(gameLengths, d.gameLengths) && Arrays.equals(absoluteError, d.absoluteError)
            && java.util.Objects.equals(exactBias, d.exactBias);
    }

    @Override
    public int hashCode() {
        return java.util.Objects.hash(title, quantity, Arrays.hashCode(gameLengths), Arrays.hashCode(absoluteError),
            exactBias);
    }
}
