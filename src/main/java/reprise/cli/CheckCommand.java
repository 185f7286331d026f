package reprise.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;
import reprise.experiment.InvalidExperimentException;
import reprise.run.Finished;
import reprise.run.Job;
import reprise.run.LocalRun;
import reprise.run.RunSettings;
import reprise.run.WorkPlan;

/** {@code check}: the main job. Runs an experiment file and writes results, figures and a report. */
@Command(name = "check", mixinStandardHelpOptions = true,
    description = {"Runs an experiment: for every case of its grid, computes the exact predictions, simulates "
        + "the games, compares the two (and any claimed values) with tests that are valid for autocorrelated "
        + "play, corrects for multiple testing, and writes results.csv, cases.csv, curves.csv, report.md, "
        + "run.json and figures/ into the output folder.",
        "Exit 0 when every comparison agrees or is consistent, 1 when any disagrees, 2 for bad input."})
final class CheckCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Parameters(index = "0", paramLabel = "FILE", description = "The experiment file (YAML).")
    Path file;

    @Option(names = "--out", paramLabel = "DIR", description = "Output folder (default: the file's output:, or "
        + "results/NAME).")
    Path out;

    @Option(names = "--threads", paramLabel = "N", description = "Worker threads. Default: all cores.")
    Integer threads;

    @Option(names = "--force", description = "Replace the results of an earlier run in the output folder (they are "
        + "removed when the new run starts).")
    boolean force;

    @Option(names = "--quiet", description = "No progress on stderr.")
    boolean quiet;

    @Option(names = "--resume", description = "Continue an interrupted run in the output folder: finished units are "
        + "kept, the rest is simulated; the results are identical to an uninterrupted run.")
    boolean resume;

    @Option(names = "--shard", arity = "0..1", fallbackValue = Shards.FROM_SLURM, paramLabel = "I/N",
        description = "Run only shard I of N (I from 1) and write its tallies to DIR/shards/shard-I-of-N.json, "
            + "for a later merge. Without I/N (or with 'slurm'): I = SLURM_ARRAY_TASK_ID and N = "
            + "SLURM_ARRAY_TASK_COUNT of an array submitted as --array=1-N.")
    String shard;

    @Option(names = "--merge", paramLabel = "DIR", description = "Merge the shard files in DIR/shards into the "
        + "results of an unsharded run of FILE, written into DIR (or --out).")
    Path merge;

    @picocli.CommandLine.Mixin
    FigureOptions figureOptions = new FigureOptions();

    @Override
    public Integer call() {
        if (reprise.experiment.PopulationFile.declares(file)) {
            return PopulationCheck.run(this);
        }
        if (shard != null || merge != null) {
            return Shards.fromCheck(this);
        }
        PrintWriter err = spec.commandLine().getErr();
        RunSettings settings = settings();
        Job job = load(file, settings.threads(), err, "check");
        if (job == null) {
            return Main.BAD_INPUT;
        }
        double expected = job.units().stream().mapToDouble(WorkPlan.Unit::expectedRounds).sum();
        RunProgress progress = new RunProgress(err, !quiet, job.cases().size(), expected);
        Finished finished;
        try {
            finished = LocalRun.run(job, settings, progress);
        } finally {
            progress.finish();
        }
        RunSummary.print(spec.commandLine().getOut(), job.experiment(), finished);
        if (!quiet) {
            RunSummary.warnings(err, finished);
        }
        return finished.exitCode();
    }

    /** The run settings from the options; threads default to all cores. */
    RunSettings settings() {
        int nThreads = threads == null ? Runtime.getRuntime().availableProcessors() : threads;
        return new RunSettings(out, nThreads, force, resume, spec.commandLine().getParseResult().originalArgs(),
            Main.version(), figureOptions.figures(), figureOptions.axis());
    }

    /**
     * Reads an experiment for running, printing its problems.
     *
     * @param file the experiment file
     * @param threads worker threads, for the memory estimate
     * @param err where problems go, one line each
     * @param command the command name for messages
     * @return the job, or null after printing the problems
     */
    static Job load(Path file, int threads, PrintWriter err, String command) {
        try {
            return Job.load(file, threads);
        } catch (InvalidExperimentException ex) {
            ex.problems().forEach(line -> err.println("reprise " + command + ": " + line));
            return null;
        }
    }
}
