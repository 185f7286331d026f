package reprise.experiment;

import java.util.ArrayList;
import java.util.List;
import reprise.game.StageGame;
import reprise.stats.Estimate;
import reprise.stats.GameSummary;
import reprise.stats.ReplicateInference;

/**
 * The values of a {@link Quantity} that the matrix outputs need, in one place: which quantities an
 * experiment reports, their exact value for a case, their value for given state frequencies, and their
 * replicate estimate from the simulated games.
 */
final class Quantities {

    private Quantities() {
    }

    /**
     * The quantities an experiment reports, in report order: the base quantities of its
     * {@code quantities:} groups, then its derived quantities.
     *
     * @param e the experiment
     * @return the quantities
     */
    static List<Quantity> reported(Experiment e) {
        List<Quantity> out = new ArrayList<>();
        for (BaseQuantity q : BaseQuantity.values()) {
            if (e.quantities().contains(q.group())) {
                out.add(q);
            }
        }
        if (e.quantities().contains(Experiment.Quantity.DERIVED)) {
            out.addAll(e.derived());
        }
        return out;
    }

    /**
     * @param q the quantity
     * @param r a case result with an exact side
     * @return the exact value for the tallied rounds of the case's horizon
     */
    static double exact(Quantity q, CaseResult r) {
        return exact(q, r.exact(), r.c().match().game());
    }

    /**
     * @param q the quantity
     * @param exact the exact side of a case
     * @param game the stage game
     * @return the exact value for the tallied rounds (for a ratio, E[a . N] / E[b . N])
     */
    static double exact(Quantity q, CaseAnalysis.Exact exact, StageGame game) {
        if (q instanceof DerivedQuantity d && d.isRatio()) {
            return exact.value(d.weights(game)) / exact.value(d.denominatorWeights(game));
        }
        return exact.value(q.weights(game));
    }

    /**
     * The exact standard error of a ratio's estimate from G games under the exact model (delta method):
     * sqrt((a - R b)' Sigma (a - R b) / G) / E[b . N], Sigma the exact covariance of one game's counts.
     *
     * @param d a ratio
     * @param exact the exact side
     * @param game the stage game
     * @param games G
     * @return the standard error
     */
    static double ratioStandardError(DerivedQuantity d, CaseAnalysis.Exact exact, StageGame game, long games) {
        double[] a = d.weights(game);
        double[] b = d.denominatorWeights(game);
        double r = exact(d, exact, game);
        double[] c = new double[4];
        for (int s = 0; s < 4; s++) {
            c[s] = a[s] - r * b[s];
        }
        double v = Math.max(0, exact.moments().quadraticForm(c));
        return Math.sqrt(v / games) / Math.abs(exact.value(b) * exact.meanLength());
    }

    /** @return whether q is a derived ratio */
    static boolean isRatio(Quantity q) {
        return q instanceof DerivedQuantity d && d.isRatio();
    }

    /**
     * @param q the quantity
     * @param game the stage game
     * @param frequencies state frequencies CC, CD, DC, DD
     * @return the quantity's value at those frequencies
     */
    static double value(Quantity q, StageGame game, double[] frequencies) {
        if (q instanceof DerivedQuantity d && d.isRatio()) {
            return CaseAnalysis.dot(d.weights(game), frequencies)
                / CaseAnalysis.dot(d.denominatorWeights(game), frequencies);
        }
        return CaseAnalysis.dot(q.weights(game), frequencies);
    }

    /**
     * @param q the quantity
     * @param game the stage game
     * @param summary the simulated games (at least 2)
     * @return the replicate estimate (games as independent observations), or null for a ratio whose
     *     denominator is 0 in every game
     */
    static Estimate estimate(Quantity q, StageGame game, GameSummary summary) {
        if (q instanceof DerivedQuantity d && d.isRatio()) {
            double[] b = d.denominatorWeights(game);
            double total = 0;
            long[] counts = summary.sumCounts();
            for (int s = 0; s < 4; s++) {
                total += b[s] * counts[s];
            }
            return total == 0 ? null : ReplicateInference.ratio(summary, d.weights(game), b);
        }
        return ReplicateInference.mean(summary, q.weights(game));
    }
}
