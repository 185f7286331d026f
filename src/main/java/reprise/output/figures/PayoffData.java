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
 * @param subject what the figure is about, shown as the first legend line, or blank for none
 * @param playerX how the legend names X, e.g. "X = TFT"
 * @param playerY how the legend names Y
 * @param payoffDescription the y-axis title, e.g. "mean payoff per round"
 * @param exactX X's exact payoff against delta
 * @param exactY Y's exact payoff against delta
 * @param simulatedX X's simulated payoffs with intervals, or null for none
 * @param simulatedY Y's simulated payoffs with intervals, or null for none
 * @param stationaryX X's stationary (delta to 1) payoff, drawn as a dashed reference, or NaN for none
 * @param stationaryY Y's stationary payoff, or NaN for none
 * @param axis what the x-axis shows
 * @param claimedX values of X's payoff claimed (for example in a paper) at some delta, drawn as crosses, or
 *     null for none
 * @param claimedY values of Y's payoff claimed, or null for none
 */
public record PayoffData(String title, String subject, String playerX, String playerY, String payoffDescription,
    Curve exactX, Curve exactY, Estimates simulatedX, Estimates simulatedY, double stationaryX, double stationaryY,
    ContinuationAxis axis, Curve claimedX, Curve claimedY) {

    /**
     * The data with players named X and Y, no stationary reference and a delta axis.
     *
     * @param title a title, or blank
     * @param payoffDescription the y-axis title
     * @param exactX X's exact payoff
     * @param exactY Y's exact payoff
     * @param simulatedX X's simulated payoffs, or null
     * @param simulatedY Y's simulated payoffs, or null
     */
    public PayoffData(String title, String payoffDescription, Curve exactX, Curve exactY, Estimates simulatedX,
        Estimates simulatedY) {
        this(title, "", "X", "Y", payoffDescription, exactX, exactY, simulatedX, simulatedY, Double.NaN, Double.NaN,
            ContinuationAxis.PROBABILITY, null, null);
    }

    /**
     * The same data with stationary references.
     *
     * @param x X's stationary payoff, or NaN
     * @param y Y's stationary payoff, or NaN
     * @return a new instance
     */
    public PayoffData withStationary(double x, double y) {
        return new PayoffData(title, subject, playerX, playerY, payoffDescription, exactX, exactY, simulatedX,
            simulatedY, x, y, axis, claimedX, claimedY);
    }

    /**
     * The same data with the players named and a subject line.
     *
     * @param subject the legend's first line, or blank
     * @param x the legend's name for X
     * @param y the legend's name for Y
     * @return a new instance
     */
    public PayoffData withNames(String subject, String x, String y) {
        return new PayoffData(title, subject, x, y, payoffDescription, exactX, exactY, simulatedX, simulatedY,
            stationaryX, stationaryY, axis, claimedX, claimedY);
    }

    /**
     * The same data on another x-axis.
     *
     * @param a the axis
     * @return a new instance
     */
    public PayoffData withAxis(ContinuationAxis a) {
        return new PayoffData(title, subject, playerX, playerY, payoffDescription, exactX, exactY, simulatedX,
            simulatedY, stationaryX, stationaryY, a, claimedX, claimedY);
    }

    /**
     * The same data with claimed values overlaid.
     *
     * @param x X's claimed payoffs against delta, or null
     * @param y Y's claimed payoffs against delta, or null
     * @return a new instance
     */
    public PayoffData withClaims(Curve x, Curve y) {
        return new PayoffData(title, subject, playerX, playerY, payoffDescription, exactX, exactY, simulatedX,
            simulatedY, stationaryX, stationaryY, axis, x, y);
    }

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
        subject = Validation.label("subject", subject);
        playerX = Validation.label("name of X", playerX);
        playerY = Validation.label("name of Y", playerY);
        if (playerX.isEmpty() || playerY.isEmpty()) {
            throw new IllegalArgumentException("players' legend names must not be blank: \"" + playerX + "\", \""
                + playerY + "\"");
        }
        if (axis == null) {
            throw new IllegalArgumentException("continuation axis must be given: null");
        }
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
