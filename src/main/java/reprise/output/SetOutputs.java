package reprise.output;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import reprise.experiment.CaseResult;
import reprise.experiment.Experiment;
import reprise.experiment.ResultRow;
import reprise.experiment.SetExactMatrix;
import reprise.experiment.SetMatrix;

/**
 * The outputs of an experiment's strategy set: {@code matrix.csv}, {@code matrix-exact.csv} and one
 * matrix figure per grid point in {@code figures/}. Nothing is written for an experiment without a
 * strategy set.
 */
public final class SetOutputs {

    /** The set's CSV files in the output folder. */
    public static final List<String> FILES = List.of("matrix.csv", "matrix-exact.csv");

    private SetOutputs() {
    }

    /**
     * Writes the strategy set's outputs.
     *
     * @param dir the output folder
     * @param e the experiment
     * @param results the case results, in case order
     * @param rows the corrected result rows
     * @return the files written, in order (empty without a strategy set)
     */
    public static List<Path> write(Path dir, Experiment e, List<CaseResult> results, List<ResultRow> rows) {
        List<Path> out = new ArrayList<>();
        if (e.strategySet() == null) {
            return out;
        }
        List<String> params = List.copyOf(e.parameters().keySet());
        List<SetMatrix> matrices = SetMatrix.of(e, results, rows);
        MatrixCsv.write(dir.resolve(FILES.get(0)), params, matrices);
        out.add(dir.resolve(FILES.get(0)));
        MatrixCsv.writeExact(dir.resolve(FILES.get(1)), e.strategySet().names(), params, SetExactMatrix.of(e));
        out.add(dir.resolve(FILES.get(1)));
        for (SetMatrix m : matrices) {
            out.add(MatrixFigure.write(m, e.game(), dir.resolve("figures").resolve(MatrixFigure.fileName(m))));
        }
        return out;
    }
}
