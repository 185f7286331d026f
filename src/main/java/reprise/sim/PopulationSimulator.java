package reprise.sim;

import java.math.BigInteger;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.atomic.AtomicLong;
import reprise.game.Horizon;
import reprise.game.MemoryStrategy;
import reprise.game.Noise;
import reprise.game.Population;
import reprise.game.StageGame;

/**
 * Simulates a finite population whose members play fresh finite games at every update (the model of
 * {@link Population}): independent invasions of one mutant, and long runs with mutation.
 *
 * <p><b>Streams.</b> Invasion k (and mutation run k) draws everything - the update's choices and every
 * round of every game - from one stream, seeded from (seed, k) exactly as game k of a
 * {@link SimulationSpec} ({@link ReplicateStream}). Invasions are therefore independent, can run on any
 * thread in any order, and their exact integer tallies ({@link InvasionTally}) add to bit-identical
 * results for any number of threads or any cut into ranges.
 *
 * <p><b>Games.</b> Each game is played round by round with the fused memory-one decisions of the fast
 * kernels (execution and perception errors folded into the per-state cooperation probabilities, one
 * 64-bit draw per round); only memory-one strategies (reactive ones included) are played. A game's payoff
 * per round is its total over the expected length of a game (see {@link Population}).
 *
 * <p><b>Moran.</b> Reproducers are found by proposal and acceptance with f_max = f(max stage payoff), which
 * needs a payoff per round that cannot exceed the largest stage payoff: fixed rounds only.
 */
public final class PopulationSimulator {
    private final StageGame game;
    private final List<MemoryStrategy> strategies;
    private final Population population;
    private final long seed;
    private final long fixedRounds;
    private final double continuation;
    private final FusedTables[][] tables;
    private final double[] payoffX;
    private final double[] payoffY;
    private final double payoffScale;
    private final double maxFitness;

    /**
     * Builds a simulator.
     *
     * @param game a symmetric stage game
     * @param strategies at least 2 memory-one strategies
     * @param noise symmetric errors
     * @param horizon game length
     * @param population the population and update rule
     * @param seed the master seed
     */
    public PopulationSimulator(StageGame game, List<MemoryStrategy> strategies, Noise noise, Horizon horizon,
        Population population, long seed) {
        this.game = game;
        this.strategies = List.copyOf(strategies);
        this.population = population;
        this.seed = seed;
        if (this.strategies.size() < 2) {
            throw new IllegalArgumentException("a population needs at least 2 strategies: " + this.strategies.size());
        }
        double[] x = game.payoffX();
        double[] y = game.payoffY();
        if (x[0] != y[0] || x[3] != y[3] || x[1] != y[2] || x[2] != y[1]) {
            throw new IllegalArgumentException("a population needs a symmetric stage game: " + game.label());
        }
        if (noise.executionX() != noise.executionY() || noise.perceptionX() != noise.perceptionY()) {
            throw new IllegalArgumentException("a population needs the same errors for every individual: " + noise);
        }
        for (MemoryStrategy s : this.strategies) {
            if (s.memory() != 1) {
                throw new IllegalArgumentException("population runs play memory-one strategies only: " + s.label()
                    + " has memory " + s.memory());
            }
        }
        if (horizon instanceof Horizon.Rounds r) {
            fixedRounds = r.count();
            continuation = 0;
        } else {
            fixedRounds = 0;
            continuation = ((Horizon.Continuation) horizon).probability();
        }
        int k = this.strategies.size();
        tables = new FusedTables[k][k];
        for (int i = 0; i < k; i++) {
            for (int j = 0; j < k; j++) {
                tables[i][j] = FusedTables.of(this.strategies.get(i), this.strategies.get(j), noise);
            }
        }
        payoffX = x.clone();
        payoffY = y.clone();
        payoffScale = 1 / (population.gamesPerIndividual() * horizon.expectedLength());
        double max = Double.NEGATIVE_INFINITY;
        double min = Double.POSITIVE_INFINITY;
        for (double u : x) {
            max = Math.max(max, u);
            min = Math.min(min, u);
        }
        if (population.update() == Population.Update.MORAN_BIRTH_DEATH) {
            if (fixedRounds == 0) {
                throw new IllegalArgumentException("Moran runs need a fixed number of rounds (fitness must be bounded): "
                    + horizon.describe());
            }
            if (!(fitness(min) >= 0)) {
                throw new IllegalArgumentException("linear fitness 1 - w + w P is negative at the smallest payoff " + min
                    + " (w = " + population.selection() + ")");
            }
        }
        maxFitness = fitness(max);
    }

    /** @return the population */
    public Population population() {
        return population;
    }

    /** @return the master seed */
    public long seed() {
        return seed;
    }

    long fixedRounds() {
        return fixedRounds;
    }

    double continuation() {
        return continuation;
    }

    FusedTables tables(int x, int y) {
        return tables[x][y];
    }

    double[] payoffX() {
        return payoffX;
    }

    double[] payoffY() {
        return payoffY;
    }

    double payoffScale() {
        return payoffScale;
    }

    double maxFitness() {
        return maxFitness;
    }

    double fitness(double p) {
        double w = population.selection();
        return population.fitness() == Population.Fitness.EXPONENTIAL ? Math.exp(w * p) : 1 - w + w * p;
    }

    private void checkPair(int mutant, int resident) {
        int k = strategies.size();
        if (mutant < 0 || mutant >= k || resident < 0 || resident >= k || mutant == resident) {
            throw new IllegalArgumentException("mutant and resident must be two different strategies 0 to " + (k - 1)
                + ": " + mutant + ", " + resident);
        }
    }

    /**
     * Plays invasions from to to - 1 of one mutant among residents, each until fixation or loss.
     *
     * @param mutant the mutant's strategy index
     * @param resident the residents' strategy index
     * @param from first invasion index, at least 0
     * @param to one past the last
     * @param threads worker threads, at least 1 (the result does not depend on it)
     * @return the exact tallies
     */
    public InvasionTally invasions(int mutant, int resident, long from, long to, int threads) {
        checkPair(mutant, resident);
        if (from < 0 || to < from) {
            throw new IllegalArgumentException("invasion range must satisfy 0 <= from <= to: " + from + ", " + to);
        }
        if (threads < 1) {
            throw new IllegalArgumentException("threads must be at least 1: " + threads);
        }
        long count = to - from;
        int parts = (int) Math.min(threads, Math.max(1, count));
        if (parts == 1) {
            return range(new PopulationWorker(this), mutant, resident, from, to);
        }
        // Invasions differ widely in length, so workers take small chunks of indexes as they go; the exact
        // integer tallies add to the same result in any order.
        long chunk = Math.max(1, count / (16L * parts));
        AtomicLong cursor = new AtomicLong(from);
        ExecutorService pool = Executors.newFixedThreadPool(parts);
        try {
            List<Future<InvasionTally>> futures = new ArrayList<>();
            for (int p = 0; p < parts; p++) {
                futures.add(pool.submit(() -> {
                    PopulationWorker w = new PopulationWorker(this);
                    InvasionTally sum = InvasionTally.EMPTY;
                    for (long a = cursor.getAndAdd(chunk); a < to; a = cursor.getAndAdd(chunk)) {
                        sum = sum.plus(range(w, mutant, resident, a, Math.min(to, a + chunk)));
                    }
                    return sum;
                }));
            }
            InvasionTally total = InvasionTally.EMPTY;
            for (Future<InvasionTally> f : futures) {
                total = total.plus(f.get());
            }
            return total;
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException("population run interrupted", e);
        } catch (ExecutionException e) {
            if (e.getCause() instanceof RuntimeException r) {
                throw r;
            }
            throw new IllegalStateException(e.getCause());
        } finally {
            pool.shutdownNow();
        }
    }

    private InvasionTally range(PopulationWorker w, int mutant, int resident, long from, long to) {
        int n = population.size();
        long fixations = 0;
        long timeSum = 0;
        BigInteger squares = BigInteger.ZERO;
        long updates = 0;
        for (long k = from; k < to; k++) {
            w.rng.seed(seed, k);
            int i = 1;
            long t = 0;
            while (i > 0 && i < n) {
                i = w.update(i, mutant, resident, 0);
                t++;
            }
            updates += t;
            if (i == n) {
                fixations++;
                timeSum = Math.addExact(timeSum, t);
                squares = squares.add(BigInteger.valueOf(t).multiply(BigInteger.valueOf(t)));
            }
        }
        return new InvasionTally(to - from, fixations, timeSum, squares, updates, w.takeRounds());
    }

    /**
     * One long run with mutation probability mu per update, from `start` individuals of strategy a.
     *
     * @param a the counted strategy
     * @param b the other strategy
     * @param mu in (0, 1]
     * @param start the initial count of a, 0 to N
     * @param updates the number of updates, at least 4 * thin
     * @param thin updates between records, at least 1
     * @param index the run's stream index
     * @return the recorded counts
     */
    public MutationRun mutationRun(int a, int b, double mu, int start, long updates, int thin, long index) {
        checkPair(a, b);
        int n = population.size();
        if (!(mu > 0 && mu <= 1)) {
            throw new IllegalArgumentException("mutation probability must be in (0, 1]: " + mu);
        }
        if (start < 0 || start > n) {
            throw new IllegalArgumentException("start must be 0 to " + n + ": " + start);
        }
        if (thin < 1 || updates / thin < 4 || updates / thin > Integer.MAX_VALUE - 8) {
            throw new IllegalArgumentException("a mutation run needs 4 to 2^31 records: " + updates + " updates, thin "
                + thin);
        }
        PopulationWorker w = new PopulationWorker(this);
        w.rng.seed(seed, index);
        int records = (int) (updates / thin);
        int[] counts = new int[records];
        int i = start;
        for (int r = 0; r < records; r++) {
            for (int j = 0; j < thin; j++) {
                i = w.update(i, a, b, mu);
            }
            counts[r] = i;
        }
        return new MutationRun(n, counts, thin, w.takeRounds());
    }
}
