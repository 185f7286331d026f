package reprise.experiment;

import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import reprise.game.Horizon;
import reprise.stats.Estimate;
import reprise.stats.GameSummary;
import reprise.stats.Interval;

/**
 * The all-against-all matrix of a strategy set at one point of the grid (parameters, noise,
 * misperception, game length): for every match played, each reported quantity's exact value for the
 * length played, its long-run value, the simulated mean with its confidence interval, and the verdict of
 * the simulation against the exact value.
 *
 * <p>Rows are the strategies playing X, columns the strategies playing Y, both in set order; cells of a
 * listed subset that were not played are absent. The long-run value is the stationary one when the chain
 * has a unique stationary distribution, else the time-average limit from the first round
 * ({@link Value#unique()} says which). The simulated mean and interval are the replicate estimates the
 * comparisons use (games are the independent observations), at confidence 1 - alpha.
 *
 * @param strategies the set's strategy names (row and column labels)
 * @param parameters the grid parameters of this point, in file order
 * @param noise the execution error as written
 * @param misperception the perception error as written
 * @param horizon the game length
 * @param cells the played cells, row-major
 */
public record SetMatrix(List<String> strategies, Map<String, Double> parameters, String noise, String misperception,
    Horizon horizon, List<Cell> cells) {

    /**
     * Copies the collections.
     *
     * @throws NullPointerException if a component is null
     */
    public SetMatrix {
        strategies = List.copyOf(strategies);
        parameters = Collections.unmodifiableMap(new LinkedHashMap<>(parameters));
        Objects.requireNonNull(noise, "noise");
        Objects.requireNonNull(misperception, "misperception");
        Objects.requireNonNull(horizon, "horizon");
        cells = List.copyOf(cells);
    }

    /**
     * One played cell.
     *
     * @param row the row strategy's index (X)
     * @param column the column strategy's index (Y)
     * @param c the case that played it
     * @param values one value per reported quantity, in report order
     * @param disagrees whether any comparison of the case that counts towards the exit code disagrees
     */
    public record Cell(int row, int column, Case c, List<Value> values, boolean disagrees) {
        /** Copies the values. */
        public Cell {
            values = List.copyOf(values);
        }

        /**
         * @param q a quantity
         * @return its value in this cell, if reported
         */
        public Optional<Value> value(Quantity q) {
            return values.stream().filter(v -> v.quantity().equals(q)).findFirst();
        }
    }

    /**
     * One quantity in one cell; numbers that do not apply are NaN.
     *
     * @param quantity the quantity
     * @param exact the exact value for the length played (NaN without an exact chain)
     * @param longRun the stationary value, or the time-average limit when {@code unique} is false
     * @param unique whether the long-run value is a unique stationary distribution's
     * @param simulated the simulated mean
     * @param lower the lower end of its interval
     * @param upper the upper end
     * @param verdict the verdict of the simulation against the exact value, or null when no such row was made
     */
    public record Value(Quantity quantity, double exact, double longRun, boolean unique, double simulated,
        double lower, double upper, Verdict verdict) {
        /** Checks the quantity. */
        public Value {
            Objects.requireNonNull(quantity, "quantity");
        }
    }

    /**
     * The cell of a pair of strategies.
     *
     * @param row the row index
     * @param column the column index
     * @return the cell, or empty when that match was not played
     */
    public Optional<Cell> cell(int row, int column) {
        return cells.stream().filter(c -> c.row() == row && c.column() == column).findFirst();
    }

    /**
     * One quantity's exact values as a matrix.
     *
     * @param q the quantity
     * @return [row][column], NaN where the match was not played or the quantity is not reported
     */
    public double[][] exact(Quantity q) {
        int n = strategies.size();
        double[][] out = new double[n][n];
        for (double[] r : out) {
            java.util.Arrays.fill(r, Double.NaN);
        }
        for (Cell c : cells) {
            c.value(q).ifPresent(v -> out[c.row()][c.column()] = v.exact());
        }
        return out;
    }

    /**
     * The matrices of an experiment's strategy set, one per grid point, in case order of the points'
     * first cells.
     *
     * @param e the experiment (with a strategy set)
     * @param results the case results, in case order
     * @param rows the corrected result rows
     * @return the matrices, empty when the experiment has no strategy set
     */
    public static List<SetMatrix> of(Experiment e, List<CaseResult> results, List<ResultRow> rows) {
        StrategySet set = e.strategySet();
        List<SetMatrix> out = new ArrayList<>();
        if (set == null) {
            return out;
        }
        List<String> setParameters = new ArrayList<>();
        for (StrategySet.Entry s : set.strategies()) {
            for (String ph : Grid.placeholders(s.spec())) {
                if (e.parameters().containsKey(ph) && !setParameters.contains(ph)) {
                    setParameters.add(ph);
                }
            }
        }
        Map<String, List<Double>> axes = new LinkedHashMap<>();
        e.parameters().forEach((k, v) -> {
            if (setParameters.contains(k)) {
                axes.put(k, v);
            }
        });
        List<Quantity> quantities = Quantities.reported(e);
        for (Map<String, Double> point : Grid.parameterPoints(axes)) {
            for (String noise : e.noise()) {
                for (String mis : e.misperception()) {
                    for (Horizon h : e.horizons()) {
                        List<Cell> cells = new ArrayList<>();
                        for (StrategySet.Cell sc : set.cells()) {
                            for (CaseResult r : results) {
                                Case c = r.c();
                                if (c.pair().equals(sc.pairName()) && c.noise().equals(noise)
                                    && c.misperception().equals(mis) && c.horizon().equals(h)
                                    && within(c.parameters(), point)) {
                                    cells.add(cell(e, sc, r, rows, quantities));
                                    break;
                                }
                            }
                        }
                        cells.sort((a, b) -> a.row() != b.row() ? Integer.compare(a.row(), b.row())
                            : Integer.compare(a.column(), b.column()));
                        out.add(new SetMatrix(set.names(), point, noise, mis, h, cells));
                    }
                }
            }
        }
        return out;
    }

    private static boolean within(Map<String, Double> own, Map<String, Double> point) {
        return own.entrySet().stream().allMatch(en -> en.getValue().equals(point.get(en.getKey())));
    }

    private static Cell cell(Experiment e, StrategySet.Cell sc, CaseResult r, List<ResultRow> rows,
        List<Quantity> quantities) {
        int index = r.c().index();
        GameSummary summary = CaseAnalysis.summary(r.simulation());
        List<Value> values = new ArrayList<>();
        double[] longRun = r.exact() == null ? null : r.exact().prediction().limitFrequencies();
        boolean unique = r.exact() != null && r.exact().prediction().stationary() != null;
        for (Quantity q : quantities) {
            double exact = r.exact() == null ? Double.NaN : Quantities.exact(q, r);
            double lr = longRun == null ? Double.NaN : Quantities.value(q, r.c().match().game(), longRun);
            double mean = Double.NaN;
            double lo = Double.NaN;
            double hi = Double.NaN;
            if (summary.games() >= 2) {
                Estimate est = Quantities.estimate(q, r.c().match().game(), summary);
                if (est != null) {
                    Interval ci = est.interval(1 - e.alpha());
                    mean = est.value();
                    lo = ci.lower();
                    hi = ci.upper();
                }
            }
            Verdict v = rows.stream().filter(row -> row.caseIndex() == index && row.subject().equals(q)
                && row.comparisonKind() == ComparisonKind.EXACT).map(ResultRow::verdict).findFirst().orElse(null);
            values.add(new Value(q, exact, lr, unique, mean, lo, hi, v));
        }
        boolean disagrees = rows.stream().anyMatch(row -> row.caseIndex() == index
            && row.comparisonKind().countsTowardsExit() && row.verdict() == Verdict.DISAGREES);
        return new Cell(sc.row(), sc.column(), r.c(), values, disagrees);
    }
}
