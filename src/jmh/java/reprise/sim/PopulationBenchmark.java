package reprise.sim;

import java.util.List;
import org.openjdk.jmh.annotations.AuxCounters;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import reprise.BenchmarkSettings;
import reprise.game.Horizon;
import reprise.game.MemoryStrategy;
import reprise.game.Noise;
import reprise.game.Population;
import reprise.game.StageGame;

/**
 * Game rounds per second inside population runs: invasions of a generic memory-one mutant among
 * win-stay lose-shift residents, N = 100, pairwise comparison (beta = 1), games of 100 rounds with 5%
 * execution and 1% perception error. Each invocation plays 20 invasions (the next 20 indexes) on
 * {@code threads} worker threads; the secondary result {@code rounds} is the rate of game rounds.
 */
public class PopulationBenchmark extends BenchmarkSettings {
    @Param({"1", "2"})
    public int threads;

    private PopulationSimulator sim;
    private long next;

    /** The rounds counter reported by JMH as a rate. */
    @State(Scope.Thread)
    @AuxCounters(AuxCounters.Type.OPERATIONS)
    public static class Counter {
        /** Game rounds played. */
        public long rounds;

        /** Clears the counter. */
        @Setup(Level.Iteration)
        public void clear() {
            rounds = 0;
        }
    }

    @Setup
    public void setUp() {
        sim = new PopulationSimulator(StageGame.DEFAULT, List.of(
            MemoryStrategy.memoryOne("m1", new double[] {0.9, 0.2, 0.7, 0.1}, 0.5),
            MemoryStrategy.memoryOne("wsls", new double[] {1, 0, 0, 1}, 1)), Noise.symmetric(0.05, 0.01),
            Horizon.rounds(100), Population.pairwise(100, 1), 1);
    }

    @Benchmark
    public long invasions(Counter counter) {
        InvasionTally t = sim.invasions(0, 1, next, next + 20, threads);
        next += 20;
        counter.rounds += t.rounds();
        return t.fixations();
    }
}
