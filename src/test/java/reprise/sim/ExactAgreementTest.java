package reprise.sim;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import reprise.game.Horizon;
import reprise.game.Match;
import reprise.game.MemoryStrategy;
import reprise.game.Noise;
import reprise.game.Player;
import reprise.game.StageGame;
import reprise.game.Strategies;
import reprise.game.Strategy;

/**
 * Simulated state and transition counts per game against exact expectations from
 * {@link ExactEnumeration} (computed independently in the test by exact enumeration of each round's
 * events), on 13 cases spanning execution and perception noise, memory-one, memory-two and custom
 * agents, fixed and geometric horizons and burn-in, each on the fast path (where it applies) and the
 * literal path.
 *
 * <p>Failure budget: every (case, path, quantity) with a non-zero exact value is one batch t-test
 * (B = 40 independent replicate ranges, 39 degrees of freedom) at level alpha = 0.01 / M, M the number
 * of such tests; by Bonferroni the whole test fails falsely with probability at most 0.01, whatever
 * the dependence between the tests. Quantities with exact value 0 must be exactly 0.
 */
class ExactAgreementTest {
    private static final StageGame PD = StageGame.DEFAULT;
    private static final int BATCHES = 40;
    private static final long SEED = 0x5EED_2024L;

    record Case(String name, String x, String y, String exactX, Noise noise, Horizon horizon, long burnIn,
        long games) {
    }

    static String m2(long seed) {
        java.util.Random r = new java.util.Random(seed);
        StringBuilder sb = new StringBuilder("memory2:");
        for (int i = 0; i < 16; i++) {
            sb.append(i == 0 ? "" : ",").append(Math.round(r.nextDouble() * 100) / 100.0);
        }
        return sb.toString();
    }

    static List<Case> cases() {
        return List.of(
            new Case("m1 pair, execution", "memory1:0.9,0.2,0.7,0.1", "memory1:0.8,0.3,0.6,0.2", null,
                new Noise(0.05, 0.05, 0, 0), Horizon.rounds(20), 0, 60_000),
            new Case("m1 pair, execution+perception", "memory1:0.9,0.2,0.7,0.1", "memory1:0.8,0.3,0.6,0.2", null,
                Noise.symmetric(0.05, 0.1), Horizon.rounds(20), 0, 60_000),
            new Case("wsls vs tft, geometric", "wsls", "tft", null, Noise.symmetric(0.03, 0.05),
                Horizon.continuation(0.9), 0, 60_000),
            new Case("reactive pair, geometric, p0", "reactive:0.9,0.2@0.5", "reactive:0.7,0.4", null,
                Noise.symmetric(0.02, 0.04), Horizon.continuation(0.75), 0, 80_000),
            new Case("tf2t vs m1", "tf2t", "memory1:0.7,0.1,0.9,0.3", null, new Noise(0.05, 0.05, 0, 0),
                Horizon.rounds(15), 0, 60_000),
            new Case("m2 pair, both noises", m2(1), m2(2), null, Noise.symmetric(0.03, 0.08), Horizon.rounds(12), 0,
                60_000),
            new Case("m2 vs m1, perception only, geometric", m2(3), "memory1:1,0.2,0.6,0.4", null,
                new Noise(0, 0, 0.1, 0.1), Horizon.continuation(0.8), 0, 80_000),
            new Case("grim vs tf2t, burn-in", "grim", "tf2t", null, Noise.symmetric(0.05, 0.05), Horizon.rounds(25),
                5, 60_000),
            new Case("asymmetric noise m1 vs m2", "memory1:0.9,0.1,0.6,0.3@0.7", m2(4), null,
                new Noise(0.1, 0, 0, 0.2), Horizon.rounds(10), 0, 60_000),
            new Case("runcap agent vs wsls, geometric", "agent:runcap,1", "wsls", "memory1:1,0,1,1",
                Noise.symmetric(0.05, 0.05), Horizon.continuation(0.85), 0, 60_000),
            new Case("extortioner vs gtft, burn-in", "extort:chi=3", "gtft", null, Noise.symmetric(0.02, 0),
                Horizon.rounds(30), 3, 40_000),
            new Case("alld vs tft", "alld", "tft", null, new Noise(0.1, 0.1, 0, 0), Horizon.rounds(8), 0, 40_000),
            new Case("random vs m1, geometric burn-in", "random", "memory1:0.95,0.05,0.5,0.5", null,
                Noise.symmetric(0.01, 0.2), Horizon.continuation(0.7), 2, 80_000));
    }

    @Test
    void statesAndTransitionsAgreeWithExactEnumeration() {
        record Run(Case c, Enactment e) {
        }
        List<Run> runs = new ArrayList<>();
        for (Case c : cases()) {
            Strategy x = Strategies.parse(c.x(), PD, Player.X);
            Strategy y = Strategies.parse(c.y(), PD, Player.Y);
            boolean fastPossible = x instanceof MemoryStrategy mx && y instanceof MemoryStrategy my
                && mx.memory() == 1 && my.memory() == 1;
            runs.add(new Run(c, Enactment.LITERAL));
            if (fastPossible) {
                runs.add(new Run(c, Enactment.FASTEST));
            }
        }
        // Count the t-tests first so that the Bonferroni level is fixed before any simulation.
        List<double[]> exactStates = new ArrayList<>();
        List<double[][]> exactTransitions = new ArrayList<>();
        int m = 0;
        for (Run r : runs) {
            Case c = r.c();
            MemoryStrategy ex = (MemoryStrategy) Strategies.parse(c.exactX() != null ? c.exactX() : c.x(), PD,
                Player.X);
            MemoryStrategy ey = (MemoryStrategy) Strategies.parse(c.y(), PD, Player.Y);
            long fixed = c.horizon() instanceof Horizon.Rounds rr ? rr.count() : 0;
            double delta = c.horizon() instanceof Horizon.Continuation cc ? cc.probability() : 0;
            ExactEnumeration exact = new ExactEnumeration(ex, ey, c.noise(), fixed, delta, c.burnIn());
            exactStates.add(exact.states);
            exactTransitions.add(exact.transitions);
            for (int s = 0; s < 4; s++) {
                m += exact.states[s] > 0 ? 1 : 0;
                for (int q = 0; q < 4; q++) {
                    m += exact.transitions[s][q] > 0 ? 1 : 0;
                }
            }
        }
        double critical = Stochastic.critical(BATCHES - 1, 0.01 / m);
        Stochastic.Ledger ledger = new Stochastic.Ledger();
        for (int i = 0; i < runs.size(); i++) {
            Run r = runs.get(i);
            Case c = r.c();
            Match match = new Match(PD, Strategies.parse(c.x(), PD, Player.X), Strategies.parse(c.y(), PD, Player.Y),
                c.noise());
            SimulationSpec spec = SimulationSpec.of(match, c.horizon(), c.games(), SEED + i).withBurnIn(c.burnIn())
                .withThreads(1).withEnactment(r.e());
            Simulator sim = new Simulator(spec);
            double[][] stateBatches = new double[4][BATCHES];
            double[][] transitionBatches = new double[16][BATCHES];
            long per = c.games() / BATCHES;
            for (int k = 0; k < BATCHES; k++) {
                SimulationResult res = sim.simulateRange(k * per, (k + 1) * per, null);
                long[] st = res.stateCounts();
                long[][] tr = res.transitionCounts();
                for (int s = 0; s < 4; s++) {
                    stateBatches[s][k] = st[s] / (double) per;
                    for (int q = 0; q < 4; q++) {
                        transitionBatches[4 * s + q][k] = tr[s][q] / (double) per;
                    }
                }
            }
            String label = c.name() + " [" + r.e() + "]";
            for (int s = 0; s < 4; s++) {
                checkOne(ledger, label + " N_" + s, stateBatches[s], exactStates.get(i)[s], critical);
                for (int q = 0; q < 4; q++) {
                    checkOne(ledger, label + " N_" + s + "->" + q, transitionBatches[4 * s + q],
                        exactTransitions.get(i)[s][q], critical);
                }
            }
        }
        assertEquals(m, ledger.tests, "every non-zero exact quantity was tested");
        assertTrue(ledger.rejected.isEmpty(), "rejected at t critical " + critical + " (" + m + " tests): "
            + ledger.rejected);
    }

    private static void checkOne(Stochastic.Ledger ledger, String what, double[] batches, double exact,
        double critical) {
        if (exact == 0) {
            for (double v : batches) {
                assertEquals(0.0, v, what + " is impossible, so it must never be counted");
            }
            return;
        }
        ledger.check(what, Stochastic.t(batches, exact), critical);
    }
}
