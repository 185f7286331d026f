package reprise.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;
import java.util.stream.Stream;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;
import reprise.experiment.Case;
import reprise.experiment.CaseResult;
import reprise.experiment.Claims;
import reprise.experiment.Experiment;
import reprise.experiment.ExperimentFile;
import reprise.experiment.InvalidExperimentException;
import reprise.experiment.Runner;
import reprise.experiment.WorkPlan;
import reprise.output.Checkpoint;
import reprise.sim.SimulationResult;
import reprise.sim.ProgressListener;
import reprise.sim.Simulator;

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

    /** The files a finished run writes into the output folder (besides figures/). */
    static final List<String> OUTPUTS = List.of("results.csv", "cases.csv", "curves.csv", "report.md", "run.json");

    @Override
    public Integer call() {
        if (shard != null || merge != null) {
            return Shards.fromCheck(this);
        }
        PrintWriter err = spec.commandLine().getErr();
        Instant start = Instant.now();
        Experiment e;
        Map<Integer, Map<String, Claims.Claim>> claims = Map.of();
        List<Case> cases;
        int nThreads = threads == null ? Runtime.getRuntime().availableProcessors() : threads;
        if (nThreads < 1 || nThreads > reprise.sim.SimulationSpec.MAX_THREADS) {
            throw new IllegalArgumentException("--threads must be between 1 and " + reprise.sim.SimulationSpec.MAX_THREADS
                + ": " + nThreads);
        }
        try {
            e = ExperimentFile.read(file);
            cases = e.cases();
            if (e.claims() != null) {
                claims = Claims.read(e.claims(), e, cases);
            }
            Runner.preflight(e, cases, nThreads);
        } catch (InvalidExperimentException ex) {
            ex.problems().forEach(line -> err.println("reprise check: " + line));
            return Main.BAD_INPUT;
        }
        Path dir = out != null ? out : e.output();
        String where = file + ": " + (out != null ? "--out" : "output");
        checkOutputFolder(where, dir, force, resume);
        Checkpoint checkpoint = Checkpoint.of(dir);
        List<WorkPlan.Unit> units = WorkPlan.units(e, cases);
        Map<String, SimulationResult> done = new java.util.HashMap<>();
        if (checkpoint.size() > 0 && !resume && !force) {
            throw new IllegalArgumentException(where + ": " + dir + " holds an interrupted run (" + checkpoint.size()
                + " finished units in " + Checkpoint.FOLDER + "); use --resume to continue it or --force to start over");
        }
        if (resume) {
            try {
                done.putAll(checkpoint.load(e, Main.version(), units));
            } catch (IllegalArgumentException ex) {
                throw new IllegalArgumentException(file + ": --resume: " + ex.getMessage(), ex);
            }
        }
        prepareOutputFolder(dir, force);
        if (resume) {
            if (!quiet) {
                err.printf(Locale.ROOT, "reprise check: resuming, %d of %d units already done%n", done.size(),
                    units.size());
            }
        } else {
            checkpoint.delete();
        }
        double expected = units.stream().mapToDouble(WorkPlan.Unit::expectedRounds).sum();
        RunProgress progress = new RunProgress(err, !quiet, cases.size(), expected);
        int[] saved = {done.size()};
        Thread hook = new Thread(() -> err.printf(Locale.ROOT, "%nreprise check: interrupted; %d of %d units are "
            + "saved in %s; run the same command with --resume to continue%n", saved[0], units.size(),
            checkpoint.folder()));
        Runtime.getRuntime().addShutdownHook(hook);
        List<CaseResult> results;
        try {
            results = RunOutputs.byCase(e, cases, units, (c, u) -> {
                SimulationResult r = done.get(u.fileName());
                if (r == null) {
                    r = Runner.runUnit(e, c, u, nThreads, progress);
                    checkpoint.save(e, Main.version(), u, r);
                    saved[0]++;
                }
                return r;
            }, progress);
        } finally {
            Runtime.getRuntime().removeShutdownHook(hook);
        }
        progress.finish();
        Runner.Outcome outcome = Runner.analyse(e, results, claims);
        int code = outcome.disagrees() ? Main.DISAGREES : Main.OK;
        RunOutputs.write(dir, file, spec.commandLine().getParseResult().originalArgs(), e, results, outcome, start, code,
            nThreads);
        checkpoint.delete();
        RunOutputs.summary(spec.commandLine().getOut(), e, cases.size(), outcome, dir);
        if (!quiet) {
            RunOutputs.warnings(err, results, outcome);
        }
        return code;
    }

    /**
     * Checks the output folder without creating or writing anything: it is a folder or can be created
     * (its nearest existing ancestor is a writable folder), it holds no finished run unless {@code force},
     * and no output name in it is taken by something of the wrong kind.
     */
    static void checkOutputFolder(String where, Path dir, boolean force, boolean resume) {
        Path target = dir.toAbsolutePath().normalize();
        Path existing = target;
        while (existing != null && !Files.exists(existing)) {
            existing = existing.getParent();
        }
        if (existing == null) {
            throw new IllegalArgumentException(where + ": " + dir + " cannot be created: no part of the path exists");
        }
        boolean exists = existing.equals(target);
        if (!Files.isDirectory(existing)) {
            throw new IllegalArgumentException(where + ": " + dir + (exists ? " is a file, not a folder"
                : " cannot be created: " + existing + " is a file, not a folder"));
        }
        if (!Files.isWritable(existing) || !Files.isExecutable(existing)) {
            throw new IllegalArgumentException(where + ": cannot write into " + (exists ? dir.toString()
                : existing + " (to create " + dir + ")") + ": not writable (permissions or a read-only file system)");
        }
        if (!exists) {
            return;
        }
        if (Files.exists(dir.resolve("run.json")) && !force) {
            throw new IllegalArgumentException(where + ": " + dir + " holds a finished run (run.json)"
                + (resume ? ", there is nothing to resume" : "") + "; use --force to replace it, or another --out");
        }
        for (String name : OUTPUTS) {
            if (Files.isDirectory(dir.resolve(name))) {
                throw new IllegalArgumentException(where + ": " + dir.resolve(name) + " is a folder; the run writes a "
                    + "file of that name");
            }
        }
        for (String name : List.of("figures", Checkpoint.FOLDER)) {
            if (Files.exists(dir.resolve(name)) && !Files.isDirectory(dir.resolve(name))) {
                throw new IllegalArgumentException(where + ": " + dir.resolve(name) + " is a file; the run needs a "
                    + "folder of that name");
            }
        }
    }

    /**
     * Creates the output folder once every check has passed. With {@code force} the previous run's
     * results are removed first, so the folder never mixes two runs; temporary files of a write that was
     * killed are removed too.
     */
    static void prepareOutputFolder(Path dir, boolean force) {
        try {
            Files.createDirectories(dir);
            try (Stream<Path> old = Files.list(dir)) {
                for (Path p : (Iterable<Path>) old::iterator) {
                    String name = p.getFileName().toString();
                    boolean stale = name.startsWith(".") && name.endsWith(".partial");
                    if (stale || force && OUTPUTS.contains(name)) {
                        Files.deleteIfExists(p);
                    }
                }
            }
            if (force && Files.isDirectory(dir.resolve("figures"))) {
                try (Stream<Path> old = Files.list(dir.resolve("figures"))) {
                    for (Path p : (Iterable<Path>) old::iterator) {
                        Files.deleteIfExists(p);
                    }
                }
            }
        } catch (IOException | UnsupportedOperationException ex) {
            throw new IllegalArgumentException("--out: cannot write into " + dir + ": " + ex.getMessage(), ex);
        }
    }

    /** Progress over the whole run: cases done, rounds per second, time left. */
    static final class RunProgress implements ProgressListener {
        private final ProgressLine line;
        private final int cases;
        private final double expectedTotal;
        private final long start = System.nanoTime();
        private final PrintWriter err;
        private final boolean enabled;
        private double doneBefore;
        private int index;
        private String id = "";
        private long lastDraw;

        RunProgress(PrintWriter err, boolean enabled, int cases, double expectedTotal) {
            this.err = err;
            this.enabled = enabled;
            this.line = new ProgressLine(err, false, "");
            this.cases = cases;
            this.expectedTotal = expectedTotal;
        }

        void startCase(Case c, int i) {
            index = i;
            id = c.id();
        }

        void endUnit(double expected) {
            doneBefore += expected;
        }

        @Override
        public synchronized void progress(long replicatesDone, long replicates, long roundsDone, long roundsExpected) {
            if (!enabled) {
                return;
            }
            long now = System.nanoTime();
            if (now - start < 2_000_000_000L || now - lastDraw < 500_000_000L) {
                return;
            }
            lastDraw = now;
            double done = doneBefore + roundsDone;
            double seconds = (now - start) / 1e9;
            double rate = done / seconds;
            double left = rate > 0 ? (expectedTotal - done) / rate : 0;
            err.print(String.format(Locale.ROOT, "\rcase %d/%d %s: %.3g rounds/s, about %s left        ", index + 1,
                cases, id, rate, ProgressLine.duration(left)));
            err.flush();
        }

        void finish() {
            if (enabled && lastDraw != 0) {
                err.println();
                err.flush();
            }
            line.finish();
        }
    }
}
