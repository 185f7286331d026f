package reprise.sim;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.atomic.AtomicLong;
import org.apache.commons.rng.UniformRandomProvider;
import reprise.game.Horizon;
import reprise.game.Match;
import reprise.game.MemoryStrategy;
import reprise.game.Strategy;

/**
 * The round-by-round Monte Carlo engine: plays independent games and tallies them exactly.
 *
 * <p>Each game enacts the model of {@link reprise.game.Noise} literally: in round 1 each player intends
 * to cooperate with its first-round probability; afterwards each intends a move from its own record (a
 * lookup table reads its own-view history, pre-game rounds CC); each realised move flips with the
 * player's execution error; payoffs follow the realised moves; each player then records its own move
 * and its perception of the co-player's, misread with its perception error. A fixed horizon plays
 * exactly n rounds; a continuation probability delta gives each game its own geometric length
 * N = 1 + floor(ln U / ln delta), so P(N &gt; t) = delta^t (one draw, the first of the game's stream).
 * Two memory-one players take a fused, equally distributed fast path unless {@link Enactment#LITERAL}
 * is asked for (see {@code FusedMemoryOneKernel}); with a fixed horizon the games of a chunk are then
 * played in lockstep blocks ({@code LockstepKernel}: the same draws and decisions, so the same results,
 * compiled to SIMD instructions; {@code SimdLockstepKernel} the same with the JDK's vector API where the VM
 * provides it, see {@link #kernel()}). Everything else takes the literal path with one draw per uncertain
 * event.
 *
 * <p>Reproducibility: game i is a function of (seed, i) only (see {@link #replicateGenerator}). Work is
 * cut into chunks of consecutive replicate indexes whose boundaries depend only on the spec; workers
 * take chunks in any order and tally into their own integer accumulators, which are merged at the end.
 * Since every tally is an integer sum, results are bit-identical for any number of threads and any
 * split of the replicates into ranges simulated separately and merged.
 *
 * <p>Memory is bounded by the requested snapshot and time-resolved arrays and the 4^n x 4 history
 * tallies, once per worker; it does not grow with rounds or replicates.
 */
public final class Simulator {

    /** The generator of every replicate stream, as a Commons RNG {@code RandomSource} name. */
    public static final String GENERATOR = "XO_RO_SHI_RO_128_PP";

    /**
     * Fewest expected rounds, summed over the fused-path runs of this VM so far and the current one, from
     * which the fused path uses the vector API kernel with a fixed horizon: loading the module, warming
     * the kernel up and compiling it cost about a second of CPU time once per VM, which 2^30 rounds
     * recover at the fixed-horizon gain (about 0.3 ns a round). With random lengths the gain over one game
     * at a time is five times larger, and a quarter of this suffices. So a long run uses it from the
     * start, and a sequence of short runs (a check's units) from the run that reaches the sum.
     */
    static final double SIMD_MIN_ROUNDS = 0x1p30;

    /** Expected rounds of the fused-path runs of this VM so far. */
    private static final java.util.concurrent.atomic.DoubleAdder FUSED_ROUNDS =
        new java.util.concurrent.atomic.DoubleAdder();

    /** Fewest games per chunk for which the fused path plays games in lockstep blocks. */
    static final long LOCKSTEP_MIN_GAMES = 32;

    /** Rounds aimed at per chunk of replicates (the chunk size depends only on the spec). */
    private static final double ROUNDS_PER_CHUNK = 1 << 23;

    private final SimulationSpec spec;
    private final boolean fast;
    private final boolean tables;
    private final int historyMemory;
    private final Plan plan;
    private final String configuration;
    private final long chunkReplicates;
    private final double simdMinRounds;

    /**
     * Prepares a run: checks the agents and the memory the tallies need.
     *
     * @param spec the run
     * @throws IllegalArgumentException for an unknown agent or bad agent arguments, or when the snapshot
     *     and time-resolved tallies would need more than half the maximum heap (the message gives the
     *     estimate)
     */
    public Simulator(SimulationSpec spec) {
        this(spec, 0);
    }

    /** With a fixed chunk size in replicates (0: derived from the spec); for tests of the chunking. */
    Simulator(SimulationSpec spec, long chunkReplicates) {
        this(spec, chunkReplicates, SIMD_MIN_ROUNDS);
    }

    /** With a fixed chunk size and another least run size for the vector kernel (testing hooks). */
    Simulator(SimulationSpec spec, long chunkReplicates, double simdMinRounds) {
        this.spec = spec;
        this.chunkReplicates = chunkReplicates;
        this.simdMinRounds = simdMinRounds;
        Match m = spec.match();
        Agents.create(m.x());
        Agents.create(m.y());
        tables = m.x() instanceof MemoryStrategy && m.y() instanceof MemoryStrategy;
        fast = tables && spec.enactment() == Enactment.FASTEST && ((MemoryStrategy) m.x()).memory() == 1
            && ((MemoryStrategy) m.y()).memory() == 1;
        historyMemory = Math.max(memory(m.x()), memory(m.y()));
        long fixed = spec.horizon() instanceof Horizon.Rounds r ? r.count() : 0;
        double delta = spec.horizon() instanceof Horizon.Continuation c ? c.probability() : 0;
        plan = new Plan(spec.seed(), fixed, delta, spec.burnIn(), spec.snapshotRounds(), spec.timeResolvedRounds());
        long workers = spec.threads() + 1L;
        long bytes = workers * Accumulator.estimateBytes(historyMemory, spec.snapshotRounds().length,
            spec.timeResolvedRounds());
        long limit = Runtime.getRuntime().maxMemory() / 2;
        if (bytes > limit) {
            throw new IllegalArgumentException(String.format(Locale.ROOT,
                "tallies would need about %.1f MiB (%d time-resolved rounds, %d snapshot rounds, %d threads); "
                    + "the limit is %.1f MiB, half the maximum heap: request fewer rounds or threads",
                bytes / 1048576.0, spec.timeResolvedRounds(), spec.snapshotRounds().length, spec.threads(),
                limit / 1048576.0));
        }
        configuration = "x=" + m.x().label() + "; y=" + m.y().label() + "; game=" + m.game() + "; noise="
            + m.noise() + "; " + spec.horizon().describe() + "; burnIn=" + spec.burnIn() + "; snapshots="
            + java.util.Arrays.toString(spec.snapshotRounds()) + "; timeResolved=" + spec.timeResolvedRounds()
            + "; path=" + (fast ? "fused" : "literal");
    }

    private static int memory(Strategy s) {
        return s instanceof MemoryStrategy m ? m.memory() : 1;
    }

    /** @return the spec of this run */
    public SimulationSpec spec() {
        return spec;
    }

    /**
     * @return the approximate heap bytes of one tally of this run (one worker's, or one finished unit's),
     *     the figure the memory check of the constructor multiplies by the workers
     */
    public long tallyBytes() {
        return Accumulator.estimateBytes(historyMemory, spec.snapshotRounds().length, spec.timeResolvedRounds());
    }

    /** @return whether the fused memory-one path will be used */
    public boolean usesFastPath() {
        return fast;
    }

    /**
     * The random stream of one replicate, as the engine starts it: XoRoShiRo128++ (Commons RNG
     * {@code XO_RO_SHI_RO_128_PP}) seeded with {@code {mix64(b + (2i + 1) G), mix64(b + (2i + 2) G)}},
     * where b = mix64(seed), G = 0x9E3779B97F4A7C15 and mix64 is the SplitMix64 output function; i.e.
     * the outputs 2i + 1 and 2i + 2 of SplitMix64 started at state b.
     *
     * @param seed the master seed
     * @param replicate the replicate index, at least 0
     * @return a fresh generator positioned at the start of that replicate's stream
     */
    public static UniformRandomProvider replicateGenerator(long seed, long replicate) {
        ReplicateStream r = new ReplicateStream();
        r.seed(seed, replicate);
        return r;
    }

    /**
     * Simulates all replicates [0, replicates).
     *
     * @return the result
     */
    public SimulationResult run() {
        return simulateRange(0, spec.replicates(), null);
    }

    /**
     * Simulates all replicates, reporting progress.
     *
     * @param listener receives progress reports, or null
     * @return the result
     */
    public SimulationResult run(ProgressListener listener) {
        return simulateRange(0, spec.replicates(), listener);
    }

    /**
     * Simulates the replicates [from, to) with the spec's threads. Results of disjoint ranges combine with
     * {@link SimulationResult#merge(SimulationResult)} into exactly the result of one run over their union.
     *
     * @param from first replicate index, at least 0
     * @param to one past the last, at most {@link SimulationSpec#replicates()}
     * @param listener receives progress reports, or null
     * @return the result over that range
     * @throws IllegalArgumentException if the range is empty or outside [0, replicates)
     */
    public SimulationResult simulateRange(long from, long to, ProgressListener listener) {
        if (!(from >= 0 && from < to && to <= spec.replicates())) {
            throw new IllegalArgumentException("replicate range must satisfy 0 <= from < to <= " + spec.replicates()
                + ": [" + from + ", " + to + ")");
        }
        long count = to - from;
        long chunk = chunkSize();
        long chunks = (count + chunk - 1) / chunk;
        int workers = (int) Math.min(spec.threads(), chunks);
        double expected = count * spec.horizon().expectedLength();
        Progress progress = new Progress(listener, count, expected >= 0x1p63 ? Long.MAX_VALUE : (long) expected);
        AtomicLong nextChunk = new AtomicLong();
        List<Worker> kernels = new ArrayList<>();
        if (fast) {
            FUSED_ROUNDS.add(expected);
        }
        boolean simd = fast && FUSED_ROUNDS.sum() >= simdThreshold();
        if (workers == 1) {
            kernels.add(worker(chunk, simd));
            work(kernels.get(0), nextChunk, chunks, chunk, from, to, progress);
        } else {
            ExecutorService pool = Executors.newFixedThreadPool(workers, r -> {
                Thread t = new Thread(r, "reprise-sim");
                t.setDaemon(true);
                return t;
            });
            try {
                // each worker allocates its own kernel, so that the hot arrays of two workers lie in
                // different threads' allocation buffers, never on a shared cache line
                List<Future<Worker>> futures = new ArrayList<>();
                for (int w = 0; w < workers; w++) {
                    futures.add(pool.submit(() -> {
                        Worker k = worker(chunk, simd);
                        work(k, nextChunk, chunks, chunk, from, to, progress);
                        return k;
                    }));
                }
                for (Future<Worker> f : futures) {
                    kernels.add(f.get());
                }
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                throw new IllegalStateException("simulation interrupted", e);
            } catch (ExecutionException e) {
                Throwable c = e.getCause();
                if (c instanceof RuntimeException re) {
                    throw re;
                }
                if (c instanceof Error err) {
                    throw err;
                }
                throw new IllegalStateException("simulation failed: " + c, c);
            } finally {
                pool.shutdownNow();
            }
        }
        Accumulator total = kernels.get(0).acc;
        for (int w = 1; w < workers; w++) {
            total.merge(kernels.get(w).acc);
        }
        return new SimulationResult(configuration, spec.seed(), fast, spec.match().game().payoffX(),
            spec.match().game().payoffY(), List.of(new SimulationResult.ReplicateRange(from, to)), total);
    }

    private double simdThreshold() {
        return plan.fixedRounds() > 0 ? simdMinRounds : simdMinRounds / 4;
    }

    private long chunkSize() {
        return chunkReplicates > 0 ? chunkReplicates : (long) Math.max(1, Math.min(1 << 20,
            Math.floor(ROUNDS_PER_CHUNK / spec.horizon().expectedLength())));
    }

    private static void work(Worker k, AtomicLong nextChunk, long chunks, long chunk, long from, long to,
        Progress progress) {
        for (long c = nextChunk.getAndIncrement(); c < chunks; c = nextChunk.getAndIncrement()) {
            if (Thread.currentThread().isInterrupted()) {
                throw new IllegalStateException("simulation interrupted after " + c + " of " + chunks + " chunks");
            }
            long a = from + c * chunk;
            long b = Math.min(to, a + chunk);
            long rounds = k.run(a, b);
            progress.add(b - a, rounds);
        }
    }

    /**
     * The engine of one worker. On the fused path with a fixed horizon and chunks of at least
     * {@link #LOCKSTEP_MIN_GAMES} games, the games of a chunk are played in lockstep blocks
     * ({@link LockstepKernel}, the same draws and decisions as the per-game fused kernel, so the choice
     * changes speed only), in the vector API's registers ({@link SimdLockstepKernel}) where the VM has the
     * module and the plan is the plain one that kernel takes.
     */
    private Worker worker(long chunk, boolean simd) {
        Match m = spec.match();
        Accumulator acc = new Accumulator(historyMemory, plan.snapshotRounds(), plan.timeRounds());
        if (fast) {
            FusedTables t = fusedTables();
            if (simd && chunk >= LOCKSTEP_MIN_GAMES && VectorModule.available()
                && SimdLockstepKernel.supports(plan, t)) {
                return SimdLockstepKernel.create(plan, acc, t);
            }
            if (plan.fixedRounds() > 0 && chunk >= LOCKSTEP_MIN_GAMES) {
                return new LockstepKernel(plan, acc, t);
            }
            return new FusedMemoryOneKernel(plan, acc, t);
        }
        if (tables) {
            return new LiteralTableKernel(plan, acc, (MemoryStrategy) m.x(), (MemoryStrategy) m.y(), m.noise());
        }
        return new AgentKernel(plan, acc, Agents.create(m.x()), Agents.create(m.y()), m.noise());
    }

    /**
     * The engine a run of all replicates uses, for reports: {@code "lockstep-simd"} (games in lockstep in
     * the vector API's 512-bit vectors, with random lengths a lane taking the next game when its game
     * ends; where the VM has the vector API, once the VM's fused-path runs reach {@link #SIMD_MIN_ROUNDS}
     * expected rounds),
     * {@code "lockstep"} (lockstep blocks the JIT vectorises),
     * {@code "per-game"} (the fused path one game at a time), {@code "literal"} or {@code "agent"}. The
     * choice never changes a result.
     *
     * @return the engine's name
     */
    public String kernel() {
        if (fast) {
            if (FUSED_ROUNDS.sum() + spec.replicates() * spec.horizon().expectedLength() >= simdThreshold()
                && chunkSize() >= LOCKSTEP_MIN_GAMES && VectorModule.available()
                && SimdLockstepKernel.supports(plan, fusedTables())) {
                return "lockstep-simd";
            }
            return playsInLockstep() ? "lockstep" : "per-game";
        }
        return tables ? "literal" : "agent";
    }

    /**
     * Why the vector API engine is or is not available in this VM, in one line ("available" when it is).
     *
     * @return the status
     */
    public static String vectorStatus() {
        return VectorModule.status();
    }

    /** Whether a run of all replicates plays games in lockstep blocks (a testing hook). */
    boolean playsInLockstep() {
        return fast && plan.fixedRounds() > 0 && chunkSize() >= LOCKSTEP_MIN_GAMES;
    }

    /** Testing hook: the lockstep kernel on one thread, with a limit for per-block statistics. */
    SimulationResult simulateLockstep(long from, long to, long blockStatisticsLength) {
        return runAlone(from, to, acc -> new LockstepKernel(plan, acc, fusedTables(), blockStatisticsLength));
    }

    /** Testing hook: the vector API lockstep kernel on one thread (only where it is available and applies). */
    SimulationResult simulateSimd(long from, long to) {
        return runAlone(from, to, acc -> SimdLockstepKernel.create(plan, acc, fusedTables()));
    }

    /** Whether the vector API lockstep kernel can play this spec in this VM (a testing hook). */
    boolean simdApplies() {
        return fast && VectorModule.available() && SimdLockstepKernel.supports(plan, fusedTables());
    }

    /** Testing hook: the per-game fused kernel on one thread, whatever the horizon and chunking. */
    SimulationResult simulatePerGame(long from, long to) {
        return runAlone(from, to, acc -> new FusedMemoryOneKernel(plan, acc, fusedTables()));
    }

    private FusedTables fusedTables() {
        Match m = spec.match();
        return FusedTables.of((MemoryStrategy) m.x(), (MemoryStrategy) m.y(), m.noise());
    }

    /** Runs [from, to) on the calling thread with the worker {@code make} builds around a fresh accumulator. */
    private SimulationResult runAlone(long from, long to, java.util.function.Function<Accumulator, Worker> make) {
        Accumulator acc = new Accumulator(historyMemory, plan.snapshotRounds(), plan.timeRounds());
        make.apply(acc).run(from, to);
        Match m = spec.match();
        return new SimulationResult(configuration, spec.seed(), fast, m.game().payoffX(), m.game().payoffY(),
            List.of(new SimulationResult.ReplicateRange(from, to)), acc);
    }

    /** Testing hook: the generic agent kernel even for table players (same draws as the table kernel). */
    SimulationResult simulateWithAgents(long from, long to) {
        Match m = spec.match();
        Accumulator acc = new Accumulator(historyMemory, plan.snapshotRounds(), plan.timeRounds());
        Kernel k = new AgentKernel(plan, acc, Agents.create(m.x()), Agents.create(m.y()), m.noise());
        k.run(from, to);
        return new SimulationResult(configuration.replace("path=fused", "path=literal"), spec.seed(), false,
            m.game().payoffX(), m.game().payoffY(), List.of(new SimulationResult.ReplicateRange(from, to)), acc);
    }

    private static final class Progress {
        private final ProgressListener listener;
        private final long replicates;
        private final long expected;
        private long replicatesDone;
        private long roundsDone;

        Progress(ProgressListener listener, long replicates, long expected) {
            this.listener = listener;
            this.replicates = replicates;
            this.expected = expected;
        }

        synchronized void add(long games, long rounds) {
            replicatesDone += games;
            roundsDone += rounds;
            if (listener != null) {
                listener.progress(replicatesDone, replicates, roundsDone, expected);
            }
        }
    }
}
