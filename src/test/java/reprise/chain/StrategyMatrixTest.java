package reprise.chain;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import reprise.game.Horizon;
import reprise.game.Match;
import reprise.game.MemoryStrategy;
import reprise.game.Noise;
import reprise.game.Player;
import reprise.game.StageGame;
import reprise.game.State;
import reprise.game.Strategies;
import reprise.game.Strategy;

class StrategyMatrixTest {

    private static final StageGame PD = StageGame.DEFAULT;

    /**
     * Press &amp; Dyson (2012), Iterated Prisoner's Dilemma contains strategies that dominate any evolutionary
     * opponent, PNAS 109(26), 10409-10413: the extortioner chi = 3, phi = 1/26 (our default phi) and the
     * equalizer (2/3, 0, 2/3, 1/3) fixing the co-player at 2, against several opponents, 5,3,1,0, no noise.
     * Values as recomputed in exact arithmetic in the team's reference list (section 4). Tolerance 1e-12.
     */
    @Test
    void pressDysonRowsOfTheMatrix() {
        List<String> columns = List.of("allc", "random", "wsls", "memory1:0.9,0.5,0.2,0.1");
        StrategyMatrix m = StrategyMatrix.of(PD, parse(List.of("extort:chi=3", "equalizer:score=2,phi=1/3"),
            Player.X), parse(columns, Player.Y), Noise.NONE, null);
        double[][] extortion = {{41 / 11.0, 21 / 11.0}, {41 / 16.0, 73 / 48.0}, {26 / 11.0, 16 / 11.0},
            {79 / 46.0, 57 / 46.0}};
        double[] equalizerX = {11 / 3.0, 33 / 14.0, 27 / 11.0, 128 / 75.0};
        for (int j = 0; j < columns.size(); j++) {
            assertEquals(extortion[j][0], m.payoffX(0, j), 1e-12, columns.get(j));
            assertEquals(extortion[j][1], m.payoffY(0, j), 1e-12, columns.get(j));
            assertEquals(equalizerX[j], m.payoffX(1, j), 1e-12, columns.get(j));
            assertEquals(2, m.payoffY(1, j), 1e-12, columns.get(j));
            assertTrue(m.unique(0, j));
        }
    }

    /**
     * Nowak &amp; Sigmund (1990), The evolution of stochastic strategies in the Prisoner's Dilemma, Acta
     * Applicandae Mathematicae 20, 247-265 (formula from memory, values recomputed in the reference list,
     * section 1): s1 = (q1 + r1 q2)/(1 - r1 r2), s2 = (q2 + r2 q1)/(1 - r1 r2) after execution error, and
     * the moves are independent in the long run, so pi_CC = s1 s2 and so on. Checked on every ordered pair of a
     * set of reactive strategies (self-play included), the formula evaluated here in the test.
     */
    static Stream<Arguments> noiseLevels() {
        return Stream.of(Arguments.of(0.0), Arguments.of(0.01), Arguments.of(0.1));
    }

    @ParameterizedTest
    @MethodSource("noiseLevels")
    void nowakSigmundAcrossASet(double e) {
        double[][] set = {{0.9, 0.2}, {0.7, 0.4}, {0.8, 0.1}, {1, 1 / 3.0}, {0, 0}, {0.5, 0.5}, {1, 0.05}};
        List<String> specs = new ArrayList<>();
        for (double[] s : set) {
            specs.add("reactive:" + s[0] + "," + s[1]);
        }
        StrategyMatrix m = StrategyMatrix.of(PD, specs, Noise.symmetric(e, 0), null);
        for (int i = 0; i < set.length; i++) {
            for (int j = 0; j < set.length; j++) {
                double p1 = (1 - e) * set[i][0] + e * (1 - set[i][0]);
                double q1 = (1 - e) * set[i][1] + e * (1 - set[i][1]);
                double p2 = (1 - e) * set[j][0] + e * (1 - set[j][0]);
                double q2 = (1 - e) * set[j][1] + e * (1 - set[j][1]);
                double r1 = p1 - q1;
                double r2 = p2 - q2;
                double s1 = (q1 + r1 * q2) / (1 - r1 * r2);
                double s2 = (q2 + r2 * q1) / (1 - r1 * r2);
                String pair = specs.get(i) + " vs " + specs.get(j) + " e=" + e;
                assertEquals(s1 * s2, m.frequency(i, j, State.CC), 1e-12, pair);
                assertEquals(s1 * (1 - s2), m.frequency(i, j, State.CD), 1e-12, pair);
                assertEquals(s1, m.cooperationX(i, j), 1e-12, pair);
                assertEquals(s2, m.cooperationY(i, j), 1e-12, pair);
                // A(S1, S2) = 1 - s1 + 4 s2 - s1 s2 for 5,3,1,0 (Nowak & Sigmund 1990, as in the reference list)
                assertEquals(1 - s1 + 4 * s2 - s1 * s2, m.payoffX(i, j), 1e-12, pair);
            }
        }
        // published values, reference list section 1 (c) and (d)
        assertEquals(e == 0 ? 14777 / 6241.0 : m.payoffX(0, 1), m.payoffX(0, 1), 1e-12);
        assertEquals(e == 0 ? 93 / 32.0 : m.payoffX(2, 3), m.payoffX(2, 3), 1e-12);
    }

    /**
     * Molander (1985), The optimal level of generosity in a selfish, uncertain environment, J. Conflict
     * Resolution 29(4), 611-618 (from memory; Nowak &amp; Sigmund 1992 for 5,3,1,0): against the resident
     * (1, q*) with q* = 1/3 no reactive mutant earns more than R = 3, the resident's own payoff; at
     * q = 0.3433 a mutant earns 3.000342640 at s1 of about 0.977 (reference list, section 2, derived in
     * exact arithmetic). Checked on a 201 x 201 grid of reactive mutants.
     */
    @Test
    void molanderGenerosityBound() {
        List<String> mutants = new ArrayList<>();
        for (int a = 0; a <= 200; a++) {
            for (int b = 0; b <= 200; b += 4) {
                mutants.add("reactive:" + a / 200.0 + "," + b / 200.0);
            }
        }
        StrategyMatrix atBound = StrategyMatrix.of(PD, parse(mutants, Player.X),
            parse(List.of("gtft", "reactive:1,0.3433"), Player.Y), Noise.NONE, null);
        double best = Double.NEGATIVE_INFINITY;
        double bestAbove = Double.NEGATIVE_INFINITY;
        for (int i = 0; i < mutants.size(); i++) {
            best = Math.max(best, atBound.payoffX(i, 0));
            bestAbove = Math.max(bestAbove, atBound.payoffX(i, 1));
        }
        assertEquals(3, best, 1e-12);
        assertTrue(bestAbove > 3 + 1e-4, "a mutant gains against q = 0.3433: " + bestAbove);
        assertTrue(bestAbove <= 3.000342640 + 1e-9, "no mutant beats the exact optimum: " + bestAbove);
    }

    /**
     * The zero-determinant residual pi_X - P - chi (pi_Y - P) is exactly zero in the long run against every
     * opponent (Press &amp; Dyson 2012) when play is free of errors (an execution error turns the vector into
     * one that no longer enforces the relation); in a game of n rounds it is not zero. Its finite-game value is checked
     * against brute-force enumeration of every realised history of a short game (4^n paths, each path's
     * probability the product of the players' per-round move probabilities after execution error), written
     * in this test without the chain code.
     */
    @Test
    void zeroDeterminantResidualLongRunAndFinite() {
        double chi = 3;
        List<String> opponents = List.of("allc", "alld", "tft", "wsls", "random", "memory1:0.3,0.8,0.25,0.6@0.4");
        double e = 0.05;
        Noise noise = Noise.symmetric(e, 0);
        List<Strategy> x = parse(List.of("extort:chi=3"), Player.X);
        List<Strategy> ys = parse(opponents, Player.Y);
        StrategyMatrix longRun = StrategyMatrix.of(PD, x, ys, Noise.NONE, null);
        for (int j = 0; j < opponents.size(); j++) {
            double residual = longRun.payoffX(0, j) - 1 - chi * (longRun.payoffY(0, j) - 1);
            assertEquals(0, residual, 1e-12, opponents.get(j));
        }
        for (int n = 1; n <= 7; n++) {
            StrategyMatrix finite = StrategyMatrix.of(PD, x, ys, noise, Horizon.rounds(n));
            for (int j = 0; j < opponents.size(); j++) {
                double[] brute = enumerate((MemoryStrategy) x.get(0), (MemoryStrategy) ys.get(j), e, n);
                String what = opponents.get(j) + " n=" + n;
                assertEquals(brute[0], finite.payoffX(0, j), 1e-13, what);
                assertEquals(brute[1], finite.payoffY(0, j), 1e-13, what);
                double residual = finite.payoffX(0, j) - 1 - chi * (finite.payoffY(0, j) - 1);
                assertEquals(brute[0] - 1 - chi * (brute[1] - 1), residual, 1e-12, what);
            }
        }
        // the extortioner opens with D, so against ALLC the one-round game gives X the temptation 5 (with no
        // error) and the residual is far from zero
        StrategyMatrix one = StrategyMatrix.of(PD, x, parse(List.of("allc"), Player.Y), Noise.NONE, Horizon.rounds(1));
        assertEquals(5, one.payoffX(0, 0), 0);
        assertEquals(5 - 1 - chi * (0 - 1), one.payoffX(0, 0) - 1 - chi * (one.payoffY(0, 0) - 1), 0);
    }

    /** Average payoffs over n rounds by enumerating all 4^n realised histories of two memory-one players. */
    private static double[] enumerate(MemoryStrategy x, MemoryStrategy y, double e, int n) {
        double[] total = new double[2];
        walk(x, y, e, n, 0, -1, 1, 0, 0, total);
        return new double[] {total[0] / n, total[1] / n};
    }

    private static void walk(MemoryStrategy x, MemoryStrategy y, double e, int n, int t, int last, double prob,
        double sumX, double sumY, double[] total) {
        if (t == n) {
            total[0] += prob * sumX;
            total[1] += prob * sumY;
            return;
        }
        // intended cooperation: first move, else the table entry for the last round in each player's own view
        double cx = last < 0 ? x.initial() : x.cooperation(last);
        int yView = last < 0 ? -1 : ((last & 1) << 1) | (last >> 1);
        double cy = last < 0 ? y.initial() : y.cooperation(yView);
        double px = (1 - e) * cx + e * (1 - cx);
        double py = (1 - e) * cy + e * (1 - cy);
        double[] ux = {3, 0, 5, 1};
        double[] uy = {3, 5, 0, 1};
        for (int s = 0; s < 4; s++) {
            double pr = ((s >> 1) == 0 ? px : 1 - px) * ((s & 1) == 0 ? py : 1 - py);
            if (pr > 0) {
                walk(x, y, e, n, t + 1, s, prob * pr, sumX + ux[s], sumY + uy[s], total);
            }
        }
    }

    /**
     * The memory-one fast path equals the general chain (the route of {@link Prediction}, which {@code solve} prints) to
     * rounding, for random pairs with both kinds of error and all three kinds of length, and the general path
     * serves a memory-two strategy. Common practice, no source: two routes through the same model.
     */
    @Test
    void fastPathEqualsTheGeneralChain() {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(20261202L);
        List<Strategy> xs = new ArrayList<>();
        List<Strategy> ys = new ArrayList<>();
        for (int i = 0; i < 12; i++) {
            xs.add(MemoryStrategy.memoryOne("x" + i, randomVector(rng), rng.nextDouble()));
            ys.add(MemoryStrategy.memoryOne("y" + i, randomVector(rng), rng.nextDouble()));
        }
        xs.add(Strategies.parse("tft", PD, Player.X));
        ys.add(Strategies.parse("tft", PD, Player.Y));
        xs.add(Strategies.parse("tf2t", PD, Player.X));
        Noise noise = new Noise(0.02, 0.01, 0.03, 0);
        for (Horizon h : new Horizon[] {null, Horizon.rounds(1), Horizon.rounds(37), Horizon.rounds(1000),
            Horizon.continuation(0), Horizon.continuation(0.9), Horizon.continuation(0.999)}) {
            StrategyMatrix m = StrategyMatrix.of(PD, xs, ys, noise, h);
            for (int i = 0; i < xs.size(); i++) {
                for (int j = 0; j < ys.size(); j++) {
                    Match match = new Match(PD, xs.get(i), ys.get(j), noise);
                    MarkovChain chain = MarkovChain.of(match);
                    double[] expected = h == null ? chain.project(chain.structure().limitDistribution())
                        : Frequencies.of(chain, h);
                    Support.assertVector(expected, m.frequencies(i, j), 1e-12, i + " vs " + j + " " + h);
                }
            }
        }
        StrategyMatrix exact = StrategyMatrix.of(PD, List.of("tft", "alld"), Noise.NONE, null);
        assertFalse(exact.unique(0, 0), "noise-free tit-for-tat pair has several closed classes");
        assertEquals(3, exact.payoffX(0, 0), 0, "the time-average limit from CC");
    }

    private static double[] randomVector(UniformRandomProvider rng) {
        return new double[] {rng.nextDouble(), rng.nextDouble(), rng.nextDouble(), rng.nextDouble()};
    }

    private static List<Strategy> parse(List<String> specs, Player p) {
        return specs.stream().map(s -> Strategies.parse(s, PD, p)).toList();
    }
}
