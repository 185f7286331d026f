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
 * One shard of a sharded run: simulates shard I of N of the experiment's units ({@link WorkPlan#shard})
 * and writes them as one {@link UnitFile}, {@code DIR/shards/shard-I-of-N.json}, replacing an earlier
 * file of the same shard. {@link Merge} joins the shards.
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
     * @param rounds rounds simulated
     * @param seconds simulation wall time
     */
    public record Written(Path file, int units, int unitsTotal, long rounds, double seconds) {
    }

    /**
     * Runs one shard.
     *
     * @param job the job
     * @param part which shard
     * @param settings where and how ({@code force} and {@code resume} do not apply: a shard replaces its own file)
     * @param listener progress
     * @return what was written
     * @throws IllegalArgumentException if the output folder is a file
     */
    public static Written run(Job job, Part part, RunSettings settings, RunListener listener) {
        Path dir = settings.folder(job);
        if (Files.exists(dir) && !Files.isDirectory(dir)) {
            throw new IllegalArgumentException("--out: " + dir + " is a file, not a folder");
        }
        List<WorkPlan.Unit> units = job.units();
        List<WorkPlan.Unit> mine = WorkPlan.shard(units, part.shard(), part.shards());
        Map<Integer, Case> byIndex = new HashMap<>();
        job.cases().forEach(c -> byIndex.put(c.index(), c));
        long t0 = System.nanoTime();
        List<UnitFile.UnitTally> tallies = new ArrayList<>();
        long rounds = 0;
        for (WorkPlan.Unit u : mine) {
            Case c = byIndex.get(u.caseIndex());
            listener.startCase(c, u.caseIndex());
            SimulationResult r = LocalRun.simulate(job, c, u, settings.threads(), listener);
            listener.endUnit(u.expectedRounds());
            tallies.add(UnitFile.UnitTally.of(u, r));
            rounds += r.roundsTotal();
        }
        double seconds = (System.nanoTime() - t0) / 1e9;
        Path target = dir.resolve(OutputFolder.SHARDS).resolve(part.fileName());
        UnitFile.Header header = new UnitFile.Header(job.identity(settings.toolVersion()), part, units.size(),
            settings.threads(), seconds);
        UnitFile.write(target, new UnitFile.Content(header, tallies));
        return new Written(target, mine.size(), units.size(), rounds, seconds);
    }

    /**
     * The expected rounds of a shard's units.
     *
     * @param job the job
     * @param part which shard
     * @return the sum of the expected rounds of its units
     */
    public static double expectedRounds(Job job, Part part) {
        return WorkPlan.shard(job.units(), part.shard(), part.shards()).stream()
            .mapToDouble(WorkPlan.Unit::expectedRounds).sum();
    }
}
