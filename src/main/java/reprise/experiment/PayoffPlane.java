package reprise.experiment;

import java.util.ArrayList;
import java.util.List;
import reprise.chain.StrategyMatrix;
import reprise.game.Horizon;
import reprise.game.Noise;
import reprise.game.Player;
import reprise.game.StageGame;
import reprise.game.Strategies;
import reprise.game.Strategy;
import reprise.game.StrategyDescription;
import reprise.game.ZeroDeterminant;

/**
 * The data of a zero-determinant payoff-plane figure: the feasible payoffs of the stage game, the line a
 * zero-determinant strategy of X enforces, and the exact payoff pairs (pi_X, pi_Y) of X against each of a
 * list of co-players for each game length.
 *
 * <p>Lines, with X's strategy zero-determinant: extortionate pi_Y = P_Y + (pi_X - P_X) / chi; generous
 * pi_Y = R_Y + (pi_X - R_X) / chi; equalizer pi_Y = score (Press &amp; Dyson 2012; Stewart &amp; Plotkin
 * 2013). The long-run points of error-free play lie on the line; finite games do not, in general.
 *
 * <p>References:
 * Press, W.H. &amp; Dyson, F.J. (2012). Iterated Prisoner's Dilemma contains strategies that dominate any
 * evolutionary opponent. PNAS 109(26), 10409-10413.
 * Stewart, A.J. &amp; Plotkin, J.B. (2013). From extortion to generosity, evolution in the Iterated
 * Prisoner's Dilemma. PNAS 110(38), 15348-15353.
 *
 * @param game the stage game
 * @param strategy X's spec
 * @param parameters X's zero-determinant parameters
 * @param coPlayers the co-players' specs
 * @param lengths the game lengths (null for the long run)
 * @param payoffX [length][co-player] X's exact payoff
 * @param payoffY [length][co-player] Y's exact payoff
 */
public record PayoffPlane(StageGame game, String strategy, ZeroDeterminant.Parameters parameters,
    List<String> coPlayers, List<Horizon> lengths, double[][] payoffX, double[][] payoffY) {

    /**
     * Computes the exact points.
     *
     * @param game the stage game
     * @param zeroDeterminantSpec X's strategy, one of the zero-determinant forms
     * @param coPlayers Y's strategies
     * @param noise the errors
     * @param lengths game lengths, null for the long run
     * @return the data
     * @throws IllegalArgumentException when X's strategy is not zero-determinant, or a spec is bad
     */
    public static PayoffPlane of(StageGame game, String zeroDeterminantSpec, List<String> coPlayers, Noise noise,
        List<Horizon> lengths) {
        StrategyDescription d = StrategyDescription.of(zeroDeterminantSpec, game, Player.X);
        if (d.zeroDeterminant() == null) {
            throw new IllegalArgumentException("the payoff plane needs a zero-determinant strategy for X "
                + "(extort:, generous: or equalizer:): " + zeroDeterminantSpec);
        }
        List<Strategy> x = List.of(Strategies.parse(zeroDeterminantSpec, game, Player.X));
        List<Strategy> y = coPlayers.stream().map(s -> Strategies.parse(s, game, Player.Y)).toList();
        double[][] px = new double[lengths.size()][];
        double[][] py = new double[lengths.size()][];
        for (int k = 0; k < lengths.size(); k++) {
            StrategyMatrix m = StrategyMatrix.of(game, x, y, noise, lengths.get(k));
            px[k] = new double[y.size()];
            py[k] = new double[y.size()];
            for (int j = 0; j < y.size(); j++) {
                px[k][j] = m.payoffX(0, j);
                py[k][j] = m.payoffY(0, j);
            }
        }
        return new PayoffPlane(game, zeroDeterminantSpec, d.zeroDeterminant(), List.copyOf(coPlayers),
            new ArrayList<>(lengths), px, py);
    }

    /**
     * The enforced line's pi_Y at a given pi_X.
     *
     * @param payoffX pi_X
     * @return pi_Y on the line
     */
    public double lineY(double payoffX) {
        double[] ux = game.payoffX();
        double[] uy = game.payoffY();
        return switch (parameters.family()) {
            case "extortionate" -> uy[3] + (payoffX - ux[3]) / parameters.chi();
            case "generous" -> uy[0] + (payoffX - ux[0]) / parameters.chi();
            default -> parameters.score();
        };
    }
}
