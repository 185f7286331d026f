package reprise.output;

import java.nio.file.Path;
import java.time.Duration;
import java.time.Instant;
import java.util.List;
import java.util.Locale;
import reprise.experiment.PopulationAnalysis;
import reprise.experiment.PopulationClaims;
import reprise.experiment.PopulationExperiment;

/**
 * report.md of a population experiment: the model, a summary of the verdicts, then for each grid point a
 * table of every ordered pair with the three bases' fixation probabilities, the simulated frequency with
 * its interval and the verdicts, and the abundances when the experiment has mutation.
 */
public final class PopulationReport {

    private PopulationReport() {
    }

    /**
     * What the report shows.
     *
     * @param e the experiment
     * @param result the analysis
     * @param figures the figure files written (relative to the output folder)
     * @param toolVersion the tool's version
     * @param start when the run started
     * @param end when it ended
     */
    public record Content(PopulationExperiment e, PopulationAnalysis.Result result, List<String> figures,
        String toolVersion, Instant start, Instant end) {
    }

    /**
     * Writes report.md atomically.
     *
     * @param file the target
     * @param c the content
     */
    public static void write(Path file, Content c) {
        AtomicFiles.writeText(file, w -> w.write(text(c)));
    }

    /**
     * The report's text.
     *
     * @param c the content
     * @return markdown
     */
    public static String text(Content c) {
        PopulationExperiment e = c.e();
        StringBuilder s = new StringBuilder();
        s.append("# ").append(e.name()).append(" (population)\n\n");
        if (!e.description().isBlank()) {
            s.append(e.description().trim()).append("\n\n");
        }
        s.append("Stage game ").append(e.gameText()).append("; strategies ").append(String.join(", ",
            e.strategyNames())).append("; update ").append(e.update() == reprise.game.Population.Update.PAIRWISE_COMPARISON
            ? "pairwise comparison (selection = beta)" : "Moran birth-death, " + e.fitness().name().toLowerCase(
            Locale.ROOT) + " fitness (selection = w)").append("; co-players ").append(e.coPlayers() == 0 ? "all"
            : Integer.toString(e.coPlayers())).append("; mutation ").append(e.mutation() ==
            PopulationExperiment.Mutation.RATE ? "rate " + e.mu() : e.mutation().label()).append("; ")
            .append(e.invasions()).append(" invasions per grid point and ordered pair; seed ").append(e.seed())
            .append("; alpha ").append(e.alpha()).append(", correction ").append(e.correction().name()
            .toLowerCase(Locale.ROOT)).append(" over each basis' tests; relative tolerance ").append(e.tolerance())
            .append(".\n\n");
        s.append("Bases: (a) `stationary` payoffs of the infinitely repeated game; (b) `expected` payoffs of the "
            + "finite or discounted game; (c) `realised`: the exact law of realised payoffs of fresh games, the exact "
            + "answer for the simulated process. (c) against the invasions is a check of reprise itself "
            + "(`consistent` / `disagrees`); (a) and (b) `describe` the population when |rho / rho_c - 1| <= "
            + e.tolerance() + ", else `misdescribe` it; `detected` says whether the invasions reject the basis' rho "
            + "after correction.\n\n");
        List<PopulationAnalysis.Row> rows = c.result().rows();
        long cTests = rows.stream().filter(r -> r.basis() == PopulationAnalysis.Basis.REALISED
            && !r.verdict().isEmpty()).count();
        long cBad = rows.stream().filter(r -> r.basis() == PopulationAnalysis.Basis.REALISED
            && "disagrees".equals(r.verdict())).count();
        s.append("## Summary\n\n");
        s.append("- (c) realised payoffs against the invasions: ").append(cTests - cBad).append(" of ").append(cTests)
            .append(" consistent").append(cBad > 0 ? ", **" + cBad + " disagree**" : "").append(".\n");
        for (PopulationAnalysis.Basis b : List.of(PopulationAnalysis.Basis.STATIONARY,
            PopulationAnalysis.Basis.EXPECTED)) {
            List<PopulationAnalysis.Row> br = rows.stream().filter(r -> r.basis() == b).toList();
            long describes = br.stream().filter(r -> "describes".equals(r.verdict())).count();
            long side = br.stream().filter(r -> r.result() != null && !r.sameSideOfNeutral()).count();
            long detected = br.stream().filter(PopulationAnalysis.Row::detected).count();
            double worst = br.stream().mapToDouble(PopulationAnalysis.Row::relativeError).filter(d -> !Double.isNaN(d))
                .map(Math::abs).max().orElse(Double.NaN);
            s.append("- (").append(b == PopulationAnalysis.Basis.STATIONARY ? "a" : "b").append(") ").append(b.label())
                .append(": describes ").append(describes).append(" of ").append(br.size())
                .append(" questions; largest |rho / rho_c - 1| = ").append(fmt(worst)).append("; wrong side of 1/N in ")
                .append(side).append("; rejected by the invasions in ").append(detected).append(".\n");
        }
        s.append("\n");
        claims(s, e, c.result());
        for (PopulationAnalysis.PointExact px : c.result().exact()) {
            s.append("## ").append(px.point().name()).append("\n\n");
            s.append("| mutant | resident | 1/N | (a) stationary | (b) expected | (c) realised | method | simulated "
                + "[interval] | (c) | (a) | (b) |\n|---|---|---|---|---|---|---|---|---|---|---|\n");
            for (int i = 0; i < rows.size(); i += 3) {
                PopulationAnalysis.Row a = rows.get(i);
                if (a.point().index() != px.point().index()) {
                    continue;
                }
                PopulationAnalysis.Row b = rows.get(i + 1);
                PopulationAnalysis.Row r = rows.get(i + 2);
                s.append("| ").append(e.strategyNames().get(a.mutant())).append(" | ")
                    .append(e.strategyNames().get(a.resident())).append(" | ")
                    .append(fmt(1.0 / px.point().population().size())).append(" | ").append(rho(a)).append(" | ")
                    .append(rho(b)).append(" | ").append(rho(r)).append(" | ")
                    .append(r.result().method().name().toLowerCase(Locale.ROOT)).append(" | ");
                if (r.tally() != null && r.tally().invasions() > 0) {
                    s.append(fmt(r.tally().fixationFrequency())).append(" [").append(fmt(r.interval().lower()))
                        .append(", ").append(fmt(r.interval().upper())).append("]");
                }
                s.append(" | ").append(r.verdict()).append(" | ").append(a.verdict()).append(" | ").append(b.verdict())
                    .append(" |\n");
            }
            s.append("\n");
            double[][] ab = px.abundance();
            if (ab[PopulationAnalysis.Basis.REALISED.ordinal()] != null) {
                s.append("Abundance (").append(e.mutation() == PopulationExperiment.Mutation.RARE ? "rare mutations"
                    : "mutation rate " + e.mu()).append("):\n\n| strategy | (a) | (b) | (c) |\n|---|---|---|---|\n");
                double[] realised = ab[PopulationAnalysis.Basis.REALISED.ordinal()];
                for (int k = 0; k < realised.length; k++) {
                    s.append("| ").append(e.strategyNames().get(k));
                    for (double[] basis : ab) {
                        s.append(" | ").append(basis == null ? "" : fmt(basis[k]));
                    }
                    s.append(" |\n");
                }
                s.append("\n");
                for (PopulationAnalysis.AbundanceRow ar : c.result().abundances()) {
                    if (ar.point().index() == px.point().index() && ar.strategy() == 0 && ar.simulated() != null
                        && ar.basis() == PopulationAnalysis.Basis.REALISED) {
                        s.append("Simulated abundance of ").append(e.strategyNames().get(0)).append(" (one run of ")
                            .append(e.updates()).append(" updates, batch means): ").append(fmt(ar.simulated().value()))
                            .append(" [").append(fmt(ar.interval().lower())).append(", ")
                            .append(fmt(ar.interval().upper())).append("], against (c): ").append(ar.verdict())
                            .append(".\n\n");
                    }
                }
            }
        }
        if (!c.figures().isEmpty()) {
            s.append("## Figures\n\n");
            for (String f : c.figures()) {
                s.append("- [").append(f).append("](").append(f).append(")\n");
            }
            s.append("\n");
        }
        s.append("reprise ").append(c.toolVersion()).append(", ").append(Duration.between(c.start(), c.end())
            .toMillis() / 1000.0).append(" s.\n");
        return s.toString();
    }

    /** The claims section: one row per claim and grid point (nothing without claims). */
    private static void claims(StringBuilder s, PopulationExperiment e, PopulationAnalysis.Result result) {
        List<PopulationAnalysis.ClaimRow> rows = result.claims();
        if (rows.isEmpty()) {
            return;
        }
        long bad = rows.stream().filter(r -> "disagrees".equals(r.verdict())).count();
        s.append("## Claims\n\n").append(rows.size() - bad).append(" of ").append(rows.size())
            .append(" claims consistent").append(bad > 0 ? ", **" + bad + " disagree**" : "").append(" (").append(
                e.claimsFile().getFileName()).append("; each against the exact (c) value within its tolerance, and "
                + "against the simulation, corrected with the (c) rows).\n\n");
        s.append("| line | grid point | claim | claimed | (c) exact | tolerance | agrees with (c) | simulated | "
            + "adjusted p | verdict |\n|---|---|---|---|---|---|---|---|---|---|\n");
        for (PopulationAnalysis.ClaimRow r : rows) {
            PopulationClaims.Claim cl = r.claim();
            String what = cl.kind() == PopulationClaims.Kind.FIXATION ? "fixation of " + e.strategyNames().get(
                cl.mutant()) + " in " + e.strategyNames().get(cl.resident()) : "abundance of " + e.strategyNames()
                .get(cl.strategy());
            String sim = r.tally() != null ? fmt(r.tally().fixationFrequency()) + " (" + r.tally().fixations() + "/"
                + r.tally().invasions() + ")" : r.simulated() != null ? fmt(r.simulated().value()) : "";
            s.append("| ").append(cl.line()).append(" | ").append(r.point().name()).append(" | ").append(what)
                .append(" | ").append(fmt(cl.value())).append(" | ").append(fmt(r.exact())).append(" | ")
                .append(cl.tolerance().describe()).append(" | ").append(r.exactAgrees() ? "yes" : "**no**")
                .append(" | ").append(sim).append(" | ").append(Double.isNaN(r.adjusted()) ? "" : fmt(r.adjusted()))
                .append(" | ").append(r.verdict()).append(" |\n");
        }
        s.append("\n");
    }

    private static String rho(PopulationAnalysis.Row r) {
        return r.result() == null ? "" : fmt(r.result().probability());
    }

    private static String fmt(double v) {
        return Double.isNaN(v) ? "" : String.format(Locale.ROOT, "%.4g", v);
    }
}
