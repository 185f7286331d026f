package reprise.sim;

import org.openjdk.jmh.annotations.Benchmark;
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
 * Rounds per second with random lengths (continuation probability 0.995, mean 200 rounds): one
 * invocation plays 335,544 games of wsls against tft with 1% execution error; the score is games per
 * second, times 200 for the expected rounds per second. {@code kernel}: {@code simd} plays the games in
 * lockstep lanes that take the next game as one ends, {@code per-game} one game at a time.
 */
public class RandomLengthBenchmark extends BenchmarkSettings {
    private static final int GAMES = 335_544;

    @Param({"simd", "per-game"})
    public String kernel;

    @Param({"1", "2"})
    public int threads;

    private Simulator simulator;

    @Setup
    public void setUp() {
        StageGame g = StageGame.DEFAULT;
        Match m = new Match(g, Strategies.parse("wsls", g, Player.X), Strategies.parse("tft", g, Player.Y),
            Noise.symmetric(0.01, 0));
        boolean simd = kernel.equals("simd");
        simulator = new Simulator(SimulationSpec.of(m, Horizon.continuation(0.995), GAMES, 1).withThreads(threads),
            0, simd ? 0 : Double.POSITIVE_INFINITY);
        String expected = simd ? "lockstep-simd" : "per-game";
        if (!simulator.kernel().equals(expected)) {
            throw new IllegalStateException("this benchmark must run " + expected + ", not " + simulator.kernel()
                + " (vector API: " + Simulator.vectorStatus() + ")");
        }
    }

    /** @return a tally, so that the work is not optimised away; the score counts invocations */
    @Benchmark
    public long games() {
        return simulator.run().roundsTotal();
    }
}
