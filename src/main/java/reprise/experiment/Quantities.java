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
        return out;
    }

    /**
     * @param q the quantity
     * @param r a case result with an exact side
     * @return the exact value for the tallied rounds of the case's horizon
     */
    static double exact(Quantity q, CaseResult r) {
        return r.exact().value(q.weights(r.c().match().game()));
    }

    /**
     * @param q the quantity
     * @param game the stage game
     * @param frequencies state frequencies CC, CD, DC, DD
     * @return the quantity's value at those frequencies
     */
    static double value(Quantity q, StageGame game, double[] frequencies) {
        return CaseAnalysis.dot(q.weights(game), frequencies);
    }

    /**
     * @param q the quantity
     * @param game the stage game
     * @param summary the simulated games (at least 2)
     * @return the replicate estimate (games as independent observations)
     */
    static Estimate estimate(Quantity q, StageGame game, GameSummary summary) {
        return ReplicateInference.mean(summary, q.weights(game));
    }
}
