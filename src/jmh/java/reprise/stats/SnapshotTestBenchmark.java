package reprise.stats;

import java.util.concurrent.TimeUnit;
import org.apache.commons.rng.simple.RandomSource;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import reprise.BenchmarkSettings;

/**
 * The round-t snapshot test in its two slow forms, as a check of a demo-sized experiment meets them:
 * the Monte Carlo multinomial test (2000 games, a state of probability 0.0015, the 20,000 samples a
 * check uses) and the enumerated exact test (200 games, 1,373,701 outcomes). One operation = one test.
 */
@OutputTimeUnit(TimeUnit.SECONDS)
public class SnapshotTestBenchmark extends BenchmarkSettings {

    private static final double[] PROBABILITIES = {0.9, 0.0015, 0.0015, 0.097};
    private static final long[] LARGE = {1800, 2, 4, 194};
    private static final long[] SMALL = {180, 0, 1, 19};

    /** @return the p-value (kept so the work is not eliminated) */
    @Benchmark
    public double monteCarlo() {
        return SnapshotTest.withDefaults().withMonteCarlo(RandomSource.XO_RO_SHI_RO_128_PP.create(42L), 20_000)
            .test(LARGE, PROBABILITIES).pValue();
    }

    /** @return the p-value */
    @Benchmark
    public double enumerated() {
        return SnapshotTest.withDefaults().test(SMALL, PROBABILITIES).pValue();
    }
}
