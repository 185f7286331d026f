package reprise.game;

/**
 * How long a game lasts.
 *
 * <p>{@link Rounds}: exactly n rounds. {@link Continuation}: after every round another one follows
 * with probability delta, so the number of rounds N is geometric on {1, 2, ...} with
 * P(N &gt; t) = delta^t and mean 1 / (1 - delta).
 *
 * <p><b>Equivalence with discounting.</b> The expected total payoff of a game with continuation
 * probability delta equals the discounted sum sum_{t&ge;0} delta^t E[u_t] of an infinitely repeated
 * game, because round t+1 is played with probability delta^t. The per-round payoff reported for such a
 * game is E[total] / E[length] = (1 - delta) sum_t delta^t E[u_t], the normalised discounted payoff. It
 * differs from the mean of per-game averages E[total / N], which weights short games more; reprise never
 * reports the latter as the per-round payoff.
 */
public sealed interface Horizon permits Horizon.Rounds, Horizon.Continuation {

    /** @return the expected number of rounds of one game */
    double expectedLength();

    /** @return a short text form ({@code rounds=N} or {@code continuation=D}) */
    String describe();

    /**
     * A fixed number of rounds.
     *
     * @param count the number of rounds, at least 1
     */
    record Rounds(long count) implements Horizon {
        /**
         * Validates the count.
         *
         * @param count at least 1
         */
        public Rounds {
            if (count < 1) {
                throw new IllegalArgumentException("rounds must be at least 1: " + count);
            }
        }

        @Override
        public double expectedLength() {
            return count;
        }

        @Override
        public String describe() {
            return "rounds=" + count;
        }
    }

    /**
     * A random length: after each round another follows with probability delta.
     *
     * @param probability the continuation probability delta in [0, 1)
     */
    record Continuation(double probability) implements Horizon {
        /**
         * Validates delta.
         *
         * @param probability in [0, 1)
         */
        public Continuation {
            if (!(probability >= 0 && probability < 1)) {
                throw new IllegalArgumentException("continuation probability must be in [0, 1): " + probability);
            }
        }

        @Override
        public double expectedLength() {
            return 1 / (1 - probability);
        }

        @Override
        public String describe() {
            return "continuation=" + Numbers.format(probability);
        }
    }

    /**
     * A fixed number of rounds.
     *
     * @param n at least 1
     * @return the horizon
     */
    static Horizon rounds(long n) {
        return new Rounds(n);
    }

    /**
     * A random length with continuation probability delta.
     *
     * @param delta in [0, 1)
     * @return the horizon
     */
    static Horizon continuation(double delta) {
        return new Continuation(delta);
    }
}
