package reprise.chain;

import reprise.game.StageGame;

/**
 * Expected per-round payoffs of both players.
 *
 * @param x X's payoff
 * @param y Y's payoff
 */
public record Payoffs(double x, double y) {

    /**
     * Payoffs from round-state frequencies: x = sum_s f_s u_X(s), y = sum_s f_s u_Y(s).
     *
     * @param game the stage game
     * @param frequencies 4 numbers CC, CD, DC, DD
     * @return the payoffs
     */
    public static Payoffs of(StageGame game, double[] frequencies) {
        checkFour(frequencies);
        double x = 0;
        double y = 0;
        for (int s = 0; s < 4; s++) {
            x += frequencies[s] * game.payoffX(s);
            y += frequencies[s] * game.payoffY(s);
        }
        return new Payoffs(x, y);
    }

    static void checkFour(double[] frequencies) {
        if (frequencies == null || frequencies.length != 4) {
            throw new IllegalArgumentException("frequencies need 4 numbers (CC, CD, DC, DD): "
                + (frequencies == null ? "none" : frequencies.length));
        }
    }
}
