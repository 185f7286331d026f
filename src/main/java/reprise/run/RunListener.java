package reprise.run;

import java.nio.file.Path;
import reprise.experiment.Case;
import reprise.sim.ProgressListener;

/**
 * What the run layer tells its caller while it runs (the caller prints; the run layer never does). Every
 * method but the simulator's {@link #progress} has an empty default.
 */
public interface RunListener extends ProgressListener {

    /** A listener that ignores everything. */
    RunListener SILENT = (replicatesDone, replicates, roundsDone, roundsExpected) -> { };

    /**
     * The folder is checked and prepared and simulation is about to start.
     *
     * @param unitsDone units already finished (loaded from a checkpoint)
     * @param unitsTotal units of the run
     * @param resumed whether the run resumes a checkpoint
     * @param checkpoint the checkpoint folder, where finished units are saved
     */
    default void started(int unitsDone, int unitsTotal, boolean resumed, Path checkpoint) {
    }

    /**
     * A case's units start (simulated, loaded or read).
     *
     * @param c the case
     * @param index its position in the run, from 0
     */
    default void startCase(Case c, int index) {
    }

    /**
     * A unit is done.
     *
     * @param expectedRounds its expected rounds
     */
    default void endUnit(double expectedRounds) {
    }

    /**
     * A simulated unit is saved in the checkpoint.
     *
     * @param saved units now in the checkpoint
     * @param unitsTotal units of the run
     */
    default void unitSaved(int saved, int unitsTotal) {
    }
}
