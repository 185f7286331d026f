package reprise.run;

import java.nio.file.Path;
import java.time.Instant;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import reprise.experiment.Case;
import reprise.experiment.CaseResult;
import reprise.experiment.Runner;
import reprise.sim.SimulationResult;
import reprise.sim.Simulator;

/**
 * An unsharded run on this machine: checks and locks the output folder (held until the last file is
 * written, see {@link OutputFolder}), resumes or clears its checkpoint,
 * simulates every unit not yet done (saving each in the checkpoint as soon as it is finished), joins the
 * units case by case, analyses and writes the output files, then deletes the checkpoint.
 */
public final class LocalRun {

    private LocalRun() {
    }

    /**
     * Runs a job.
     *
     * @param job the job
     * @param settings where and how
     * @param listener told of progress, the start and every saved unit
     * @return the finished run
     * @throws IllegalArgumentException one line, if the folder or its checkpoint does not allow the run
     */
    public static Finished run(Job job, RunSettings settings, RunListener listener) {
        Instant start = Instant.now();
        Path dir = settings.folder(job);
        String where = job.file() + ": " + (settings.out() != null ? "--out" : "output");
        Checkpoint checkpoint = Checkpoint.of(dir);
        List<WorkPlan.Unit> units = job.units();
        RunIdentity identity = job.identity(settings.toolVersion());
        Map<WorkPlan.Unit, SimulationResult> done = new HashMap<>();
        OutputFolder.Lock lock = OutputFolder.open(where, dir, settings.force(), settings.resume(),
            () -> loadCheckpoint(job, settings, where, dir, checkpoint, identity, units, done));
        try {
            if (!settings.resume()) {
                checkpoint.delete();
            }
            listener.started(done.size(), units.size(), settings.resume(), checkpoint.folder());
            int[] saved = {done.size()};
            List<CaseResult> results = Outputs.byCase(job, units, (c, u) -> {
                SimulationResult r = done.get(u);
                if (r == null) {
                    r = simulate(job, c, u, settings.threads(), listener);
                    checkpoint.save(identity, units.size(), settings.threads(), u, r);
                    saved[0]++;
                    listener.unitSaved(saved[0], units.size());
                    TestHold.afterUnitSaved(saved[0] - done.size());
                }
                return r;
            }, listener);
            Finished finished = new Finished(results, Runner.analyse(job.experiment(), results, job.claims()), dir);
            Outputs.write(dir, job, settings, finished, start, settings.threads());
            checkpoint.delete();
            return finished;
        } finally {
            lock.close();
        }
    }

    /** Under the folder's lock: refuses a checkpoint without --resume or --force, and loads it with --resume. */
    private static void loadCheckpoint(Job job, RunSettings settings, String where, Path dir, Checkpoint checkpoint,
        RunIdentity identity, List<WorkPlan.Unit> units, Map<WorkPlan.Unit, SimulationResult> done) {
        if (checkpoint.size() > 0 && !settings.resume() && !settings.force()) {
            throw new IllegalArgumentException(where + ": " + dir + " holds an interrupted run (" + checkpoint.size()
                + " finished units in " + Checkpoint.FOLDER + "); use --resume to continue it or --force to start over");
        }
        if (settings.resume()) {
            try {
                done.putAll(checkpoint.load(identity, units));
            } catch (IllegalArgumentException ex) {
                throw new IllegalArgumentException(job.file() + ": --resume: " + ex.getMessage(), ex);
            }
        }
    }

    /**
     * Simulates one unit: the games [from, to) of its case, on this machine.
     *
     * @param job the job
     * @param c the unit's case
     * @param u the unit
     * @param threads worker threads
     * @param listener progress
     * @return the unit's tallies
     */
    static SimulationResult simulate(Job job, Case c, WorkPlan.Unit u, int threads, RunListener listener) {
        return new Simulator(Runner.spec(job.experiment(), c, threads)).simulateRange(u.from(), u.to(), listener);
    }
}
