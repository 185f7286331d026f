package reprise.experiment;

import java.util.List;
import reprise.sim.SimulationResult;

/**
 * A simulated case with its exact side: everything the comparisons need.
 *
 * @param c the case
 * @param seed the case's master seed (derived from the experiment's seed and the case index)
 * @param simulation the simulator's tallies over all replicates
 * @param exact the exact side, or null when there is no exact prediction
 * @param noPrediction why there is no exact prediction, or null
 * @param warnings guard-rail warnings for this case, in plain words
 */
public record CaseResult(Case c, long seed, SimulationResult simulation, CaseAnalysis.Exact exact,
    String noPrediction, List<String> warnings) {
    /**
     * Copies the warnings.
     *
     * @param c the case
     * @param seed its seed
     * @param simulation the tallies
     * @param exact the exact side or null
     * @param noPrediction reason or null
     * @param warnings warnings
     */
    public CaseResult {
        warnings = List.copyOf(warnings);
    }
}
