package reprise.evolution;

import java.util.List;
import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Setup;
import reprise.BenchmarkSettings;
import reprise.game.Horizon;
import reprise.game.MemoryStrategy;
import reprise.game.Noise;
import reprise.game.Population;
import reprise.game.StageGame;

/**
 * Time for one exact fixation probability with basis (c), the law of realised payoffs: N = 100, games of
 * 100 rounds of the prisoner's dilemma 3,0,5,1, a generic memory-one mutant among win-stay lose-shift
 * residents with 5% execution and 1% perception error. {@code pairwise}: pairwise comparison (the
 * Fourier evaluation over every co-player); {@code moran}: Moran with exponential fitness (tilted chains).
 */
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
public class FixationBenchmark extends BenchmarkSettings {
    @Param({"pairwise", "moran"})
    public String rule;

    private PayoffBasis.Realised basis;
    private Population population;

    @Setup
    public void setUp() {
        basis = new PayoffBasis.Realised(StageGame.DEFAULT, List.of(
            MemoryStrategy.memoryOne("m1", new double[] {0.9, 0.2, 0.7, 0.1}, 0.5),
            MemoryStrategy.memoryOne("wsls", new double[] {1, 0, 0, 1}, 1)), Noise.symmetric(0.05, 0.01),
            Horizon.rounds(100));
        population = rule.equals("pairwise") ? Population.pairwise(100, 1)
            : Population.moran(100, 0.5, Population.Fitness.EXPONENTIAL);
    }

    @Benchmark
    public double fixation() {
        return Fixation.probability(basis, population, 0, 1).probability();
    }
}
