package reprise.cli;

import java.io.PrintWriter;
import java.util.Locale;
import reprise.experiment.InvalidExperimentException;
import reprise.experiment.PopulationAnalysis;
import reprise.experiment.PopulationExperiment;
import reprise.experiment.PopulationFile;
import reprise.run.PopulationRun;
import reprise.run.RunSettings;

/** {@code check} on a population experiment (a file with a {@code population:} section). */
final class PopulationCheck {

    private PopulationCheck() {
    }

    /**
     * Runs a population experiment for {@code check}.
     *
     * @param c the command with its options
     * @return the exit code: 0 when every (c) comparison is consistent, 1 when any disagrees, 2 for bad input
     */
    static int run(CheckCommand c) {
        PrintWriter err = c.spec.commandLine().getErr();
        PrintWriter out = c.spec.commandLine().getOut();
        if (c.shard != null || c.merge != null) {
            err.println("reprise check: " + c.file + ": --shard and --merge are not available for population "
                + "experiments");
            return Main.BAD_INPUT;
        }
        PopulationExperiment e;
        try {
            e = PopulationFile.read(c.file);
        } catch (InvalidExperimentException ex) {
            ex.problems().forEach(line -> err.println("reprise check: " + line));
            return Main.BAD_INPUT;
        }
        RunSettings settings = c.settings();
        PopulationRun.Done done = PopulationRun.run(e, settings, (finished, total) -> {
            if (!c.quiet) {
                err.print("\rpopulation questions " + finished + "/" + total);
                if (finished == total) {
                    err.println();
                }
                err.flush();
            }
        });
        long questions = done.result().rows().stream().filter(r -> r.basis() == PopulationAnalysis.Basis.REALISED)
            .count();
        long disagree = done.result().rows().stream().filter(r -> r.basis() == PopulationAnalysis.Basis.REALISED
            && "disagrees".equals(r.verdict())).count();
        out.println(String.format(Locale.ROOT, "%s: %d fixation questions (%d grid points), realised payoffs against "
            + "invasions: %d disagree; results in %s", e.name(), questions, done.result().exact().size(), disagree,
            done.folder()));
        for (PopulationAnalysis.Basis b : new PopulationAnalysis.Basis[] {PopulationAnalysis.Basis.STATIONARY,
            PopulationAnalysis.Basis.EXPECTED}) {
            long describes = done.result().rows().stream().filter(r -> r.basis() == b && "describes".equals(r.verdict()))
                .count();
            out.println(String.format(Locale.ROOT, "  %s payoffs describe the population in %d of %d", b.label(),
                describes, questions));
        }
        if (!done.result().claims().isEmpty()) {
            long bad = done.result().claims().stream().filter(r -> "disagrees".equals(r.verdict())).count();
            out.println(String.format(Locale.ROOT, "  claims: %d of %d disagree", bad, done.result().claims().size()));
        }
        out.flush();
        return done.exitCode();
    }
}
