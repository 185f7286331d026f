package reprise.chain;

import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Deque;
import java.util.List;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.LUDecomposition;
import org.apache.commons.math3.linear.RealMatrix;

/**
 * The long-run structure of a chain: its closed communicating classes, transient states, where play
 * ends up from the first-round distribution, and the stationary distribution when it is unique.
 *
 * <p>A closed class is a set of states that communicate and that play never leaves. Each has its own
 * stationary distribution pi_c (computed by GTH state reduction on the class) and a period. Starting from
 * v_1, play enters class c with probability a_c (the absorption probability); the time average of the
 * state distribution, lim (1/n) sum_{t&le;n} v_t, always exists (also for periodic classes) and equals
 * sum_c a_c pi_c. The stationary distribution is unique exactly when there is one closed class; then it
 * is {@link #stationary()}, otherwise that is null and {@link #note()} names the classes.
 *
 * <p>Class membership is decided by which transition probabilities are exactly zero; a probability that
 * underflows to zero (for example an error rate of 1e-200 squared) counts as impossible.
 *
 * <p>Implementation note. Classes by Tarjan's strongly connected components on the non-zero pattern;
 * absorption probabilities by one LU solve of (I - Q) on the transient states (Q is substochastic with
 * every transient state leaking, so the system is non-singular); precision about cond(I - Q) * 1e-16,
 * which is small unless transient states are left only with tiny probability.
 *
 * <p>References:
 * Kemeny, J.G. &amp; Snell, J.L. (1960). Finite Markov Chains. Van Nostrand, ch. 3.
 * Tarjan, R. (1972). Depth-first search and linear graph algorithms. SIAM J. Computing 1(2), 146-160.
 *
 * @param closedClasses the closed classes, each a sorted array of chain states, ordered by smallest state
 * @param periods the period of each closed class
 * @param transientStates the states outside all closed classes, sorted
 * @param absorption the probability a_c that play from v_1 ends in each closed class
 * @param limitDistribution the time-average limit sum_c a_c pi_c over chain states
 * @param stationary the unique stationary distribution over chain states, or null
 * @param classDescriptions each closed class in readable form: "{CC}", "{CC, DD}" or a cycle "CD -> DC"
 * @param note null when the stationary distribution is unique, else a one-line explanation
 */
public record ChainStructure(List<int[]> closedClasses, int[] periods, int[] transientStates, double[] absorption,
    double[] limitDistribution, double[] stationary, List<String> classDescriptions, String note) {

    /**
     * Copies the arrays.
     *
     * @param closedClasses classes
     * @param periods periods
     * @param transientStates transient states
     * @param absorption absorption probabilities
     * @param limitDistribution limit
     * @param stationary stationary or null
     * @param classDescriptions descriptions
     * @param note note or null
     */
    public ChainStructure {
        closedClasses = closedClasses.stream().map(int[]::clone).toList();
        periods = periods.clone();
        transientStates = transientStates.clone();
        absorption = absorption.clone();
        limitDistribution = limitDistribution.clone();
        stationary = stationary == null ? null : stationary.clone();
        classDescriptions = List.copyOf(classDescriptions);
    }

    /** @return whether exactly one closed class exists (the stationary distribution is unique) */
    public boolean hasUniqueStationary() {
        return stationary != null;
    }

    /** @return the closed classes (copies) */
    @Override
    public List<int[]> closedClasses() {
        return closedClasses.stream().map(int[]::clone).toList();
    }

    /** @return periods (a copy) */
    @Override
    public int[] periods() {
        return periods.clone();
    }

    /** @return transient states (a copy) */
    @Override
    public int[] transientStates() {
        return transientStates.clone();
    }

    /** @return absorption probabilities (a copy) */
    @Override
    public double[] absorption() {
        return absorption.clone();
    }

    /** @return the time-average limit over chain states (a copy) */
    @Override
    public double[] limitDistribution() {
        return limitDistribution.clone();
    }

    /** @return the unique stationary distribution over chain states (a copy), or null */
    @Override
    public double[] stationary() {
        return stationary == null ? null : stationary.clone();
    }

    static ChainStructure analyze(MarkovChain chain) {
        String[] labels = new String[chain.size()];
        for (int i = 0; i < labels.length; i++) {
            labels[i] = chain.stateLabel(i);
        }
        return analyze(chain.matrix(), chain.initialDistribution(), labels);
    }

    static ChainStructure analyze(double[][] m, double[] v, String[] labels) {
        int k = m.length;
        int[] comp = components(m);
        int count = 0;
        for (int c : comp) {
            count = Math.max(count, c + 1);
        }
        boolean[] closed = new boolean[count];
        Arrays.fill(closed, true);
        for (int i = 0; i < k; i++) {
            for (int j = 0; j < k; j++) {
                if (m[i][j] > 0 && comp[i] != comp[j]) {
                    closed[comp[i]] = false;
                }
            }
        }
        List<int[]> classes = new ArrayList<>();
        List<Integer> transientList = new ArrayList<>();
        int[] seen = new int[count];
        Arrays.fill(seen, -1);
        for (int i = 0; i < k; i++) {
            if (!closed[comp[i]]) {
                transientList.add(i);
            } else if (seen[comp[i]] < 0) {
                seen[comp[i]] = classes.size();
                int c = comp[i];
                classes.add(java.util.stream.IntStream.range(0, k).filter(j -> comp[j] == c).toArray());
            }
        }
        int[] trans = transientList.stream().mapToInt(Integer::intValue).toArray();
        int nc = classes.size();
        double[][] pis = new double[nc][];
        int[] periods = new int[nc];
        List<String> descriptions = new ArrayList<>();
        for (int c = 0; c < nc; c++) {
            int[] cls = classes.get(c);
            double[][] sub = new double[cls.length][cls.length];
            for (int a = 0; a < cls.length; a++) {
                for (int b = 0; b < cls.length; b++) {
                    sub[a][b] = m[cls[a]][cls[b]];
                }
            }
            pis[c] = Gth.stationary(sub);
            periods[c] = period(sub);
            descriptions.add(describe(labels, cls, sub, periods[c]));
        }
        double[] absorption = absorption(m, v, classes, trans, comp, seen);
        double[] limit = new double[k];
        for (int c = 0; c < nc; c++) {
            int[] cls = classes.get(c);
            for (int a = 0; a < cls.length; a++) {
                limit[cls[a]] += absorption[c] * pis[c][a];
            }
        }
        double[] stationary = null;
        String note = null;
        if (nc == 1) {
            stationary = new double[k];
            int[] cls = classes.get(0);
            for (int a = 0; a < cls.length; a++) {
                stationary[cls[a]] = pis[0][a];
            }
        } else {
            note = "no unique stationary distribution: " + nc + " closed classes " + String.join(", ", descriptions)
                + "; the long-run frequencies depend on the first round (see the time-average limit)";
        }
        return new ChainStructure(classes, periods, trans, absorption, limit, stationary, descriptions, note);
    }

    private static double[] absorption(double[][] m, double[] v, List<int[]> classes, int[] trans, int[] comp,
        int[] classOfComp) {
        int nc = classes.size();
        double[] a = new double[nc];
        for (int c = 0; c < nc; c++) {
            for (int i : classes.get(c)) {
                a[c] += v[i];
            }
        }
        int t = trans.length;
        if (t == 0) {
            return a;
        }
        double[] vt = new double[t];
        double total = 0;
        for (int i = 0; i < t; i++) {
            vt[i] = v[trans[i]];
            total += vt[i];
        }
        if (total == 0) {
            return a;
        }
        RealMatrix iq = new Array2DRowRealMatrix(t, t);
        for (int i = 0; i < t; i++) {
            for (int j = 0; j < t; j++) {
                iq.setEntry(j, i, (i == j ? 1 : 0) - m[trans[i]][trans[j]]);
            }
        }
        // expected visits y with y (I - Q) = v_T, solved as (I - Q)^T y^T = v_T^T
        double[] y = new LUDecomposition(iq).getSolver().solve(new org.apache.commons.math3.linear.ArrayRealVector(vt))
            .toArray();
        for (int i = 0; i < t; i++) {
            double[] row = m[trans[i]];
            for (int j = 0; j < row.length; j++) {
                if (row[j] > 0 && classOfComp[comp[j]] >= 0) {
                    a[classOfComp[comp[j]]] += y[i] * row[j];
                }
            }
        }
        return a;
    }

    /** Tarjan's strongly connected components, iterative. */
    private static int[] components(double[][] m) {
        int k = m.length;
        int[] index = new int[k];
        int[] low = new int[k];
        int[] comp = new int[k];
        boolean[] onStack = new boolean[k];
        Arrays.fill(index, -1);
        Deque<Integer> stack = new ArrayDeque<>();
        int[] next = new int[k];
        int counter = 0;
        int compCount = 0;
        Deque<Integer> call = new ArrayDeque<>();
        for (int root = 0; root < k; root++) {
            if (index[root] >= 0) {
                continue;
            }
            call.push(root);
            index[root] = low[root] = counter++;
            stack.push(root);
            onStack[root] = true;
            while (!call.isEmpty()) {
                int u = call.peek();
                if (next[u] < k) {
                    int w = next[u]++;
                    if (!(m[u][w] > 0)) {
                        continue;
                    }
                    if (index[w] < 0) {
                        index[w] = low[w] = counter++;
                        stack.push(w);
                        onStack[w] = true;
                        call.push(w);
                    } else if (onStack[w]) {
                        low[u] = Math.min(low[u], index[w]);
                    }
                } else {
                    call.pop();
                    if (!call.isEmpty()) {
                        int parent = call.peek();
                        low[parent] = Math.min(low[parent], low[u]);
                    }
                    if (low[u] == index[u]) {
                        int w;
                        do {
                            w = stack.pop();
                            onStack[w] = false;
                            comp[w] = compCount;
                        } while (w != u);
                        compCount++;
                    }
                }
            }
        }
        return comp;
    }

    /** Period of an irreducible matrix: gcd of level[u] + 1 - level[w] over edges, from BFS levels. */
    private static int period(double[][] sub) {
        int k = sub.length;
        int[] level = new int[k];
        Arrays.fill(level, -1);
        level[0] = 0;
        Deque<Integer> queue = new ArrayDeque<>();
        queue.add(0);
        int g = 0;
        while (!queue.isEmpty()) {
            int u = queue.poll();
            for (int w = 0; w < k; w++) {
                if (sub[u][w] > 0) {
                    if (level[w] < 0) {
                        level[w] = level[u] + 1;
                        queue.add(w);
                    } else {
                        g = gcd(g, Math.abs(level[u] + 1 - level[w]));
                    }
                }
            }
        }
        return g == 0 ? 1 : g;
    }

    private static int gcd(int a, int b) {
        return b == 0 ? a : gcd(b, a % b);
    }

    private static String describe(String[] labels, int[] cls, double[][] sub, int period) {
        int k = cls.length;
        if (k > 1 && period == k) {
            StringBuilder sb = new StringBuilder(labels[cls[0]]);
            int u = 0;
            for (int step = 1; step < k; step++) {
                int w = 0;
                while (!(sub[u][w] > 0)) {
                    w++;
                }
                sb.append(" -> ").append(labels[cls[w]]);
                u = w;
            }
            return sb.toString();
        }
        StringBuilder sb = new StringBuilder("{");
        for (int a = 0; a < k; a++) {
            sb.append(a == 0 ? "" : ", ").append(labels[cls[a]]);
        }
        return sb.append('}').toString();
    }
}
