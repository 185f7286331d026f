package reprise.game;

/** The two players of a match. States are always written from X's view. */
public enum Player {
    /** The row player. */
    X,
    /** The column player. */
    Y;

    /** @return the co-player */
    public Player other() {
        return this == X ? Y : X;
    }
}
