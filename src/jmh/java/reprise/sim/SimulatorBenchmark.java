package reprise.sim;

import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.OperationsPerInvocation;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Setup;
import reprise.BenchmarkSettings;
import reprise.game.Horizon;
import reprise.game.Match;
import reprise.game.Noise;
import reprise.game.Player;
import reprise.game.StageGame;
import reprise.game.Strategies;

/**
 * Rounds per second of the engine: one operation is one round (each invocation plays 16 games of
 * 250,000 rounds, one replicate per chunk so that 2 threads share the work).
 * {@code fused}: memory-one players with execution noise on the fast path; {@code literal}: memory-two
 * players with execution and perception noise on the literal path; {@code literal3}: the same with a
 * memory-three player (tf3t against a random memory-three table).
 */
public class SimulatorBenchmark extends BenchmarkSettings {
    private static final int GAMES = 16;
    private static final int ROUNDS = 250_000;

    @Param({"fused", "literal", "literal3"})
    public String path;

    @Param({"1", "2"})
    public int threads;

    private Simulator simulator;
    private long seed;

    @Setup
    public void setUp() {
        StageGame g = StageGame.DEFAULT;
        Match m = switch (path) {
            case "fused" -> new Match(g, Strategies.parse("memory1:0.9,0.2,0.7,0.1", g, Player.X),
                Strategies.parse("wsls", g, Player.Y), Noise.symmetric(0.05, 0));
            case "literal" -> new Match(g, Strategies.parse("tf2t", g, Player.X), Strategies.parse(
                "memory2:0.9,0.1,0.8,0.2,0.7,0.3,0.6,0.4,0.5,0.5,0.4,0.6,0.3,0.7,0.2,0.8", g, Player.Y),
                Noise.symmetric(0.02, 0.05));
            default -> new Match(g, Strategies.parse("tft", g, Player.X), Strategies.parse(memoryThree(), g,
                Player.Y), Noise.symmetric(0.02, 0.05));
        };
        simulator = new Simulator(SimulationSpec.of(m, Horizon.rounds(ROUNDS), GAMES, 1).withThreads(threads), 1);
    }

    /** A memory-three table: 64 cooperation probabilities 0.05 to 0.95 in a fixed pattern. */
    private static String memoryThree() {
        StringBuilder sb = new StringBuilder("memory3:");
        for (int i = 0; i < 64; i++) {
            sb.append(i > 0 ? "," : "").append(String.format(java.util.Locale.ROOT, "%.2f", 0.05 + 0.9 * ((i * 37) % 64) / 63.0));
        }
        return sb.toString();
    }

    @Benchmark
    @OperationsPerInvocation(GAMES * ROUNDS)
    public long rounds() {
        return simulator.spec().seed() + simulator.simulateRange(0, GAMES, null).stateCounts()[0];
    }
}
