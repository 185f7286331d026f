package reprise.stats;

import java.util.Locale;
import java.util.function.DoubleSupplier;

/**
 * Monte Carlo p-values under a fully specified hypothesis: draw the test statistic T_1, T_2, ... from the
 * hypothesis (for reprise: whole studies drawn from the exact chain, see {@link ExactModelReference}) and
 * compare them with the observed t. Upper-tail tests (large T is evidence against the hypothesis).
 *
 * <ul>
 *   <li>{@link #fixed}: B draws, p = (1 + #{T_b &ge; t}) / (B + 1) (Davison &amp; Hinkley 1997, eq. 4.11;
 *       North, Curtis &amp; Sham 2002). Under the hypothesis P(p &le; u) &le; u for every u, exactly, however
 *       small B is (T and the T_b are exchangeable); the smallest attainable p-value is 1 / (B + 1).</li>
 *   <li>{@link #sequential}: the sequential rule of Besag &amp; Clifford (1991): draw until h draws reach t
 *       or n - 1 draws are made; with L draws and h exceedances p = h / L, with all n - 1 draws and g &lt; h
 *       exceedances p = (g + 1) / n. Equally valid, and a p-value far from the threshold costs about h / p
 *       draws instead of n.</li>
 * </ul>
 * <b>Resolving a threshold.</b> To decide "p &lt; alpha*" at a corrected threshold alpha* (for Holm's first
 * step alpha / m), {@link #drawsToResolve} gives n = ceil(k / alpha*) draws: then 1 / n &lt; alpha* is
 * attainable and, at a true p equal to alpha*, about k exceedances are expected, so the estimate's
 * relative standard error there is about 1 / sqrt(k) (k = 20: 22%). A cap on draws that is smaller than
 * that cannot resolve alpha*: the result says so ({@link Result#resolves}) and the honest verdict is
 * inconclusive.
 *
 * <p>Ties: a draw counts as reaching t when T_b &ge; t - 1e-12 max(1, |t|), so that a discrete statistic
 * recomputed in floating point does not miss its own value (a conservative choice: ties count against the
 * hypothesis' rejection). NaN draws are an error.
 *
 * <p>References:
 * <ul>
 *   <li>Davison, A.C. &amp; Hinkley, D.V. (1997). Bootstrap Methods and their Application. Cambridge
 *       University Press, section 4.2.</li>
 *   <li>North, B.V., Curtis, D. &amp; Sham, P.C. (2002). A note on the calculation of empirical P values
 *       from Monte Carlo procedures. American Journal of Human Genetics 71(2), 439-441.</li>
 *   <li>Besag, J. &amp; Clifford, P. (1991). Sequential Monte Carlo p-values. Biometrika 78(2), 301-304.</li>
 * </ul>
 */
public final class MonteCarloPValue {

    /** Expected exceedances at the threshold that {@link #drawsToResolve} aims for. */
    public static final int DEFAULT_EXCEEDANCES = 20;

    /**
     * A Monte Carlo p-value.
     *
     * @param pValue the p-value, in (0, 1]
     * @param draws the number of statistics drawn
     * @param exceedances the number of draws that reached the observed value
     * @param smallestAttainable the smallest p-value this rule could have returned with its budget
     * @param note one line: the rule and its figures
     */
    public record Result(double pValue, long draws, long exceedances, double smallestAttainable, String note) {

        /**
         * Whether the budget could resolve a threshold, i.e. whether a p-value below it was attainable.
         *
         * @param threshold alpha* in (0, 1)
         * @return true if the smallest attainable p-value is below the threshold
         */
        public boolean resolves(double threshold) {
            return smallestAttainable < Checks.level("threshold", threshold);
        }

        /** @return the result as a {@link TestResult} with the given statistic and degrees of freedom */
        TestResult asTest(double statistic, double degreesOfFreedom) {
            return new TestResult(statistic, degreesOfFreedom, pValue, note);
        }
    }

    private MonteCarloPValue() {
    }

    /**
     * The number of draws that resolves a threshold (see the class description).
     *
     * @param threshold alpha* in (0, 1)
     * @param exceedances k &ge; 1, the expected exceedances at a p-value equal to the threshold
     * @return ceil(k / alpha*)
     */
    public static long drawsToResolve(double threshold, int exceedances) {
        Checks.level("threshold", threshold);
        if (exceedances < 1) {
            throw new IllegalArgumentException("expected exceedances must be at least 1: " + exceedances);
        }
        return (long) Math.ceil(exceedances / threshold);
    }

    /**
     * The fixed-B p-value (1 + #{T_b &ge; t}) / (B + 1).
     *
     * @param observed t, finite or +infinity
     * @param draw one statistic drawn under the hypothesis per call
     * @param draws B &ge; 1
     * @return the p-value
     */
    public static Result fixed(double observed, DoubleSupplier draw, long draws) {
        checkObserved(observed);
        if (draws < 1) {
            throw new IllegalArgumentException("number of Monte Carlo draws must be at least 1: " + draws);
        }
        double bar = bar(observed);
        long hits = 0;
        for (long b = 0; b < draws; b++) {
            if (drawn(draw) >= bar) {
                hits++;
            }
        }
        double p = (1.0 + hits) / (draws + 1.0);
        return new Result(p, draws, hits, 1.0 / (draws + 1.0), String.format(Locale.ROOT,
            "Monte Carlo p-value under the exact model: (1 + %d) / (%d + 1)", hits, draws));
    }

    /**
     * The sequential p-value of Besag &amp; Clifford (1991).
     *
     * @param observed t
     * @param draw one statistic drawn under the hypothesis per call
     * @param exceedances h &ge; 1: stop after h draws reach t
     * @param maximumDraws n - 1 &ge; h: the most draws made
     * @return the p-value
     */
    public static Result sequential(double observed, DoubleSupplier draw, int exceedances, long maximumDraws) {
        checkObserved(observed);
        if (exceedances < 1 || maximumDraws < exceedances) {
            throw new IllegalArgumentException("sequential Monte Carlo needs 1 <= exceedances <= maximum draws: "
                + exceedances + ", " + maximumDraws);
        }
        double bar = bar(observed);
        long hits = 0;
        long made = 0;
        while (made < maximumDraws) {
            made++;
            if (drawn(draw) >= bar) {
                hits++;
                if (hits == exceedances) {
                    double p = hits / (double) made;
                    return new Result(p, made, hits, 1.0 / (maximumDraws + 1.0), String.format(Locale.ROOT,
                        "sequential Monte Carlo p-value under the exact model (Besag & Clifford): %d of %d draws "
                            + "reached the observed value", hits, made));
                }
            }
        }
        double p = (hits + 1.0) / (maximumDraws + 1.0);
        return new Result(p, made, hits, 1.0 / (maximumDraws + 1.0), String.format(Locale.ROOT,
            "sequential Monte Carlo p-value under the exact model (Besag & Clifford): (1 + %d) / (%d + 1)", hits,
            maximumDraws));
    }

    private static void checkObserved(double t) {
        if (Double.isNaN(t) || t == Double.NEGATIVE_INFINITY) {
            throw new IllegalArgumentException("observed statistic must be a number or +infinity: " + t);
        }
    }

    private static double bar(double t) {
        return t == Double.POSITIVE_INFINITY ? t : t - 1e-12 * Math.max(1, Math.abs(t));
    }

    private static double drawn(DoubleSupplier draw) {
        double t = draw.getAsDouble();
        if (Double.isNaN(t)) {
            throw new IllegalStateException("a Monte Carlo draw of the statistic was NaN");
        }
        return t;
    }
}
