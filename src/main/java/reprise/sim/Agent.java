package reprise.sim;

import org.apache.commons.rng.UniformRandomProvider;

/**
 * A player as the simulator enacts it: it chooses an intended move from its own record only.
 *
 * <p>The record is what the player has seen: its own realised moves (which it always knows) and the
 * co-player's moves as perceived, possibly misread. The agent never sees the true state, the
 * co-player's intention, or whether an error happened. Each game proceeds as
 * <ol>
 *   <li>{@link #startGame()} once, before round 1;</li>
 *   <li>each round: {@link #intendsToCooperate(UniformRandomProvider)} for the intended move; the
 *       engine then applies execution error, pays, applies perception error, and calls
 *       {@link #record(boolean, boolean)} with what the agent saw.</li>
 * </ol>
 * An agent may keep any record it likes (ints are recommended: the engine calls these methods once per
 * round). It must draw randomness only from the generator it is given, so that a game is a function of
 * its replicate's random stream. An agent instance plays one game at a time; the engine creates one
 * instance per worker thread.
 *
 * <p>To make an agent available to specs {@code agent:NAME[,ARG...]}, implement {@link AgentFactory}.
 */
public interface Agent {

    /** Forgets everything: a new game starts. */
    void startGame();

    /**
     * The move this agent intends to play in the coming round.
     *
     * @param rng the replicate's random stream, for randomised choices
     * @return true to intend cooperation, false to intend defection
     */
    boolean intendsToCooperate(UniformRandomProvider rng);

    /**
     * Adds the round just played to the agent's record.
     *
     * @param ownCooperated the agent's own realised move (after execution error)
     * @param coPlayerSeenCooperating the co-player's realised move as this agent perceived it
     */
    void record(boolean ownCooperated, boolean coPlayerSeenCooperating);
}
