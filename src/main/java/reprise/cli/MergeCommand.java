package reprise.cli;

import java.nio.file.Path;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;
import reprise.sim.SimulationSpec;

/** {@code merge}: joins the shards of a sharded {@code check} into the results of an unsharded run. */
@Command(name = "merge", mixinStandardHelpOptions = true,
    description = {"Merges the shard files in DIR/shards (written by check FILE --shard I/N --out DIR) into "
        + "exactly the results an unsharded check of FILE with the same seed writes: results.csv, cases.csv, "
        + "curves.csv, report.md, run.json and figures/.",
        "Every shard 1..N must be present, from the same experiment file (SHA-256), seed, tool version, build (jar "
        + "SHA-256 and commit) and N; "
        + "the experiment file is read again from the path recorded in the shards, and its hash checked. "
        + "Otherwise one line names what is missing or mismatched, nothing is written, and the exit code is 2.",
        "Exit 0 when every comparison agrees or is consistent, 1 when any disagrees, 2 for bad input."})
final class MergeCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Parameters(index = "0", paramLabel = "DIR", description = "The output folder of the shards (holds shards/).")
    Path dir;

    @Option(names = "--experiment", paramLabel = "FILE", description = "Read the experiment from FILE instead of "
        + "the path recorded in the shards (for example after moving the folder); its hash must match.")
    Path file;

    @Option(names = "--out", paramLabel = "OUT", description = "Write the results into OUT instead of DIR.")
    Path out;

    @Option(names = "--force", description = "Replace the results of an earlier run in the output folder.")
    boolean force;

    @Option(names = "--threads", paramLabel = "N", description = "Threads of the merge: cases are joined and analysed, "
        + "and figures drawn, in parallel (the results do not depend on it). Default: all cores.")
    Integer threads;

    @Override
    public Integer call() {
        int n = threads == null ? Math.min(Runtime.getRuntime().availableProcessors(), SimulationSpec.MAX_THREADS)
            : threads;
        return Shards.merge(dir, file, out, force, n, spec.commandLine().getParseResult().originalArgs(),
            spec.commandLine().getOut(), spec.commandLine().getErr(), "merge");
    }
}
