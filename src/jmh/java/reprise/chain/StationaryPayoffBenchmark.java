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
 * Stationary payoffs of memory-one pairs on a dense grid with the allocation-free 4 x 4 path: every pair of
 * the 256 strategies with entries in {0, 1/3, 2/3, 1}, execution error 0.01 and perception error 0.005 for
 * both players. One operation = one pair; two threads.
 */
@Threads(2)
@OutputTimeUnit(TimeUnit.SECONDS)
public class StationaryPayoffBenchmark extends BenchmarkSettings {

    private static final int SIDE = 4;
    private static final int STRATEGIES = SIDE * SIDE * SIDE * SIDE;

    private final double[][] grid = buildGrid();
    private final double[] payoffX = {3, 0, 5, 1};
    private final double[] payoffY = {3, 5, 0, 1};

    /** Per-thread scratch space. */
    @State(Scope.Thread)
    public static class Worker {
        final MemoryOneStationary solver = new MemoryOneStationary();
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
     * All pairs of the grid.
     *
     * @param worker the thread's solver
     * @return the sum of both players' payoffs (kept so the work is not eliminated)
     */
    @Benchmark
    @OperationsPerInvocation(STRATEGIES * STRATEGIES)
    public double allPairs(Worker worker) {
        MemoryOneStationary s = worker.solver;
        double total = 0;
        for (double[] p : grid) {
            for (double[] q : grid) {
                s.solve(p, q, 0.01, 0.01, 0.005, 0.005);
                total += s.payoff(payoffX) + s.payoff(payoffY);
            }
        }
        return total;
    }
}
