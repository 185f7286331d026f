package reprise.stats;

/**
 * The outcome of a significance test.
 *
 * <p>{@code pValue} is an upper-tail probability computed from a survival function (or an exact or Monte
 * Carlo tail sum where the test says so). A p-value of exactly 0 with a non-empty {@code note} means the
 * data are impossible under the hypothesis (for example a transition the hypothesis gives probability 0,
 * or a zero-variance component whose observed value differs from its expectation); the statistic is then
 * {@link Double#POSITIVE_INFINITY}.
 *
 * @param statistic the test statistic (chi-square, T^2, ...), or +infinity for an impossible outcome
 * @param degreesOfFreedom the (numerator) degrees of freedom of the reference distribution; 0 when
 *     nothing was left to test
 * @param pValue the p-value in [0, 1]
 * @param note a one-line remark on how the test was done (method used, components dropped, why p = 0);
 *     empty when there is nothing to say
 * @param smallSample what was done because expected counts were too small for the large-sample reference
 *     distribution ({@link SmallSample#NONE} when nothing was), the structured form of part of the note
 */
public record TestResult(double statistic, double degreesOfFreedom, double pValue, String note,
    SmallSample smallSample) {

    /**
     * What a test did about expected counts too small for its chi-square or normal reference
     * distribution: the method, and for pooling the number of cells merged into another.
     *
     * @param method the remedy; a new remedy is added as a constant of {@link Method}
     * @param cellsPooled the cells merged into another: at least 1 for {@link Method#POOLED}, else 0
     */
    public record SmallSample(Method method, int cellsPooled) {

        /** Nothing was done. */
        public static final SmallSample NONE = new SmallSample(Method.NONE, 0);
        /** An exact test by enumeration. */
        public static final SmallSample EXACT = new SmallSample(Method.EXACT, 0);
        /** A Monte Carlo estimate of the exact p-value. */
        public static final SmallSample MONTE_CARLO = new SmallSample(Method.MONTE_CARLO, 0);

        /** The remedies. */
        public enum Method {
            /** Nothing: the large-sample reference distribution was used as is (or none was needed). */
            NONE,
            /** Sparse cells of a contingency table were pooled before the chi-square test. */
            POOLED,
            /** An exact test by complete enumeration replaced the chi-square approximation. */
            EXACT,
            /** A Monte Carlo estimate of the exact p-value replaced the chi-square approximation. */
            MONTE_CARLO
        }

        /**
         * Validates the pair.
         *
         * @param method not null
         * @param cellsPooled positive exactly for pooling
         */
        public SmallSample {
            if (method == null) {
                throw new IllegalArgumentException("small-sample method must not be null (use NONE)");
            }
            if ((method == Method.POOLED) != (cellsPooled > 0) || cellsPooled < 0) {
                throw new IllegalArgumentException("cells pooled must be positive for pooling and 0 otherwise: "
                    + method + ", " + cellsPooled);
            }
        }

        /**
         * Pooling of sparse cells.
         *
         * @param cells the cells merged into another, at least 1
         * @return the remedy
         */
        public static SmallSample pooled(int cells) {
            return new SmallSample(Method.POOLED, cells);
        }
    }

    /**
     * A result with {@link SmallSample#NONE}.
     *
     * @param statistic not NaN
     * @param degreesOfFreedom at least 0; positive infinity for a normal (z) reference
     * @param pValue in [0, 1]
     * @param note not null
     */
    public TestResult(double statistic, double degreesOfFreedom, double pValue, String note) {
        this(statistic, degreesOfFreedom, pValue, note, SmallSample.NONE);
    }

    /**
     * Validates the result.
     *
     * @param statistic not NaN
     * @param degreesOfFreedom at least 0; positive infinity for a normal (z) reference
     * @param pValue in [0, 1]
     * @param note not null
     * @param smallSample not null
     */
    public TestResult {
        if (Double.isNaN(statistic)) {
            throw new IllegalArgumentException("test statistic must not be NaN");
        }
        if (!(degreesOfFreedom >= 0)) {
            throw new IllegalArgumentException("degrees of freedom must be >= 0 (infinite for a normal reference): "
                + degreesOfFreedom);
        }
        Checks.probability("p-value", pValue);
        if (note == null) {
            throw new IllegalArgumentException("note must not be null (use an empty string)");
        }
        if (smallSample == null) {
            throw new IllegalArgumentException("small-sample method must not be null (use NONE)");
        }
    }

    /**
     * Whether the hypothesis is rejected at level alpha, that is whether {@code pValue < alpha}.
     *
     * @param alpha the significance level in (0, 1)
     * @return true if rejected
     */
    public boolean reject(double alpha) {
        Checks.level("significance level alpha", alpha);
        return pValue < alpha;
    }

    /**
     * The same result with more note text and a small-sample method.
     *
     * @param extra appended to the note as is (include any separator)
     * @param remedy the small-sample remedy now in effect
     * @return a new result
     */
    public TestResult withSmallSample(String extra, SmallSample remedy) {
        return new TestResult(statistic, degreesOfFreedom, pValue, note + extra, remedy);
    }

    static TestResult impossible(double degreesOfFreedom, String why) {
        return new TestResult(Double.POSITIVE_INFINITY, degreesOfFreedom, 0, why);
    }
}
