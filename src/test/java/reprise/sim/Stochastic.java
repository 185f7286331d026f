package reprise.sim;

import java.util.ArrayList;
import java.util.List;
import org.apache.commons.statistics.distribution.TDistribution;

/**
 * Batch t-tests of per-game means against exact values, with a Bonferroni family budget.
 *
 * <p>A run of G games is split into B replicate ranges of equal size (simulated separately and
 * therefore independent); each range gives the mean per game of a tally, and
 * t = (mean of the B means - exact) / (sd / sqrt B) is compared with Student's t with B - 1 degrees of
 * freedom (common practice, no source). Quantities whose exact value is 0 must be 0 in every batch,
 * which is a deterministic check.
 */
final class Stochastic {
    private Stochastic() {
    }

    /** Two-sided critical value of Student's t with df degrees of freedom at level alpha. */
    static double critical(int df, double alpha) {
        return TDistribution.of(df).inverseSurvivalProbability(alpha / 2);
    }

    /**
     * @param batches per-batch means, batches[k]
     * @param exact the expected value
     * @return the t statistic, 0 if the batches agree exactly with exact, infinity if they have no spread
     *     but differ from exact
     */
    static double t(double[] batches, double exact) {
        int b = batches.length;
        double mean = 0;
        for (double v : batches) {
            mean += v;
        }
        mean /= b;
        double ss = 0;
        for (double v : batches) {
            ss += (v - mean) * (v - mean);
        }
        double sd = Math.sqrt(ss / (b - 1));
        if (sd == 0) {
            return Math.abs(mean - exact) <= 1e-9 * Math.max(1, Math.abs(exact)) ? 0 : Double.POSITIVE_INFINITY;
        }
        return (mean - exact) / (sd / Math.sqrt(b));
    }

    /** Collects failures with their descriptions. */
    static final class Ledger {
        final List<String> rejected = new ArrayList<>();
        int tests;

        void check(String what, double statistic, double critical) {
            tests++;
            if (!(Math.abs(statistic) <= critical)) {
                rejected.add(what + ": t = " + statistic);
            }
        }
    }
}
