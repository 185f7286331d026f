package reprise.experiment;

import java.math.BigInteger;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.apache.commons.rng.simple.RandomSource;
import org.apache.commons.statistics.distribution.NormalDistribution;
import reprise.chain.CountMoments;
import reprise.chain.Frequencies;
import reprise.chain.MarkovChain;
import reprise.chain.NoPredictionException;
import reprise.chain.Prediction;
import reprise.game.Horizon;
import reprise.game.Match;
import reprise.game.StageGame;
import reprise.sim.SimulationResult;
import reprise.stats.Estimate;
import reprise.stats.GameSummary;
import reprise.stats.ReplicateInference;
import reprise.stats.SnapshotTest;
import reprise.stats.SparseCells;
import reprise.stats.TestResult;
import reprise.stats.TransitionTest;
import reprise.stats.WaldTest;

/**
 * Joins the exact engine, the simulator's tallies and the statistics for one case: the exact quantities
 * for the tallied window of the horizon, and every test of the simulation against them.
 *
 * <p>Each game is one independent observation. For a quantity w . N / L the estimate is the ratio
 * sum w . N / sum L (for fixed lengths, the mean of per-game averages); under the exact model its
 * standard error is sqrt((w - r0)' Sigma (w - r0) / G) / E[L], with Sigma the exact covariance of one
 * game's counts and r0 the exact value (delta method; exact for fixed lengths).
 */
public final class CaseAnalysis {

    private static final NormalDistribution NORMAL = NormalDistribution.of(0, 1);
    /**
     * Samples of the Monte Carlo multinomial test when an exact snapshot test cannot be enumerated: the
     * p-value's standard error is then at most 0.5 / sqrt(20000) = 0.0035 (near p = 0.05: 0.0015).
     */
    static final int SNAPSHOT_MONTE_CARLO = 20_000;

    /**
     * Cells of a transition row with a smaller expected count are pooled (Cochran 1954's rule of 5) by
     * {@link SparseCells#pool}: within a row, the cells in increasing order of expected count are grouped
     * until each group reaches the minimum, so that the Pearson form's heavy right tail and the
     * likelihood-ratio form's light one (measured with calibrate: 19% and 0% false alarms at alpha = 0.05
     * for two noisy tf2t players) are avoided; the pooled probabilities stay in [0, 1].
     */
    static final double MINIMUM_EXPECTED_TRANSITIONS = SparseCells.COCHRAN_MINIMUM;

    private CaseAnalysis() {
    }

    /**
     * The exact side of a case.
     *
     * @param chain the chain
     * @param prediction long-run and horizon predictions
     * @param moments the exact mean and covariance of one game's tallied counts
     * @param frequencies the exact expected frequencies over the tallied rounds, E[N]/E[L]
     * @param transitions the observable transition matrix, or null with {@code transitionsNote}
     * @param transitionsNote why there is no transition test, or null
     */
    public record Exact(MarkovChain chain, Prediction prediction, CountMoments moments, double[] frequencies,
        double[][] transitions, String transitionsNote) {

        /** @return the expected tallied length of one game */
        public double meanLength() {
            return moments.lengthMean();
        }

        /**
         * The exact value of a quantity.
         *
         * @param w the weights
         * @return w . E[N] / E[L]
         */
        public double value(double[] w) {
            return dot(w, frequencies);
        }

        /**
         * The exact standard error of the estimate of w . N / L from G games, under this model.
         *
         * @param w the weights
         * @param games G
         * @return the standard error
         */
        public double standardError(double[] w, long games) {
            double r0 = value(w);
            double[] a = new double[4];
            for (int s = 0; s < 4; s++) {
                a[s] = w[s] - r0;
            }
            double v = Math.max(0, moments.quadraticForm(a));
            return Math.sqrt(v / games) / meanLength();
        }
    }

    /**
     * Computes the exact side.
     *
     * @param match the match the exact engine assumes
     * @param horizon the horizon it assumes
     * @param burnIn rounds left out at the start
     * @return the exact quantities
     * @throws NoPredictionException when the match has no exact chain
     */
    public static Exact exact(Match match, Horizon horizon, long burnIn) {
        MarkovChain chain = MarkovChain.of(match);
        Prediction prediction = Prediction.of(match, horizon);
        CountMoments moments;
        double[] f;
        if (horizon instanceof Horizon.Rounds r) {
            moments = CountMoments.rounds(chain, burnIn + 1, r.count());
            f = Frequencies.rounds(chain, burnIn + 1, r.count());
        } else {
            double delta = ((Horizon.Continuation) horizon).probability();
            moments = CountMoments.continuation(chain, delta, burnIn);
            f = Frequencies.continuation(chain, delta, burnIn);
        }
        double[][] transitions = null;
        String note = null;
        try {
            transitions = chain.observableTransitionMatrix();
        } catch (NoPredictionException e) {
            note = e.getMessage();
        }
        return new Exact(chain, prediction, moments, f, transitions, note);
    }

    /**
     * The simulator's per-game sufficient statistics in the form the statistics expect.
     *
     * @param r the simulation result
     * @return the summary over all games (games with no tallied round count as zeros)
     */
    public static GameSummary summary(SimulationResult r) {
        BigInteger[][] products = r.sumOfStateCountProducts();
        long[][] p = new long[4][4];
        BigInteger[] lengthCounts = r.sumOfLengthTimesStateCounts();
        long[] lc = new long[4];
        try {
            for (int i = 0; i < 4; i++) {
                for (int j = 0; j < 4; j++) {
                    p[i][j] = products[i][j].longValueExact();
                }
                lc[i] = lengthCounts[i].longValueExact();
            }
            return new GameSummary(r.replicates(), r.stateCounts(), p, lc, r.sumOfTalliedLengths(),
                r.sumOfSquaredTalliedLengths().longValueExact());
        } catch (ArithmeticException e) {
            throw new IllegalArgumentException("the per-game sums of squares exceed 9.2e18 (games too long or too "
                + "many for one case); split the case into fewer replicates or shorter games", e);
        }
    }

    /**
     * The note part saying that sparse transition cells were pooled, as written after a transition test's
     * note and quoted in the report's warnings.
     *
     * @param merged the number of cells merged into another, at least 1
     * @return e.g. "3 sparse cells (expected count below 5) pooled within their rows"
     */
    public static String pooledCellsPhrase(int merged) {
        return merged + " sparse cells (expected count below " + (int) MINIMUM_EXPECTED_TRANSITIONS
            + ") pooled within their rows";
    }

    static double dot(double[] a, double[] b) {
        double s = 0;
        for (int i = 0; i < a.length; i++) {
            s += a[i] * b[i];
        }
        return s;
    }

    /**
     * The z-test of one quantity against the exact value, with the exact standard error.
     *
     * @param exact the exact side
     * @param estimate the simulated estimate
     * @param w the quantity's weights
     * @return statistic z, df infinite (normal reference), two-sided p
     */
    public static TestResult zTest(Exact exact, Estimate estimate, double[] w) {
        double predicted = exact.value(w);
        double se = exact.standardError(w, estimate.replicates());
        double d = estimate.value() - predicted;
        if (!(se > 0)) {
            boolean same = Math.abs(d) <= 1e-12 * Math.max(1, Math.abs(predicted));
            return new TestResult(same ? 0 : Double.POSITIVE_INFINITY, Double.POSITIVE_INFINITY, same ? 1 : 0,
                same ? "no variance under the model, and none observed" : "the model allows no variation here, "
                    + "but the simulation differs");
        }
        double z = d / se;
        return new TestResult(z, Double.POSITIVE_INFINITY, Math.min(1, 2 * NORMAL.survivalProbability(Math.abs(z))), "");
    }

    /**
     * Every test of a simulation against the exact side that applies, without z tests.
     *
     * @param exact the exact side
     * @param r the simulation
     * @return the results by test, in the order of {@link #tests(Exact, SimulationResult, StageGame, List)}
     */
    public static Map<TestId, TestResult> tests(Exact exact, SimulationResult r) {
        return tests(exact, r, null, List.of());
    }

    /**
     * Every test of a simulation against the exact side that applies.
     *
     * @param exact the exact side
     * @param r the simulation
     * @param game the stage game (for the quantities' weights); may be null when {@code zQuantities} is empty
     * @param zQuantities quantities to test individually (may be empty)
     * @return the results by test, in this order: frequencies (Wald); transitions (Pearson) and (LR) when the
     *     chain has an observable transition matrix; one snapshot test per round some game reached; one z
     *     test per quantity, in the given order
     */
    public static Map<TestId, TestResult> tests(Exact exact, SimulationResult r, StageGame game,
        List<? extends Quantity> zQuantities) {
        Map<TestId, TestResult> out = new LinkedHashMap<>();
        GameSummary summary = summary(r);
        double[] mu = exact.moments().mean();
        double[][] sigma = exact.moments().covariance();
        out.put(TestId.Standard.FREQUENCIES_WALD, summary.fixedLength()
            ? WaldTest.withDefaults().testMeanCounts(summary, mu, sigma)
            : WaldTest.withDefaults().testRatio(summary, mu, sigma));
        transitionTests(exact, r, out);
        snapshotTests(exact, r, out);
        for (Quantity q : zQuantities) {
            double[] w = q.weights(game);
            out.put(new TestId.ZScore(q), zTest(exact, ReplicateInference.mean(summary, w), w));
        }
        return Collections.unmodifiableMap(out);
    }

    /**
     * The simulated transition counts with sparse cells pooled against the exact transition matrix.
     *
     * @param exact the exact side
     * @param r the simulation
     * @return the pooled table, or null when the case has no transition test
     */
    static SparseCells.Pooled pooledTransitions(Exact exact, SimulationResult r) {
        if (exact.transitions() == null) {
            return null;
        }
        long[][] counts = exact.chain().size() == 4 ? r.transitionCounts() : r.historyTransitionCounts();
        if (counts == null || counts.length != exact.transitions().length) {
            return null;
        }
        return SparseCells.pool(counts, exact.transitions(), MINIMUM_EXPECTED_TRANSITIONS);
    }

    private static void transitionTests(Exact exact, SimulationResult r, Map<TestId, TestResult> out) {
        if (exact.transitions() == null) {
            return;
        }
        SparseCells.Pooled pooled = pooledTransitions(exact, r);
        if (pooled == null) {
            return;
        }
        int merged = pooled.merged();
        TestResult pearson = TransitionTest.withDefaults().test(pooled.counts(), pooled.hypothesis());
        TestResult lr = TransitionTest.withDefaults().with(TransitionTest.Form.LIKELIHOOD_RATIO)
            .test(pooled.counts(), pooled.hypothesis());
        if (merged > 0) {
            String note = "; " + pooledCellsPhrase(merged);
            pearson = pearson.withSmallSample(note, TestResult.SmallSample.pooled(merged));
            lr = lr.withSmallSample(note, TestResult.SmallSample.pooled(merged));
        }
        out.put(TestId.Standard.TRANSITIONS_PEARSON, pearson);
        out.put(TestId.Standard.TRANSITIONS_LR, lr);
    }

    private static void snapshotTests(Exact exact, SimulationResult r, Map<TestId, TestResult> out) {
        long[] rounds = r.snapshotRounds();
        long[][] snaps = r.snapshotCounts();
        for (int i = 0; i < rounds.length; i++) {
            if (r.snapshotReached()[i] > 0) {
                SnapshotTest test = SnapshotTest.withDefaults().withMonteCarlo(
                    RandomSource.XO_RO_SHI_RO_128_PP.create(Runner.caseSeed(r.seed(), (int) rounds[i])),
                    SNAPSHOT_MONTE_CARLO);
                out.put(new TestId.AtRound(rounds[i]), test.test(snaps[i],
                    exact.chain().roundStateDistributionAt(rounds[i])));
            }
        }
    }
}
