package reprise.stats;

import java.util.Arrays;
import java.util.Comparator;

/**
 * Adjusted p-values for a sweep of m tests.
 *
 * <ul>
 *   <li>Holm (1979), the default: sort p_(1) &le; ... &le; p_(m); adjusted
 *       p~_(i) = max_{j &le; i} min(1, (m - j + 1) p_(j)). Controls the family-wise error rate under any
 *       dependence.</li>
 *   <li>Benjamini &amp; Hochberg (1995): p~_(i) = min_{j &ge; i} min(1, m p_(j) / j). Controls the false
 *       discovery rate for independent or positively dependent tests.</li>
 * </ul>
 * Adjusted values are monotone in the raw ones and capped at 1; rejecting where p~ &lt; alpha is the
 * step-down (Holm) or step-up (BH) procedure at level alpha. Ties keep their input order.
 *
 * <p>References:
 * <ul>
 *   <li>Holm, S. (1979). A simple sequentially rejective multiple test procedure. Scandinavian Journal of
 *       Statistics 6(2), 65-70.</li>
 *   <li>Benjamini, Y. &amp; Hochberg, Y. (1995). Controlling the false discovery rate: a practical and
 *       powerful approach to multiple testing. Journal of the Royal Statistical Society B 57(1),
 *       289-300.</li>
 *   <li>Wright, S.P. (1992). Adjusted p-values for simultaneous inference. Biometrics 48, 1005-1013.</li>
 * </ul>
 */
public final class MultipleTesting {

    /** The adjustment. */
    public enum Method {
        /** Holm's step-down, family-wise error rate. */
        HOLM,
        /** Benjamini-Hochberg step-up, false discovery rate. */
        BENJAMINI_HOCHBERG
    }

    private MultipleTesting() {
    }

    /**
     * Holm-adjusted p-values.
     *
     * @param pValues the raw p-values in [0, 1], at least one
     * @return adjusted p-values in the input order
     */
    public static double[] adjust(double[] pValues) {
        return adjust(pValues, Method.HOLM);
    }

    /**
     * Adjusted p-values.
     *
     * @param pValues the raw p-values in [0, 1], at least one
     * @param method HOLM or BENJAMINI_HOCHBERG
     * @return adjusted p-values in the input order
     */
    public static double[] adjust(double[] pValues, Method method) {
        if (pValues == null || pValues.length == 0) {
            throw new IllegalArgumentException("p-values must have at least one entry: none");
        }
        int m = pValues.length;
        for (int i = 0; i < m; i++) {
            Checks.probability("p-value " + i, pValues[i]);
        }
        Integer[] order = new Integer[m];
        for (int i = 0; i < m; i++) {
            order[i] = i;
        }
        Arrays.sort(order, Comparator.comparingDouble(i -> pValues[i]));
        double[] out = new double[m];
        if (method == Method.HOLM) {
            double running = 0;
            for (int r = 0; r < m; r++) {
                running = Math.max(running, Math.min(1, (m - r) * pValues[order[r]]));
                out[order[r]] = running;
            }
        } else {
            double running = 1;
            for (int r = m - 1; r >= 0; r--) {
                running = Math.min(running, Math.min(1, m * pValues[order[r]] / (r + 1)));
                out[order[r]] = running;
            }
        }
        return out;
    }

    /**
     * Which hypotheses are rejected at level alpha.
     *
     * @param pValues the raw p-values
     * @param alpha the level in (0, 1)
     * @param method HOLM or BENJAMINI_HOCHBERG
     * @return true where the adjusted p-value is below alpha
     */
    public static boolean[] reject(double[] pValues, double alpha, Method method) {
        Checks.level("alpha", alpha);
        double[] a = adjust(pValues, method);
        boolean[] r = new boolean[a.length];
        for (int i = 0; i < a.length; i++) {
            r[i] = a[i] < alpha;
        }
        return r;
    }
}
