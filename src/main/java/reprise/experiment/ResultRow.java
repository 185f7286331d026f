package reprise.experiment;

/**
 * One row of {@code results.csv}: one comparison of one quantity in one case.
 *
 * <p>Numbers that do not apply are NaN (written as empty cells).
 *
 * @param caseIndex the case's index
 * @param caseId the case's identifier
 * @param quantity CC, CD, DC, DD, coop_x, coop_y, payoff_x, payoff_y, states (all four), transitions,
 *     or snapshot_t (state at round t)
 * @param comparison exact, stationary, claim-vs-simulation, claim-vs-exact
 * @param predicted the value compared with (exact, stationary or claimed)
 * @param observed the simulated estimate (or, for claim-vs-exact, the exact value)
 * @param lower lower end of the confidence interval of the observed value
 * @param upper upper end
 * @param statistic the test statistic
 * @param degreesOfFreedom its degrees of freedom
 * @param pValue the unadjusted p-value
 * @param adjustedP the p-value after the multiple-testing correction
 * @param verdict the outcome in plain words
 * @param note a short explanation (test used, bias, games needed)
 */
public record ResultRow(int caseIndex, String caseId, String quantity, String comparison, double predicted,
    double observed, double lower, double upper, double statistic, double degreesOfFreedom, double pValue,
    double adjustedP, Verdict verdict, String note) {

    /**
     * The same row with the adjusted p-value and verdict replaced.
     *
     * @param p the adjusted p-value
     * @param v the verdict
     * @return a new row
     */
    public ResultRow adjusted(double p, Verdict v) {
        return new ResultRow(caseIndex, caseId, quantity, comparison, predicted, observed, lower, upper, statistic,
            degreesOfFreedom, pValue, p, v, note);
    }
}
