package reprise.sim;

import org.apache.commons.rng.UniformRandomProvider;

/**
 * The example user agent {@code agent:runcap[,K[,G]]}: retaliates against a defection it saw, but
 * never for more than K rounds in a row (it caps the run of its own defections, hence the name).
 *
 * <p>Rule: cooperate in round 1. Afterwards, if the co-player was seen cooperating in the last round,
 * cooperate. If it was seen defecting, defect, except
 * <ul>
 *   <li>when this agent's own last K realised moves were all defections: then cooperate (forgive);</li>
 *   <li>with probability G (generosity) cooperate anyway; G = 0 or 1 takes no random draw.</li>
 * </ul>
 * K = 1 with G = 0 is the memory-one table (1, 0, 1, 1) in own view; larger K needs a memory of K
 * rounds of its own moves, kept here as one int (the length of the current run of own defections).
 * Defaults: K = 2, G = 0.
 */
final class RunCapAgent implements Agent {
    private final int patience;
    private final double generosity;
    private int ownDefectionRun;
    private boolean coPlayerSeenDefecting;

    RunCapAgent(int patience, double generosity) {
        this.patience = patience;
        this.generosity = generosity;
    }

    @Override
    public void startGame() {
        ownDefectionRun = 0;
        coPlayerSeenDefecting = false;
    }

    @Override
    public boolean intendsToCooperate(UniformRandomProvider rng) {
        if (!coPlayerSeenDefecting || ownDefectionRun >= patience) {
            return true;
        }
        return generosity >= 1 || (generosity > 0 && rng.nextDouble() < generosity);
    }

    @Override
    public void record(boolean ownCooperated, boolean coPlayerSeenCooperating) {
        ownDefectionRun = ownCooperated ? 0 : ownDefectionRun + 1;
        coPlayerSeenDefecting = !coPlayerSeenCooperating;
    }
}
