package reprise.experiment;

/**
 * What one result row is about: a scalar {@link Quantity}, the four state frequencies jointly, the
 * transitions, or the state at one round across games. The value of {@code results.csv}'s
 * {@code quantity} column is {@link #label()}.
 *
 * <p>A new kind of subject is a new permitted subtype; code that treats kinds differently tests with
 * {@code instanceof} (or, from Java 21, a pattern switch), so the compiler lists the sites when a kind is
 * added to a sealed hierarchy that a switch covers.
 */
public sealed interface Subject permits Quantity, Subject.Joint, Subject.Snapshot {

    /** @return the name written in {@code results.csv} and {@code report.md}, e.g. "CC", "states", "snapshot_3" */
    String label();

    /**
     * The name a {@code results.csv} reader finds in the quantity column, back as a subject.
     *
     * @param label a value of {@link #label()}
     * @return the subject
     * @throws IllegalArgumentException if no subject has that label
     */
    static Subject ofLabel(String label) {
        for (Joint j : Joint.values()) {
            if (j.label().equals(label)) {
                return j;
            }
        }
        if (label.startsWith(Snapshot.PREFIX)) {
            try {
                return new Snapshot(Long.parseLong(label.substring(Snapshot.PREFIX.length())));
            } catch (NumberFormatException e) {
                throw new IllegalArgumentException("not a snapshot round: '" + label + "'", e);
            }
        }
        for (BaseQuantity q : BaseQuantity.values()) {
            if (q.label().equals(label)) {
                return q;
            }
        }
        if (DerivedQuantity.NAME.matcher(label).matches()) {
            return DerivedQuantity.named(label);
        }
        return BaseQuantity.ofLabel(label);
    }

    /** Tests of several state counts at once. */
    enum Joint implements Subject {
        /** The four state frequencies of the tallied rounds, jointly. */
        STATES("states"),
        /** The transition counts between consecutive observable states. */
        TRANSITIONS("transitions");

        private final String label;

        Joint(String label) {
            this.label = label;
        }

        @Override
        public String label() {
            return label;
        }
    }

    /**
     * The state at round t across games.
     *
     * @param round t, at least 1 (a long, as the simulator's snapshot rounds are)
     */
    record Snapshot(long round) implements Subject {

        static final String PREFIX = "snapshot_";

        /**
         * Validates the round.
         *
         * @param round at least 1
         */
        public Snapshot {
            if (round < 1) {
                throw new IllegalArgumentException("snapshot round must be at least 1: " + round);
            }
        }

        @Override
        public String label() {
            return PREFIX + round;
        }
    }
}
