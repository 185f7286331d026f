package reprise.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import reprise.experiment.Case;
import reprise.experiment.CaseResult;
import reprise.experiment.Curves;
import reprise.experiment.Experiment;
import reprise.experiment.Runner;
import reprise.experiment.Verdict;
import reprise.experiment.WorkPlan;
import reprise.output.CasesCsv;
import reprise.output.CurvesCsv;
import reprise.output.Plotter;
import reprise.output.Provenance;
import reprise.output.Report;
import reprise.output.ResultsCsv;
import reprise.sim.SimulationResult;
import reprise.sim.Simulator;

/**
 * What an unsharded {@code check} and a {@code merge} of shards share, so that both give the same
 * files: the per-case join of unit tallies (in plan order), the output files and the summary on stdout.
 */
final class RunOutputs {

    private RunOutputs() {
    }

    /** Where a unit's tallies come from: simulated now, loaded from a checkpoint, or read from a shard. */
    @FunctionalInterface
    interface UnitSource {
        /**
         * @param c the case
         * @param u one of its units
         * @return the unit's tallies
         */
        SimulationResult tally(Case c, WorkPlan.Unit u);
    }

    /**
     * Joins the unit tallies of every case, in plan order, with the case's exact side.
     *
     * @param e the experiment
     * @param cases its cases
     * @param units all its units
     * @param source the tallies of each unit
     * @param progress progress over the run
     * @return the case results, in case order
     */
    static List<CaseResult> byCase(Experiment e, List<Case> cases, List<WorkPlan.Unit> units, UnitSource source,
        CheckCommand.RunProgress progress) {
        List<CaseResult> results = new ArrayList<>();
        for (Case c : cases) {
            progress.startCase(c, results.size());
            SimulationResult merged = null;
            for (WorkPlan.Unit u : units) {
                if (u.caseIndex() != c.index()) {
                    continue;
                }
                SimulationResult r = source.tally(c, u);
                progress.endUnit(u.expectedRounds());
                merged = merged == null ? r : merged.merge(r);
            }
            results.add(Runner.fromSimulation(e, c, merged));
        }
        return results;
    }

    /**
     * Writes curves.csv, figures/, results.csv, cases.csv, report.md and run.json.
     *
     * @param dir the output folder
     * @param file the experiment file as given
     * @param commandLine the arguments, for run.json
     * @param e the experiment
     * @param results the case results
     * @param outcome the analysis
     * @param start when the run started
     * @param code the exit code
     * @param nThreads worker threads
     */
    static void write(Path dir, Path file, List<String> commandLine, Experiment e, List<CaseResult> results,
        Runner.Outcome outcome, Instant start, int code, int nThreads) {
        List<String> params = List.copyOf(e.parameters().keySet());
        List<Case> cases = results.stream().map(CaseResult::c).toList();
        List<Curves.Point> points = Curves.of(e, results, outcome.rows(), 1 - e.alpha());
        CurvesCsv.write(dir.resolve("curves.csv"), points);
        List<Plotter.Drawn> drawn = Plotter.draw(CurvesCsv.read(dir.resolve("curves.csv")), dir.resolve("figures"));
        ResultsCsv.write(dir.resolve("results.csv"), cases, params, outcome.rows());
        CasesCsv.write(dir.resolve("cases.csv"), params, results);
        Instant end = Instant.now();
        Report.write(dir.resolve("report.md"), new Report.Content(e, results, outcome, drawn, Main.version(),
            Simulator.GENERATOR, start, end));
        List<String> outputs = new ArrayList<>(CheckCommand.OUTPUTS);
        for (Plotter.Drawn d : drawn) {
            d.result().files().forEach(f -> outputs.add(dir.toAbsolutePath().relativize(f.toAbsolutePath()).toString()));
        }
        Provenance.write(dir.resolve("run.json"), new Provenance.Run(Main.version(), List.copyOf(commandLine), file,
            e.sha256(), e.claims(), e.claims() == null ? null : sha256(e.claims()), e.seed(), Simulator.GENERATOR,
            "case i: SplitMix64(seed + (i+1) * 0x9E3779B97F4A7C15); game g of a case: the simulator's stream for "
                + "(case seed, g)", nThreads, results.size(), results.stream().mapToLong(r -> r.simulation().roundsTotal())
                .sum(), start, end, code, outputs));
    }

    /**
     * Prints the one-line summary and one line per disagreement.
     *
     * @param stdout where to print
     * @param e the experiment
     * @param cases the number of cases
     * @param outcome the analysis
     * @param dir the output folder
     */
    static void summary(PrintWriter stdout, Experiment e, int cases, Runner.Outcome outcome, Path dir) {
        long bad = outcome.rows().stream().filter(r -> r.verdict() == Verdict.DISAGREES
            && r.comparisonKind().countsTowardsExit()).count();
        stdout.printf(Locale.ROOT, "%s: %d cases, %d comparisons, %s; results in %s%n", e.name(), cases,
            outcome.rows().size(), bad == 0 ? "no disagreement" : bad + " disagree", dir);
        outcome.rows().stream().filter(r -> r.verdict() == Verdict.DISAGREES
            && r.comparisonKind().countsTowardsExit()).forEach(r -> stdout.printf(Locale.ROOT,
            "  disagrees: %s %s (%s): predicted %s, observed %s%n", r.caseId(), r.subject().label(),
            r.comparisonKind().label(),
            Double.isNaN(r.predicted()) ? "-" : String.format(Locale.ROOT, "%.6g", r.predicted()),
            Double.isNaN(r.observed()) ? "-" : String.format(Locale.ROOT, "%.6g", r.observed())));
    }

    /**
     * Prints the run's warnings on stderr: the experiment-level ones in full, the per-case ones as a count
     * (they are listed in report.md and cases.csv).
     *
     * @param err stderr
     * @param results the case results
     * @param outcome the outcome
     */
    static void warnings(PrintWriter err, List<CaseResult> results, Runner.Outcome outcome) {
        outcome.warnings().forEach(w -> err.println("reprise check: warning: " + w));
        long withWarnings = results.stream().filter(r -> !r.warnings().isEmpty()).count();
        if (withWarnings > 0) {
            err.printf(Locale.ROOT, "reprise check: %d of %d cases have warnings (listed in report.md)%n", withWarnings,
                results.size());
        }
    }

    /**
     * @param p a file
     * @return its SHA-256 in hex, or null if it cannot be read
     */
    static String sha256(Path p) {
        try {
            java.security.MessageDigest md = java.security.MessageDigest.getInstance("SHA-256");
            return java.util.HexFormat.of().formatHex(md.digest(Files.readAllBytes(p)));
        } catch (IOException | java.security.NoSuchAlgorithmException ex) {
            return null;
        }
    }
}
