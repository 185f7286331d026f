package reprise.experiment;

import java.util.Optional;

/**
 * Which test of a simulation against the exact side a result belongs to: the keys of
 * {@link CaseAnalysis#tests} and of a calibration study's results. {@link #label()} is the name written
 * in {@code calibration.csv}, {@code calibration.json} and the calibration table.
 *
 * <p>Extension point: a test without parameters is a new {@link Standard} constant; a family of tests
 * (one per round, one per quantity) is a new permitted record carrying its parameter.
 */
public sealed interface TestId permits TestId.Standard, TestId.AtRound, TestId.ZScore {

    /** @return the test's name in files, e.g. "frequencies (Wald)", "snapshot t=3", "z CC" */
    String label();

    /** @return whether the test is an illustration of a wrong method, not a valid test */
    default boolean illustration() {
        return false;
    }

    /**
     * The test a file names (the inverse of {@link #label()}, for readers of files).
     *
     * @param label the name
     * @return the test, or empty if no test has that name (for example a quantity unknown to this version)
     */
    static Optional<TestId> ofLabel(String label) {
        for (Standard s : Standard.values()) {
            if (s.label().equals(label)) {
                return Optional.of(s);
            }
        }
        try {
            if (label.startsWith(AtRound.PREFIX)) {
                return Optional.of(new AtRound(Long.parseLong(label.substring(AtRound.PREFIX.length()))));
            }
            if (label.startsWith(ZScore.PREFIX)) {
                return Optional.of(new ZScore(BaseQuantity.ofLabel(label.substring(ZScore.PREFIX.length()))));
            }
        } catch (IllegalArgumentException e) {
            return Optional.empty();
        }
        return Optional.empty();
    }

    /** The tests without parameters. */
    enum Standard implements TestId {
        /** Wald test of the four mean state counts (or frequencies) with the exact covariance. */
        FREQUENCIES_WALD("frequencies (Wald)"),
        /** Anderson and Goodman test of the transition counts, Pearson form. */
        TRANSITIONS_PEARSON("transitions (Pearson)"),
        /** The same test, likelihood-ratio form. */
        TRANSITIONS_LR("transitions (LR)"),
        /** The pooled-rounds chi-square, which treats autocorrelated rounds as independent (invalid). */
        POOLED_ROUNDS_ILLUSTRATION("pooled rounds chi-square (ILLUSTRATION, invalid)");

        private final String label;

        Standard(String label) {
            this.label = label;
        }

        @Override
        public String label() {
            return label;
        }

        @Override
        public boolean illustration() {
            return this == POOLED_ROUNDS_ILLUSTRATION;
        }
    }

    /**
     * The test of the state at round t across games against v_1 M^(t-1).
     *
     * @param round t, at least 1
     */
    record AtRound(long round) implements TestId {

        static final String PREFIX = "snapshot t=";

        /**
         * Validates the round.
         *
         * @param round at least 1
         */
        public AtRound {
            if (round < 1) {
                throw new IllegalArgumentException("snapshot round must be at least 1: " + round);
            }
        }

        @Override
        public String label() {
            return PREFIX + round;
        }

        /** @return the result row subject of this test */
        public Subject.Snapshot subject() {
            return new Subject.Snapshot(round);
        }
    }

    /**
     * The z test of one quantity against its exact value, with the exact standard error.
     *
     * @param quantity the quantity
     */
    record ZScore(Quantity quantity) implements TestId {

        static final String PREFIX = "z ";

        /**
         * Validates the quantity.
         *
         * @param quantity not null
         */
        public ZScore {
            java.util.Objects.requireNonNull(quantity, "quantity");
        }

        @Override
        public String label() {
            return PREFIX + quantity.label();
        }
    }
}
