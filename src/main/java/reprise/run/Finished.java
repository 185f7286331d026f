package reprise.run;

import java.nio.file.Path;
import java.util.List;
import reprise.experiment.CaseResult;
import reprise.experiment.Runner;

/**
 * A finished run (unsharded or merged): the case results, the analysis and where the files are.
 *
 * @param results the case results, in case order
 * @param outcome the comparisons, corrected, and experiment-level warnings
 * @param folder the output folder
 */
public record Finished(List<CaseResult> results, Runner.Outcome outcome, Path folder) {

    /** The exit code when every comparison that counts agrees or is consistent. */
    public static final int AGREES = 0;
    /** The exit code when a comparison that counts disagrees. */
    public static final int DISAGREES = 1;

    /** Copies the list. */
    public Finished {
        results = List.copyOf(results);
    }

    /** @return {@value #DISAGREES} if any comparison that counts disagrees, else {@value #AGREES}; also in run.json */
    public int exitCode() {
        return outcome.disagrees() ? DISAGREES : AGREES;
    }
}
