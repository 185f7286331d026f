package reprise.cli;

import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;
import reprise.experiment.Experiment;
import reprise.experiment.ExperimentFile;
import reprise.experiment.InvalidExperimentException;
import reprise.run.WorkPlan;
import reprise.output.AtomicFiles;

/**
 * {@code slurm-script}: writes a ready-to-submit batch script that runs an experiment as a Slurm job
 * array of N shards plus a merge job that waits for the whole array ({@code --dependency=afterok}).
 *
 * <p>Implementation note (the resource estimate). Let R_i be the expected rounds of shard i (the sum of
 * its units' expected rounds, {@link WorkPlan#shard}) and R = max_i R_i. With a simulation rate r
 * rounds per second per core (default {@value #DEFAULT_RATE}, conservative: one thread of the simulator
 * measured 8e6 to 3e7 rounds per second on memory-one pairs on a shared 2-core machine), a task gets
 * <ul>
 * <li>cpus = min({@value #MAX_CPUS}, max(1, ceil(R / (r * 3600)))), so a task's simulation is about an
 * hour at most before the cap;</li>
 * <li>time = max(5 min, {@value #SAFETY} * R / (r * cpus) + 60 s for the JVM start), rounded up to a
 * minute;</li>
 * <li>heap = 256 MB + 64 MB per cpu (tallies are a few kilobytes per unit; the heap holds per-thread
 * generators and buffers) and mem = heap + 256 MB for the JVM outside the heap, rounded up to 64 MB.</li>
 * </ul>
 * The merge job gets one cpu, heap 512 MB + 1 MB per 100 units (it holds every unit's tallies) and time
 * max(5 min, 60 s + {@value #SAFETY} * 2 s per case) for the exact side and the statistics of every case.
 */
@Command(name = "slurm-script", mixinStandardHelpOptions = true,
    description = {"Writes a batch script that runs FILE on a Slurm cluster: a job array of N tasks, task I "
        + "running check FILE --shard I/N --out DIR, and a merge job that starts when every task has succeeded "
        + "(--dependency=afterok) and writes the same results as an unsharded check into DIR.",
        "Submit with: bash SCRIPT (it calls sbatch for the array and the merge job). Re-run failed tasks only "
        + "with: bash SCRIPT --array=3,7 (options go to the array's sbatch; a new merge job follows them).",
        "Time, memory and CPUs per task are estimated from the work size; see the comment in the script."})
final class SlurmScriptCommand implements Callable<Integer> {

    /** Default simulation rate, rounds per second per core. */
    static final double DEFAULT_RATE = 5e6;
    /** Safety factor on the estimated time. */
    static final double SAFETY = 3;
    /** The most CPUs asked for one task. */
    static final int MAX_CPUS = 8;

    @Spec
    CommandSpec spec;

    @Parameters(index = "0", paramLabel = "FILE", description = "The experiment file (YAML).")
    Path file;

    @Option(names = "--tasks", required = true, paramLabel = "N", description = "Array tasks (shards), at least 1.")
    int tasks;

    @Option(names = "--out", paramLabel = "DIR", description = "Output folder of the run (default: the file's "
        + "output:, or results/NAME).")
    Path out;

    @Option(names = "--partition", paramLabel = "P", description = "Slurm partition (default: the cluster's).")
    String partition;

    @Option(names = "--jar", paramLabel = "PATH", description = "The reprise jar on the cluster (default: the jar "
        + "this command runs from).")
    Path jar;

    @Option(names = "--rate", paramLabel = "R", description = "Rounds per second per core for the time estimate "
        + "(default: ${DEFAULT-VALUE}).", defaultValue = "5e6")
    double rate;

    @Option(names = "--script", paramLabel = "OUTFILE", description = "Write the script to OUTFILE (default: stdout).")
    Path script;

    /** The estimate of one array task. */
    record Estimate(int cpus, long seconds, int heapMb, int memMb) {
    }

    @Override
    public Integer call() {
        PrintWriter err = spec.commandLine().getErr();
        if (tasks < 1 || tasks > WorkPlan.MOST_SHARDS) {
            throw new IllegalArgumentException("--tasks must be between 1 and " + WorkPlan.MOST_SHARDS
                + " (the most tasks a Slurm job array can have): " + tasks);
        }
        if (!(rate > 0) || Double.isInfinite(rate)) {
            throw new IllegalArgumentException("--rate must be a positive number of rounds per second: " + rate);
        }
        if (partition != null && !partition.matches("[A-Za-z0-9_.,-]+")) {
            throw new IllegalArgumentException("--partition must be a Slurm partition name: " + partition);
        }
        Experiment e;
        try {
            e = ExperimentFile.read(file);
        } catch (InvalidExperimentException ex) {
            ex.problems().forEach(line -> err.println("reprise slurm-script: " + line));
            return Main.BAD_INPUT;
        }
        Path jarPath = jar != null ? jar : runningJar();
        if (jarPath == null) {
            throw new IllegalArgumentException("--jar: this command does not run from a jar; give --jar PATH of the "
                + "reprise jar on the cluster");
        }
        List<WorkPlan.Unit> units = WorkPlan.units(e, e.cases());
        int[] owner = WorkPlan.owners(units, tasks);
        double[] load = new double[Math.min(units.size(), tasks)];
        for (int u = 0; u < units.size(); u++) {
            load[owner[u]] += units.get(u).expectedRounds();
        }
        double maxRounds = 0;
        double total = 0;
        for (double r : load) {
            maxRounds = Math.max(maxRounds, r);
            total += r;
        }
        Estimate task = estimate(maxRounds, rate);
        int mergeHeap = 512 + units.size() / 100;
        int mergeMem = roundUp(mergeHeap + 256, 64);
        long mergeSeconds = roundUp((long) Math.max(300, 60 + SAFETY * 2 * e.cases().size()), 60);
        Path dir = (out != null ? out : e.output()).toAbsolutePath().normalize();
        String text = render(e, units.size(), total, maxRounds, task, mergeHeap, mergeMem, mergeSeconds, dir,
            jarPath.toAbsolutePath().normalize());
        if (script == null) {
            spec.commandLine().getOut().print(text);
        } else {
            AtomicFiles.writeText(script, w -> w.write(text));
            script.toFile().setExecutable(true);
            spec.commandLine().getOut().printf(Locale.ROOT, "wrote %s: %d tasks of up to %.3g rounds, %d cpus, %s, "
                + "%d MB each; submit with: bash %s%n", script, tasks, maxRounds, task.cpus(), hms(task.seconds()),
                task.memMb(), script);
        }
        return Main.OK;
    }

    /**
     * The resources of a task (see the class's implementation note).
     *
     * @param rounds expected rounds of the largest shard
     * @param rate rounds per second per core
     * @return cpus, time limit in seconds, heap and memory in MB
     */
    static Estimate estimate(double rounds, double rate) {
        int cpus = (int) Math.min(MAX_CPUS, Math.max(1, Math.ceil(rounds / (rate * 3600))));
        long seconds = roundUp((long) Math.ceil(Math.max(300, SAFETY * rounds / (rate * cpus) + 60)), 60);
        int heap = 256 + 64 * cpus;
        return new Estimate(cpus, seconds, heap, roundUp(heap + 256, 64));
    }

    private static int roundUp(int v, int step) {
        return (v + step - 1) / step * step;
    }

    private static long roundUp(long v, long step) {
        return (v + step - 1) / step * step;
    }

    static String hms(long seconds) {
        return String.format(Locale.ROOT, "%d:%02d:%02d", seconds / 3600, seconds / 60 % 60, seconds % 60);
    }

    private static Path runningJar() {
        try {
            Path p = Path.of(Main.class.getProtectionDomain().getCodeSource().getLocation().toURI());
            return Files.isRegularFile(p) && p.toString().endsWith(".jar") ? p : null;
        } catch (java.net.URISyntaxException | SecurityException | NullPointerException ex) {
            return null;
        }
    }

    /** Quotes a word for bash. */
    static String q(Object word) {
        return "'" + word.toString().replace("'", "'\\''") + "'";
    }

    private String render(Experiment e, int units, double total, double maxRounds, Estimate t, int mergeHeap,
        int mergeMem, long mergeSeconds, Path dir, Path jarPath) {
        String name = e.name().replaceAll("[^A-Za-z0-9_.-]", "_");
        Path experiment = file.toAbsolutePath().normalize();
        Path logs = dir.resolve("slurm");
        List<String> l = new ArrayList<>();
        l.add("#!/bin/bash");
        l.add("# Sharded run of experiment " + e.name() + " on Slurm, written by reprise slurm-script " + Main.version()
            + ".");
        l.add("#   experiment file " + experiment + " (SHA-256 " + e.sha256() + ", seed " + e.seed() + ")");
        l.add(String.format(Locale.ROOT, "#   %d units, %.4g expected rounds in all; %d tasks, the largest %.4g rounds",
            units, total, tasks, maxRounds));
        l.add(String.format(Locale.ROOT, "#   estimate at %.3g rounds/s per core, safety factor %.0f: %d cpus, %s, "
            + "heap %d MB, mem %d MB per task", rate, SAFETY, t.cpus(), hms(t.seconds()), t.heapMb(), t.memMb()));
        l.add("#");
        l.add("# Submit the array and the merge job:       bash " + (script == null ? "THIS_SCRIPT" : script));
        l.add("# Re-run only failed tasks, then merge:     bash " + (script == null ? "THIS_SCRIPT" : script)
            + " --array=3,7");
        l.add("#   (options after the script name go to the array's sbatch; scancel the old merge job, which stays");
        l.add("#   pending with reason DependencyNeverSatisfied)");
        l.add("# Results: " + dir + " (shard files in " + dir.resolve("shards") + ", job logs in " + logs + ").");
        l.add("# REPRISE_COMMAND, if set when submitting, replaces 'java -Xmx... -jar JAR' (words split on spaces).");
        l.add("#SBATCH --job-name=reprise-" + name);
        l.add("#SBATCH --array=1-" + tasks);
        l.add("#SBATCH --ntasks=1");
        l.add("#SBATCH --cpus-per-task=" + t.cpus());
        l.add("#SBATCH --mem=" + t.memMb() + "M");
        l.add("#SBATCH --time=" + hms(t.seconds()));
        l.add("#SBATCH --output=" + logs.resolve("shard-%a-job-%A.out"));
        if (partition != null) {
            l.add("#SBATCH --partition=" + partition);
        }
        l.add("set -euo pipefail");
        l.add("reprise() {");
        l.add("  local heap=$1");
        l.add("  shift");
        l.add("  local cmd");
        l.add("  if [[ -n ${REPRISE_COMMAND:-} ]]; then");
        l.add("    read -r -a cmd <<<\"$REPRISE_COMMAND\"");
        l.add("  else");
        l.add("    cmd=(java \"-Xmx$heap\" -jar " + q(jarPath) + ")");
        l.add("  fi");
        l.add("  exec \"${cmd[@]}\" \"$@\"");
        l.add("}");
        l.add("if [[ ${1:-} == --merge-step ]]; then");
        l.add("  reprise " + mergeHeap + "m merge " + q(dir) + " --force");
        l.add("fi");
        l.add("if [[ -n ${SLURM_ARRAY_TASK_ID:-} ]]; then");
        l.add("  reprise " + t.heapMb() + "m check " + q(experiment) + " --shard \"$SLURM_ARRAY_TASK_ID/" + tasks
            + "\" --out " + q(dir) + " --threads " + t.cpus() + " --quiet");
        l.add("fi");
        l.add("self=$(realpath \"$0\")");
        l.add("mkdir -p " + q(logs));
        l.add("array=$(sbatch --parsable \"$@\" \"$self\" </dev/null)");
        l.add("array=${array%%;*}");
        l.add("merge=$(sbatch --parsable --dependency=afterok:\"$array\" --job-name=reprise-" + name + "-merge "
            + "--ntasks=1 --cpus-per-task=1 --mem=" + mergeMem + "M --time=" + hms(mergeSeconds)
            + (partition != null ? " --partition=" + partition : "") + " --output=" + q(logs.resolve("merge-job-%j.out"))
            + " --wrap=\"bash $(printf %q \"$self\") --merge-step\" </dev/null)");
        l.add("merge=${merge%%;*}");
        l.add("echo \"submitted array job $array and merge job $merge (after the array succeeds)\"");
        return String.join("\n", l) + "\n";
    }
}
