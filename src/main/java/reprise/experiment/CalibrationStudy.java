package reprise.experiment;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import reprise.chain.NoPredictionException;
import reprise.game.Horizon;
import reprise.game.Match;
import reprise.sim.ProgressListener;
import reprise.sim.SimulationResult;
import reprise.sim.SimulationSpec;
import reprise.sim.Simulator;
import reprise.stats.Calibration;
import reprise.stats.PooledRoundsIllustration;
import reprise.stats.Regime;
import reprise.stats.TestResult;

/**
 * Repeats one simulation K times with independent seeds, tests every repetition against the exact
 * prediction with {@link CaseAnalysis#tests}, and summarises each test's K p-values with
 * {@link Calibration#summarize}: the false-alarm rate when the prediction assumes the true model, the
 * power when it deliberately assumes a wrong one (another noise level, another horizon).
 *
 * <p>Tests per repetition: every test {@link CaseAnalysis#tests} applies (frequencies (Wald),
 * transitions (Pearson) and (LR) when the true history is a Markov chain, one snapshot test per
 * requested round), the z tests of the four state frequencies and both payoffs ({@link #Z_QUANTITIES}),
 * and the pooled-rounds chi-square of {@link PooledRoundsIllustration}, identified by
 * {@link TestId.Standard#POOLED_ROUNDS_ILLUSTRATION} and flagged {@code illustration}: it treats
 * autocorrelated rounds as independent and is expected to be miscalibrated.
 *
 * <p>Seeds: repetition k (0-based) runs the simulation with master seed
 * {@code mix64(seed + (k + 1) * 0x9E3779B97F4A7C15)}, the (k + 1)-th output of SplitMix64 started at
 * state {@code seed} ({@link #repetitionSeed}); within it game i's stream depends on that master seed
 * and i only (see {@link Simulator#replicateGenerator}). Repetitions are independent and each is run on
 * one thread, so the result is the same for any number of threads.
 *
 * <p>References:
 * <ul>
 *   <li>Steele, G.L., Lea, D. &amp; Flood, C.H. (2014). Fast splittable pseudorandom number generators.
 *       OOPSLA 2014, ACM SIGPLAN Notices 49(10), 453-472 (SplitMix64).</li>
 *   <li>Anderson, T.W. &amp; Goodman, L.A. (1957). Statistical inference about Markov chains. Annals of
 *       Mathematical Statistics 28(1), 89-110.</li>
 * </ul>
 */
public final class CalibrationStudy {

    /** The quantities with a z test in every repetition: the four state frequencies and both payoffs. */
    public static final List<BaseQuantity> Z_QUANTITIES = List.of(BaseQuantity.CC, BaseQuantity.CD, BaseQuantity.DC,
        BaseQuantity.DD, BaseQuantity.PAYOFF_X, BaseQuantity.PAYOFF_Y);

    /** A state expected fewer times than this over one repetition's games gets a warning (check's rule too). */
    public static final double SPARSE_STATE_COUNT = Regime.SPARSE_STATE_COUNT;

    private static final long GOLDEN = 0x9E3779B97F4A7C15L;
    private static final double INTERVAL_CONFIDENCE = 0.95;

    private final SimulationSpec simulation;
    private final Match predictedMatch;
    private final Horizon predictedHorizon;
    private final int repetitions;
    private final double alpha;

    private CalibrationStudy(SimulationSpec simulation, Match predictedMatch, Horizon predictedHorizon,
        int repetitions, double alpha) {
        this.simulation = simulation;
        this.predictedMatch = predictedMatch;
        this.predictedHorizon = predictedHorizon;
        this.repetitions = repetitions;
        this.alpha = alpha;
    }

    /**
     * A study of a true-model prediction with K = 200 repetitions at alpha = 0.05.
     *
     * @param simulation the simulation of one repetition (its seed is the study's master seed; its thread
     *     count is the number of repetitions run at once); at least 2 replicates
     * @return the study
     */
    public static CalibrationStudy of(SimulationSpec simulation) {
        Objects.requireNonNull(simulation, "simulation");
        if (simulation.replicates() < 2) {
            throw new IllegalArgumentException("calibration needs at least 2 replicates per repetition (the z "
                + "tests estimate a standard error): " + simulation.replicates());
        }
        return new CalibrationStudy(simulation, simulation.match(), simulation.horizon(), 200, 0.05);
    }

    /**
     * @param k the number of repetitions K, at least 1
     * @return a copy with K repetitions
     */
    public CalibrationStudy withRepetitions(int k) {
        if (k < 1) {
            throw new IllegalArgumentException("repetitions must be at least 1: " + k);
        }
        return new CalibrationStudy(simulation, predictedMatch, predictedHorizon, k, alpha);
    }

    /**
     * @param a the nominal level in (0, 1)
     * @return a copy with this level
     */
    public CalibrationStudy withAlpha(double a) {
        if (!(a > 0 && a < 1)) {
            throw new IllegalArgumentException("alpha must be in (0, 1): " + a);
        }
        return new CalibrationStudy(simulation, predictedMatch, predictedHorizon, repetitions, a);
    }

    /**
     * The model the exact side predicts under; by default the simulated one. A different one (another
     * noise level, another horizon) makes the rejection rates measure power.
     *
     * @param match the match the prediction assumes
     * @param horizon the horizon it assumes
     * @return a copy
     */
    public CalibrationStudy withPrediction(Match match, Horizon horizon) {
        Objects.requireNonNull(match, "predicted match");
        Objects.requireNonNull(horizon, "predicted horizon");
        if (horizon instanceof Horizon.Rounds r && simulation.burnIn() >= r.count()) {
            throw new IllegalArgumentException("burn-in must be shorter than the predicted game (" + r.count()
                + " rounds): " + simulation.burnIn());
        }
        return new CalibrationStudy(simulation, match, horizon, repetitions, alpha);
    }

    /** @return K */
    public int repetitions() {
        return repetitions;
    }

    /** @return alpha */
    public double alpha() {
        return alpha;
    }

    /** @return whether the prediction assumes exactly the simulated match and horizon */
    public boolean trueModel() {
        return predictedMatch.equals(simulation.match()) && predictedHorizon.equals(simulation.horizon());
    }

    /**
     * The master seed of repetition k: mix64(seed + (k + 1) G), G = 0x9E3779B97F4A7C15, mix64 the
     * SplitMix64 output function (Steele, Lea &amp; Flood 2014).
     *
     * @param seed the study's master seed
     * @param k the repetition, at least 0
     * @return the seed of that repetition's simulation
     */
    public static long repetitionSeed(long seed, long k) {
        if (k < 0) {
            throw new IllegalArgumentException("repetition index must be at least 0: " + k);
        }
        long z = seed + (k + 1) * GOLDEN;
        z = (z ^ (z >>> 30)) * 0xBF58476D1CE4E5B9L;
        z = (z ^ (z >>> 27)) * 0x94D049BB133111EBL;
        return z ^ (z >>> 31);
    }

    /**
     * One test's calibration over the repetitions.
     *
     * @param test the test, as keyed by {@link CaseAnalysis#tests}, or the pooled-rounds illustration
     * @param repetitionIndexes the 0-based repetitions in which the test applied (all K, except for a
     *     snapshot round that no game of a repetition reached), increasing
     * @param pValues the p-value of each of those repetitions, same order
     * @param summary rejections at alpha, their rate with a 95% Wilson interval, the binomial check and
     *     the Kolmogorov-Smirnov uniformity p-value of {@code pValues}
     * @param note the test's note in the first repetition (method, dropped components), may be empty
     * @param tails the rejection rates at 0.05, 0.01 and 0.001 with 95% Wilson intervals, and whether the
     *     lower tail of {@code pValues} departs from uniform ({@link Calibration#tails})
     */
    public record TestCalibration(TestId test, int[] repetitionIndexes, double[] pValues,
        Calibration.Summary summary, String note, Calibration.TailSummary tails) {
        /**
         * Copies the arrays.
         *
         * @param test test
         * @param repetitionIndexes repetitions
         * @param pValues p-values
         * @param summary summary
         * @param note note
         * @param tails tails
         */
        public TestCalibration {
            java.util.Objects.requireNonNull(test, "test");
            java.util.Objects.requireNonNull(tails, "tails");
            repetitionIndexes = repetitionIndexes.clone();
            pValues = pValues.clone();
            if (repetitionIndexes.length != pValues.length) {
                throw new IllegalArgumentException("one repetition index per p-value needed: "
                    + repetitionIndexes.length + " for " + pValues.length);
            }
        }

        /** @return the test's name in files, e.g. "z CC" */
        public String name() {
            return test.label();
        }

        /** @return true for the pooled-rounds illustration, which is not a valid test */
        public boolean illustration() {
            return test.illustration();
        }

        /** @return the repetitions (a copy) */
        @Override
        public int[] repetitionIndexes() {
            return repetitionIndexes.clone();
        }

        /** @return the p-values (a copy) */
        @Override
        public double[] pValues() {
            return pValues.clone();
        }
    }

    /**
     * The study's result.
     *
     * @param repetitions K
     * @param alpha the level
     * @param trueModel whether the prediction assumed the simulated model (rates are false-alarm rates)
     *     or not (rates are power)
     * @param tests one entry per test, in the order the tests first appeared
     * @param transitionsNote why there are no transition tests, or null
     * @param warnings one line per state whose expected tallied count over one repetition's games is
     *     below {@link #SPARSE_STATE_COUNT} (tests that involve it rest on a poor normal approximation), then
     *     (under the true model only, where small p-values are false alarms) one per test whose p-values'
     *     lower tail departs from uniform
     * @param roundsTotal tallied rounds over all repetitions
     */
    public record Result(int repetitions, double alpha, boolean trueModel, List<TestCalibration> tests,
        String transitionsNote, List<String> warnings, long roundsTotal) {
        /**
         * Copies the list.
         *
         * @param repetitions K
         * @param alpha alpha
         * @param trueModel flag
         * @param tests tests
         * @param transitionsNote or null
         * @param warnings warnings
         * @param roundsTotal rounds
         */
        public Result {
            tests = List.copyOf(tests);
            warnings = List.copyOf(warnings);
        }
    }

    /**
     * Runs the study.
     *
     * @param listener progress over all repetitions (games done of K G), or null
     * @return the result
     * @throws NoPredictionException when the predicted match has no exact chain (nothing to calibrate
     *     against)
     */
    public Result run(ProgressListener listener) {
        CaseAnalysis.Exact exact;
        try {
            exact = CaseAnalysis.exact(predictedMatch, predictedHorizon, simulation.burnIn());
        } catch (NoPredictionException e) {
            throw new NoPredictionException("nothing to calibrate against: " + e.getMessage());
        }
        SimulationSpec one = simulation.withThreads(1);
        new Simulator(one);
        Repetition[] perRepetition = runAll(one, exact, listener);
        Map<TestId, List<Double>> pValues = new LinkedHashMap<>();
        Map<TestId, List<Integer>> indexes = new LinkedHashMap<>();
        Map<TestId, String> notes = new LinkedHashMap<>();
        long rounds = 0;
        for (int k = 0; k < perRepetition.length; k++) {
            rounds += perRepetition[k].rounds();
            int rep = k;
            perRepetition[k].tests().forEach((id, t) -> {
                pValues.computeIfAbsent(id, n -> new ArrayList<>()).add(t.pValue());
                indexes.computeIfAbsent(id, n -> new ArrayList<>()).add(rep);
                notes.putIfAbsent(id, t.note());
            });
        }
        List<TestCalibration> out = new ArrayList<>();
        for (Map.Entry<TestId, List<Double>> e : pValues.entrySet()) {
            double[] p = e.getValue().stream().mapToDouble(Double::doubleValue).toArray();
            int[] ks = indexes.get(e.getKey()).stream().mapToInt(Integer::intValue).toArray();
            out.add(new TestCalibration(e.getKey(), ks, p, Calibration.summarize(p, alpha, INTERVAL_CONFIDENCE),
                notes.get(e.getKey()), Calibration.tails(p, INTERVAL_CONFIDENCE)));
        }
        List<String> warnings = warnings(exact);
        for (TestCalibration t : out) {
            if (trueModel() && !t.illustration() && t.tails().lowerTailDeparts()) {
                t.tails().warnings().forEach(w -> warnings.add(t.name() + ": " + w));
            }
        }
        return new Result(repetitions, alpha, trueModel(), out, exact.transitionsNote(), warnings, rounds);
    }

    /** The rare-state rule of {@link Regime#sparseStateWarnings}, the same as check's, per repetition's games. */
    private List<String> warnings(CaseAnalysis.Exact exact) {
        double[] expected = exact.moments().mean();
        for (int s = 0; s < 4; s++) {
            expected[s] *= simulation.replicates();
        }
        return new ArrayList<>(Regime.sparseStateWarnings(expected));
    }

    private record Repetition(Map<TestId, TestResult> tests, long rounds) {
    }

    private Repetition[] runAll(SimulationSpec one, CaseAnalysis.Exact exact, ProgressListener listener) {
        Repetition[] results = new Repetition[repetitions];
        Progress progress = new Progress(listener, repetitions, one);
        int workers = Math.min(simulation.threads(), repetitions);
        if (workers == 1) {
            for (int k = 0; k < repetitions; k++) {
                results[k] = repetition(one, exact, k, progress);
            }
            return results;
        }
        ExecutorService pool = Executors.newFixedThreadPool(workers, r -> {
            Thread t = new Thread(r, "reprise-calibrate");
            t.setDaemon(true);
            return t;
        });
        try {
            List<Future<Repetition>> futures = new ArrayList<>();
            for (int k = 0; k < repetitions; k++) {
                int rep = k;
                futures.add(pool.submit(() -> repetition(one, exact, rep, progress)));
            }
            for (int k = 0; k < repetitions; k++) {
                results[k] = futures.get(k).get();
            }
            return results;
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException("calibration interrupted", e);
        } catch (ExecutionException e) {
            Throwable c = e.getCause();
            if (c instanceof RuntimeException re) {
                throw re;
            }
            if (c instanceof Error err) {
                throw err;
            }
            throw new IllegalStateException("calibration failed: " + c, c);
        } finally {
            pool.shutdownNow();
        }
    }

    private Repetition repetition(SimulationSpec one, CaseAnalysis.Exact exact, int k, Progress progress) {
        SimulationResult r = new Simulator(one.withSeed(repetitionSeed(simulation.seed(), k))).run();
        Map<TestId, TestResult> tests = new LinkedHashMap<>(CaseAnalysis.tests(exact, r, predictedMatch.game(),
            Z_QUANTITIES));
        tests.put(TestId.Standard.POOLED_ROUNDS_ILLUSTRATION, PooledRoundsIllustration.misleadingTest(
            r.stateCounts(), exact.frequencies()));
        progress.done(r.lengthSum());
        return new Repetition(tests, r.roundsTotal());
    }

    /** Serialised progress over repetitions. */
    private static final class Progress {
        private final ProgressListener listener;
        private final long games;
        private final long roundsExpected;
        private final long gamesPerRepetition;
        private long repetitionsDone;
        private long roundsDone;

        Progress(ProgressListener listener, int repetitions, SimulationSpec one) {
            this.listener = listener;
            this.gamesPerRepetition = one.replicates();
            this.games = repetitions * one.replicates();
            double e = (double) games * one.horizon().expectedLength();
            this.roundsExpected = e >= 0x1p63 ? Long.MAX_VALUE : (long) e;
        }

        synchronized void done(long rounds) {
            repetitionsDone++;
            roundsDone += rounds;
            if (listener != null) {
                listener.progress(repetitionsDone * gamesPerRepetition, games, roundsDone, roundsExpected);
            }
        }
    }
}
