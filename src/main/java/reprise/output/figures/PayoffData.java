package reprise.output.figures;

/**
 * Data for the payoff-against-continuation-probability figure of one case.
 *
 * <p>Every x value is a continuation probability delta in [0, 1); the y values are payoffs in the
 * stage game's units, per round (for example normalised discounted payoff (1 - delta) sum delta^t u_t,
 * or mean payoff per round of a game with geometric length; the caller says which in
 * {@code payoffDescription}).
 *
 * @param title a title drawn above the plot, or blank for none
 * @param payoffDescription the y-axis title, e.g. "mean payoff per round"
 * @param exactX X's exact payoff against delta
 * @param exactY Y's exact payoff against delta
 * @param simulatedX X's simulated payoffs with intervals, or null for none
 * @param simulatedY Y's simulated payoffs with intervals, or null for none
 */
public record PayoffData(String title, String payoffDescription, Curve exactX, Curve exactY, Estimates simulatedX,
    Estimates simulatedY) {

    /**
     * Validates the data.
     *
     * @param title the title, may be blank
     * @param payoffDescription non-blank
     * @param exactX not null
     * @param exactY not null
     * @param simulatedX may be null
     * @param simulatedY may be null
     */
    public PayoffData {
        title = Validation.label("title", title);
        payoffDescription = Validation.label("payoff description", payoffDescription);
        if (payoffDescription.isEmpty()) {
            throw new IllegalArgumentException("payoff description (the y-axis title) must not be blank");
        }
        if (exactX == null || exactY == null) {
            throw new IllegalArgumentException("exact payoff curves of X and Y must both be given: "
                + (exactX == null ? "X missing" : "Y missing"));
        }
    }
}
