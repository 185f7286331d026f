package reprise.experiment;

import java.util.ArrayList;
import java.util.List;
import reprise.game.Horizon;
import reprise.game.Match;
import reprise.game.Noise;
import reprise.game.Player;
import reprise.game.StageGame;
import reprise.game.Strategies;
import reprise.game.Strategy;
import reprise.sim.SimulationResult;
import reprise.sim.SimulationSpec;
import reprise.sim.Simulator;

/**
 * Simulated per-game payoffs for a payoff-plane figure: for each finite game length and co-player, the
 * realised payoffs per round (pi_X, pi_Y) of single games played round by round by the simulator. The exact
 * side ({@link PayoffPlane}) gives where these clouds are centred; their spread shows how far one finite
 * game strays from the line a zero-determinant strategy enforces in the long run.
 *
 * <p>Implementation note: the simulator keeps only sums over the games of a run, so each game is played as
 * its own run of one game. Game g of (length k, co-player j) uses the master seed
 * {@code caseSeed(caseSeed(seed, k * J + j), g)} ({@link Runner#caseSeed}, SplitMix64 mixing), so the clouds
 * are reproducible from the seed and independent across games.
 *
 * @param lengths the finite game lengths (the long run has no cloud)
 * @param coPlayers the co-players' specs
 * @param payoffX [length][co-player][game] X's payoff per round in that game
 * @param payoffY [length][co-player][game] Y's payoff per round in that game
 */
public record PayoffClouds(List<Horizon> lengths, List<String> coPlayers, double[][][] payoffX,
    double[][][] payoffY) {

    /** The most games per cloud: enough for any figure, and a bound on the run's cost. */
    public static final int MOST_GAMES = 100_000;

    /**
     * Plays the games.
     *
     * @param game the stage game
     * @param xSpec X's strategy
     * @param coPlayers Y's strategies
     * @param noise the errors
     * @param lengths game lengths; null entries (the long run) are skipped
     * @param games games per cloud, 1 to {@link #MOST_GAMES}
     * @param seed the master seed
     * @return the clouds, one per finite length and co-player
     */
    public static PayoffClouds play(StageGame game, String xSpec, List<String> coPlayers, Noise noise,
        List<Horizon> lengths, int games, long seed) {
        if (games < 1 || games > MOST_GAMES) {
            throw new IllegalArgumentException("games per cloud must be between 1 and " + MOST_GAMES + ": " + games);
        }
        Strategy x = Strategies.parse(xSpec, game, Player.X);
        List<Horizon> finite = lengths.stream().filter(h -> h != null).toList();
        double[][][] px = new double[finite.size()][coPlayers.size()][games];
        double[][][] py = new double[finite.size()][coPlayers.size()][games];
        for (int k = 0; k < finite.size(); k++) {
            for (int j = 0; j < coPlayers.size(); j++) {
                Match m = new Match(game, x, Strategies.parse(coPlayers.get(j), game, Player.Y), noise);
                long cloudSeed = Runner.caseSeed(seed, k * coPlayers.size() + j);
                for (int g = 0; g < games; g++) {
                    SimulationResult r = new Simulator(SimulationSpec.of(m, finite.get(k), 1,
                        Runner.caseSeed(cloudSeed, g)).withThreads(1)).run();
                    px[k][j][g] = r.meanPayoffX();
                    py[k][j][g] = r.meanPayoffY();
                }
            }
        }
        return new PayoffClouds(new ArrayList<>(finite), List.copyOf(coPlayers), px, py);
    }
}
