package reprise.output.figures;

/** What the x-axis of a figure over continuation probabilities shows. */
public enum ContinuationAxis {
    /** The continuation probability delta itself, on a linear axis. */
    PROBABILITY,
    /**
     * The expected game length 1/(1 - delta) in rounds, on a log axis, which spreads out the long
     * games that a linear delta axis squeezes against 1.
     */
    EXPECTED_LENGTH
}
