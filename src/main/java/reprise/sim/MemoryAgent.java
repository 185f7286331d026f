package reprise.sim;

import org.apache.commons.rng.UniformRandomProvider;
import reprise.game.MemoryStrategy;

/**
 * The agent of a lookup-table strategy: its record is one int, the own-view history index
 * {@code s_t + 4 s_{t-1} + 16 s_{t-2}} with {@code s = 2 * ownDefected + coPlayerSeenDefecting},
 * padded with CC before round 1.
 *
 * <p>Draws: an intended move whose probability is exactly 0 or 1 takes no draw; otherwise one
 * {@code nextDouble() < p}. The engine's inlined table path makes the same draws in the same order,
 * so both give identical games.
 */
final class MemoryAgent implements Agent {
    private final double[] table;
    private final double initial;
    private final int mask;
    private int history;
    private boolean fresh;

    MemoryAgent(MemoryStrategy strategy) {
        this.table = strategy.table();
        this.initial = strategy.initial();
        this.mask = table.length - 1;
    }

    @Override
    public void startGame() {
        history = 0;
        fresh = true;
    }

    @Override
    public boolean intendsToCooperate(UniformRandomProvider rng) {
        double p = fresh ? initial : table[history];
        return p >= 1 || (p > 0 && rng.nextDouble() < p);
    }

    @Override
    public void record(boolean ownCooperated, boolean coPlayerSeenCooperating) {
        fresh = false;
        int code = (ownCooperated ? 0 : 2) | (coPlayerSeenCooperating ? 0 : 1);
        history = ((history << 2) | code) & mask;
    }
}
