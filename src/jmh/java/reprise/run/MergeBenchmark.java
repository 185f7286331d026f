package reprise.run;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Comparator;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.TearDown;
import org.openjdk.jmh.annotations.Warmup;
import reprise.BenchmarkSettings;

/**
 * The merge of a sharded run against the number of shards: experiments/length-sweep.yaml (18 cases) with
 * its 4000 replicates and with 40000 (ten times the rounds), simulated as N shards through
 * {@link ShardRun#run} in the set-up (the same code path as array tasks, one after another on this
 * machine), then merged by {@link Merge#run} on {@code threads} threads: shard files read and checked,
 * tallies joined, every case analysed, all files and figures written. One operation = one merge.
 *
 * <pre>
 * java -jar target/benchmarks.jar MergeBenchmark
 * java -jar target/benchmarks.jar MergeBenchmark -p shards=64 -p replicates=4000 -p threads=1,2
 * </pre>
 */
@BenchmarkMode(Mode.SingleShotTime)
@Warmup(iterations = 2)
@Measurement(iterations = 5)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
public class MergeBenchmark extends BenchmarkSettings {

    /** N, the shards of the run. */
    @Param({"4", "16", "64", "256"})
    public int shards;

    /** Games per case: 4000 as in the file, or 40000 for ten times the rounds. */
    @Param({"4000", "40000"})
    public int replicates;

    /** Threads of the merge. */
    @Param({"2"})
    public int threads;

    private Path tmp;
    private Path shardsDir;
    private Job job;
    private RunSettings settings;

    /**
     * Writes the experiment and simulates its N shards.
     *
     * @throws IOException if the temporary folder cannot be written
     */
    @Setup(Level.Trial)
    public void simulateShards() throws IOException {
        tmp = Files.createTempDirectory("merge-bench");
        Path file = tmp.resolve("length-sweep.yaml");
        String text = Files.readString(Path.of("experiments/length-sweep.yaml"));
        Files.writeString(file, text.replace("replicates: 4000", "replicates: " + replicates));
        job = Job.load(file, 1);
        shardsDir = tmp.resolve("run");
        RunSettings shard = new RunSettings(shardsDir, 1, false, false, List.of("bench"), "bench");
        for (int i = 1; i <= shards; i++) {
            ShardRun.run(job, new Part(i, shards), shard, RunListener.SILENT);
        }
        settings = new RunSettings(tmp.resolve("merged"), threads, true, false, List.of("bench"), "bench");
    }

    /**
     * One merge, from reading the shard files to the last output file.
     *
     * @return the finished run (kept so the work is not eliminated)
     */
    @Benchmark
    public Finished merge() {
        return Merge.run(shardsDir, ShardSet.read(shardsDir, "bench"), job, settings);
    }

    /** Deletes the temporary folder. */
    @TearDown(Level.Trial)
    public void delete() {
        try (Stream<Path> s = Files.walk(tmp)) {
            s.sorted(Comparator.reverseOrder()).forEach(p -> p.toFile().delete());
        } catch (IOException ex) {
            throw new UncheckedIOException(ex);
        }
    }
}
