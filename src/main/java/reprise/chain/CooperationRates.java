package reprise.chain;

/**
 * The fraction of rounds in which each player cooperates (realised moves).
 *
 * @param x X's cooperation rate, f_CC + f_CD
 * @param y Y's cooperation rate, f_CC + f_DC
 */
public record CooperationRates(double x, double y) {

    /**
     * Cooperation rates from round-state frequencies.
     *
     * @param frequencies 4 numbers CC, CD, DC, DD
     * @return the rates
     */
    public static CooperationRates of(double[] frequencies) {
        Payoffs.checkFour(frequencies);
        return new CooperationRates(frequencies[0] + frequencies[1], frequencies[0] + frequencies[2]);
    }
}
