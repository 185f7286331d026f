package reprise.experiment;

import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import reprise.chain.MemoryOnePair;
import reprise.game.Horizon;
import reprise.game.MemoryStrategy;
import reprise.game.Noise;
import reprise.game.Player;
import reprise.game.StageGame;
import reprise.game.Strategies;
import reprise.game.Strategy;
import reprise.game.StrategyDescription;
import reprise.game.ZeroDeterminant;

/**
 * Runs a {@link SweepDefinition}: solves every match exactly with the allocation-free memory-one engine,
 * in parallel over strategies.
 *
 * <p>Implementation note. The swept strategies are first generated in index order (random ones from one
 * seeded generator, in one pass), then the strategy range is cut into contiguous blocks solved by the worker
 * threads, each with its own {@link MemoryOnePair}; every match writes only its own slots, so the result is
 * identical for any number of threads. Co-players must be memory-one tables (named memory-one classics,
 * reactive, memory1 and the zero-determinant constructors).
 */
public final class Sweep {
    private static final int BLOCK = 4096;

    private Sweep() {
    }

    /**
     * Runs the sweep.
     *
     * @param d the definition
     * @param threads the number of worker threads, at least 1
     * @return the table of exact values
     * @throws IllegalArgumentException when a co-player is not a memory-one table
     */
    public static SweepTable run(SweepDefinition d, int threads) {
        if (threads < 1) {
            throw new IllegalArgumentException("threads must be at least 1: " + threads);
        }
        StageGame game = d.game();
        List<MemoryStrategy> co = new ArrayList<>();
        List<SweepDefinition.Relation> enforced = new ArrayList<>();
        for (String spec : d.coPlayers()) {
            Strategy s = Strategies.parse(spec, game, Player.Y);
            if (!(s instanceof MemoryStrategy m) || m.memory() != 1) {
                throw new IllegalArgumentException("sweep co-player '" + spec + "' must be a memory-one strategy");
            }
            co.add(m);
            enforced.add(enforcedRelation(StrategyDescription.of(spec, game, Player.Y), game));
        }
        int n = d.family().size();
        double[] tables = strategies(d.family());
        int c = co.size();
        int lengths = d.lengths().size();
        double[] freq = new double[Math.multiplyExact(Math.multiplyExact(n, c * lengths), 4)];
        boolean[] unique = new boolean[n * c * lengths];
        double[][] q = new double[c][];
        double[] q0 = new double[c];
        for (int j = 0; j < c; j++) {
            q[j] = co.get(j).table();
            q0[j] = co.get(j).initial();
        }
        int blocks = (n + BLOCK - 1) / BLOCK;
        Noise e = d.noise();
        Runnable[] work = new Runnable[blocks];
        for (int b = 0; b < blocks; b++) {
            int from = b * BLOCK;
            int to = Math.min(n, from + BLOCK);
            work[b] = () -> solveBlock(from, to, tables, d.firstMove(), q, q0, d.lengths(), e, freq, unique);
        }
        runAll(work, threads);
        return new SweepTable(d, tables, List.copyOf(co.stream().map(MemoryStrategy::label).toList()), enforced, freq,
            unique);
    }

    private static void solveBlock(int from, int to, double[] tables, double p0, double[][] q, double[] q0,
        List<Horizon> lengths, Noise e, double[] freq, boolean[] unique) {
        MemoryOnePair pair = new MemoryOnePair();
        double[] p = new double[4];
        double[] f = new double[4];
        int c = q.length;
        int l = lengths.size();
        for (int i = from; i < to; i++) {
            System.arraycopy(tables, 4 * i, p, 0, 4);
            for (int j = 0; j < c; j++) {
                for (int k = 0; k < l; k++) {
                    pair.solve(lengths.get(k), p, p0, q[j], q0[j], e.executionX(), e.executionY(), e.perceptionX(),
                        e.perceptionY());
                    int row = (i * c + j) * l + k;
                    pair.frequencies(f);
                    System.arraycopy(f, 0, freq, 4 * row, 4);
                    unique[row] = pair.unique();
                }
            }
        }
    }

    private static void runAll(Runnable[] work, int threads) {
        if (threads == 1 || work.length == 1) {
            for (Runnable r : work) {
                r.run();
            }
            return;
        }
        ExecutorService pool = Executors.newFixedThreadPool(Math.min(threads, work.length), r -> {
            Thread t = new Thread(r, "sweep");
            t.setDaemon(true);
            return t;
        });
        try {
            List<Future<?>> futures = new ArrayList<>();
            for (Runnable r : work) {
                futures.add(pool.submit(r));
            }
            for (Future<?> f : futures) {
                f.get();
            }
        } catch (InterruptedException ex) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException("sweep interrupted", ex);
        } catch (ExecutionException ex) {
            Throwable cause = ex.getCause();
            if (cause instanceof RuntimeException re) {
                throw re;
            }
            throw new IllegalStateException(cause);
        } finally {
            pool.shutdownNow();
        }
    }

    /**
     * The swept strategies' tables, 4 numbers per strategy in index order.
     *
     * @param family the family
     * @return n x 4 numbers
     */
    static double[] strategies(SweepDefinition.Family family) {
        int n = family.size();
        double[] t = new double[4 * n];
        if (family instanceof SweepDefinition.ReactiveGrid g) {
            double[] p = g.p();
            double[] q = g.q();
            int i = 0;
            for (double a : p) {
                for (double b : q) {
                    t[4 * i] = a;
                    t[4 * i + 1] = b;
                    t[4 * i + 2] = a;
                    t[4 * i + 3] = b;
                    i++;
                }
            }
        } else if (family instanceof SweepDefinition.MemoryOneGrid g) {
            double[][] ax = g.axes();
            int i = 0;
            for (double a : ax[0]) {
                for (double b : ax[1]) {
                    for (double c : ax[2]) {
                        for (double d : ax[3]) {
                            t[4 * i] = a;
                            t[4 * i + 1] = b;
                            t[4 * i + 2] = c;
                            t[4 * i + 3] = d;
                            i++;
                        }
                    }
                }
            }
        } else {
            SweepDefinition.RandomStrategies r = (SweepDefinition.RandomStrategies) family;
            UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(r.seed());
            for (int i = 0; i < n; i++) {
                if (r.reactive()) {
                    double a = rng.nextDouble();
                    double b = rng.nextDouble();
                    t[4 * i] = a;
                    t[4 * i + 1] = b;
                    t[4 * i + 2] = a;
                    t[4 * i + 3] = b;
                } else {
                    for (int s = 0; s < 4; s++) {
                        t[4 * i + s] = rng.nextDouble();
                    }
                }
            }
        }
        return t;
    }

    /**
     * The relation a zero-determinant co-player (Y) enforces, written as a combination that is zero when it
     * holds: extortionate (pi_Y - P_Y) - chi (pi_X - P_X), generous (pi_Y - R_Y) - chi (pi_X - R_X),
     * equalizer pi_X - score; null for other strategies.
     *
     * @param d the co-player's description
     * @param game the stage game
     * @return the relation, or null
     */
    static SweepDefinition.Relation enforcedRelation(StrategyDescription d, StageGame game) {
        ZeroDeterminant.Parameters z = d.zeroDeterminant();
        if (z == null) {
            return null;
        }
        double[] ux = game.payoffX();
        double[] uy = game.payoffY();
        return switch (z.family()) {
            case "extortionate" -> new SweepDefinition.Relation("enforced_residual", -z.chi(), 1,
                z.chi() * ux[3] - uy[3]);
            case "generous" -> new SweepDefinition.Relation("enforced_residual", -z.chi(), 1,
                z.chi() * ux[0] - uy[0]);
            default -> new SweepDefinition.Relation("enforced_residual", 1, 0, -z.score());
        };
    }
}
