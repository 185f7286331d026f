package reprise.stats;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;

/**
 * Pools the sparse cells of each row of a transition table before the Anderson &amp; Goodman test, so
 * that every cell left has an expected count n_i p0_ij of at least a minimum (Cochran's rule of 5).
 *
 * <p>Within a row the positive-probability cells are taken in increasing order of hypothesised
 * probability and grouped greedily until each group's expected count reaches the minimum; a short last
 * group joins the one before it. A group's counts and probabilities are put in its first cell and the
 * other cells get count 0 and probability 0, which {@link TransitionTest} leaves out, so the table stays
 * square. Cells of probability 0 are not touched (a count there still makes the hypothesis impossible).
 * The grouping depends on the row totals only, on which the test conditions.
 *
 * <p>Implementation note: summing the probabilities of a group in floating point can exceed 1 by an
 * ulp when one group takes the whole row (0.9975 + 0.0025 ... = 1.0000000000000002), which a probability
 * check rejects. So the group with the largest probability gets 1 minus the sum of the other groups'
 * probabilities (each group's sum is at most 1 - that of the largest, so every entry stays in [0, 1]),
 * and a sum above 1 is clamped; the row then sums to 1 within one rounding.
 *
 * <p>References:
 * <ul>
 *   <li>Cochran, W.G. (1954). Some methods for strengthening the common chi-square tests. Biometrics
 *       10(4), 417-451.</li>
 *   <li>Anderson, T.W. &amp; Goodman, L.A. (1957). Statistical inference about Markov chains. Annals of
 *       Mathematical Statistics 28(1), 89-110.</li>
 * </ul>
 */
public final class SparseCells {

    /** Cochran's (1954) smallest expected count per cell. */
    public static final double COCHRAN_MINIMUM = 5;

    /**
     * A pooled table.
     *
     * @param counts the pooled counts, m x m
     * @param hypothesis the pooled probabilities, m x m, each row summing to 1 within one rounding and
     *     every entry in [0, 1]
     * @param merged the number of cells merged into another
     */
    public record Pooled(long[][] counts, double[][] hypothesis, int merged) {

        /**
         * The smallest expected count n_i p0_ij over the cells kept (p0_ij &gt; 0) of the rows with
         * transitions (n_i &gt; 0), the figure {@link TailTrust#cells} needs.
         *
         * @return the smallest expected count, +infinity if no row has a transition
         */
        public double smallestExpectedCount() {
            double min = Double.POSITIVE_INFINITY;
            for (int i = 0; i < counts.length; i++) {
                long ni = 0;
                for (long v : counts[i]) {
                    ni += v;
                }
                if (ni == 0) {
                    continue;
                }
                for (double p : hypothesis[i]) {
                    if (p > 0) {
                        min = Math.min(min, ni * p);
                    }
                }
            }
            return min;
        }
    }

    private SparseCells() {
    }

    /**
     * Pools the sparse cells of every row (see the class description).
     *
     * @param counts n_ij, m x m, counts &ge; 0
     * @param hypothesis p0, m x m, rows probability vectors (sum within 1e-9 of 1)
     * @param minimum the smallest expected count a pooled cell must reach, &gt; 0
     * @return the pooled table
     */
    public static Pooled pool(long[][] counts, double[][] hypothesis, double minimum) {
        Checks.positive("minimum expected count", minimum);
        if (counts == null || hypothesis == null || counts.length != hypothesis.length || counts.length < 2) {
            throw new IllegalArgumentException("transition counts and hypothesis must be square tables of the same "
                + "size, at least 2: " + (counts == null ? "none" : counts.length) + " and "
                + (hypothesis == null ? "none" : hypothesis.length));
        }
        int m = counts.length;
        long[][] outCounts = new long[m][];
        double[][] outP = new double[m][];
        int merged = 0;
        for (int i = 0; i < m; i++) {
            long[] n = Checks.counts("transition counts row " + i, counts[i], m);
            double[] p = Checks.distribution("hypothesised transition matrix row " + i, hypothesis[i], m);
            long ni = 0;
            for (long v : n) {
                ni += v;
            }
            List<Integer> cells = new ArrayList<>();
            for (int j = 0; j < m; j++) {
                if (p[j] > 0) {
                    cells.add(j);
                }
            }
            double[] row = p;
            cells.sort(Comparator.comparingDouble(j -> row[j]));
            List<List<Integer>> groups = new ArrayList<>();
            List<Integer> group = new ArrayList<>();
            double expected = 0;
            for (int j : cells) {
                group.add(j);
                expected += ni * p[j];
                if (expected >= minimum) {
                    groups.add(group);
                    group = new ArrayList<>();
                    expected = 0;
                }
            }
            if (!group.isEmpty()) {
                if (groups.isEmpty()) {
                    groups.add(group);
                } else {
                    groups.get(groups.size() - 1).addAll(group);
                }
            }
            long[] pooledN = n.clone();
            double[] pooledP = new double[m];
            int largest = -1;
            for (List<Integer> g : groups) {
                int first = g.get(0);
                double sum = 0;
                for (int j : g) {
                    sum += p[j];
                    if (j != first) {
                        pooledN[first] += n[j];
                        pooledN[j] = 0;
                        merged++;
                    }
                }
                pooledP[first] = Math.min(1, sum);
                if (largest < 0 || pooledP[first] > pooledP[largest]) {
                    largest = first;
                }
            }
            if (largest >= 0) {
                double others = 0;
                for (int j = 0; j < m; j++) {
                    if (j != largest) {
                        others += pooledP[j];
                    }
                }
                pooledP[largest] = Math.max(0, Math.min(1, 1 - others));
            }
            outCounts[i] = pooledN;
            outP[i] = pooledP;
        }
        return new Pooled(outCounts, outP, merged);
    }
}
