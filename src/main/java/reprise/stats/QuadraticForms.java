package reprise.stats;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.DecompositionSolver;
import org.apache.commons.math3.linear.EigenDecomposition;
import org.apache.commons.math3.linear.LUDecomposition;
import org.apache.commons.math3.linear.RealVector;

/**
 * Wald-type quadratic forms d' C^- d with explicit handling of singular and degenerate covariances.
 *
 * <p>Implementation note. Let d = observed - expected and C the covariance of the observed vector.
 * <ol>
 *   <li>A coordinate whose variance C_ii is at most 1e-12 max_j C_jj is deterministic under the
 *       hypothesis. If |d_i| &le; 1e-9 max(|observed|, |expected|) (infinity norm) it is dropped;
 *       otherwise the hypothesis is impossible and the caller reports p = 0.</li>
 *   <li>Pseudo-inverse route: eigen-decompose the remaining C (Commons Math, symmetric QL). Eigenvalues
 *       at most 1e-10 lambda_max are treated as zero (rounding in a covariance computed in double is
 *       about 1e-15 lambda_max; genuine variance ratios in repeated games are far above 1e-10). The
 *       deviation must have no component along those null directions (the same 1e-9 tolerance), else the
 *       hypothesis is impossible; the form is sum_k (v_k . d)^2 / lambda_k over the rest and the rank
 *       is their number (Moore 1977).</li>
 *   <li>Drop route: the remaining C is assumed to have exactly one null direction, the all-ones vector
 *       (components that sum to a constant, like the state counts of a fixed-length game). One coordinate
 *       is dropped and the rest is inverted by LU (after scaling by max C_ii). The result does not depend
 *       on which coordinate is dropped, and equals the pseudo-inverse form (Moore 1977).</li>
 * </ol>
 *
 * <p>References: Moore, D.S. (1977). Generalized inverses, Wald's method, and the construction of
 * chi-squared tests of fit. Journal of the American Statistical Association 72, 131-137.
 */
final class QuadraticForms {

    /** Relative tolerance for a zero variance on the diagonal. */
    static final double VARIANCE_TOLERANCE = 1e-12;
    /** Relative tolerance for a zero eigenvalue. */
    static final double EIGENVALUE_TOLERANCE = 1e-10;
    /** Relative tolerance for a deviation that should be zero. */
    static final double DEVIATION_TOLERANCE = 1e-9;

    /**
     * The outcome.
     *
     * @param value the quadratic form (+infinity if impossible)
     * @param rank the degrees of freedom
     * @param impossible whether the data contradict a deterministic part of the hypothesis
     * @param note what was dropped, or why it is impossible
     */
    record Form(double value, int rank, boolean impossible, String note) {
    }

    private QuadraticForms() {
    }

    /**
     * The form by either route.
     *
     * @param observed the observed vector
     * @param expected its expectation under the hypothesis
     * @param covariance its covariance (symmetric, already validated)
     * @param names component names for notes
     * @param drop the coordinate to drop, or -1 for the pseudo-inverse route
     * @return the form
     */
    static Form compute(double[] observed, double[] expected, double[][] covariance, String[] names, int drop) {
        int k = observed.length;
        double[] d = new double[k];
        double scale = 0;
        double maxVariance = 0;
        for (int i = 0; i < k; i++) {
            d[i] = observed[i] - expected[i];
            scale = Math.max(scale, Math.max(Math.abs(observed[i]), Math.abs(expected[i])));
            maxVariance = Math.max(maxVariance, covariance[i][i]);
        }
        double deviationTolerance = DEVIATION_TOLERANCE * scale;
        List<Integer> kept = new ArrayList<>();
        List<String> droppedNames = new ArrayList<>();
        for (int i = 0; i < k; i++) {
            if (covariance[i][i] <= VARIANCE_TOLERANCE * maxVariance) {
                if (Math.abs(d[i]) > deviationTolerance) {
                    return new Form(Double.POSITIVE_INFINITY, 0, true, String.format(Locale.ROOT,
                        "%s has zero variance under the hypothesis but observed %s differs from expected %s",
                        names[i], observed[i], expected[i]));
                }
                droppedNames.add(names[i]);
            } else {
                kept.add(i);
            }
        }
        String note = droppedNames.isEmpty() ? ""
            : "dropped zero-variance components equal to their expectation: " + String.join(", ", droppedNames);
        int m = kept.size();
        if (m == 0) {
            return new Form(0, 0, false, note.isEmpty() ? "nothing to test" : note);
        }
        double[] dk = new double[m];
        double[][] ck = new double[m][m];
        for (int a = 0; a < m; a++) {
            dk[a] = d[kept.get(a)];
            for (int b = 0; b < m; b++) {
                ck[a][b] = covariance[kept.get(a)][kept.get(b)];
            }
        }
        return drop < 0 ? pseudoInverse(dk, ck, deviationTolerance, note)
            : dropOne(dk, ck, kept, drop, names, deviationTolerance, note);
    }

    private static Form pseudoInverse(double[] d, double[][] c, double deviationTolerance, String note) {
        EigenDecomposition eigen = new EigenDecomposition(new Array2DRowRealMatrix(c, false));
        double[] lambda = eigen.getRealEigenvalues();
        double max = 0;
        for (double l : lambda) {
            max = Math.max(max, l);
        }
        RealVector dv = new ArrayRealVector(d, false);
        double value = 0;
        int rank = 0;
        for (int i = 0; i < lambda.length; i++) {
            double projection = eigen.getEigenvector(i).dotProduct(dv);
            if (lambda[i] <= EIGENVALUE_TOLERANCE * max) {
                if (Math.abs(projection) > deviationTolerance) {
                    return new Form(Double.POSITIVE_INFINITY, rank, true, String.format(Locale.ROOT,
                        "the deviation has a component %s along a direction of zero variance under the "
                            + "hypothesis (a combination it fixes, such as the sum of all components)", projection));
                }
            } else {
                value += projection * projection / lambda[i];
                rank++;
            }
        }
        return new Form(value, rank, false, note);
    }

    private static Form dropOne(double[] d, double[][] c, List<Integer> kept, int drop, String[] names,
                                double deviationTolerance, String note) {
        int m = d.length;
        double sum = 0;
        double maxVariance = 0;
        for (int a = 0; a < m; a++) {
            sum += d[a];
            maxVariance = Math.max(maxVariance, c[a][a]);
        }
        if (Math.abs(sum) > deviationTolerance * m) {
            return new Form(Double.POSITIVE_INFINITY, m - 1, true, String.format(Locale.ROOT,
                "the deviations sum to %s, but the components sum to a constant under the hypothesis", sum));
        }
        int position = kept.indexOf(drop);
        if (position < 0) {
            position = m - 1;
        }
        String dropNote = "dropped " + names[kept.get(position)] + " (components sum to a constant)";
        note = note.isEmpty() ? dropNote : note + "; " + dropNote;
        if (m == 1) {
            return new Form(0, 0, false, note);
        }
        double[] dr = new double[m - 1];
        double[][] cr = new double[m - 1][m - 1];
        for (int a = 0, ra = 0; a < m; a++) {
            if (a == position) {
                continue;
            }
            dr[ra] = d[a];
            for (int b = 0, rb = 0; b < m; b++) {
                if (b == position) {
                    continue;
                }
                cr[ra][rb++] = c[a][b] / maxVariance;
            }
            ra++;
        }
        DecompositionSolver solver = new LUDecomposition(new Array2DRowRealMatrix(cr, false),
            EIGENVALUE_TOLERANCE).getSolver();
        if (!solver.isNonSingular()) {
            throw new IllegalArgumentException("the covariance is still singular after dropping "
                + names[kept.get(position)] + "; use the pseudo-inverse route instead");
        }
        RealVector x = solver.solve(new ArrayRealVector(dr, false));
        return new Form(x.dotProduct(new ArrayRealVector(dr, false)) / maxVariance, m - 1, false, note);
    }
}
