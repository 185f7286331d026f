package reprise.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import reprise.run.WorkPlan;
import reprise.run.Finished;
import reprise.run.Job;
import reprise.run.Merge;
import reprise.run.Part;
import reprise.run.RunSettings;
import reprise.run.ShardRun;
import reprise.run.ShardSet;

/**
 * The command-line side of sharded runs: {@code check FILE --shard I/N} (the shard's number from the option
 * or from Slurm, then {@link ShardRun}) and {@code merge DIR} or {@code check FILE --merge DIR}
 * ({@link ShardSet} and {@link Merge}); the run layer does the work, this class parses and prints.
 *
 * <p>Shard numbers from Slurm: without an explicit I/N, shard I is the array task id and N the array's
 * task count, for an array submitted as {@code --array=1-N}. Any other array (ids from 0, a subset such
 * as {@code --array=3,7} when re-running failed tasks, a step) is refused, because I/N could not be
 * inferred without guessing; the job scripts of {@code slurm-script} therefore pass
 * {@code --shard $SLURM_ARRAY_TASK_ID/N} explicitly.
 */
final class Shards {

    /** The {@code --shard} value (also the value of a bare {@code --shard}) that takes I/N from Slurm. */
    static final String FROM_SLURM = "slurm";

    private Shards() {
    }

    /**
     * Shard I and N from a {@code --shard} value.
     *
     * @param value "I/N", or {@value #FROM_SLURM}
     * @param env the environment (for the Slurm variables)
     * @return {I, N}
     * @throws IllegalArgumentException with a one-line reason
     */
    static int[] parse(String value, Map<String, String> env) {
        if (FROM_SLURM.equals(value)) {
            String id = env.get("SLURM_ARRAY_TASK_ID");
            if (id == null) {
                throw new IllegalArgumentException("--shard without I/N takes them from a Slurm array task, but "
                    + "SLURM_ARRAY_TASK_ID is not set; give --shard I/N");
            }
            String count = env.get("SLURM_ARRAY_TASK_COUNT");
            String min = env.get("SLURM_ARRAY_TASK_MIN");
            String max = env.get("SLURM_ARRAY_TASK_MAX");
            if (!"1".equals(min) || count == null || !count.equals(max)) {
                throw new IllegalArgumentException("--shard from Slurm needs an array submitted as --array=1-N, but "
                    + "this one has task ids " + min + " to " + max + " (" + count + " tasks); give --shard "
                    + "$SLURM_ARRAY_TASK_ID/N explicitly");
            }
            return parse(id + "/" + count, Map.of());
        }
        String[] parts = value.split("/", -1);
        try {
            if (parts.length == 2) {
                int i = Integer.parseInt(parts[0].trim());
                int n = Integer.parseInt(parts[1].trim());
                if (n >= 1 && i >= 1 && i <= n && n <= WorkPlan.MOST_SHARDS) {
                    return new int[] {i, n};
                }
            }
        } catch (NumberFormatException ignored) {
            // reported below with the value
        }
        throw new IllegalArgumentException("--shard must be I/N with 1 <= I <= N <= " + WorkPlan.MOST_SHARDS
            + " (or 'slurm'): " + value);
    }

    /** {@code check} with {@code --shard} or {@code --merge}. */
    static int fromCheck(CheckCommand cmd) {
        if (cmd.shard != null && cmd.merge != null) {
            throw new IllegalArgumentException("--shard and --merge cannot be combined: run the shards first, then "
                + "merge them");
        }
        if (cmd.resume) {
            throw new IllegalArgumentException("--resume cannot be combined with " + (cmd.shard != null ? "--shard"
                : "--merge") + ": a shard re-run takes back its own checkpoint by itself");
        }
        List<String> args = cmd.spec.commandLine().getParseResult().originalArgs();
        if (cmd.merge != null) {
            return merge(cmd.merge, cmd.file, cmd.out, cmd.force, cmd.settings().threads(), args,
                cmd.spec.commandLine().getOut(),
                cmd.spec.commandLine().getErr(), "check");
        }
        int[] in = parse(cmd.shard, System.getenv());
        return runShard(cmd, new Part(in[0], in[1]));
    }

    private static int runShard(CheckCommand cmd, Part part) {
        PrintWriter err = cmd.spec.commandLine().getErr();
        RunSettings settings = cmd.settings();
        Job job = CheckCommand.load(cmd.file, 1, err, "check");
        if (job == null) {
            return Main.BAD_INPUT;
        }
        RunProgress progress = new RunProgress(err, !cmd.quiet, job.cases().size(), ShardRun.expectedRounds(job, part))
            .forShard();
        ShardRun.Written w;
        try {
            w = ShardRun.run(job, part, settings, progress);
        } finally {
            progress.finish();
        }
        cmd.spec.commandLine().getOut().printf(Locale.ROOT, "%s: shard %d of %d, %d of %d units%s, %d rounds in %.1f s; "
            + "wrote %s%n", job.experiment().name(), part.shard(), part.shards(), w.units(), w.unitsTotal(),
            w.resumed() > 0 ? " (" + w.resumed() + " taken back from the shard's checkpoint)" : "", w.rounds(),
            w.seconds(), w.file());
        return Main.OK;
    }

    /**
     * Merges the shards in {@code dir/shards} and writes the outputs of an unsharded run.
     *
     * @param dir the folder holding shards/
     * @param file the experiment file, or null for the path recorded in the shards
     * @param out the output folder, or null for {@code dir}
     * @param force whether to replace a finished run in the output folder
     * @param threads threads of the merge (cases joined and analysed, figures drawn, in parallel)
     * @param args the command line, for run.json
     * @param stdout data
     * @param err messages
     * @param command the command name for messages
     * @return the exit code
     */
    static int merge(Path dir, Path file, Path out, boolean force, int threads, List<String> args, PrintWriter stdout,
        PrintWriter err, String command) {
        ShardSet shards = ShardSet.read(dir, Main.version());
        Job job = CheckCommand.load(file != null ? file : shards.identity().experimentFile(), 1, err, command);
        if (job == null) {
            return Main.BAD_INPUT;
        }
        Finished finished = Merge.run(dir, shards, job, new RunSettings(out, threads, force, false, args,
            Main.version()));
        RunSummary.print(stdout, job.experiment(), finished);
        return finished.exitCode();
    }
}
