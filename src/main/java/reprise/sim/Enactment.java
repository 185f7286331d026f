package reprise.sim;

/** How rounds are enacted. */
public enum Enactment {
    /**
     * The fused fast path when both players are memory-one (reactive included) lookup tables, the
     * literal path otherwise.
     */
    FASTEST,
    /**
     * Always the literal path: separate draws for each intended move, execution error and perception
     * error. Results differ draw by draw from {@link #FASTEST} but agree in distribution.
     */
    LITERAL
}
