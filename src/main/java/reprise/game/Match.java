package reprise.game;

import java.util.Objects;

/**
 * Everything that defines play between two players, except how long a game lasts.
 *
 * @param game the stage game
 * @param x the row player's strategy
 * @param y the column player's strategy
 * @param noise execution and perception errors
 */
public record Match(StageGame game, Strategy x, Strategy y, Noise noise) {
    /**
     * Checks that nothing is missing.
     *
     * @param game the stage game
     * @param x X's strategy
     * @param y Y's strategy
     * @param noise the errors
     */
    public Match {
        Objects.requireNonNull(game, "game");
        Objects.requireNonNull(x, "strategy of X");
        Objects.requireNonNull(y, "strategy of Y");
        Objects.requireNonNull(noise, "noise");
    }

    /**
     * The strategy of one player.
     *
     * @param p the player
     * @return its strategy
     */
    public Strategy strategy(Player p) {
        return p == Player.X ? x : y;
    }

    /**
     * The same match with the roles of X and Y exchanged (states mirror: CD and DC swap).
     *
     * @return the swapped match
     */
    public Match swapped() {
        double[] px = game.payoffX();
        double[] py = game.payoffY();
        StageGame g = new StageGame(game.label(),
            new double[] {py[0], py[2], py[1], py[3]}, new double[] {px[0], px[2], px[1], px[3]});
        return new Match(g, y, x, noise.swapped());
    }
}
