package reprise.output;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVPrinter;
import reprise.experiment.CaseResult;

/**
 * {@code cases.csv}: one row per case with its parameters, seed, sizes, the exact chain's long-run facts
 * and the case's warnings.
 */
public final class CasesCsv {

    private static final List<String> TAIL = List.of("seed", "replicates", "games_tallied", "rounds_total",
        "mean_tallied_length", "chain_states", "stationary_CC", "stationary_CD", "stationary_DC", "stationary_DD",
        "exact_CC", "exact_CD", "exact_DC", "exact_DD", "simulated_CC", "simulated_CD", "simulated_DC",
        "simulated_DD", "second_eigenvalue_modulus", "mixing_time", "fast_path", "warnings");

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
                    out.printRecord(cells);
                }
            }
        });
    }
}
