package reprise.sim;

import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.Setup;
import reprise.BenchmarkSettings;

/** The raw rate of the generator, the practical limit of a one-draw-per-round engine: nextLong per second. */
public class GeneratorBenchmark extends BenchmarkSettings {
    private UniformRandomProvider replicateStream;
    private UniformRandomProvider commons;

    @Setup
    public void setUp() {
        replicateStream = Simulator.replicateGenerator(1, 0);
        commons = RandomSource.XO_RO_SHI_RO_128_PP.create(1L);
    }

    @Benchmark
    public long replicateStreamNextLong() {
        return replicateStream.nextLong();
    }

    @Benchmark
    public long commonsNextLong() {
        return commons.nextLong();
    }
}
