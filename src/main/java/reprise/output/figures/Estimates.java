package reprise.output.figures;

import java.util.Arrays;

/**
 * Simulated estimates with an interval each: drawn as markers with vertical error bars from
 * {@code lower[i]} to {@code upper[i]}.
 *
 * <p>The interval is whatever the caller computed (for example a 95% confidence interval that allows
 * for autocorrelated play); the figure only draws it, and the legend calls it "interval". A point with
 * a NaN or infinite estimate is skipped; a point with a usable estimate but a NaN bound is drawn without
 * its error bar. Both cases are reported in the figure's notes.
 *
 * @param x the abscissae (game length, continuation probability, round, ...)
 * @param estimate the point estimates
 * @param lower the lower interval bounds, {@code lower[i] <= estimate[i]}
 * @param upper the upper interval bounds, {@code upper[i] >= estimate[i]}
 */
public record Estimates(double[] x, double[] estimate, double[] lower, double[] upper) {

    /**
     * Validates lengths and the order of bounds where all three values are numbers, and copies the
     * arrays.
     *
     * @param x at least one value
     * @param estimate as many values as {@code x}
     * @param lower as many values as {@code x}
     * @param upper as many values as {@code x}
     */
    public Estimates {
        x = Validation.nonEmpty("estimate x values", x);
        estimate = Validation.sameLength("estimates", estimate, x.length);
        lower = Validation.sameLength("lower interval bounds", lower, x.length);
        upper = Validation.sameLength("upper interval bounds", upper, x.length);
        for (int i = 0; i < x.length; i++) {
            if (lower[i] > estimate[i] || estimate[i] > upper[i]) {
                throw new IllegalArgumentException("interval " + i + " must satisfy lower <= estimate <= upper: "
                    + lower[i] + ", " + estimate[i] + ", " + upper[i]);
            }
        }
    }

    /**
     * Estimates without intervals (every bound NaN, so no error bars are drawn).
     *
     * @param x the abscissae
     * @param estimate the estimates
     * @return the estimates
     */
    public static Estimates withoutIntervals(double[] x, double[] estimate) {
        double[] none = new double[x == null ? 0 : x.length];
        Arrays.fill(none, Double.NaN);
        return new Estimates(x, estimate, none, none.clone());
    }

    /** @return the number of points */
    public int size() {
        return x.length;
    }

    /** @return the x values (a copy) */
    @Override
    public double[] x() {
        return x.clone();
    }

    /** @return the estimates (a copy) */
    @Override
    public double[] estimate() {
        return estimate.clone();
    }

    /** @return the lower interval ends (a copy) */
    @Override
    public double[] lower() {
        return lower.clone();
    }

    /** @return the upper interval ends (a copy) */
    @Override
    public double[] upper() {
        return upper.clone();
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof Estimates e && Arrays.equals(x, e.x) && Arrays.equals(estimate, e.estimate)
            && Arrays.equals(lower, e.lower) && Arrays.equals(upper, e.upper);
    }

    @Override
    public int hashCode() {
        return Arrays.hashCode(new int[] {Arrays.hashCode(x), Arrays.hashCode(estimate), Arrays.hashCode(lower),
            Arrays.hashCode(upper)});
    }

    @Override
    public String toString() {
        return "Estimates[" + x.length + " points]";
    }
}
