package reprise.sim;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.math.BigInteger;
import java.util.List;
import org.junit.jupiter.api.Test;
import reprise.game.Horizon;
import reprise.game.MemoryStrategy;
import reprise.game.Noise;
import reprise.game.Population;
import reprise.game.StageGame;

/**
 * The population simulator's fixed-seed output (a regression pin, no source: a change of these numbers
 * changes every published population result and must be made deliberately), and its refusals.
 */
class PopulationTraceTest {

    private static final List<MemoryStrategy> PAIR = List.of(
        MemoryStrategy.memoryOne("m1", new double[] {0.9, 0.2, 0.7, 0.1}, 0.5),
        MemoryStrategy.memoryOne("wsls", new double[] {1, 0, 0, 1}, 1));

    @Test
    void fixedSeedInvasions() {
        PopulationSimulator pairwise = new PopulationSimulator(StageGame.DEFAULT, PAIR, Noise.symmetric(0.05, 0.01),
            Horizon.rounds(7), Population.pairwise(6, 1), 42);
        assertEquals(PINNED_PAIRWISE, pairwise.invasions(0, 1, 0, 500, 1));
        PopulationSimulator moran = new PopulationSimulator(StageGame.DEFAULT, PAIR, Noise.symmetric(0.05, 0),
            Horizon.rounds(3), Population.moran(5, 0.5, Population.Fitness.EXPONENTIAL).withCoPlayers(2), 42);
        assertEquals(PINNED_MORAN, moran.invasions(1, 0, 0, 500, 1));
        PopulationSimulator continuation = new PopulationSimulator(StageGame.DEFAULT, PAIR, Noise.symmetric(0.02, 0),
            Horizon.continuation(0.8), Population.pairwise(4, 2), 42);
        assertArrayEquals(PINNED_RUN, continuation.mutationRun(0, 1, 0.1, 2, 20, 1, 3).counts());
    }

    @Test
    void refusals() {
        assertThrows(IllegalArgumentException.class, () -> new PopulationSimulator(StageGame.DEFAULT, PAIR,
            Noise.symmetric(0.05, 0), Horizon.continuation(0.5), Population.moran(5, 0.5, Population.Fitness.LINEAR), 1));
        assertThrows(IllegalArgumentException.class, () -> new PopulationSimulator(StageGame.asymmetric(
            new double[] {3, 0, 5, 1}, new double[] {2, 0, 5, 1}), PAIR, Noise.NONE, Horizon.rounds(2), Population.pairwise(5, 1), 1));
        PopulationSimulator s = new PopulationSimulator(StageGame.DEFAULT, PAIR, Noise.NONE, Horizon.rounds(2),
            Population.pairwise(5, 1), 1);
        assertThrows(IllegalArgumentException.class, () -> s.invasions(0, 0, 0, 10, 1));
        assertThrows(IllegalArgumentException.class, () -> s.invasions(0, 1, 5, 4, 1));
        assertThrows(IllegalArgumentException.class, () -> s.mutationRun(0, 1, 0, 1, 100, 1, 0));
    }

    static final InvasionTally PINNED_PAIRWISE = new InvasionTally(500, 74, 3640, BigInteger.valueOf(252598), 10883,
        293013);
    static final InvasionTally PINNED_MORAN = new InvasionTally(500, 106, 1763, BigInteger.valueOf(38687), 4487, 95994);
    static final int[] PINNED_RUN = {2, 2, 2, 3, 2, 2, 2, 3, 2, 2, 3, 3, 3, 3, 3, 3, 3, 3, 4, 4};
}
