package reprise.output;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVPrinter;
import reprise.experiment.PopulationAnalysis;
import reprise.experiment.PopulationClaims;
import reprise.experiment.PopulationExperiment;
import reprise.game.Horizon;
import reprise.game.Population;

/**
 * population.csv and abundance.csv of a population experiment: tidy tables, one row per grid point, ordered
 * (mutant, resident) pair and payoff basis (fixation), or per grid point, basis and strategy (abundance).
 * Numbers are written in full (Java's shortest round-trip decimal); a missing value is an empty cell.
 */
public final class PopulationCsv {

    /** The columns that describe a grid point. */
    public static final List<String> POINT_COLUMNS = List.of("point", "N", "update", "selection", "fitness",
        "co_players", "noise", "misperception", "rounds", "continuation");
    /** The columns of population.csv after the point's. */
    public static final List<String> FIXATION_COLUMNS = List.of("mutant", "resident", "basis", "rho", "rho_times_N",
        "method", "error_bound", "exact_time", "invasions", "fixations", "simulated", "lower", "upper",
        "simulated_time", "p_value", "adjusted_p", "verdict", "relative_error", "same_side_of_neutral",
        "detected_by_invasions");
    /** The columns of abundance.csv after the point's. */
    public static final List<String> ABUNDANCE_COLUMNS = List.of("mutation", "basis", "strategy", "abundance",
        "simulated", "standard_error", "lower", "upper", "p_value", "adjusted_p", "verdict", "relative_error");

    private PopulationCsv() {
    }

    /**
     * Writes population.csv.
     *
     * @param file the target
     * @param e the experiment
     * @param result the analysis
     */
    public static void writeFixation(Path file, PopulationExperiment e, PopulationAnalysis.Result result) {
        List<String> header = new ArrayList<>(POINT_COLUMNS);
        header.addAll(FIXATION_COLUMNS);
        AtomicFiles.writeText(file, w -> {
            try (CSVPrinter out = printer(w, header)) {
                for (PopulationAnalysis.Row r : result.rows()) {
                    List<String> cells = pointCells(r.point(), e);
                    cells.add(e.strategyNames().get(r.mutant()));
                    cells.add(e.strategyNames().get(r.resident()));
                    cells.add(r.basis().label());
                    boolean has = r.result() != null;
                    cells.add(has ? num(r.result().probability()) : "");
                    cells.add(has ? num(r.result().relativeToNeutral()) : "");
                    cells.add(has ? r.result().method().name().toLowerCase(java.util.Locale.ROOT) : "");
                    cells.add(has ? num(r.result().relativeError()) : "");
                    cells.add(has ? num(r.result().chain().conditionalFixationTime()) : "");
                    boolean sim = r.tally() != null && r.tally().invasions() > 0;
                    cells.add(sim ? Long.toString(r.tally().invasions()) : "");
                    cells.add(sim ? Long.toString(r.tally().fixations()) : "");
                    cells.add(sim ? num(r.tally().fixationFrequency()) : "");
                    cells.add(sim ? num(r.interval().lower()) : "");
                    cells.add(sim ? num(r.interval().upper()) : "");
                    cells.add(sim && r.tally().fixations() > 0 ? num(r.tally().meanFixationTime()) : "");
                    cells.add(num(r.pValue()));
                    cells.add(num(r.adjusted()));
                    cells.add(r.verdict());
                    cells.add(num(r.relativeError()));
                    cells.add(has ? Boolean.toString(r.sameSideOfNeutral()) : "");
                    cells.add(Double.isNaN(r.adjusted()) ? "" : Boolean.toString(r.detected()));
                    out.printRecord(cells);
                }
                for (PopulationAnalysis.ClaimRow r : result.claims()) {
                    if (r.claim().kind() != PopulationClaims.Kind.FIXATION) {
                        continue;
                    }
                    List<String> cells = pointCells(r.point(), e);
                    cells.add(e.strategyNames().get(r.claim().mutant()));
                    cells.add(e.strategyNames().get(r.claim().resident()));
                    cells.add("claim");
                    cells.add(num(r.claim().value()));
                    cells.add(num(r.claim().value() * r.point().population().size()));
                    cells.add("line " + r.claim().line());
                    cells.add(num(r.claim().tolerance().margin(r.exact())));
                    cells.add("");
                    boolean sim = r.tally() != null && r.tally().invasions() > 0;
                    cells.add(sim ? Long.toString(r.tally().invasions()) : "");
                    cells.add(sim ? Long.toString(r.tally().fixations()) : "");
                    cells.add(sim ? num(r.tally().fixationFrequency()) : "");
                    cells.add("");
                    cells.add("");
                    cells.add("");
                    cells.add(num(r.pValue()));
                    cells.add(num(r.adjusted()));
                    cells.add(r.verdict());
                    cells.add(r.exact() == 0 ? "" : num(r.claim().value() / r.exact() - 1));
                    double n = 1.0 / r.point().population().size();
                    cells.add(Boolean.toString(Math.signum(r.claim().value() - n) == Math.signum(r.exact() - n)));
                    cells.add(Double.isNaN(r.adjusted()) ? "" : Boolean.toString(r.detected()));
                    out.printRecord(cells);
                }
            }
        });
    }

    /**
     * Writes abundance.csv (the header only when the experiment has no mutation): exact abundances of each
     * basis, and with an explicit rate the simulated abundance of one run (batch means) with its test.
     *
     * @param file the target
     * @param e the experiment
     * @param result the analysis
     */
    public static void writeAbundance(Path file, PopulationExperiment e, PopulationAnalysis.Result result) {
        List<String> header = new ArrayList<>(POINT_COLUMNS);
        header.addAll(ABUNDANCE_COLUMNS);
        AtomicFiles.writeText(file, w -> {
            try (CSVPrinter out = printer(w, header)) {
                for (PopulationAnalysis.AbundanceRow r : result.abundances()) {
                    List<String> cells = pointCells(r.point(), e);
                    cells.add(e.mutation() == PopulationExperiment.Mutation.RATE ? num(e.mu()) : e.mutation().label());
                    cells.add(r.basis().label());
                    cells.add(e.strategyNames().get(r.strategy()));
                    cells.add(num(r.abundance()));
                    boolean sim = r.simulated() != null;
                    cells.add(sim ? num(r.simulated().value()) : "");
                    cells.add(sim ? num(r.simulated().standardError()) : "");
                    cells.add(sim ? num(r.interval().lower()) : "");
                    cells.add(sim ? num(r.interval().upper()) : "");
                    cells.add(num(r.pValue()));
                    cells.add(num(r.adjusted()));
                    cells.add(r.verdict());
                    cells.add(num(r.abundance() / r.realised() - 1));
                    out.printRecord(cells);
                }
                for (PopulationAnalysis.ClaimRow r : result.claims()) {
                    if (r.claim().kind() != PopulationClaims.Kind.ABUNDANCE) {
                        continue;
                    }
                    List<String> cells = pointCells(r.point(), e);
                    cells.add(e.mutation() == PopulationExperiment.Mutation.RATE ? num(e.mu()) : e.mutation().label());
                    cells.add("claim");
                    cells.add(e.strategyNames().get(r.claim().strategy()));
                    cells.add(num(r.claim().value()));
                    boolean sim = r.simulated() != null;
                    cells.add(sim ? num(r.simulated().value()) : "");
                    cells.add(sim ? num(r.simulated().standardError()) : "");
                    cells.add("");
                    cells.add("");
                    cells.add(num(r.pValue()));
                    cells.add(num(r.adjusted()));
                    cells.add(r.verdict());
                    cells.add(r.exact() == 0 ? "" : num(r.claim().value() / r.exact() - 1));
                    out.printRecord(cells);
                }
            }
        });
    }

    private static CSVPrinter printer(java.io.Writer w, List<String> header) throws IOException {
        return new CSVPrinter(w, CSVFormat.DEFAULT.builder().setHeader(header.toArray(String[]::new))
            .setRecordSeparator('\n').build());
    }

    private static List<String> pointCells(PopulationExperiment.Point p, PopulationExperiment e) {
        Population pop = p.population();
        List<String> cells = new ArrayList<>();
        cells.add(p.name());
        cells.add(Integer.toString(pop.size()));
        cells.add(pop.update() == Population.Update.PAIRWISE_COMPARISON ? "pairwise" : "moran");
        cells.add(num(pop.selection()));
        cells.add(pop.update() == Population.Update.MORAN_BIRTH_DEATH ? pop.fitness().name().toLowerCase(
            java.util.Locale.ROOT) : "");
        cells.add(pop.coPlayers() == 0 ? "all" : Integer.toString(pop.coPlayers()));
        cells.add(num(p.noise().executionX()));
        cells.add(num(p.noise().perceptionX()));
        cells.add(p.horizon() instanceof Horizon.Rounds r ? Long.toString(r.count()) : "");
        cells.add(p.horizon() instanceof Horizon.Continuation c ? num(c.probability()) : "");
        return cells;
    }

    static String num(double v) {
        return Double.isNaN(v) ? "" : Double.toString(v);
    }
}
