package reprise.run;

import java.nio.file.Path;
import java.time.Instant;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import reprise.experiment.CaseResult;
import reprise.experiment.Experiment;
import reprise.experiment.Runner;
import reprise.sim.SimulationResult;

/**
 * Merges the shards of a sharded run into exactly the files of an unsharded run. Given a checked shard
 * set ({@link ShardSet}) and the experiment read again (from the path recorded in the shards unless
 * another is given), it checks that the experiment file, its seed and its claims are what the shards ran,
 * checks the shards against the plan, adds the tallies unit by unit and writes the outputs. Nothing is
 * written unless every check passes.
 */
public final class Merge {

    private Merge() {
    }

    /**
     * Merges the shards in {@code dir/shards}.
     *
     * @param dir the folder holding shards/
     * @param shards its shard set, read by {@link ShardSet#read}
     * @param job the experiment, read from the file the shards record ({@link ShardSet#identity()}) or from
     *     a file given instead
     * @param settings the output folder (null for {@code dir}), {@code force}, the command line, tool version and
     *     the threads of the merge (cases are joined and analysed, and figures drawn, on that many threads; run.json
     *     records the most threads a shard used)
     * @return the finished run
     * @throws IllegalArgumentException one line, if the shards do not belong to this experiment or the
     *     output folder does not allow the run
     */
    public static Finished run(Path dir, ShardSet shards, Job job, RunSettings settings) {
        Instant start = Instant.now();
        checkExperiment(job, shards.identity());
        List<WorkPlan.Unit> units = job.units(shards.shards());
        Map<WorkPlan.Unit, SimulationResult> tallies = shards.tallies(units);
        Path target = settings.out() != null ? settings.out() : dir;
        OutputFolder.Lock lock = OutputFolder.open(settings.out() != null ? "--out" : "merge", target,
            settings.force(), false, null);
        try {
            List<CaseResult> results = Outputs.byCaseInParallel(job, units, (c, u) -> tallies.get(u),
                settings.threads());
            Finished finished = new Finished(results, Runner.analyse(job.experiment(), results, job.claims()), target);
            Outputs.write(target, job, settings, finished, start, shards.threads());
            return finished;
        } finally {
            lock.close();
        }
    }

    private static void checkExperiment(Job job, RunIdentity ran) {
        Experiment e = job.experiment();
        if (!e.sha256().equals(ran.experimentSha256())) {
            throw new IllegalArgumentException(job.file() + " is not the experiment file the shards ran (its "
                + "SHA-256 is " + e.sha256() + ", the shards' " + ran.experimentSha256() + ")");
        }
        if (e.seed() != ran.seed()) {
            throw new IllegalArgumentException(job.file() + ": seed " + e.seed() + ", the shards ran seed " + ran.seed());
        }
        String claimsHash = e.claims() == null ? null : RunIdentity.sha256(e.claims());
        if (!Objects.equals(claimsHash, ran.claimsSha256())) {
            throw new IllegalArgumentException("the claims file " + e.claims() + " has changed since the shards ran "
                + "(SHA-256 " + claimsHash + ", the shards' " + ran.claimsSha256() + ")");
        }
    }
}
