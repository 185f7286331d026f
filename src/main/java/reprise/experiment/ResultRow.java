package reprise.experiment;

import java.util.Objects;
import reprise.stats.Interval;
import reprise.stats.TestResult;

/**
 * One row of {@code results.csv}: one comparison of one subject in one case.
 *
 * <p>Numbers that do not apply are NaN (written as empty cells). Rows are built with
 * {@link #builder(Case, Subject, ComparisonKind)}, which starts every number at NaN, so a row kind
 * states only the numbers it has.
 *
 * @param caseIndex the case's index, at least 0
 * @param caseId the case's identifier
 * @param subject what is compared: a quantity, the states jointly, the transitions, or a snapshot
 * @param comparisonKind what it is compared with
 * @param predicted the value compared with (exact, stationary or claimed)
 * @param observed the simulated estimate (or, for claim-vs-exact, the exact value)
 * @param lower lower end of the confidence interval of the observed value
 * @param upper upper end, not below {@code lower}
 * @param statistic the test statistic
 * @param degreesOfFreedom its degrees of freedom, NaN or at least 0
 * @param pValue the unadjusted p-value, NaN or in [0, 1]
 * @param adjustedP the p-value after the multiple-testing correction, NaN or in [0, 1]
 * @param verdict the outcome in plain words
 * @param note a short explanation (test used, bias, games needed), possibly empty
 * @param smallSample what the test did about small expected counts ({@code NONE} for rows without a test,
 *     and for rows read back from a file, which keeps only the note)
 * @param diagnosis the regime of the row and how its p-values and interval were made ({@link Diagnosis#NONE}
 *     for rows without one)
 */
public record ResultRow(int caseIndex, String caseId, Subject subject, ComparisonKind comparisonKind,
    double predicted, double observed, double lower, double upper, double statistic, double degreesOfFreedom,
    double pValue, double adjustedP, Verdict verdict, String note, TestResult.SmallSample smallSample,
    Diagnosis diagnosis) {

    /**
     * How far a row's approximations can be trusted, and what was used instead where they could not
     * (issue 12's columns of results.csv, written after the older ones).
     *
     * @param regime the regime of the quantity or of the worst state, e.g. "sparse: 3.2 informative games of
     *     10, skewness 7.1", or empty
     * @param informativeGames expected games in which the quantity is not at its modal value, or NaN
     * @param skewness skewness of one game's value (of the worst state for joint tests), or NaN
     * @param minimumExpectedCount the smallest expected count that the test's reference rests on (state,
     *     cell or snapshot category), or NaN
     * @param pMethod how the p-value was found: "asymptotic", "monte-carlo", "exact", "interval" (inverted
     *     from the reported interval family), or empty
     * @param monteCarloDraws studies drawn from the exact model for the p-value, or NaN
     * @param intervalMethod how the interval was made: "t", "effective-size", "finite-sample", "constant", or
     *     empty
     * @param agreeP the p-value for "|d| &lt; h" (TOST), NaN for rows without a tolerance
     * @param agreeAdjustedP it after the multiple-testing correction
     * @param disagreeP the p-value for "|d| &gt; h" (rows with a tolerance) or "any difference" (the others),
     *     the one whose adjusted value is {@code adjustedP}
     */
    public record Diagnosis(String regime, double informativeGames, double skewness, double minimumExpectedCount,
        String pMethod, double monteCarloDraws, String intervalMethod, double agreeP, double agreeAdjustedP,
        double disagreeP) {

        /** No diagnosis. */
        public static final Diagnosis NONE = new Diagnosis("", Double.NaN, Double.NaN, Double.NaN, "", Double.NaN,
            "", Double.NaN, Double.NaN, Double.NaN);

        /**
         * Validates.
         *
         * @param regime not null
         * @param informativeGames any
         * @param skewness any
         * @param minimumExpectedCount any
         * @param pMethod not null
         * @param monteCarloDraws any
         * @param intervalMethod not null
         * @param agreeP NaN or a probability
         * @param agreeAdjustedP NaN or a probability
         * @param disagreeP NaN or a probability
         */
        public Diagnosis {
            Objects.requireNonNull(regime, "regime");
            Objects.requireNonNull(pMethod, "p-value method");
            Objects.requireNonNull(intervalMethod, "interval method");
            probabilityOrNaN("agreement p-value", agreeP);
            probabilityOrNaN("adjusted agreement p-value", agreeAdjustedP);
            probabilityOrNaN("disagreement p-value", disagreeP);
        }

        /**
         * @param adjusted the adjusted agreement p-value
         * @return a copy with it
         */
        public Diagnosis withAgreeAdjusted(double adjusted) {
            return new Diagnosis(regime, informativeGames, skewness, minimumExpectedCount, pMethod, monteCarloDraws,
                intervalMethod, agreeP, adjusted, disagreeP);
        }
    }

    /**
     * Validates the row.
     *
     * @param caseIndex at least 0
     * @param caseId not null
     * @param subject not null
     * @param comparisonKind not null
     * @param predicted any
     * @param observed any
     * @param lower any
     * @param upper not below lower
     * @param statistic any
     * @param degreesOfFreedom NaN or at least 0
     * @param pValue NaN or a probability
     * @param adjustedP NaN or a probability
     * @param verdict not null
     * @param note not null
     * @param smallSample not null
     * @param diagnosis not null
     */
    public ResultRow {
        if (caseIndex < 0) {
            throw new IllegalArgumentException("case index must be at least 0: " + caseIndex);
        }
        Objects.requireNonNull(caseId, "case id");
        Objects.requireNonNull(subject, "subject");
        Objects.requireNonNull(comparisonKind, "comparison kind");
        Objects.requireNonNull(verdict, "verdict");
        Objects.requireNonNull(note, "note");
        Objects.requireNonNull(smallSample, "small-sample method");
        Objects.requireNonNull(diagnosis, "diagnosis");
        if (lower > upper) {
            throw new IllegalArgumentException("interval lower end above upper end: [" + lower + ", " + upper + "]");
        }
        if (degreesOfFreedom < 0) {
            throw new IllegalArgumentException("degrees of freedom must be at least 0: " + degreesOfFreedom);
        }
        probabilityOrNaN("p-value", pValue);
        probabilityOrNaN("adjusted p-value", adjustedP);
    }

    private static void probabilityOrNaN(String what, double p) {
        if (!Double.isNaN(p) && !(p >= 0 && p <= 1)) {
            throw new IllegalArgumentException(what + " must be in [0, 1] or absent: " + p);
        }
    }

    /**
     * A builder for a row of a case; every number starts as NaN, the verdict as {@link Verdict#INCONCLUSIVE},
     * the note as empty.
     *
     * @param c the case
     * @param subject what is compared
     * @param kind what it is compared with
     * @return the builder
     */
    public static Builder builder(Case c, Subject subject, ComparisonKind kind) {
        return new Builder(c.index(), c.id(), subject, kind);
    }

    /**
     * A builder for a row of a case given by index and identifier (for readers of files).
     *
     * @param caseIndex the case's index
     * @param caseId its identifier
     * @param subject what is compared
     * @param kind what it is compared with
     * @return the builder
     */
    public static Builder builder(int caseIndex, String caseId, Subject subject, ComparisonKind kind) {
        return new Builder(caseIndex, caseId, subject, kind);
    }

    /**
     * The same row with the adjusted p-value and verdict replaced.
     *
     * @param p the adjusted p-value
     * @param v the verdict
     * @return a new row
     */
    public ResultRow adjusted(double p, Verdict v) {
        return new ResultRow(caseIndex, caseId, subject, comparisonKind, predicted, observed, lower, upper, statistic,
            degreesOfFreedom, pValue, p, v, note, smallSample, diagnosis);
    }

    /**
     * The same row with the adjusted p-values and verdict replaced.
     *
     * @param p the adjusted p-value of the "disagrees" test
     * @param agree the adjusted p-value of the "agrees" test (NaN for rows without a tolerance)
     * @param v the verdict
     * @return a new row
     */
    public ResultRow adjusted(double p, double agree, Verdict v) {
        return new ResultRow(caseIndex, caseId, subject, comparisonKind, predicted, observed, lower, upper, statistic,
            degreesOfFreedom, pValue, p, v, note, smallSample, diagnosis.withAgreeAdjusted(agree));
    }

    /** Collects a row's values; {@link #build()} validates them. */
    public static final class Builder {
        private final int caseIndex;
        private final String caseId;
        private final Subject subject;
        private final ComparisonKind kind;
        private double predicted = Double.NaN;
        private double observed = Double.NaN;
        private double lower = Double.NaN;
        private double upper = Double.NaN;
        private double statistic = Double.NaN;
        private double degreesOfFreedom = Double.NaN;
        private double pValue = Double.NaN;
        private double adjustedP = Double.NaN;
        private Verdict verdict = Verdict.INCONCLUSIVE;
        private String note = "";
        private TestResult.SmallSample smallSample = TestResult.SmallSample.NONE;
        private Diagnosis diagnosis = Diagnosis.NONE;

        private Builder(int caseIndex, String caseId, Subject subject, ComparisonKind kind) {
            this.caseIndex = caseIndex;
            this.caseId = caseId;
            this.subject = subject;
            this.kind = kind;
        }

        /**
         * @param value the value compared with
         * @return this builder
         */
        public Builder predicted(double value) {
            predicted = value;
            return this;
        }

        /**
         * @param value the observed (or exact) value
         * @return this builder
         */
        public Builder observed(double value) {
            observed = value;
            return this;
        }

        /**
         * @param ci the confidence interval of the observed value
         * @return this builder
         */
        public Builder interval(Interval ci) {
            return interval(ci.lower(), ci.upper());
        }

        /**
         * @param lowerEnd lower end
         * @param upperEnd upper end
         * @return this builder
         */
        public Builder interval(double lowerEnd, double upperEnd) {
            lower = lowerEnd;
            upper = upperEnd;
            return this;
        }

        /**
         * The statistic, degrees of freedom, p-value and small-sample method of a test (not its note).
         *
         * @param t the test result
         * @return this builder
         */
        public Builder test(TestResult t) {
            smallSample = t.smallSample();
            return test(t.statistic(), t.degreesOfFreedom(), t.pValue());
        }

        /**
         * @param stat the statistic
         * @param df its degrees of freedom (NaN when not stated)
         * @param p the unadjusted p-value
         * @return this builder
         */
        public Builder test(double stat, double df, double p) {
            statistic = stat;
            degreesOfFreedom = df;
            pValue = p;
            return this;
        }

        /**
         * @param p the adjusted p-value
         * @return this builder
         */
        public Builder adjustedP(double p) {
            adjustedP = p;
            return this;
        }

        /**
         * @param v the verdict
         * @return this builder
         */
        public Builder verdict(Verdict v) {
            verdict = v;
            return this;
        }

        /**
         * @param text the note
         * @return this builder
         */
        public Builder note(String text) {
            note = text;
            return this;
        }

        /**
         * @param d the diagnosis
         * @return this builder
         */
        public Builder diagnosis(Diagnosis d) {
            diagnosis = d;
            return this;
        }

        /** @return the validated row */
        public ResultRow build() {
            return new ResultRow(caseIndex, caseId, subject, kind, predicted, observed, lower, upper, statistic,
                degreesOfFreedom, pValue, adjustedP, verdict, note, smallSample, diagnosis);
        }
    }
}
