package reprise.stats;

import org.apache.commons.rng.UniformRandomProvider;

/** Test helpers: brute-force exact moments of per-game state counts, and a literal chain simulator. */
final class Chains {

    private Chains() {
    }

    /**
     * Exact mean and covariance of the per-game counts of an n-round game by enumerating every path
     * (m^n paths, each with its probability): a brute-force computation independent of the code under test.
     *
     * @return {mean (as a 1 x m array), covariance (m x m)} packed as m + 1 rows: row 0 the mean
     */
    static double[][] exactCountMoments(double[][] p, double[] start, int n) {
        int m = p.length;
        double[] mean = new double[m];
        double[][] second = new double[m][m];
        int[] path = new int[n];
        long paths = (long) Math.pow(m, n);
        for (long code = 0; code < paths; code++) {
            long c = code;
            for (int t = 0; t < n; t++) {
                path[t] = (int) (c % m);
                c /= m;
            }
            double prob = start[path[0]];
            for (int t = 1; t < n && prob > 0; t++) {
                prob *= p[path[t - 1]][path[t]];
            }
            if (prob == 0) {
                continue;
            }
            int[] counts = new int[m];
            for (int s : path) {
                counts[s]++;
            }
            for (int i = 0; i < m; i++) {
                mean[i] += prob * counts[i];
                for (int j = 0; j < m; j++) {
                    second[i][j] += prob * counts[i] * counts[j];
                }
            }
        }
        double[][] out = new double[m + 1][];
        out[0] = mean;
        for (int i = 0; i < m; i++) {
            out[i + 1] = new double[m];
            for (int j = 0; j < m; j++) {
                out[i + 1][j] = second[i][j] - mean[i] * mean[j];
            }
        }
        return out;
    }

    static double[][] covariance(double[][] moments) {
        double[][] c = new double[moments.length - 1][];
        for (int i = 0; i < c.length; i++) {
            c[i] = moments[i + 1].clone();
        }
        return c;
    }

    static int draw(double[] p, UniformRandomProvider rng) {
        double u = rng.nextDouble();
        double cumulative = 0;
        for (int j = 0; j < p.length - 1; j++) {
            cumulative += p[j];
            if (u < cumulative) {
                return j;
            }
        }
        return p.length - 1;
    }

    /** State counts of one simulated game of n rounds (first state drawn from start). */
    static long[] simulateCounts(double[][] p, double[] start, int n, UniformRandomProvider rng) {
        long[] counts = new long[p.length];
        int s = draw(start, rng);
        counts[s]++;
        for (int t = 1; t < n; t++) {
            s = draw(p[s], rng);
            counts[s]++;
        }
        return counts;
    }
}
