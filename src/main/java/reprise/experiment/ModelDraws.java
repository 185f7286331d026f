package reprise.experiment;

import java.util.ArrayList;
import java.util.List;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import reprise.chain.ChainSampler;
import reprise.game.Horizon;
import reprise.stats.GameSummary;
import reprise.stats.Regime;

/**
 * Games drawn from the exact model of one case, for the regime of each quantity ({@link Regime}) and the
 * Monte Carlo p-values of tests whose asymptotic tail is not trusted. The draws come from
 * {@link ChainSampler}, the exact side's sampler of the exact transition matrix: the simulator is never
 * used, so the two sides stay independent.
 *
 * <p>Seeds: the generator of stream k (k = 0 for the model games that fix the regimes, k = 1, 2, ... for
 * the Monte Carlo references of a case's tests, in a fixed order) is XO_RO_SHI_RO_128_PP seeded with
 * {@code Runner.caseSeed(caseSeed ^ STREAM_KEY, k)}, a SplitMix64 output of the case seed. The draws thus
 * depend on the case seed only, not on the number of threads, shards, or other cases, and the results
 * are reproducible bit for bit.
 *
 * <p>Budget: {@link #modelGames()} draws M = clamp(MODEL_ROUNDS / E[L], MINIMUM_MODEL_GAMES,
 * MAXIMUM_MODEL_GAMES) games (half a million rounds, or 1000 games of more than 500 rounds, per case:
 * about 0.5 s of the demo experiment's 6-7 s of CPU; the modal probability of a quantity is then known to
 * a standard error of at most 0.016, and to 0.0035 or better for games of up to 25 rounds, where the few-games
 * regimes arise); games with no tallied round (random lengths ending
 * in the burn-in) are left out of the regimes, which describe per-round averages.
 */
final class ModelDraws {

    /** Mixed into the case seed, so the model's streams differ from the simulator's and the snapshot tests'. */
    static final long STREAM_KEY = 0x6578616374436861L;
    /** Rounds drawn for the regimes of one case (before the bounds on the number of games). */
    static final double MODEL_ROUNDS = 500_000;
    /** Fewest model games. */
    static final int MINIMUM_MODEL_GAMES = 1_000;
    /** Most model games. */
    static final int MAXIMUM_MODEL_GAMES = 20_000;

    private final CaseAnalysis.Exact exact;
    private final Horizon horizon;
    private final long burnIn;
    private final long caseSeed;
    private final ChainSampler sampler;
    private long[][] games;

    ModelDraws(CaseAnalysis.Exact exact, Horizon horizon, long burnIn, long caseSeed) {
        this.exact = exact;
        this.horizon = horizon;
        this.burnIn = burnIn;
        this.caseSeed = caseSeed;
        this.sampler = ChainSampler.of(exact.chain());
    }

    ChainSampler sampler() {
        return sampler;
    }

    Horizon horizon() {
        return horizon;
    }

    long burnIn() {
        return burnIn;
    }

    /**
     * The generator of one stream (see the class description).
     *
     * @param stream k &ge; 0
     * @return a new generator
     */
    UniformRandomProvider generator(int stream) {
        return RandomSource.XO_RO_SHI_RO_128_PP.create(Runner.caseSeed(caseSeed ^ STREAM_KEY, stream));
    }

    /** @return the per-game counts of the model games with at least one tallied round (drawn once) */
    long[][] modelGames() {
        if (games == null) {
            double length = Math.max(1, exact.meanLength());
            int m = (int) Math.max(MINIMUM_MODEL_GAMES, Math.min(MAXIMUM_MODEL_GAMES, MODEL_ROUNDS / length));
            long[][] all = sampler.sample(generator(0), m, horizon, burnIn, new long[0]).perGameCounts();
            List<long[]> kept = new ArrayList<>();
            for (long[] g : all) {
                if (g[0] + g[1] + g[2] + g[3] > 0) {
                    kept.add(g);
                }
            }
            games = kept.toArray(long[][]::new);
        }
        return games;
    }

    /**
     * The regime of a quantity for a study of G games, with the expected state counts from the exact
     * engine.
     *
     * @param weights w
     * @param studyGames G
     * @return the regime; {@code null} when fewer than 2 model games had a tallied round
     */
    Regime regime(double[] weights, long studyGames) {
        long[][] g = modelGames();
        if (g.length < 2) {
            return null;
        }
        return Regime.fromModelGames(g, weights, studyGames, exact.moments().mean());
    }

    /**
     * A stand-in regime when there is no exact model (claims only): ordinary when the games differ, sparse
     * when they are all alike (so that zero spread never gives the t-interval), with the observed state
     * counts.
     *
     * @param summary the games
     * @param spread whether the quantity's replicate standard error is positive
     * @return the regime
     */
    static Regime fromData(GameSummary summary, boolean spread) {
        double[] counts = new double[4];
        long[] sums = summary.sumCounts();
        for (int s = 0; s < 4; s++) {
            counts[s] = sums[s];
        }
        return new Regime(summary.games(), spread ? 0 : 1, 0, counts);
    }
}
