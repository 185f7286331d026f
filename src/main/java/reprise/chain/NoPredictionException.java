package reprise.chain;

/**
 * Thrown when the exact engine has no Markov-chain prediction for a match, as opposed to bad input.
 *
 * <p>Typical causes: a user-written agent (it has no known chain), or memory-three players with
 * perception errors (the joint record chain would be too large to analyse exactly). The message says
 * which player and why, in one line.
 */
public class NoPredictionException extends IllegalArgumentException {
    private static final long serialVersionUID = 1L;

    /**
     * Creates the exception.
     *
     * @param message a one-line reason, starting with "no exact prediction for ..."
     */
    public NoPredictionException(String message) {
        super(message);
    }
}
