package reprise.sim;

import reprise.game.Population;

/**
 * Plays the updates of one population run from one stream: every game of an update is played round by
 * round with the fused memory-one decisions ({@link FusedTables}: the same limits and one 64-bit draw per
 * round as {@link FusedMemoryOneKernel}), and the update's choices are drawn from the same stream.
 *
 * <p>Draws per update, in order. Pairwise comparison: the learner (nextInt(N): a mutant iff below i); if
 * mutation is on, one nextDouble() (below mu: the learner switches to the other strategy and the update
 * ends); the model among the other N - 1 (nextInt(N - 1)); if their strategies differ, the games (the
 * model's, then the learner's; with every co-player the shared game first, with the model as X), then
 * one nextDouble() against F(beta (P_model - P_learner)). Moran: repeated proposals (nextInt(N), the
 * proposal's games, one nextDouble() against f / f_max) until one is accepted; if mutation is on, one
 * nextDouble() for the offspring's mutation; the replaced individual (nextInt(N - 1)). With sampled
 * co-players each sample is drawn one member at a time without replacement (nextInt(remaining)) just
 * before its game. A game of continuation length first draws its length
 * ({@link ReplicateStream#geometricLength}).
 */
final class PopulationWorker {
    final ReplicateStream rng = new ReplicateStream();
    private final PopulationSimulator sim;
    private final Population population;
    private final int n;
    private final double beta;
    private long rounds;
    private final long[] counts = new long[4];

    PopulationWorker(PopulationSimulator sim) {
        this.sim = sim;
        this.population = sim.population();
        this.n = population.size();
        this.beta = population.selection();
    }

    long takeRounds() {
        long r = rounds;
        rounds = 0;
        return r;
    }

    /**
     * Plays one game of X (strategy x) against Y (strategy y); leaves the state counts in {@link #counts}.
     */
    private void play(FusedTables t) {
        long length = sim.fixedRounds() > 0 ? sim.fixedRounds() : rng.geometricLength(sim.continuation());
        rounds += length;
        final long[] lx = t.limitX();
        final long[] ly = t.limitY();
        long s0 = rng.state0;
        long s1 = rng.state1;
        long r = Long.rotateLeft(s0 + s1, 17) + s0;
        s1 ^= s0;
        s0 = Long.rotateLeft(s0, 49) ^ s1 ^ (s1 << 21);
        s1 = Long.rotateLeft(s1, 28);
        int s = (int) (((t.firstLimitX() - (r >>> 32)) >>> 63) << 1) | (int) ((t.firstLimitY() - (r & 0xFFFFFFFFL)) >>> 63);
        long[] tally = counts;
        tally[0] = 0;
        tally[1] = 0;
        tally[2] = 0;
        tally[3] = 0;
        tally[s]++;
        long left = length - 1;
        while (left > 0) {
            // Four 16-bit counters in one word, one per state, emptied every 65,535 rounds.
            int block = (int) Math.min(left, 0xFFFF);
            long packed = 0;
            for (int k = 0; k < block; k++) {
                r = Long.rotateLeft(s0 + s1, 17) + s0;
                s1 ^= s0;
                s0 = Long.rotateLeft(s0, 49) ^ s1 ^ (s1 << 21);
                s1 = Long.rotateLeft(s1, 28);
                s = (int) (((lx[s] - (r >>> 32)) >>> 63) << 1) | (int) ((ly[s] - (r & 0xFFFFFFFFL)) >>> 63);
                packed += 1L << (s << 4);
            }
            tally[0] += packed & 0xFFFF;
            tally[1] += (packed >>> 16) & 0xFFFF;
            tally[2] += (packed >>> 32) & 0xFFFF;
            tally[3] += packed >>> 48;
            left -= block;
        }
        rng.state0 = s0;
        rng.state1 = s1;
    }

    private double payoffX() {
        double[] u = sim.payoffX();
        return counts[0] * u[0] + counts[1] * u[1] + counts[2] * u[2] + counts[3] * u[3];
    }

    private double payoffY() {
        double[] u = sim.payoffY();
        return counts[0] * u[0] + counts[1] * u[1] + counts[2] * u[2] + counts[3] * u[3];
    }

    /** Total payoff of a focal of strategy f over games against `aCount` mutants and `bCount` residents. */
    private double games(int f, int a, int b, long aCount, long bCount) {
        double total = 0;
        for (long j = 0; j < aCount; j++) {
            play(sim.tables(f, a));
            total += payoffX();
        }
        for (long j = 0; j < bCount; j++) {
            play(sim.tables(f, b));
            total += payoffX();
        }
        return total;
    }

    /** Total payoff over m co-players drawn without replacement from `others`, `aOthers` of them mutants. */
    private double sampledGames(int f, int a, int b, int others, int aOthers) {
        int m = population.coPlayers();
        double total = 0;
        int left = others;
        int aLeft = aOthers;
        for (int j = 0; j < m; j++) {
            boolean meetsA = rng.nextInt(left) < aLeft;
            left--;
            if (meetsA) {
                aLeft--;
            }
            play(sim.tables(f, meetsA ? a : b));
            total += payoffX();
        }
        return total;
    }

    /**
     * One pairwise-comparison update with i mutants of strategy a among residents b.
     *
     * @return the new i
     */
    int pairwise(int i, int a, int b, double mu) {
        boolean learnerA = rng.nextInt(n) < i;
        if (mu > 0 && rng.nextDouble() < mu) {
            return learnerA ? i - 1 : i + 1;
        }
        boolean modelA = rng.nextInt(n - 1) < i - (learnerA ? 1 : 0);
        if (learnerA == modelA) {
            return i;
        }
        int model = modelA ? a : b;
        int learner = modelA ? b : a;
        double pm;
        double pl;
        if (population.coPlayers() == 0) {
            play(sim.tables(model, learner));
            pm = payoffX();
            pl = payoffY();
            int aOthers = i - 1;
            int bOthers = n - i - 1;
            pm += games(model, a, b, aOthers, bOthers);
            pl += games(learner, a, b, aOthers, bOthers);
        } else {
            int modelOthersA = i - (modelA ? 1 : 0);
            int learnerOthersA = i - (modelA ? 0 : 1);
            pm = sampledGames(model, a, b, n - 1, modelOthersA);
            pl = sampledGames(learner, a, b, n - 1, learnerOthersA);
        }
        double scale = sim.payoffScale();
        double x = beta * (pm - pl) * scale;
        double adopt = x >= 0 ? 1 / (1 + Math.exp(-x)) : Math.exp(x) / (1 + Math.exp(x));
        if (rng.nextDouble() < adopt) {
            return modelA ? i + 1 : i - 1;
        }
        return i;
    }

    /**
     * One Moran birth-death update (one accepted reproduction).
     *
     * @return the new i
     */
    int moran(int i, int a, int b, double mu) {
        boolean parentA;
        while (true) {
            boolean focalA = rng.nextInt(n) < i;
            int f = focalA ? a : b;
            double p;
            if (population.coPlayers() == 0) {
                p = games(f, a, b, i - (focalA ? 1 : 0), n - i - (focalA ? 0 : 1));
            } else {
                p = sampledGames(f, a, b, n - 1, i - (focalA ? 1 : 0));
            }
            double fitness = sim.fitness(p * sim.payoffScale());
            if (rng.nextDouble() * sim.maxFitness() < fitness) {
                parentA = focalA;
                break;
            }
        }
        boolean childA = parentA;
        if (mu > 0 && rng.nextDouble() < mu) {
            childA = !childA;
        }
        boolean replacedA = rng.nextInt(n - 1) < i - (parentA ? 1 : 0);
        return i + (childA ? 1 : 0) - (replacedA ? 1 : 0);
    }

    int update(int i, int a, int b, double mu) {
        return population.update() == Population.Update.PAIRWISE_COMPARISON ? pairwise(i, a, b, mu) : moran(i, a, b, mu);
    }
}
