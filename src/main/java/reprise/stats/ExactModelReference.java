package reprise.stats;

import java.util.function.DoubleSupplier;
import org.apache.commons.rng.UniformRandomProvider;
import reprise.chain.ChainSampler;
import reprise.game.Horizon;

/**
 * Draws of the Wald, transition and snapshot statistics under the exact model, for
 * {@link MonteCarloPValue}: each draw is a whole study of G games drawn from the exact chain by
 * {@link ChainSampler} (the exact side's sampler, independent of the simulator), with the study's horizon,
 * burn-in and number of games, and the statistic computed exactly as for the observed study.
 *
 * <p>The transition statistic pools sparse cells by each draw's own row totals ({@link SparseCells}), the
 * same function of the data as for the observed table; the snapshot statistic is Pearson's X^2 of
 * {@link SnapshotTest#statistic}. Each supplier uses the generator it is given and is not thread-safe;
 * give each thread its own.
 *
 * <p>References:
 * <ul>
 *   <li>Davison, A.C. &amp; Hinkley, D.V. (1997). Bootstrap Methods and their Application. Cambridge
 *       University Press, section 4.2 (Monte Carlo tests under a simple null hypothesis).</li>
 * </ul>
 */
public final class ExactModelReference {

    private final ChainSampler sampler;
    private final int games;
    private final Horizon horizon;
    private final long burnIn;

    private ExactModelReference(ChainSampler sampler, int games, Horizon horizon, long burnIn) {
        this.sampler = sampler;
        this.games = games;
        this.horizon = horizon;
        this.burnIn = burnIn;
    }

    /**
     * The reference for a study.
     *
     * @param sampler the exact chain's sampler
     * @param games G &ge; 2, the study's number of games
     * @param horizon the study's horizon
     * @param burnIn the study's burn-in b &ge; 0
     * @return the reference
     */
    public static ExactModelReference of(ChainSampler sampler, int games, Horizon horizon, long burnIn) {
        if (sampler == null || horizon == null) {
            throw new IllegalArgumentException("sampler and horizon must not be null");
        }
        if (games < 2) {
            throw new IllegalArgumentException("number of games must be at least 2: " + games);
        }
        if (burnIn < 0) {
            throw new IllegalArgumentException("burn-in must be >= 0: " + burnIn);
        }
        return new ExactModelReference(sampler, games, horizon, burnIn);
    }

    /**
     * The Wald statistic of the mean counts (fixed length) or the ratio estimator (random length).
     *
     * @param rng the generator
     * @param expectedCounts E[N_s] of one game
     * @param perGameCovariance Cov(N) of one game
     * @return a supplier of draws
     */
    public DoubleSupplier wald(UniformRandomProvider rng, double[] expectedCounts, double[][] perGameCovariance) {
        double[] mu = expectedCounts.clone();
        double[][] sigma = perGameCovariance.clone();
        WaldTest test = WaldTest.withDefaults();
        return () -> {
            GameSummary s = GameSummary.of(draw(rng, new long[0]).perGameCounts());
            return (s.fixedLength() ? test.testMeanCounts(s, mu, sigma) : test.testRatio(s, mu, sigma)).statistic();
        };
    }

    /**
     * The Anderson &amp; Goodman statistic after pooling sparse cells.
     *
     * @param rng the generator
     * @param hypothesis the chain's transition matrix (the observable one)
     * @param minimum the pooling threshold, e.g. {@link SparseCells#COCHRAN_MINIMUM}
     * @param form PEARSON or LIKELIHOOD_RATIO
     * @return a supplier of draws
     */
    public DoubleSupplier transitions(UniformRandomProvider rng, double[][] hypothesis, double minimum,
                                      TransitionTest.Form form) {
        if (hypothesis == null || hypothesis.length != sampler.size()) {
            throw new IllegalArgumentException("hypothesised transition matrix must have " + sampler.size() + " rows: "
                + (hypothesis == null ? "none" : hypothesis.length));
        }
        double[][] p0 = new double[hypothesis.length][];
        for (int i = 0; i < p0.length; i++) {
            p0[i] = hypothesis[i].clone();
        }
        TransitionTest test = TransitionTest.withDefaults().with(form);
        return () -> {
            SparseCells.Pooled pooled = SparseCells.pool(draw(rng, new long[0]).transitions(), p0, minimum);
            return test.statistic(pooled.counts(), pooled.hypothesis());
        };
    }

    /**
     * Pearson's X^2 of the state at round t across games.
     *
     * @param rng the generator
     * @param round t &ge; 1
     * @param probabilities the exact distribution of the round state at round t
     * @return a supplier of draws
     */
    public DoubleSupplier snapshot(UniformRandomProvider rng, long round, double[] probabilities) {
        double[] p = probabilities.clone();
        SnapshotTest test = SnapshotTest.withDefaults();
        long[] at = {round};
        return () -> test.statistic(draw(rng, at).snapshotCounts()[0], p);
    }

    private ChainSampler.Sample draw(UniformRandomProvider rng, long[] snapshots) {
        return sampler.sample(rng, games, horizon, burnIn, snapshots);
    }
}
