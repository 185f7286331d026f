package reprise.output;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVPrinter;
import reprise.experiment.CaseResult;
import reprise.game.Player;
import reprise.game.StrategyDescription;
import reprise.game.ZeroDeterminant;

/**
 * {@code cases.csv}: one row per case with its parameters, seed, sizes, the exact chain's long-run facts,
 * the case's warnings and, at the end of the row, each player's resolved strategy
 * ({@link StrategyDescription}): its kind, first-move cooperation probability, probability table (own view,
 * entries separated by ';') and, for the zero-determinant constructors, chi or the equalizer's score, phi
 * with its allowed range, and delta (empty cells otherwise).
 */
public final class CasesCsv {

    private static final List<String> TAIL = List.of("seed", "replicates", "games_tallied", "rounds_total",
        "mean_tallied_length", "chain_states", "stationary_CC", "stationary_CD", "stationary_DC", "stationary_DD",
        "exact_CC", "exact_CD", "exact_DC", "exact_DD", "simulated_CC", "simulated_CD", "simulated_DC",
        "simulated_DD", "second_eigenvalue_modulus", "mixing_time", "fast_path", "warnings");
    /** The resolved-strategy columns of one player, after its prefix x_ or y_. */
    private static final List<String> STRATEGY = List.of("kind", "first_move", "table", "zd_chi", "zd_score",
        "zd_phi", "zd_phi_low", "zd_phi_high", "zd_delta");

    private CasesCsv() {
    }

    /**
     * Writes the file atomically.
     *
     * @param file the target
     * @param parameters the grid's parameter names
     * @param results the case results
     */
    public static void write(Path file, List<String> parameters, List<CaseResult> results) {
        List<String> header = new ArrayList<>(ResultsCsv.CASE_COLUMNS);
        parameters.forEach(p -> header.add("param_" + p));
        header.addAll(TAIL);
        for (String p : List.of("x_", "y_")) {
            STRATEGY.forEach(c -> header.add(p + c));
        }
        AtomicFiles.writeText(file, w -> {
            try (CSVPrinter out = new CSVPrinter(w, CSVFormat.DEFAULT.builder().setHeader(header.toArray(String[]::new))
                .setRecordSeparator('\n').build())) {
                for (CaseResult r : results) {
                    List<String> cells = ResultsCsv.caseCells(r.c(), parameters);
                    cells.add(Long.toString(r.seed()));
                    cells.add(Long.toString(r.simulation().replicates()));
                    cells.add(Long.toString(r.simulation().gamesTallied()));
                    cells.add(Long.toString(r.simulation().roundsTotal()));
                    cells.add(ResultsCsv.num((double) r.simulation().roundsTotal() / r.simulation().replicates()));
                    double[] st = r.exact() == null ? null : r.exact().prediction().stationary();
                    double[] ex = r.exact() == null ? null : r.exact().frequencies();
                    cells.add(r.exact() == null ? "" : Integer.toString(r.exact().chain().size()));
                    for (int s = 0; s < 4; s++) {
                        cells.add(st == null ? "" : ResultsCsv.num(st[s]));
                    }
                    for (int s = 0; s < 4; s++) {
                        cells.add(ex == null ? "" : ResultsCsv.num(ex[s]));
                    }
                    long[] counts = r.simulation().stateCounts();
                    long total = r.simulation().roundsTotal();
                    for (int s = 0; s < 4; s++) {
                        cells.add(total == 0 ? "" : ResultsCsv.num((double) counts[s] / total));
                    }
                    cells.add(r.exact() == null ? "" : ResultsCsv.num(r.exact().prediction().secondEigenvalueModulus()));
                    cells.add(r.exact() == null || r.exact().prediction().mixingTime().isEmpty() ? ""
                        : Long.toString(r.exact().prediction().mixingTime().getAsLong()));
                    cells.add(Boolean.toString(r.simulation().fastPath()));
                    cells.add(String.join("; ", r.warnings()));
                    strategy(cells, r.c().xSpec(), r, Player.X);
                    strategy(cells, r.c().ySpec(), r, Player.Y);
                    out.printRecord(cells);
                }
            }
        });
    }

    private static void strategy(List<String> cells, String spec, CaseResult r, Player player) {
        StrategyDescription d = StrategyDescription.of(spec, r.c().match().game(), player);
        cells.add(d.kind());
        cells.add(ResultsCsv.num(d.firstMove()));
        cells.add(String.join(";", Arrays.stream(d.table()).mapToObj(Double::toString).toList()));
        ZeroDeterminant.Parameters z = d.zeroDeterminant();
        if (z == null) {
            for (int i = 0; i < 6; i++) {
                cells.add("");
            }
            return;
        }
        cells.add(ResultsCsv.num(z.chi()));
        cells.add(ResultsCsv.num(z.score()));
        cells.add(ResultsCsv.num(z.phi()));
        cells.add(ResultsCsv.num(z.phiLow()));
        cells.add(ResultsCsv.num(z.phiHigh()));
        cells.add(ResultsCsv.num(z.delta()));
    }
}
