package reprise.run;

import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import reprise.experiment.Case;
import reprise.experiment.Claims;
import reprise.experiment.Experiment;
import reprise.experiment.ExperimentFile;
import reprise.experiment.InvalidExperimentException;
import reprise.experiment.Runner;

/**
 * An experiment read and checked for running: the file as given, the experiment, its cases and claims.
 *
 * @param file the experiment file as given
 * @param experiment the experiment
 * @param cases its cases
 * @param claims claims by case index (empty without a claims file)
 */
public record Job(Path file, Experiment experiment, List<Case> cases, Map<Integer, Map<reprise.experiment.Quantity, Claims.Claim>> claims) {

    /** Copies the collections. */
    public Job {
        cases = List.copyOf(cases);
        claims = Map.copyOf(claims);
    }

    /**
     * Reads an experiment file and its claims, and checks that the simulator accepts every case.
     *
     * @param file the experiment file
     * @param threads the worker threads the run will use (for the memory estimate)
     * @return the job
     * @throws InvalidExperimentException one line per problem
     */
    public static Job load(Path file, int threads) {
        Experiment e = ExperimentFile.read(file);
        List<Case> cases = e.cases();
        Map<Integer, Map<reprise.experiment.Quantity, Claims.Claim>> claims = e.claims() == null ? Map.of()
            : Claims.readAll(e.claims(), e, cases);
        Runner.preflight(e, cases, threads);
        return new Job(file, e, cases, claims);
    }

    /** @return the experiment's units of work, cut for an unsharded run */
    public List<WorkPlan.Unit> units() {
        return WorkPlan.units(experiment, cases);
    }

    /**
     * @param shards the number of shards of the run
     * @return the experiment's units of work, cut for that many shards ({@link WorkPlan#units(Experiment, List, int)})
     */
    public List<WorkPlan.Unit> units(int shards) {
        return WorkPlan.units(experiment, cases, shards);
    }

    /**
     * @param toolVersion the tool version
     * @return the identity of this job's run by that version
     */
    public RunIdentity identity(String toolVersion) {
        return RunIdentity.of(experiment, file, toolVersion);
    }
}
