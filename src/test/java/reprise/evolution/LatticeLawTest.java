package reprise.evolution;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import reprise.chain.MarkovChain;
import reprise.game.Horizon;
import reprise.game.Match;
import reprise.game.MemoryStrategy;
import reprise.game.Noise;
import reprise.game.Population;
import reprise.game.StageGame;

/**
 * The exact law of realised payoffs against brute-force enumeration of every path of short games
 * (every realised move and every perception in every round, each with its probability from the
 * strategies' tables and the error rates: an evaluation that uses no transition matrix), and the update
 * probabilities of tiny populations against the expectation over every combination of games.
 * Common practice, no source: enumeration is the definition of the law.
 */
class LatticeLawTest {

    /** Per path: X's payoff total, Y's payoff total, probability, accumulated over n rounds. */
    static Map<List<Double>, Double> enumerate(StageGame g, MemoryStrategy x, MemoryStrategy y, double e, double h, int n) {
        Map<List<Double>, Double> out = new HashMap<>();
        walk(g, x, y, e, h, n, 0, -1, -1, 0, 0, 1, out);
        return out;
    }

    /** rx, ry: each player's record of the last round, own move first (index 0..3), -1 before round 1. */
    private static void walk(StageGame g, MemoryStrategy x, MemoryStrategy y, double e, double h, int n, int t, int rx,
        int ry, double ux, double uy, double p, Map<List<Double>, Double> out) {
        if (t == n) {
            out.merge(List.of(ux, uy), p, Double::sum);
            return;
        }
        double cx = rx < 0 ? x.initial() : x.cooperation(rx);
        double cy = ry < 0 ? y.initial() : y.cooperation(ry);
        cx = (1 - e) * cx + e * (1 - cx);
        cy = (1 - e) * cy + e * (1 - cy);
        for (int mx = 0; mx < 2; mx++) {
            for (int my = 0; my < 2; my++) {
                double pm = (mx == 0 ? cx : 1 - cx) * (my == 0 ? cy : 1 - cy);
                int s = 2 * mx + my;
                double vx = g.payoffX()[s];
                double vy = g.payoffY()[s];
                for (int fx = 0; fx < 2; fx++) {
                    for (int fy = 0; fy < 2; fy++) {
                        double pp = (fx == 0 ? 1 - h : h) * (fy == 0 ? 1 - h : h);
                        if (pm * pp == 0) {
                            continue;
                        }
                        int seenY = my ^ fx;
                        int seenX = mx ^ fy;
                        walk(g, x, y, e, h, n, t + 1, 2 * mx + seenY, 2 * my + seenX, ux + vx, uy + vy, p * pm * pp, out);
                    }
                }
            }
        }
    }

    static Stream<Arguments> cases() {
        StageGame donation = StageGame.donation(3, 1);
        StageGame halves = StageGame.symmetric(1.5, -0.5, 2, 0);
        MemoryStrategy tft = MemoryStrategy.memoryOne("tft", new double[] {1, 0, 1, 0}, 1);
        MemoryStrategy wsls = MemoryStrategy.memoryOne("wsls", new double[] {1, 0, 0, 1}, 1);
        MemoryStrategy rnd = MemoryStrategy.memoryOne("m1", new double[] {0.9, 0.3, 0.6, 0.2}, 0.7);
        MemoryStrategy gtft = MemoryStrategy.reactive("gtft", 1, 0.4, 1);
        return Stream.of(
            Arguments.of(donation, tft, wsls, 0.1, 0.0, 4),
            Arguments.of(donation, rnd, gtft, 0.05, 0.1, 3),
            Arguments.of(halves, wsls, rnd, 0.0, 0.2, 4),
            Arguments.of(StageGame.DEFAULT, gtft, tft, 0.02, 0.05, 2));
    }

    @ParameterizedTest
    @MethodSource("cases")
    void singleGameLawMatchesEnumeration(StageGame g, MemoryStrategy x, MemoryStrategy y, double e, double h, int n) {
        Noise noise = Noise.symmetric(e, h);
        MarkovChain chain = MarkovChain.of(new Match(g, x, y, noise));
        Lattice lattice = Lattice.of(g.payoffX());
        for (boolean difference : new boolean[] {false, true}) {
            int[] steps = difference ? GameLaw.differenceSteps(lattice) : GameLaw.focalSteps(lattice);
            GameLaw law = GameLaw.of(chain, steps, Horizon.rounds(n), n);
            Map<Long, Double> brute = new HashMap<>();
            enumerate(g, x, y, e, h, n).forEach((k, p) -> brute.merge(
                Math.round((difference ? k.get(0) - k.get(1) : k.get(0)) / lattice.unit()), p, Double::sum));
            double[] q = law.probability();
            double total = 0;
            for (int j = 0; j < q.length; j++) {
                double expected = brute.getOrDefault((long) (law.lowest() + j), 0.0);
                assertEquals(expected, q[j], 1e-14, "step " + (law.lowest() + j));
                total += q[j];
            }
            assertEquals(1, total, 1e-14);
        }
        // Continuation truncated after n rounds: the mixture sum_t (1 - delta) delta^(t-1) law_t.
        double delta = 0.4;
        GameLaw law = GameLaw.of(chain, GameLaw.focalSteps(lattice), Horizon.continuation(delta), n);
        Map<Long, Double> brute = new HashMap<>();
        for (int t = 1; t <= n; t++) {
            double w = (1 - delta) * Math.pow(delta, t - 1);
            enumerate(g, x, y, e, h, t).forEach((k, p) -> brute.merge(Math.round(k.get(0) / lattice.unit()), w * p,
                Double::sum));
        }
        for (int j = 0; j < law.probability().length; j++) {
            assertEquals(brute.getOrDefault((long) (law.lowest() + j), 0.0), law.probability()[j], 1e-14);
        }
        assertEquals(Math.pow(delta, n), law.missing(), 1e-15);
    }

    /** Convolution of discrete laws stored as value -> probability. */
    static Map<Double, Double> convolve(Map<Double, Double> a, Map<Double, Double> b) {
        Map<Double, Double> out = new HashMap<>();
        a.forEach((va, pa) -> b.forEach((vb, pb) -> out.merge(round(va + vb), pa * pb, Double::sum)));
        return out;
    }

    private static double round(double v) {
        return Math.round(v * 1e9) / 1e9;
    }

    static Map<Double, Double> own(StageGame g, MemoryStrategy x, MemoryStrategy y, Noise noise, int n, boolean negate) {
        Map<Double, Double> out = new HashMap<>();
        enumerate(g, x, y, noise.executionX(), noise.perceptionX(), n)
            .forEach((k, p) -> out.merge(round(negate ? -k.get(0) : k.get(0)), p, Double::sum));
        return out;
    }

    static Map<Double, Double> power(Map<Double, Double> a, int k) {
        Map<Double, Double> out = Map.of(0.0, 1.0);
        for (int j = 0; j < k; j++) {
            out = convolve(out, a);
        }
        return out;
    }

    /**
     * Pairwise comparison with every co-player in N = 4 (the shared game and two more each) and with one
     * sampled co-player in N = 5 (hypergeometric mixture, no shared game): E[F(beta D)] and E[F(-beta D)]
     * by enumerating every combination of games, against the Fourier evaluation.
     */
    @ParameterizedTest
    @MethodSource("cases")
    void pairwiseUpdateProbabilitiesMatchEnumeration(StageGame g, MemoryStrategy a, MemoryStrategy b, double e, double h,
        int n) {
        Noise noise = Noise.symmetric(e, h);
        PayoffBasis.Realised basis = new PayoffBasis.Realised(g, List.of(a, b), noise, Horizon.rounds(n));
        double beta = 0.7;
        int size = 4;
        Rates rates = RealisedRates.of(basis, Population.pairwise(size, beta), 0, 1);
        Map<Double, Double> shared = new HashMap<>();
        enumerate(g, a, b, e, h, n).forEach((k, p) -> shared.merge(round(k.get(0) - k.get(1)), p, Double::sum));
        for (int i = 1; i < size; i++) {
            Map<Double, Double> d = shared;
            d = convolve(d, power(own(g, a, a, noise, n, false), i - 1));
            d = convolve(d, power(own(g, a, b, noise, n, false), size - i - 1));
            d = convolve(d, power(own(g, b, a, noise, n, true), i - 1));
            d = convolve(d, power(own(g, b, b, noise, n, true), size - i - 1));
            double f = 0;
            double r = 0;
            for (Map.Entry<Double, Double> en : d.entrySet()) {
                double dp = en.getKey() / ((size - 1.0) * n);
                f += en.getValue() * Rates.logistic(beta * dp);
                r += en.getValue() * Rates.logistic(-beta * dp);
            }
            assertEquals(f, rates.forward()[i], 1e-12, "i = " + i);
            assertEquals(r, rates.backward()[i], 1e-12, "i = " + i);
        }
        int big = 5;
        Rates sampled = RealisedRates.of(basis, Population.pairwise(big, beta).withCoPlayers(1), 0, 1);
        for (int i = 1; i < big; i++) {
            double pModelMeetsA = (i - 1.0) / (big - 1);
            double pLearnerMeetsA = (double) i / (big - 1);
            Map<Double, Double> model = mix(own(g, a, a, noise, n, false), own(g, a, b, noise, n, false), pModelMeetsA);
            Map<Double, Double> learner = mix(own(g, b, a, noise, n, true), own(g, b, b, noise, n, true), pLearnerMeetsA);
            double f = 0;
            for (Map.Entry<Double, Double> en : convolve(model, learner).entrySet()) {
                f += en.getValue() * Rates.logistic(beta * en.getKey() / n);
            }
            assertEquals(f, sampled.forward()[i], 1e-12, "sampled, i = " + i);
        }
    }

    private static Map<Double, Double> mix(Map<Double, Double> x, Map<Double, Double> y, double px) {
        Map<Double, Double> out = new HashMap<>();
        x.forEach((v, p) -> out.merge(v, px * p, Double::sum));
        y.forEach((v, p) -> out.merge(v, (1 - px) * p, Double::sum));
        return out;
    }

    /** Moran with exponential fitness: E[exp(w P)] by enumeration against the tilted-chain evaluation. */
    @ParameterizedTest
    @MethodSource("cases")
    void moranExpectedFitnessMatchesEnumeration(StageGame g, MemoryStrategy a, MemoryStrategy b, double e, double h,
        int n) {
        Noise noise = Noise.symmetric(e, h);
        PayoffBasis.Realised basis = new PayoffBasis.Realised(g, List.of(a, b), noise, Horizon.rounds(n));
        int size = 4;
        double w = 0.8;
        Rates rates = RealisedRates.of(basis, Population.moran(size, w, Population.Fitness.EXPONENTIAL), 0, 1);
        for (int i = 1; i <= size; i++) {
            Map<Double, Double> s = convolve(power(own(g, a, a, noise, n, false), i - 1),
                power(own(g, a, b, noise, n, false), size - i));
            double f = 0;
            for (Map.Entry<Double, Double> en : s.entrySet()) {
                f += en.getValue() * Math.exp(w * en.getKey() / ((size - 1.0) * n));
            }
            assertEquals(f, rates.forward()[i], 1e-12 * f, "i = " + i);
        }
    }

    /**
     * Payoffs off any small lattice (irrational entries) are rounded to a grid and labelled ROUNDED; the
     * update probabilities must lie within the stated bound beta unit / 4 (plus rounding) of the exact
     * expectation, here by enumeration with the real payoffs (N = 3, 3-round games).
     */
    @org.junit.jupiter.api.Test
    void offLatticePayoffsAreRoundedWithinTheStatedBound() {
        StageGame g = StageGame.symmetric(Math.sqrt(8), -Math.PI / 10, Math.E + 2, Math.sqrt(2) / 3);
        MemoryStrategy a = MemoryStrategy.memoryOne("m1", new double[] {0.9, 0.3, 0.6, 0.2}, 0.7);
        MemoryStrategy b = MemoryStrategy.memoryOne("wsls", new double[] {1, 0, 0, 1}, 1);
        Noise noise = Noise.symmetric(0.05, 0.05);
        int n = 3;
        int size = 3;
        double beta = 3;
        PayoffBasis.Realised basis = new PayoffBasis.Realised(g, List.of(a, b), noise, Horizon.rounds(n));
        Rates rates = RealisedRates.of(basis, Population.pairwise(size, beta), 0, 1);
        org.junit.jupiter.api.Assertions.assertEquals(Fixation.Method.ROUNDED, rates.method());
        Lattice lattice = Lattice.of(g.payoffX());
        org.junit.jupiter.api.Assertions.assertTrue(lattice.rounded());
        Map<Double, Double> shared = new HashMap<>();
        enumerate(g, a, b, 0.05, 0.05, n).forEach((k, p) -> shared.merge(k.get(0) - k.get(1), p, Double::sum));
        for (int i = 1; i < size; i++) {
            Map<Double, Double> d = shared;
            d = convolve(d, power(own(g, a, a, noise, n, false), i - 1));
            d = convolve(d, power(own(g, a, b, noise, n, false), size - i - 1));
            d = convolve(d, power(own(g, b, a, noise, n, true), i - 1));
            d = convolve(d, power(own(g, b, b, noise, n, true), size - i - 1));
            double f = 0;
            for (Map.Entry<Double, Double> en : d.entrySet()) {
                f += en.getValue() * Rates.logistic(beta * en.getKey() / ((size - 1.0) * n));
            }
            org.junit.jupiter.api.Assertions.assertEquals(f, rates.forward()[i], rates.absoluteError(), "i = " + i);
        }
        org.junit.jupiter.api.Assertions.assertTrue(rates.absoluteError() < beta * lattice.unit() / 4 + 1e-9);
    }
}
