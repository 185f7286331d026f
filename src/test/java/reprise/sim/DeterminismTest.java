package reprise.sim;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.stream.Stream;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.core.source64.SplitMix64;
import org.apache.commons.rng.core.source64.XoRoShiRo128PlusPlus;
import org.apache.commons.rng.simple.RandomSource;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import reprise.game.Horizon;
import reprise.game.Match;
import reprise.game.Noise;
import reprise.game.Player;
import reprise.game.StageGame;
import reprise.game.Strategies;

/** Bit-identical results whatever the threads, chunking and merge order; the documented seed derivation. */
class DeterminismTest {
    private static final StageGame PD = StageGame.DEFAULT;

    static Match match(String x, String y, Noise noise) {
        return new Match(PD, Strategies.parse(x, PD, Player.X), Strategies.parse(y, PD, Player.Y), noise);
    }

    static Stream<Arguments> specs() {
        return Stream.of(
            Arguments.of("fused m1", SimulationSpec.of(match("memory1:0.9,0.2,0.7,0.1", "wsls", Noise.symmetric(0.05, 0.1)),
                Horizon.rounds(50), 5_000, 11).withBurnIn(3).withSnapshots(1, 7, 50).withTimeResolved(10)),
            Arguments.of("literal m2 geometric", SimulationSpec.of(match("tf2t", "memory1:0.8,0.1,0.6,0.3",
                Noise.symmetric(0.02, 0.05)), Horizon.continuation(0.95), 5_000, 12).withBurnIn(4)
                .withSnapshots(2, 30, 100).withTimeResolved(20)),
            Arguments.of("agent", SimulationSpec.of(match("agent:runcap,2,0.1", "gtft", Noise.symmetric(0.05, 0.05)),
                Horizon.continuation(0.9), 3_000, 13).withSnapshots(5).withTimeResolved(5)),
            Arguments.of("literal forced m1", SimulationSpec.of(match("tft", "random", new Noise(0.1, 0, 0, 0.1)),
                Horizon.rounds(40), 4_000, 14).withEnactment(Enactment.LITERAL)));
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("specs")
    void identicalForAnyThreadCountAndSplit(String name, SimulationSpec spec) {
        SimulationResult one = new Simulator(spec.withThreads(1)).run();
        SimulationResult two = new Simulator(spec.withThreads(2), 97).run();
        SimulationResult seven = new Simulator(spec.withThreads(7), 13).run();
        SimulationResult sevenOther = new Simulator(spec.withThreads(7), 1000).run();
        assertEquals(one, two, name + ": 1 vs 2 threads");
        assertEquals(one, seven, name + ": 1 vs 7 threads");
        assertEquals(one, sevenOther, name + ": 7 threads, other chunks");
        Simulator sim = new Simulator(spec.withThreads(2), 31);
        long n = spec.replicates();
        SimulationResult a = sim.simulateRange(0, 1, null);
        SimulationResult b = sim.simulateRange(1, n / 3, null);
        SimulationResult c = sim.simulateRange(n / 3, n, null);
        assertEquals(one, c.merge(a).merge(b), name + ": three ranges merged out of order");
        assertEquals(one, a.merge(b.merge(c)), name + ": merged in another association");
        assertEquals(one.stateCounts()[0], a.merge(b).merge(c).stateCounts()[0]);
        assertEquals(n, one.replicates());
        assertEquals(1, c.merge(a).merge(b).replicateRanges().size());
    }

    @Test
    void agentPathWithTableAgentsMakesTheSameDrawsAsTheTablePath() {
        SimulationSpec spec = SimulationSpec.of(match("tf2t", "memory1:0.8,0.1,0.6,0.3", Noise.symmetric(0.05, 0.1)),
            Horizon.continuation(0.9), 2_000, 21).withThreads(1).withTimeResolved(5).withSnapshots(3);
        Simulator sim = new Simulator(spec);
        assertEquals(sim.simulateRange(0, 2_000, null), sim.simulateWithAgents(0, 2_000));
    }

    @Test
    void mergeRefusesOverlapsAndForeignRuns() {
        SimulationSpec spec = SimulationSpec.of(match("tft", "tft", Noise.symmetric(0.1, 0)), Horizon.rounds(5), 100, 1)
            .withThreads(1);
        Simulator sim = new Simulator(spec);
        SimulationResult a = sim.simulateRange(0, 50, null);
        SimulationResult b = sim.simulateRange(40, 100, null);
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> a.merge(b));
        assertEquals("cannot merge overlapping replicate ranges: [0, 50) and [40, 100)", e.getMessage());
        SimulationResult other = new Simulator(spec.withSeed(2)).simulateRange(50, 100, null);
        assertEquals("cannot merge results with different seeds: 1 and 2",
            assertThrows(IllegalArgumentException.class, () -> a.merge(other)).getMessage());
        SimulationResult literal = new Simulator(spec.withEnactment(Enactment.LITERAL)).simulateRange(50, 100, null);
        assertTrue(assertThrows(IllegalArgumentException.class, () -> a.merge(literal)).getMessage()
            .startsWith("cannot merge results of different runs"));
        assertThrows(IllegalArgumentException.class, () -> sim.simulateRange(0, 101, null));
        assertThrows(IllegalArgumentException.class, () -> sim.simulateRange(5, 5, null));
    }

    @Test
    void replicateStreamIsCommonsXoRoShiRo128PlusPlusSeededFromSplitMix64() {
        long seed = -7_654_321L;
        for (long i : new long[] {0, 1, 2, 1_000_003}) {
            // SplitMix64 started at mix64(seed) advanced by 2i outputs; the documented derivation.
            SplitMix64 sm = new SplitMix64(ReplicateStream.mix64(seed) + 2 * i * ReplicateStream.GOLDEN);
            long[] state = {sm.nextLong(), sm.nextLong()};
            UniformRandomProvider reference = new XoRoShiRo128PlusPlus(state[0], state[1]);
            UniformRandomProvider viaSource = RandomSource.XO_RO_SHI_RO_128_PP.create(state.clone());
            UniformRandomProvider ours = Simulator.replicateGenerator(seed, i);
            for (int k = 0; k < 100; k++) {
                long v = reference.nextLong();
                assertEquals(v, viaSource.nextLong());
                assertEquals(v, ours.nextLong(), "replicate " + i + " draw " + k);
            }
        }
        // mix64 of 0 from SplitMix64's first output at state -G (so that state + G = 0).
        assertEquals(new SplitMix64(-ReplicateStream.GOLDEN).nextLong(), ReplicateStream.mix64(0));
        assertEquals("XO_RO_SHI_RO_128_PP", RandomSource.XO_RO_SHI_RO_128_PP.name());
        assertEquals(RandomSource.XO_RO_SHI_RO_128_PP.name(), Simulator.GENERATOR);
    }
}
