package reprise.experiment;

/**
 * What a result row compares the simulation (or a claim) with: the value of {@code results.csv}'s
 * {@code comparison} column is {@link #label()}.
 *
 * <p>Extension point: a new comparison is a new constant; {@link #countsTowardsExit()} says whether its
 * rows can make the experiment disagree, and the report's section methods select rows by constant.
 */
public enum ComparisonKind {
    /** The simulation against the exact finite-horizon expectation. */
    EXACT("exact", true, false),
    /** The simulation against the stationary (infinitely repeated) value: descriptive only. */
    STATIONARY("stationary", false, false),
    /** A claimed value against the simulation. */
    CLAIM_VS_SIMULATION("claim-vs-simulation", true, true),
    /** A claimed value against the exact expectation. */
    CLAIM_VS_EXACT("claim-vs-exact", true, true),
    /**
     * A claimed long-run value against the simulated games of one length: whether games of this length
     * match it, with the exact finite-horizon bias (descriptive; the claim itself is checked against the
     * exact long-run value by a {@link #CLAIM_VS_EXACT} row).
     */
    LONG_RUN_CLAIM_VS_SIMULATION("long-run-claim-vs-simulation", false, true);

    private final String label;
    private final boolean countsTowardsExit;
    private final boolean claim;

    ComparisonKind(String label, boolean countsTowardsExit, boolean claim) {
        this.label = label;
        this.countsTowardsExit = countsTowardsExit;
        this.claim = claim;
    }

    /** @return the word written in the files, e.g. "claim-vs-exact" */
    public String label() {
        return label;
    }

    /** @return whether a disagreeing row of this kind makes the experiment disagree (exit code 1) */
    public boolean countsTowardsExit() {
        return countsTowardsExit;
    }

    /** @return whether the row tests a claimed value */
    public boolean isClaim() {
        return claim;
    }

    /**
     * The kind a file names (the inverse of {@link #label()}, for readers of files).
     *
     * @param label e.g. "exact"
     * @return the kind
     * @throws IllegalArgumentException if none matches
     */
    public static ComparisonKind ofLabel(String label) {
        for (ComparisonKind k : values()) {
            if (k.label.equals(label)) {
                return k;
            }
        }
        throw new IllegalArgumentException("unknown comparison '" + label + "'");
    }
}
