package reprise.run;

import java.nio.file.Path;
import java.util.List;
import reprise.output.figures.ContinuationAxis;
import reprise.output.figures.Figures;
import reprise.sim.SimulationSpec;

/**
 * How to run: where to write, with how many threads, what to do with an earlier run in the folder, and
 * what to record in run.json.
 *
 * @param out the output folder, or null for the experiment's {@code output:}
 * @param threads worker threads, at least 1
 * @param force whether to replace a finished or interrupted run in the folder
 * @param resume whether to continue an interrupted run from its checkpoint
 * @param commandLine the command line, for run.json
 * @param toolVersion the tool version, recorded in every file and checked when tallies are read back
 * @param figures how the figures are drawn (size, formats, resolution)
 * @param continuationAxis the x-axis of payoff figures over continuation probabilities
 */
public record RunSettings(Path out, int threads, boolean force, boolean resume, List<String> commandLine,
    String toolVersion, Figures figures, ContinuationAxis continuationAxis) {

    /**
     * Settings with the default figures (single column, PNG, SVG and PDF, delta axis).
     *
     * @param out the output folder, or null
     * @param threads worker threads
     * @param force replace an earlier run
     * @param resume continue an interrupted run
     * @param commandLine the command line
     * @param toolVersion the tool version
     */
    public RunSettings(Path out, int threads, boolean force, boolean resume, List<String> commandLine,
        String toolVersion) {
        this(out, threads, force, resume, commandLine, toolVersion, Figures.withDefaults(),
            ContinuationAxis.PROBABILITY);
    }

    /**
     * @throws IllegalArgumentException if threads is not between 1 and {@link SimulationSpec#MAX_THREADS}
     */
    public RunSettings {
        if (threads < 1 || threads > SimulationSpec.MAX_THREADS) {
            throw new IllegalArgumentException("--threads must be between 1 and " + SimulationSpec.MAX_THREADS + ": "
                + threads);
        }
        commandLine = List.copyOf(commandLine);
        java.util.Objects.requireNonNull(figures, "figures");
        java.util.Objects.requireNonNull(continuationAxis, "continuationAxis");
    }

    /**
     * @param job the job
     * @return the output folder of this run of the job
     */
    public Path folder(Job job) {
        return out != null ? out : job.experiment().output();
    }
}
