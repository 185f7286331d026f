package reprise.output.figures;

/**
 * Data for the error-against-game-length figure of one case.
 *
 * @param title a title drawn above the plot, or blank for none
 * @param subject what the figure is about, shown as the first legend line (e.g. "TFT vs ALLD,
 *     noise=0.05"), or blank for none
 * @param quantity what the error is measured on, e.g. "payoff of X per round"; part of the y-axis title
 * @param observed |observed - stationary| against game length n, with an interval for each point
 *     (NaN bounds: no error bar)
 * @param exactBias the exact bias |E f_n - pi| against n, or null for none
 * @param exactStandardError the exact standard error of the observed mean against n (what sampling
 *     alone makes the error), or null for none
 */
public record ErrorScalingData(String title, String subject, String quantity, Estimates observed, Curve exactBias,
    Curve exactStandardError) {

    /**
     * Checks the data.
     *
     * @param title see the record description
     * @param subject see the record description
     * @param quantity not blank
     * @param observed not null
     * @param exactBias may be null
     * @param exactStandardError may be null
     */
    public ErrorScalingData {
        title = Validation.label("title", title);
        subject = Validation.label("subject", subject);
        quantity = Validation.label("quantity", quantity);
        if (quantity.isEmpty()) {
            throw new IllegalArgumentException("quantity must name what the error is measured on: blank");
        }
        if (observed == null) {
            throw new IllegalArgumentException("observed errors must be given: null");
        }
    }

    /**
     * Observed errors without intervals or standard-error curve.
     *
     * @param title a title, or blank
     * @param quantity what the error is measured on
     * @param gameLengths n, at least one
     * @param absoluteError |observed - stationary| at each n
     * @param exactBias the exact bias, or null
     */
    public ErrorScalingData(String title, String quantity, double[] gameLengths, double[] absoluteError,
        Curve exactBias) {
        this(title, "", quantity, Estimates.withoutIntervals(Validation.nonEmpty("game lengths", gameLengths),
            Validation.sameLength("absolute errors", absoluteError, gameLengths.length)), exactBias, null);
    }

    /** @return the game lengths of the observed points */
    public double[] gameLengths() {
        return observed.x();
    }

    /** @return the observed absolute errors */
    public double[] absoluteError() {
        return observed.estimate();
    }
}
