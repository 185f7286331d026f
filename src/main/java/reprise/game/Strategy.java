package reprise.game;

/**
 * A player's rule for choosing moves.
 *
 * <p>Two kinds exist. A {@link MemoryStrategy} is a lookup table over the last n rounds (n = 1, 2, 3),
 * which covers reactive, memory-one, memory-n, the named classics and the zero-determinant strategies;
 * the exact engine can analyse it. A {@link CustomStrategy} names a user-written agent that only the
 * simulator can play; the exact engine has no prediction for it and says so.
 */
public sealed interface Strategy permits MemoryStrategy, CustomStrategy {
    /** @return the text that identifies this strategy in reports (its spec) */
    String label();
}
