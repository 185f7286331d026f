package reprise.stats;

/**
 * A two-sided confidence interval around a point estimate.
 *
 * @param estimate the point estimate
 * @param lower the lower bound
 * @param upper the upper bound
 * @param confidence the nominal coverage in (0, 1), for example 0.95
 */
public record Interval(double estimate, double lower, double upper, double confidence) {

    /**
     * Validates the interval.
     *
     * @param estimate finite
     * @param lower finite, at most upper
     * @param upper finite
     * @param confidence in (0, 1)
     */
    public Interval {
        Checks.finite("estimate", estimate);
        Checks.finite("lower bound", lower);
        Checks.finite("upper bound", upper);
        Checks.level("confidence", confidence);
        if (!(lower <= upper)) {
            throw new IllegalArgumentException("lower bound must not exceed upper bound: " + lower + " > " + upper);
        }
    }

    /** @return (upper - lower) / 2 */
    public double halfWidth() {
        return 0.5 * (upper - lower);
    }

    /**
     * Whether the closed interval contains a value.
     *
     * @param value the value
     * @return true if lower &le; value &le; upper
     */
    public boolean contains(double value) {
        return lower <= value && value <= upper;
    }
}
