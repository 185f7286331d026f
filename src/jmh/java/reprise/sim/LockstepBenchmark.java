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
 * Rounds per second of the fused path on many short games, played in lockstep blocks: one operation is
 * one round; each invocation plays 335,544 games of 200 rounds (eight chunks of 41,943 games, so that 2
 * threads share the work evenly). {@code players}: {@code wsls-tft} is the pair of the NumPy comparison (1% execution error);
 * {@code memory1} the generic memory-one pair of {@link SimulatorBenchmark} (5% execution error).
 */
public class LockstepBenchmark extends BenchmarkSettings {
    private static final int GAMES = 335_544;
    private static final int ROUNDS = 200;

    @Param({"wsls-tft", "memory1", "wsls-tft-perception"})
    public String players;

    @Param({"simd", "auto"})
    public String kernel;

    @Param({"1", "2"})
    public int threads;

    private Simulator simulator;

    @Setup
    public void setUp() {
        StageGame g = StageGame.DEFAULT;
        Match m = players.startsWith("wsls-tft")
            ? new Match(g, Strategies.parse("wsls", g, Player.X), Strategies.parse("tft", g, Player.Y),
                Noise.symmetric(0.01, players.endsWith("perception") ? 0.01 : 0))
            : new Match(g, Strategies.parse("memory1:0.9,0.2,0.7,0.1", g, Player.X), Strategies.parse("wsls", g,
                Player.Y), Noise.symmetric(0.05, 0));
        boolean simd = kernel.equals("simd");
        simulator = new Simulator(SimulationSpec.of(m, Horizon.rounds(ROUNDS), GAMES, 1).withThreads(threads), 0,
            simd ? 0 : Double.POSITIVE_INFINITY);
        String expected = simd ? "lockstep-simd" : "lockstep";
        if (!simulator.kernel().equals(expected)) {
            throw new IllegalStateException("this benchmark must run " + expected + ", not " + simulator.kernel()
                + " (vector API: " + Simulator.vectorStatus() + ")");
        }
    }

    @Benchmark
    @OperationsPerInvocation(GAMES * ROUNDS)
    public long rounds() {
        return simulator.run().stateCounts()[0];
    }
}
