package reprise.game;

/**
 * The outcome of one round, written from player X's view: X's move first, then Y's.
 *
 * <p>The index order CC, CD, DC, DD (0 to 3) is used everywhere in reprise: in transition matrices,
 * tallies, payoff vectors and output files. In terms of moves, {@code index = 2 * xDefects + yDefects}.
 */
public enum State {
    /** Both cooperate. */
    CC,
    /** X cooperates, Y defects. */
    CD,
    /** X defects, Y cooperates. */
    DC,
    /** Both defect. */
    DD;

    private static final State[] VALUES = values();

    /** Number of states of one round. */
    public static final int COUNT = 4;

    /**
     * The state with the given index.
     *
     * @param index 0 to 3
     * @return the state
     */
    public static State of(int index) {
        return VALUES[index];
    }

    /**
     * The state from the two moves.
     *
     * @param xCooperates X's move
     * @param yCooperates Y's move
     * @return the state
     */
    public static State of(boolean xCooperates, boolean yCooperates) {
        return VALUES[(xCooperates ? 0 : 2) + (yCooperates ? 0 : 1)];
    }

    /** @return whether X cooperated in this state */
    public boolean xCooperates() {
        return this == CC || this == CD;
    }

    /** @return whether Y cooperated in this state */
    public boolean yCooperates() {
        return this == CC || this == DC;
    }

    /**
     * The same round seen from Y's side (CD and DC swap).
     *
     * @return the mirrored state
     */
    public State mirror() {
        return of(yCooperates(), xCooperates());
    }

    /**
     * Mirrors a state index: CD (1) and DC (2) swap, CC and DD stay.
     *
     * @param index 0 to 3
     * @return the mirrored index
     */
    public static int mirror(int index) {
        return ((index & 1) << 1) | (index >> 1);
    }
}
