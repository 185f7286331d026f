package reprise.stats;

import java.util.List;
import org.apache.commons.rng.UniformRandomProvider;
import reprise.chain.ChainSampler;
import reprise.chain.CountMoments;
import reprise.chain.MarkovChain;
import reprise.game.Horizon;
import reprise.game.Match;
import reprise.game.Noise;
import reprise.game.Player;
import reprise.game.StageGame;
import reprise.game.Strategies;

/**
 * Cases of issue 12 (and ordinary ones) on which interval coverage is measured: games drawn from the exact
 * chain ({@link ChainSampler}), exact values from {@link CountMoments} (E N_s / E L, the ratio estimator's
 * target).
 */
final class CoverageCases {

    static final StageGame PD = StageGame.DEFAULT;

    /**
     * One case.
     *
     * @param name label
     * @param x X's strategy
     * @param y Y's strategy
     * @param execution execution error
     * @param perception perception error
     * @param horizon length
     * @param games G
     * @param weights the quantity (a state indicator or a payoff)
     */
    record Case(String name, String x, String y, double execution, double perception, Horizon horizon, int games,
                double[] weights) {

        MarkovChain chain() {
            return MarkovChain.of(new Match(PD, Strategies.parse(x, PD, Player.X), Strategies.parse(y, PD, Player.Y),
                Noise.symmetric(execution, perception)));
        }

        CountMoments moments() {
            MarkovChain c = chain();
            return horizon instanceof Horizon.Rounds r ? CountMoments.rounds(c, 1, r.count())
                : CountMoments.continuation(c, ((Horizon.Continuation) horizon).probability(), 0);
        }

        double exact() {
            double[] mu = moments().mean();
            double sum = 0;
            double len = 0;
            for (int s = 0; s < 4; s++) {
                sum += weights[s] * mu[s];
                len += mu[s];
            }
            return sum / len;
        }

        GameSummary draw(ChainSampler sampler, UniformRandomProvider rng) {
            return GameSummary.of(sampler.sample(rng, games, horizon, 0, new long[0]).perGameCounts());
        }

        @Override
        public String toString() {
            return name;
        }
    }

    static double[] state(int s) {
        double[] w = new double[4];
        w[s] = 1;
        return w;
    }

    static final double[] PAYOFF_X = {3, 0, 5, 1};

    private CoverageCases() {
    }

    /** The failing cases of issue 12. */
    static List<Case> sparse() {
        Horizon r5 = new Horizon.Rounds(5);
        return List.of(
            new Case("wsls-wsls e0.005 n5 G10 CC", "wsls", "wsls", 0.005, 0, r5, 10, state(0)),
            new Case("wsls-wsls e0.005 n5 G10 payoff", "wsls", "wsls", 0.005, 0, r5, 10, PAYOFF_X),
            new Case("tf2t-stft e0.03 n20 G200 DD", "tf2t", "stft", 0.03, 0, new Horizon.Rounds(20), 200, state(3)),
            new Case("tft-tft e0.003 n20 G15 CC", "tft", "tft", 0.003, 0, new Horizon.Rounds(20), 15, state(0)),
            new Case("wsls-tft e0.002 n30 G12 CD", "wsls", "tft", 0.002, 0, new Horizon.Rounds(30), 12, state(1)),
            new Case("gtft-wsls e0.005 n10 G20 CC", "gtft", "wsls", 0.005, 0, new Horizon.Rounds(10), 20, state(0)),
            new Case("tft-tft e0.005 n40 G50 DD (two errors)", "tft", "tft", 0.005, 0, new Horizon.Rounds(40), 50,
                state(3)),
            new Case("tft-tft p0.01 d0.9 G30 CC (perception, random length)", "tft", "tft", 0, 0.01,
                new Horizon.Continuation(0.9), 30, state(0)));
    }

    /** Cases near the boundary of the regime rule. */
    static List<Case> boundary() {
        return List.of(
            new Case("tf2t-stft e0.03 n20 G1000 DD", "tf2t", "stft", 0.03, 0, new Horizon.Rounds(20), 1000, state(3)),
            new Case("tf2t-stft e0.03 n20 G3000 DD", "tf2t", "stft", 0.03, 0, new Horizon.Rounds(20), 3000, state(3)),
            new Case("wsls-wsls e0.005 n5 G500 CC", "wsls", "wsls", 0.005, 0, new Horizon.Rounds(5), 500, state(0)),
            new Case("tft-tft p0.01 d0.9 G200 CC", "tft", "tft", 0, 0.01, new Horizon.Continuation(0.9), 200, state(0)),
            new Case("gtft-wsls e0.02 n10 G40 CC", "gtft", "wsls", 0.02, 0, new Horizon.Rounds(10), 40, state(0)),
            new Case("tft-tft e0.01 n40 G100 DD", "tft", "tft", 0.01, 0, new Horizon.Rounds(40), 100, state(3)));
    }

    /** Ordinary cases, where the t-interval is known to cover (issue 12: 0.94-0.96). */
    static List<Case> ordinary() {
        return List.of(
            new Case("tft-gtft e0.05 n50 G100 CC", "tft", "gtft", 0.05, 0, new Horizon.Rounds(50), 100, state(0)),
            new Case("wsls-alld e0.1 n20 G60 DD", "wsls", "alld", 0.1, 0, new Horizon.Rounds(20), 60, state(3)),
            new Case("gtft-tf2t e0.05 d0.95 G80 payoff", "gtft", "tf2t", 0.05, 0, new Horizon.Continuation(0.95), 80,
                PAYOFF_X));
    }
}
