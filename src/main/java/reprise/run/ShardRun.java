package reprise.run;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import reprise.experiment.Case;
import reprise.sim.SimulationResult;

/**
 * One shard of a sharded run: simulates shard I of N of the experiment's units, cut for N shards
 * ({@link WorkPlan#units(reprise.experiment.Experiment, List, int)}, {@link WorkPlan#shard}), and writes them
 * as one {@link UnitFile}, {@code DIR/shards/shard-I-of-N.json}, replacing an earlier file of the same shard.
 * {@link Merge} joins the shards.
 *
 * <p>Each finished unit is saved at once in the shard's own checkpoint, {@code DIR/shards/.checkpoint-I-of-N/};
 * a re-run of the shard (a task that was killed, ran out of time or memory) takes back the units saved
 * there by the same run and build and simulates only the rest. A checkpoint of another run or build is
 * discarded (the shard starts over), since a shard replaces its own file either way. The checkpoint is
 * deleted once the shard file is written.
 */
public final class ShardRun {

    private ShardRun() {
    }

    /**
     * What a shard run wrote.
     *
     * @param file the shard file
     * @param units the shard's units
     * @param unitsTotal the experiment's units
     * @param rounds rounds simulated by this process
     * @param seconds simulation wall time of this process
     * @param resumed units taken back from the shard's checkpoint
     */
    public record Written(Path file, int units, int unitsTotal, long rounds, double seconds, int resumed) {
    }

    /**
     * The checkpoint folder of a shard.
     *
     * @param dir the output folder
     * @param part the shard
     * @return {@code dir/shards/.checkpoint-I-of-N}
     */
    public static Path checkpointFolder(Path dir, Part part) {
        return dir.resolve(OutputFolder.SHARDS).resolve(".checkpoint-" + part.shard() + "-of-" + part.shards());
    }

    /**
     * Runs one shard.
     *
     * @param job the job
     * @param part which shard
     * @param settings where and how ({@code force} and {@code resume} do not apply: a shard replaces its own file
     *     and always resumes its own checkpoint)
     * @param listener progress
     * @return what was written
     * @throws IllegalArgumentException if the output folder is a file
     */
    public static Written run(Job job, Part part, RunSettings settings, RunListener listener) {
        Path dir = settings.folder(job);
        if (Files.exists(dir) && !Files.isDirectory(dir)) {
            throw new IllegalArgumentException("--out: " + dir + " is a file, not a folder");
        }
        List<WorkPlan.Unit> units = job.units(part.shards());
        List<WorkPlan.Unit> mine = WorkPlan.shard(units, part.shard(), part.shards());
        Map<Integer, Case> byIndex = new HashMap<>();
        job.cases().forEach(c -> byIndex.put(c.index(), c));
        RunIdentity identity = job.identity(settings.toolVersion());
        Checkpoint checkpoint = Checkpoint.in(checkpointFolder(dir, part), part);
        Map<WorkPlan.Unit, SimulationResult> done = new HashMap<>();
        try {
            done.putAll(checkpoint.load(identity, mine));
        } catch (IllegalArgumentException stale) {
            checkpoint.delete();
        }
        listener.started(done.size(), mine.size(), !done.isEmpty(), checkpoint.folder());
        long t0 = System.nanoTime();
        List<UnitFile.UnitTally> tallies = new ArrayList<>();
        long rounds = 0;
        int savedHere = 0;
        for (WorkPlan.Unit u : mine) {
            Case c = byIndex.get(u.caseIndex());
            listener.startCase(c, u.caseIndex());
            SimulationResult r = done.get(u);
            if (r == null) {
                r = LocalRun.simulate(job, c, u, settings.threads(), listener);
                rounds += r.roundsTotal();
                checkpoint.save(identity, units.size(), settings.threads(), u, r);
                savedHere++;
                listener.unitSaved(done.size() + savedHere, mine.size());
                TestHold.afterUnitSaved(savedHere);
            }
            listener.endUnit(u.expectedRounds());
            tallies.add(UnitFile.UnitTally.of(u, r));
        }
        double seconds = (System.nanoTime() - t0) / 1e9;
        Path target = dir.resolve(OutputFolder.SHARDS).resolve(part.fileName());
        UnitFile.Header header = new UnitFile.Header(identity, part, units.size(), settings.threads(), seconds);
        UnitFile.write(target, new UnitFile.Content(header, tallies));
        checkpoint.delete();
        return new Written(target, mine.size(), units.size(), rounds, seconds, done.size());
    }

    /**
     * The expected rounds of a shard's units.
     *
     * @param job the job
     * @param part which shard
     * @return the sum of the expected rounds of its units
     */
    public static double expectedRounds(Job job, Part part) {
        return WorkPlan.shard(job.units(part.shards()), part.shard(), part.shards()).stream()
            .mapToDouble(WorkPlan.Unit::expectedRounds).sum();
    }
}
