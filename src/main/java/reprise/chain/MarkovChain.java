package reprise.chain;

import reprise.game.Match;
import reprise.game.MemoryStrategy;
import reprise.game.State;

/**
 * The exact Markov chain of a match: its states, transition matrix and first-round distribution.
 *
 * <p><b>States.</b> Three layouts ({@link Kind}), chosen by {@link #of(Match)}:
 * <ul>
 *   <li>{@link Kind#ROUND_STATES}: both players have memory one; the 4 states CC, CD, DC, DD of the last
 *       round from X's view. Exact also with perception errors, because the next intended moves depend
 *       only on the fresh perception of the last round: P(X intends C | x, y) = (1 - h) c(x, y) + h c(x, not y).</li>
 *   <li>{@link Kind#TRUE_HISTORIES}: memory n = max(nx, ny) &ge; 2 and no player of memory &ge; 2 misperceives;
 *       the 4^n true histories of the last n rounds, index s_t + 4 s_{t-1} + 16 s_{t-2} (X's view, latest
 *       round in the low bits), as in {@link MemoryStrategy}. Rounds before the first read as CC.</li>
 *   <li>{@link Kind#PLAYER_RECORDS}: a player of memory &ge; 2 misperceives; the state is the pair of both
 *       players' private records (own realised moves and perceived co-player moves over n rounds, each
 *       in its own view, indexed like a table), index xRecord + 4^n yRecord: 16^n states, at most
 *       {@link #MAX_STATES}.</li>
 * </ul>
 * Every chain state maps to the true state of its latest round ({@link #roundState(int)}); frequencies
 * reported elsewhere are over those 4 round states, in the order CC, CD, DC, DD.
 *
 * <p><b>Time.</b> {@link #initialDistribution()} is the distribution of the state after round 1
 * (v_1); the state after round t has distribution v_t = v_1 M^(t-1).
 *
 * <p>Implementation note. See {@code ChainBuilder}: probabilities are built without subtractive
 * cancellation, so each entry has relative error of a few units of 2^-53; rows sum to 1 within
 * about 1e-16. Powers use repeated squaring of non-negative matrices, each square rescaled to unit row
 * sums (relative error about log2(t) * k * 2^-53).
 *
 * <p>References:
 * Kemeny, J.G. &amp; Snell, J.L. (1960). Finite Markov Chains. Van Nostrand.
 */
public final class MarkovChain {

    /** The largest number of chain states analysed exactly (memory two with perception errors). */
    public static final int MAX_STATES = 256;

    /** The state layout of a chain. */
    public enum Kind {
        /** The 4 round states CC, CD, DC, DD. */
        ROUND_STATES,
        /** The 4^n true histories of the last n rounds. */
        TRUE_HISTORIES,
        /** The 16^n pairs of private records (own move, perceived co-player move). */
        PLAYER_RECORDS
    }

    private final Match match;
    private final Kind kind;
    private final int memory;
    private final double[][] transition;
    private final double[] initial;
    private final int[] roundState;
    private final String[] labels;
    private volatile ChainStructure structure;

    MarkovChain(Match match, Kind kind, int memory, double[][] transition, double[] initial, int[] roundState,
        String[] labels) {
        this.match = match;
        this.kind = kind;
        this.memory = memory;
        this.transition = transition;
        this.initial = initial;
        this.roundState = roundState;
        this.labels = labels;
    }

    /**
     * Builds the chain of a match.
     *
     * @param match the stage game, strategies and noise
     * @return the chain
     * @throws NoPredictionException for user-written agents, and for memory-three players with perception
     *     errors (more than {@link #MAX_STATES} states)
     */
    public static MarkovChain of(Match match) {
        return ChainBuilder.build(match);
    }

    /** @return the match this chain describes */
    public Match match() {
        return match;
    }

    /** @return the state layout */
    public Kind kind() {
        return kind;
    }

    /** @return the number of rounds a chain state spans, max(nx, ny) */
    public int memory() {
        return memory;
    }

    /** @return the number of chain states */
    public int size() {
        return transition.length;
    }

    /** @return the transition matrix M (a copy), M[i][j] = P(next state j | state i) */
    public double[][] transitionMatrix() {
        return Dense.copy(transition);
    }

    /**
     * One transition probability.
     *
     * @param from chain state
     * @param to chain state
     * @return M[from][to]
     */
    public double transition(int from, int to) {
        return transition[from][to];
    }

    double[][] matrix() {
        return transition;
    }

    /** @return v_1, the distribution of the chain state after round 1 (a copy) */
    public double[] initialDistribution() {
        return initial.clone();
    }

    /**
     * The true state of the latest round of a chain state.
     *
     * @param chainState 0 to size() - 1
     * @return 0 to 3 (CC, CD, DC, DD from X's view)
     */
    public int roundState(int chainState) {
        return roundState[chainState];
    }

    int[] roundStates() {
        return roundState;
    }

    /**
     * A readable name of a chain state: "CD" for round states; rounds oldest first for histories
     * ("CC DC"); "x:CC.CD y:CC.DC" for records (each player's record in its own view, oldest first).
     *
     * @param chainState 0 to size() - 1
     * @return the label
     */
    public String stateLabel(int chainState) {
        return labels[chainState];
    }

    /**
     * Projects a distribution over chain states to the 4 round states.
     *
     * @param chainDistribution size() numbers
     * @return 4 numbers in the order CC, CD, DC, DD
     */
    public double[] project(double[] chainDistribution) {
        if (chainDistribution.length != size()) {
            throw new IllegalArgumentException("distribution must have " + size() + " entries: "
                + chainDistribution.length);
        }
        double[] out = new double[State.COUNT];
        for (int i = 0; i < chainDistribution.length; i++) {
            out[roundState[i]] += chainDistribution[i];
        }
        return out;
    }

    /**
     * The distribution of the chain state after round t, v_1 M^(t-1), by repeated squaring.
     *
     * @param round t &ge; 1
     * @return size() probabilities
     */
    public double[] distributionAt(long round) {
        if (round < 1) {
            throw new IllegalArgumentException("round must be at least 1: " + round);
        }
        return Dense.power(initial, transition, round - 1);
    }

    /**
     * The distribution of the round state of round t (for snapshot tests).
     *
     * @param round t &ge; 1
     * @return 4 probabilities CC, CD, DC, DD
     */
    public double[] roundStateDistributionAt(long round) {
        return project(distributionAt(round));
    }

    /**
     * Closed classes, transient states, absorption probabilities and stationary or limit distribution.
     *
     * @return the structure (computed once)
     */
    public ChainStructure structure() {
        ChainStructure s = structure;
        if (s == null) {
            s = ChainStructure.analyze(this);
            structure = s;
        }
        return s;
    }

    /**
     * The transition matrix of the observable true history, for a transition-count test: on the 4 round
     * states for memory-one players (any noise), on the 4^n true histories otherwise.
     *
     * @return the matrix (a copy), states as in {@link #stateLabel(int)}
     * @throws NoPredictionException when a player of memory &ge; 2 misperceives: the true history is then
     *     not a Markov chain, because that player's moves depend on its private record
     */
    public double[][] observableTransitionMatrix() {
        if (kind == Kind.PLAYER_RECORDS) {
            throw new NoPredictionException("no exact prediction for the transition counts of " + match.x().label()
                + " vs " + match.y().label() + ": with perception errors a memory-" + memory + " player acts on "
                + "its private record, so the true history is not a Markov chain");
        }
        return transitionMatrix();
    }

    @Override
    public String toString() {
        return kind + " chain with " + size() + " states for " + match.x().label() + " vs " + match.y().label()
            + " (" + match.noise() + ")";
    }
}
