package reprise.cli;

import java.io.PrintWriter;
import java.util.List;
import java.util.Locale;
import reprise.experiment.CaseResult;
import reprise.experiment.Experiment;
import reprise.experiment.Runner;
import reprise.experiment.ResultRow;
import reprise.experiment.Verdict;
import reprise.output.Report;
import reprise.run.Finished;

/** What {@code check} and {@code merge} print about a finished run: the summary and the warnings. */
final class RunSummary {

    private RunSummary() {
    }

    /**
     * Prints the one-line summary and one line per disagreement.
     *
     * @param stdout where to print
     * @param e the experiment
     * @param finished the finished run
     */
    static void print(PrintWriter stdout, Experiment e, Finished finished) {
        Runner.Outcome outcome = finished.outcome();
        long bad = outcome.rows().stream().filter(r -> r.verdict() == Verdict.DISAGREES
            && r.comparisonKind().countsTowardsExit()).count();
        stdout.printf(Locale.ROOT, "%s: %d cases, %d comparisons, %s; results in %s%n", e.name(),
            finished.results().size(), outcome.rows().size(), bad == 0 ? "no disagreement" : bad + " disagree",
            finished.folder());
        outcome.rows().stream().filter(r -> r.verdict() == Verdict.DISAGREES
            && r.comparisonKind().countsTowardsExit()).forEach(r -> stdout.printf(Locale.ROOT,
            "  disagrees: %s %s (%s): %s%n", r.caseId(), r.subject().label(), r.comparisonKind().label(),
            disagreement(r)));
    }

    /**
     * What a disagreeing row says: predicted and observed values when it has them, the test statistic
     * (with its degrees of freedom) when it is a joint test without single values, then the adjusted p-value.
     */
    static String disagreement(ResultRow r) {
        StringBuilder sb = new StringBuilder();
        if (!Double.isNaN(r.predicted()) || !Double.isNaN(r.observed())) {
            sb.append("predicted ").append(g(r.predicted())).append(", observed ").append(g(r.observed()));
        } else if (!Double.isNaN(r.statistic())) {
            sb.append("statistic ").append(g(r.statistic()));
            if (!Double.isNaN(r.degreesOfFreedom())) {
                double df = r.degreesOfFreedom();
                sb.append(" on ").append(df == Math.rint(df) ? Long.toString((long) df) : g(df)).append(" df");
            }
        }
        if (!Double.isNaN(r.adjustedP())) {
            sb.append(sb.length() == 0 ? "" : ", ").append("adjusted p ")
                .append(r.adjustedP() < Report.SMALLEST_P_SHOWN ? "< 1e-300" : "= " + Report.pValue(r.adjustedP()));
        }
        return sb.length() == 0 ? r.note() : sb.toString();
    }

    private static String g(double v) {
        return Double.isNaN(v) ? "-" : String.format(Locale.ROOT, "%.6g", v);
    }

    /**
     * Prints the run's warnings on stderr: the experiment-level ones in full, the per-case ones as a count
     * (they are listed in report.md and cases.csv).
     *
     * @param err stderr
     * @param finished the finished run
     */
    static void warnings(PrintWriter err, Finished finished) {
        List<CaseResult> results = finished.results();
        finished.outcome().warnings().forEach(w -> err.println("reprise check: warning: " + w));
        long withWarnings = results.stream().filter(r -> !r.warnings().isEmpty()).count();
        if (withWarnings > 0) {
            err.printf(Locale.ROOT, "reprise check: %d of %d cases have warnings (listed in report.md)%n", withWarnings,
                results.size());
        }
    }
}
