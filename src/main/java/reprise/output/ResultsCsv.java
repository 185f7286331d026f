package reprise.output;

import java.io.IOException;
import java.io.Reader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVPrinter;
import org.apache.commons.csv.CSVRecord;
import reprise.experiment.Case;
import reprise.experiment.ComparisonKind;
import reprise.experiment.ResultRow;
import reprise.experiment.Subject;
import reprise.experiment.Verdict;
import reprise.game.Horizon;

/**
 * {@code results.csv}: one row per case x quantity x comparison, in tidy long format.
 *
 * <p>Columns: case, pair, x, y, noise, misperception, horizon, horizon_value, one {@code param_NAME} per grid
 * parameter, quantity, comparison, predicted, observed, ci_lower, ci_upper, statistic, df, p_value,
 * p_adjusted, verdict, note, then the diagnosis columns ({@link #DIAGNOSIS_COLUMNS}, after the older ones
 * so that readers of the earlier layout keep working): regime, informative_games, skewness,
 * min_expected_count, p_method, mc_draws, interval_method, p_agree, p_agree_adjusted, p_disagree.
 * {@code p_value} is the p-value of the row's statistic (for a quantity: its z or t difference test);
 * {@code p_adjusted} is the corrected p-value of the row's "disagrees" test ({@code p_disagree}: |d| &gt; h
 * for rows with a tolerance, any difference for the distribution tests), so a counting row disagrees iff
 * p_adjusted &lt; alpha; {@code p_agree_adjusted} &lt; alpha is "agrees". Numbers are written with {@link Double#toString(double)} (they read back to
 * the same double); a number that does not apply is an empty cell.
 */
public final class ResultsCsv {

    /** The fixed columns before the parameters. */
    public static final List<String> CASE_COLUMNS = List.of("case", "pair", "x", "y", "noise", "misperception",
        "horizon", "horizon_value");
    /** The columns after the parameters. */
    public static final List<String> RESULT_COLUMNS = List.of("quantity", "comparison", "predicted", "observed",
        "ci_lower", "ci_upper", "statistic", "df", "p_value", "p_adjusted", "verdict", "note");
    /** The diagnosis columns, at the end of each row (see {@link ResultRow.Diagnosis}). */
    public static final List<String> DIAGNOSIS_COLUMNS = List.of("regime", "informative_games", "skewness",
        "min_expected_count", "p_method", "mc_draws", "interval_method", "p_agree", "p_agree_adjusted", "p_disagree");

    private ResultsCsv() {
    }

    /**
     * Writes the file atomically.
     *
     * @param file the target
     * @param cases the cases (for their parameters)
     * @param parameters the grid's parameter names, in file order
     * @param rows the rows
     */
    public static void write(Path file, List<Case> cases, List<String> parameters, List<ResultRow> rows) {
        List<String> header = new ArrayList<>(CASE_COLUMNS);
        parameters.forEach(p -> header.add("param_" + p));
        header.addAll(RESULT_COLUMNS);
        header.addAll(DIAGNOSIS_COLUMNS);
        AtomicFiles.writeText(file, w -> {
            try (CSVPrinter out = new CSVPrinter(w, CSVFormat.DEFAULT.builder().setHeader(header.toArray(String[]::new))
                .setRecordSeparator('\n').build())) {
                for (ResultRow r : rows) {
                    Case c = cases.get(r.caseIndex());
                    List<String> cells = caseCells(c, parameters);
                    cells.add(r.subject().label());
                    cells.add(r.comparisonKind().label());
                    cells.add(num(r.predicted()));
                    cells.add(num(r.observed()));
                    cells.add(num(r.lower()));
                    cells.add(num(r.upper()));
                    cells.add(num(r.statistic()));
                    cells.add(num(r.degreesOfFreedom()));
                    cells.add(num(r.pValue()));
                    cells.add(num(r.adjustedP()));
                    cells.add(r.verdict().word());
                    cells.add(r.note());
                    ResultRow.Diagnosis d = r.diagnosis();
                    cells.add(d.regime());
                    cells.add(num(d.informativeGames()));
                    cells.add(num(d.skewness()));
                    cells.add(num(d.minimumExpectedCount()));
                    cells.add(d.pMethod());
                    cells.add(num(d.monteCarloDraws()));
                    cells.add(d.intervalMethod());
                    cells.add(num(d.agreeP()));
                    cells.add(num(d.agreeAdjustedP()));
                    cells.add(num(d.disagreeP()));
                    out.printRecord(cells);
                }
            }
        });
    }

    static List<String> caseCells(Case c, List<String> parameters) {
        List<String> cells = new ArrayList<>();
        cells.add(c.id());
        cells.add(c.pair());
        cells.add(c.xSpec());
        cells.add(c.ySpec());
        cells.add(c.noise());
        cells.add(c.misperception());
        cells.add(c.horizon() instanceof Horizon.Rounds ? "rounds" : "continuation");
        cells.add(c.horizon() instanceof Horizon.Rounds r ? Long.toString(r.count())
            : Double.toString(((Horizon.Continuation) c.horizon()).probability()));
        for (String p : parameters) {
            Double v = c.parameters().get(p);
            cells.add(v == null ? "" : Double.toString(v));
        }
        return cells;
    }

    /**
     * Reads a results file back.
     *
     * @param file the file
     * @return the rows (caseIndex is the row's position among distinct cases, in file order; the
     *     small-sample method is not in the file and reads back as {@code NONE})
     * @throws IllegalArgumentException if the file is not a results file, or names an unknown quantity or
     *     comparison
     */
    public static List<ResultRow> read(Path file) {
        List<ResultRow> rows = new ArrayList<>();
        try (Reader r = Files.newBufferedReader(file, StandardCharsets.UTF_8);
             CSVParser p = CSVFormat.DEFAULT.builder().setHeader().setSkipHeaderRecord(true).build().parse(r)) {
            Map<String, Integer> header = p.getHeaderMap();
            for (String col : RESULT_COLUMNS) {
                if (!header.containsKey(col)) {
                    throw new IllegalArgumentException(file + ": not a results file, column '" + col + "' is missing");
                }
            }
            List<String> caseIds = new ArrayList<>();
            for (CSVRecord rec : p) {
                String id = rec.get("case");
                if (!caseIds.contains(id)) {
                    caseIds.add(id);
                }
                rows.add(ResultRow.builder(caseIds.indexOf(id), id, Subject.ofLabel(rec.get("quantity")),
                    ComparisonKind.ofLabel(rec.get("comparison"))).predicted(parse(rec.get("predicted")))
                    .observed(parse(rec.get("observed"))).interval(parse(rec.get("ci_lower")), parse(rec.get("ci_upper")))
                    .test(parse(rec.get("statistic")), parse(rec.get("df")), parse(rec.get("p_value")))
                    .adjustedP(parse(rec.get("p_adjusted"))).verdict(Verdict.ofWord(rec.get("verdict")))
                    .note(rec.get("note")).diagnosis(diagnosis(rec, header)).build());
            }
        } catch (IOException e) {
            throw new IllegalArgumentException(file + ": cannot be read: " + e.getMessage(), e);
        }
        return rows;
    }

    private static ResultRow.Diagnosis diagnosis(CSVRecord rec, Map<String, Integer> header) {
        if (!header.containsKey("p_disagree")) {
            return ResultRow.Diagnosis.NONE;
        }
        return new ResultRow.Diagnosis(rec.get("regime"), parse(rec.get("informative_games")),
            parse(rec.get("skewness")), parse(rec.get("min_expected_count")), rec.get("p_method"),
            parse(rec.get("mc_draws")), rec.get("interval_method"), parse(rec.get("p_agree")),
            parse(rec.get("p_agree_adjusted")), parse(rec.get("p_disagree")));
    }

    static String num(double v) {
        return Double.isNaN(v) ? "" : Double.toString(v);
    }

    static double parse(String s) {
        return s == null || s.isEmpty() ? Double.NaN : Double.parseDouble(s);
    }

    static String label(double v) {
        if (v == Math.rint(v) && Math.abs(v) < 1e15) {
            return Long.toString((long) v);
        }
        return java.math.BigDecimal.valueOf(v).stripTrailingZeros().toPlainString();
    }
}
