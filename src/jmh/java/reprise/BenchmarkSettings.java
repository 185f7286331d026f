package reprise;

import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;

/**
 * Shared JMH settings for all benchmarks. The forked VMs get the export that lets the simulator load the
 * vector API (as the jar's manifest does for {@code java -jar}).
 */
@BenchmarkMode(Mode.Throughput)
@Warmup(iterations = 3, time = 2, timeUnit = TimeUnit.SECONDS)
@Measurement(iterations = 5, time = 2, timeUnit = TimeUnit.SECONDS)
@Fork(value = 1, jvmArgsAppend = "--add-exports=java.base/jdk.internal.module=ALL-UNNAMED")
@State(Scope.Benchmark)
public abstract class BenchmarkSettings {
}
