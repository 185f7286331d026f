package reprise.chain;

import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.OperationsPerInvocation;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Threads;
import reprise.BenchmarkSettings;

/**
 * The sweep engine, {@link MemoryOnePair}: exact values of memory-one matches for the three kinds of game
 * length. X runs over the 1,296 strategies with entries in {0, 0.2, ..., 1}, each against one fixed
 * co-player (win-stay lose-shift, first move C), execution error 0.01 and perception error 0.005 for both.
 * One operation = one match; run with {@code -t 1} or {@code -t 2}.
 */
@Threads(2)
@OutputTimeUnit(TimeUnit.SECONDS)
public class MemoryOnePairBenchmark extends BenchmarkSettings {

    private static final int SIDE = 6;
    private static final int STRATEGIES = SIDE * SIDE * SIDE * SIDE;

    private final double[][] grid = buildGrid();
    private final double[] wsls = {1, 0, 0, 1};
    private final double[] payoffX = {3, 0, 5, 1};

    /** Per-thread engine. */
    @State(Scope.Thread)
    public static class Worker {
        final MemoryOnePair pair = new MemoryOnePair();
    }

    private static double[][] buildGrid() {
        double[][] g = new double[STRATEGIES][4];
        for (int i = 0; i < STRATEGIES; i++) {
            int r = i;
            for (int s = 0; s < 4; s++) {
                g[i][s] = (r % SIDE) / (double) (SIDE - 1);
                r /= SIDE;
            }
        }
        return g;
    }

    /**
     * Long-run (stationary) payoffs.
     *
     * @param w the thread's engine
     * @return a sum kept so the work is not eliminated
     */
    @Benchmark
    @OperationsPerInvocation(STRATEGIES)
    public double longRun(Worker w) {
        double total = 0;
        for (double[] p : grid) {
            w.pair.longRun(p, 1, wsls, 1, 0.01, 0.01, 0.005, 0.005);
            total += w.pair.payoff(payoffX);
        }
        return total;
    }

    /**
     * Expected payoffs of a 1000-round game.
     *
     * @param w the thread's engine
     * @return a sum kept so the work is not eliminated
     */
    @Benchmark
    @OperationsPerInvocation(STRATEGIES)
    public double rounds1000(Worker w) {
        double total = 0;
        for (double[] p : grid) {
            w.pair.rounds(1000, p, 1, wsls, 1, 0.01, 0.01, 0.005, 0.005);
            total += w.pair.payoff(payoffX);
        }
        return total;
    }

    /**
     * Normalised discounted payoffs, continuation probability 0.99.
     *
     * @param w the thread's engine
     * @return a sum kept so the work is not eliminated
     */
    @Benchmark
    @OperationsPerInvocation(STRATEGIES)
    public double continuation099(Worker w) {
        double total = 0;
        for (double[] p : grid) {
            w.pair.continuation(0.99, p, 1, wsls, 1, 0.01, 0.01, 0.005, 0.005);
            total += w.pair.payoff(payoffX);
        }
        return total;
    }
}
