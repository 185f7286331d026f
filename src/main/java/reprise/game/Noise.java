package reprise.game;

/**
 * The two kinds of error, each per player.
 *
 * <p><b>Execution error</b> (probability e): the move a player intended is flipped when played; the
 * co-player and the player itself see the realised move. An intended cooperation probability c thus
 * becomes (1 - e) c + e (1 - c).
 *
 * <p><b>Perception error</b> (probability h): after each round a player misreads the co-player's
 * realised move, independently of everything else, and remembers the misread move. Each player always
 * knows its own realised move.
 *
 * <p>Order of events in a round: each player intends a move from its own record, each realised move may
 * flip, payoffs follow the realised moves, then each player records its own realised move and its
 * (possibly misread) perception of the co-player's.
 *
 * @param executionX X's execution error probability
 * @param executionY Y's execution error probability
 * @param perceptionX the probability that X misreads Y's move
 * @param perceptionY the probability that Y misreads X's move
 */
public record Noise(double executionX, double executionY, double perceptionX, double perceptionY) {

    /** No errors at all. */
    public static final Noise NONE = new Noise(0, 0, 0, 0);

    /**
     * Validates the probabilities.
     *
     * @param executionX in [0, 1]
     * @param executionY in [0, 1]
     * @param perceptionX in [0, 1]
     * @param perceptionY in [0, 1]
     */
    public Noise {
        Checks.probability("execution error of X", executionX);
        Checks.probability("execution error of Y", executionY);
        Checks.probability("perception error of X", perceptionX);
        Checks.probability("perception error of Y", perceptionY);
    }

    /**
     * The same errors for both players.
     *
     * @param execution execution error
     * @param perception perception error
     * @return the noise
     */
    public static Noise symmetric(double execution, double perception) {
        return new Noise(execution, execution, perception, perception);
    }

    /**
     * A player's execution error.
     *
     * @param p the player
     * @return its probability
     */
    public double execution(Player p) {
        return p == Player.X ? executionX : executionY;
    }

    /**
     * A player's perception error.
     *
     * @param p the player
     * @return its probability
     */
    public double perception(Player p) {
        return p == Player.X ? perceptionX : perceptionY;
    }

    /** @return whether either player can misperceive */
    public boolean hasPerceptionError() {
        return perceptionX > 0 || perceptionY > 0;
    }

    /** @return the same errors with the players' roles swapped */
    public Noise swapped() {
        return new Noise(executionY, executionX, perceptionY, perceptionX);
    }
}
