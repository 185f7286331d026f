package reprise.game;

/**
 * A well-mixed population of {@code size} individuals and the rule by which one of them may change
 * strategy in an update: the shared description read by the exact side ({@code reprise.evolution}) and
 * the simulator ({@code reprise.sim.PopulationSimulator}), which compute everything else independently.
 *
 * <p><b>Payoff of a focal individual.</b> Its mean payoff per round over fresh games against every other
 * member ({@code coPlayers = 0}), or against {@code coPlayers} members drawn uniformly at random without
 * replacement from the other size - 1. A game's payoff per round is its total payoff divided by the
 * expected length of a game (n for n rounds, 1 / (1 - delta) for continuation probability delta), so its
 * expectation is the per-round payoff of {@link Horizon}. With every co-player, the two individuals
 * compared in a pairwise update play one game against each other, which counts for both; with sampled
 * co-players each draws its own sample and plays its own games.
 *
 * <p><b>Update rules.</b>
 * <ul>
 *   <li>{@link Update#PAIRWISE_COMPARISON}: a learner and a role model are drawn uniformly (distinct);
 *       the learner adopts the model's strategy with probability 1 / (1 + exp(-beta (P_model - P_learner)))
 *       (Traulsen, Nowak &amp; Pacheco 2006); {@code selection} is beta.</li>
 *   <li>{@link Update#MORAN_BIRTH_DEATH}: one individual reproduces with probability proportional to its
 *       fitness, f = 1 - w + w P ({@link Fitness#LINEAR}) or exp(w P) ({@link Fitness#EXPONENTIAL}), and its
 *       offspring replaces one of the other size - 1 uniformly (Nowak, Sasaki, Taylor &amp; Fudenberg 2004);
 *       {@code selection} is w. With realised payoffs the reproducer is found by proposal and acceptance:
 *       an individual drawn uniformly plays fresh games and is accepted with probability f / f_max, else
 *       another is proposed; so it is chosen with probability proportional to its expected fitness.</li>
 * </ul>
 *
 * <p>References:
 * <ul>
 *   <li>Traulsen, A., Nowak, M.A. &amp; Pacheco, J.M. (2006). Stochastic dynamics of invasion and fixation.
 *       Physical Review E 74, 011909.</li>
 *   <li>Nowak, M.A., Sasaki, A., Taylor, C. &amp; Fudenberg, D. (2004). Emergence of cooperation and
 *       evolutionary stability in finite populations. Nature 428, 646-650.</li>
 * </ul>
 *
 * @param size the number of individuals N, 2 to 100,000
 * @param update the update rule
 * @param selection beta (pairwise comparison, at least 0) or w (Moran, at least 0; at most 1 for linear
 *     fitness)
 * @param fitness how payoff maps to fitness (read by the Moran rule only)
 * @param coPlayers 0 for every other member, else the number m of co-players drawn, 1 to size - 1
 */
public record Population(int size, Update update, double selection, Fitness fitness, int coPlayers) {

    /** The largest population. */
    public static final int MAX_SIZE = 100_000;

    /** How an update changes the population. */
    public enum Update {
        /** Imitation by the Fermi rule. */
        PAIRWISE_COMPARISON,
        /** Fitness-proportional reproduction, offspring replaces another individual. */
        MORAN_BIRTH_DEATH
    }

    /** The map from payoff P to fitness in the Moran rule. */
    public enum Fitness {
        /** 1 - w + w P. */
        LINEAR,
        /** exp(w P). */
        EXPONENTIAL
    }

    /**
     * Validates the description.
     *
     * @param size 2 to {@link #MAX_SIZE}
     * @param update not null
     * @param selection finite, at least 0 (at most 1 for linear Moran fitness)
     * @param fitness not null
     * @param coPlayers 0 or 1 to size - 1
     */
    public Population {
        if (size < 2 || size > MAX_SIZE) {
            throw new IllegalArgumentException("population size must be 2 to " + MAX_SIZE + ": " + size);
        }
        if (update == null || fitness == null) {
            throw new IllegalArgumentException("population update rule and fitness must be given");
        }
        if (!(selection >= 0 && selection < Double.POSITIVE_INFINITY)) {
            throw new IllegalArgumentException("selection strength must be finite and at least 0: " + selection);
        }
        if (update == Update.MORAN_BIRTH_DEATH && fitness == Fitness.LINEAR && selection > 1) {
            throw new IllegalArgumentException("linear fitness 1 - w + w P needs w in [0, 1]: " + selection);
        }
        if (coPlayers < 0 || coPlayers > size - 1) {
            throw new IllegalArgumentException("co-players must be 0 (all) or 1 to " + (size - 1) + ": " + coPlayers);
        }
    }

    /**
     * Pairwise comparison with every co-player.
     *
     * @param size N
     * @param beta selection strength
     * @return the population
     */
    public static Population pairwise(int size, double beta) {
        return new Population(size, Update.PAIRWISE_COMPARISON, beta, Fitness.EXPONENTIAL, 0);
    }

    /**
     * The Moran birth-death rule with every co-player.
     *
     * @param size N
     * @param w selection intensity
     * @param fitness linear or exponential
     * @return the population
     */
    public static Population moran(int size, double w, Fitness fitness) {
        return new Population(size, Update.MORAN_BIRTH_DEATH, w, fitness, 0);
    }

    /**
     * The same population with m co-players drawn at random (0 for all).
     *
     * @param m the number of co-players
     * @return the population
     */
    public Population withCoPlayers(int m) {
        return new Population(size, update, selection, fitness, m);
    }

    /**
     * The same population of another size.
     *
     * @param n the size
     * @return the population
     */
    public Population withSize(int n) {
        return new Population(n, update, selection, fitness, coPlayers);
    }

    /**
     * The same population with another selection strength.
     *
     * @param s beta or w
     * @return the population
     */
    public Population withSelection(double s) {
        return new Population(size, update, s, fitness, coPlayers);
    }

    /** @return the number of co-players each focal individual plays: m, or size - 1 for all */
    public int gamesPerIndividual() {
        return coPlayers == 0 ? size - 1 : coPlayers;
    }
}
