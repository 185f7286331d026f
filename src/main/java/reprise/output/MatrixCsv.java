package reprise.output;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVPrinter;
import reprise.chain.StrategyMatrix;
import reprise.experiment.SetExactMatrix;
import reprise.experiment.SetMatrix;
import reprise.game.Horizon;

/**
 * The strategy-set matrices as tidy CSV: {@code matrix.csv} (one row per played match, grid point and
 * quantity: exact value for the length played, long-run value, simulated mean, interval, verdict) and
 * {@code matrix-exact.csv} (every ordered pair of the set, exact only, for each grid length, the long
 * run and the set's extra continuation probabilities). Numbers are written with {@link Double#toString},
 * as in results.csv; an empty cell is a number that does not apply.
 */
public final class MatrixCsv {

    /** The columns of matrix.csv before the grid parameters. */
    static final List<String> KEY = List.of("row", "column", "case", "noise", "misperception", "horizon",
        "horizon_value");
    /** The columns of matrix.csv after the grid parameters. */
    static final List<String> VALUES = List.of("quantity", "exact", "long_run", "long_run_unique", "simulated",
        "ci_lower", "ci_upper", "verdict");
    /** The value columns of matrix-exact.csv. */
    static final List<String> EXACT = List.of("CC", "CD", "DC", "DD", "coop_x", "coop_y", "payoff_x", "payoff_y",
        "long_run_unique");

    private MatrixCsv() {
    }

    /**
     * Writes matrix.csv atomically.
     *
     * @param file the target
     * @param parameters the grid's parameter names
     * @param matrices the matrices, one per grid point
     */
    public static void write(Path file, List<String> parameters, List<SetMatrix> matrices) {
        List<String> header = new ArrayList<>(KEY);
        parameters.forEach(p -> header.add("param_" + p));
        header.addAll(VALUES);
        AtomicFiles.writeText(file, w -> {
            try (CSVPrinter out = new CSVPrinter(w, CSVFormat.DEFAULT.builder().setHeader(header.toArray(String[]::new))
                .setRecordSeparator('\n').build())) {
                for (SetMatrix m : matrices) {
                    for (SetMatrix.Cell c : m.cells()) {
                        for (SetMatrix.Value v : c.values()) {
                            List<String> cells = new ArrayList<>();
                            cells.add(m.strategies().get(c.row()));
                            cells.add(m.strategies().get(c.column()));
                            cells.add(c.c().id());
                            cells.add(m.noise());
                            cells.add(m.misperception());
                            horizon(m.horizon(), cells);
                            for (String p : parameters) {
                                Double d = m.parameters().get(p);
                                cells.add(d == null ? "" : Double.toString(d));
                            }
                            cells.add(v.quantity().label());
                            cells.add(ResultsCsv.num(v.exact()));
                            cells.add(ResultsCsv.num(v.longRun()));
                            cells.add(Double.isNaN(v.longRun()) ? "" : Boolean.toString(v.unique()));
                            cells.add(ResultsCsv.num(v.simulated()));
                            cells.add(ResultsCsv.num(v.lower()));
                            cells.add(ResultsCsv.num(v.upper()));
                            cells.add(v.verdict() == null ? "" : v.verdict().word());
                            out.printRecord(cells);
                        }
                    }
                }
            }
        });
    }

    /**
     * Writes matrix-exact.csv atomically.
     *
     * @param file the target
     * @param names the set's strategy names (row and column labels)
     * @param parameters the grid's parameter names
     * @param matrices the exact matrices
     */
    public static void writeExact(Path file, List<String> names, List<String> parameters,
        List<SetExactMatrix> matrices) {
        List<String> header = new ArrayList<>(List.of("row", "column", "noise", "misperception", "horizon",
            "horizon_value"));
        parameters.forEach(p -> header.add("param_" + p));
        header.addAll(EXACT);
        AtomicFiles.writeText(file, w -> {
            try (CSVPrinter out = new CSVPrinter(w, CSVFormat.DEFAULT.builder().setHeader(header.toArray(String[]::new))
                .setRecordSeparator('\n').build())) {
                for (SetExactMatrix em : matrices) {
                    StrategyMatrix m = em.matrix();
                    for (int i = 0; i < m.rows(); i++) {
                        for (int j = 0; j < m.columns(); j++) {
                            List<String> cells = new ArrayList<>();
                            cells.add(names.get(i));
                            cells.add(names.get(j));
                            cells.add(em.noise());
                            cells.add(em.misperception());
                            horizon(em.horizon(), cells);
                            for (String p : parameters) {
                                Double d = em.parameters().get(p);
                                cells.add(d == null ? "" : Double.toString(d));
                            }
                            for (double f : m.frequencies(i, j)) {
                                cells.add(Double.toString(f));
                            }
                            cells.add(Double.toString(m.cooperationX(i, j)));
                            cells.add(Double.toString(m.cooperationY(i, j)));
                            cells.add(Double.toString(m.payoffX(i, j)));
                            cells.add(Double.toString(m.payoffY(i, j)));
                            cells.add(Boolean.toString(m.unique(i, j)));
                            out.printRecord(cells);
                        }
                    }
                }
            }
        });
    }

    private static void horizon(Horizon h, List<String> cells) {
        if (h == null) {
            cells.add("long-run");
            cells.add("");
        } else if (h instanceof Horizon.Rounds r) {
            cells.add("rounds");
            cells.add(Long.toString(r.count()));
        } else {
            cells.add("continuation");
            cells.add(Double.toString(((Horizon.Continuation) h).probability()));
        }
    }
}
