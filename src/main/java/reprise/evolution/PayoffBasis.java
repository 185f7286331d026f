package reprise.evolution;

import java.util.List;
import reprise.game.Horizon;
import reprise.game.MemoryStrategy;
import reprise.game.Noise;
import reprise.game.StageGame;

/**
 * Where a focal individual's payoff per round comes from.
 *
 * <ul>
 *   <li>{@link Matrix}: a deterministic payoff per round for each pair of strategies, supplied by the caller.
 *       The stationary payoffs of the infinitely repeated game (basis a, what most papers use) and the exact
 *       expected payoffs of the finite or discounted game (basis b) are two such matrices.</li>
 *   <li>{@link Realised}: every game is a fresh finite game whose realised payoff is random (basis c); the
 *       update probabilities are expectations over its exact law. This is the process a simulation of the
 *       population plays.</li>
 * </ul>
 */
public sealed interface PayoffBasis permits PayoffBasis.Matrix, PayoffBasis.Realised {

    /** @return the number k of strategies */
    int strategyCount();

    /**
     * A payoff matrix: payoffs[x][y] is the payoff per round of strategy x against strategy y.
     *
     * @param payoffs a k x k matrix of finite numbers, k &ge; 2
     */
    record Matrix(double[][] payoffs) implements PayoffBasis {
        /**
         * Validates and copies the matrix.
         *
         * @param payoffs k x k, finite
         */
        public Matrix {
            if (payoffs == null || payoffs.length < 2) {
                throw new IllegalArgumentException("a payoff matrix needs at least 2 strategies");
            }
            double[][] c = new double[payoffs.length][];
            for (int x = 0; x < payoffs.length; x++) {
                if (payoffs[x] == null || payoffs[x].length != payoffs.length) {
                    throw new IllegalArgumentException("payoff matrix row " + x + " must have " + payoffs.length + " entries");
                }
                c[x] = payoffs[x].clone();
                for (int y = 0; y < c[x].length; y++) {
                    if (!Double.isFinite(c[x][y])) {
                        throw new IllegalArgumentException("payoff of strategy " + x + " against " + y + " must be finite: "
                            + c[x][y]);
                    }
                }
            }
            payoffs = c;
        }

        @Override
        public int strategyCount() {
            return payoffs.length;
        }

        /**
         * One entry.
         *
         * @param x the focal strategy
         * @param y the co-player's strategy
         * @return the payoff per round of x against y
         */
        public double payoff(int x, int y) {
            return payoffs[x][y];
        }

        /** @return the matrix (a copy) */
        @Override
        public double[][] payoffs() {
            double[][] c = new double[payoffs.length][];
            for (int x = 0; x < c.length; x++) {
                c[x] = payoffs[x].clone();
            }
            return c;
        }
    }

    /**
     * Fresh finite games with realised payoffs: the stage game (symmetric), the strategies (analysable by the
     * exact engine), the errors (the same for every individual) and the length of a game.
     *
     * @param game a symmetric stage game
     * @param strategies k &ge; 2 strategies
     * @param noise symmetric execution and perception errors
     * @param horizon fixed rounds or a continuation probability
     */
    record Realised(StageGame game, List<MemoryStrategy> strategies, Noise noise, Horizon horizon)
        implements PayoffBasis {
        /**
         * Validates the basis.
         *
         * @param game symmetric
         * @param strategies at least 2
         * @param noise symmetric
         * @param horizon not null
         */
        public Realised {
            if (game == null || noise == null || horizon == null || strategies == null) {
                throw new IllegalArgumentException("realised payoffs need a stage game, strategies, noise and horizon");
            }
            double[] x = game.payoffX();
            double[] y = game.payoffY();
            if (x[0] != y[0] || x[3] != y[3] || x[1] != y[2] || x[2] != y[1]) {
                throw new IllegalArgumentException("a population needs a symmetric stage game: " + game.label());
            }
            if (noise.executionX() != noise.executionY() || noise.perceptionX() != noise.perceptionY()) {
                throw new IllegalArgumentException("a population needs the same errors for every individual: " + noise);
            }
            strategies = List.copyOf(strategies);
            if (strategies.size() < 2) {
                throw new IllegalArgumentException("a population needs at least 2 strategies: " + strategies.size());
            }
        }

        @Override
        public int strategyCount() {
            return strategies.size();
        }
    }
}
