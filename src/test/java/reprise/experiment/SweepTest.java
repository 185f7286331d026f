package reprise.experiment;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.StringWriter;
import java.util.Arrays;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import reprise.chain.Prediction;
import reprise.game.Horizon;
import reprise.game.Match;
import reprise.game.MemoryStrategy;
import reprise.game.Noise;
import reprise.game.Player;
import reprise.game.StageGame;
import reprise.game.Strategies;
import reprise.output.SweepCsv;

class SweepTest {

    private static final List<Horizon> LENGTHS = Arrays.asList(SweepDefinition.LONG_RUN, Horizon.rounds(1),
        Horizon.rounds(1000), Horizon.continuation(0.95));

    static Stream<Arguments> families() {
        double[] ax = SweepDefinition.steps(0, 1, 6);
        return Stream.of(
            Arguments.of(new SweepDefinition.ReactiveGrid(SweepDefinition.steps(0, 1, 11), SweepDefinition.steps(0, 1, 9))),
            Arguments.of(new SweepDefinition.MemoryOneGrid(new double[][] {ax, {0.5}, ax, {0, 1}})),
            Arguments.of(new SweepDefinition.RandomStrategies(200, 42L, false)),
            Arguments.of(new SweepDefinition.RandomStrategies(200, 43L, true)));
    }

    /**
     * The sweep's values equal those {@code solve} prints ({@link Prediction}, the general chain) at every
     * fifth strategy, for every co-player and length, to 1e-12 (the two routes order their floating-point
     * operations differently; common practice, no source).
     */
    @ParameterizedTest
    @MethodSource("families")
    void equalsSolveAtSampledPoints(SweepDefinition.Family family) {
        StageGame game = StageGame.DEFAULT;
        Noise noise = new Noise(0.01, 0.02, 0.005, 0);
        List<String> co = List.of("wsls", "extort:chi=2", "reactive:0.9,0.3@0.5", "alld");
        SweepDefinition d = new SweepDefinition(game, noise, family, 0.7, co, LENGTHS,
            List.of(new SweepDefinition.Relation("gap", 1, -1, 0)));
        SweepTable t = Sweep.run(d, 2);
        assertEquals(family.size() * co.size() * LENGTHS.size(), t.rows());
        for (int s = 0; s < family.size(); s += 5) {
            double[] p = {t.entry(s, 0), t.entry(s, 1), t.entry(s, 2), t.entry(s, 3)};
            MemoryStrategy x = MemoryStrategy.memoryOne("x", p, 0.7);
            for (int j = 0; j < co.size(); j++) {
                Match m = new Match(game, x, Strategies.parse(co.get(j), game, Player.Y), noise);
                for (int k = 0; k < LENGTHS.size(); k++) {
                    Horizon h = LENGTHS.get(k);
                    Prediction pr = Prediction.of(m, h);
                    double[] f = h == null ? pr.limitFrequencies() : pr.horizon().frequencies();
                    int row = t.row(s, j, k);
                    for (int st = 0; st < 4; st++) {
                        assertEquals(f[st], t.frequency(row, st), 1e-12, s + " vs " + co.get(j) + " " + h);
                    }
                    double px = h == null ? pr.limitPayoffs().x() : pr.horizon().payoffs().x();
                    double py = h == null ? pr.limitPayoffs().y() : pr.horizon().payoffs().y();
                    assertEquals(px, t.payoffX(row), 1e-12);
                    assertEquals(py, t.payoffY(row), 1e-12);
                    assertEquals(px - py, t.relation(row, 0), 1e-12);
                }
            }
        }
    }

    /** Results and CSV bytes do not depend on the number of threads. */
    @Test
    void identicalForAnyThreadCount() {
        SweepDefinition d = new SweepDefinition(StageGame.DEFAULT, Noise.symmetric(0.01, 0.01),
            new SweepDefinition.RandomStrategies(20_000, 7L, false), 1, List.of("tft", "generous:chi=2"),
            Arrays.asList(SweepDefinition.LONG_RUN, Horizon.rounds(50)), List.of());
        String one = csv(Sweep.run(d, 1), 1);
        assertEquals(one, csv(Sweep.run(d, 2), 2));
        assertEquals(one, csv(Sweep.run(d, 3), 1));
        assertTrue(one.startsWith("strategy,p_cc,p_cd,p_dc,p_dd,co_player,length,"), one.substring(0, 80));
        assertEquals(1 + 20_000 * 2 * 2, one.split("\n").length);
    }

    /**
     * Against an extortionate co-player the enforced residual (pi_Y - P) - chi (pi_X - P) is zero in the long
     * run of error-free play, for every swept strategy (Press &amp; Dyson 2012, PNAS 109(26), 10409-10413), but
     * not in a 10-round game.
     */
    @Test
    void enforcedResidualVanishesInTheLongRun() {
        SweepDefinition d = new SweepDefinition(StageGame.DEFAULT, Noise.NONE,
            new SweepDefinition.ReactiveGrid(SweepDefinition.steps(0.05, 0.95, 19), SweepDefinition.steps(0.05, 0.95, 19)),
            1, List.of("extort:chi=3"), Arrays.asList(SweepDefinition.LONG_RUN, Horizon.rounds(10)), List.of());
        SweepTable t = Sweep.run(d, 2);
        double finiteMax = 0;
        for (int s = 0; s < d.family().size(); s++) {
            assertEquals(0, t.enforcedResidual(t.row(s, 0, 0)), 1e-12);
            finiteMax = Math.max(finiteMax, Math.abs(t.enforcedResidual(t.row(s, 0, 1))));
        }
        assertTrue(finiteMax > 0.01, "finite games do not obey the relation: " + finiteMax);
    }

    @Test
    void gridOrderAndBadInput() {
        SweepDefinition.ReactiveGrid g = new SweepDefinition.ReactiveGrid(new double[] {0, 1}, new double[] {0.2, 0.4, 0.6});
        double[] t = Sweep.strategies(g);
        assertArrayEquals(new double[] {1, 0.4, 1, 0.4}, Arrays.copyOfRange(t, 16, 20));
        assertArrayEquals(new double[] {0, 0.25, 0.5, 0.75, 1}, SweepDefinition.steps(0, 1, 5));
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
            () -> new SweepDefinition.ReactiveGrid(new double[] {1.5}, new double[] {0}));
        assertEquals("grid axis p must hold probabilities in [0, 1]: 1.5", e.getMessage());
        SweepDefinition d = new SweepDefinition(StageGame.DEFAULT, Noise.NONE, g, 1, List.of("tf2t"),
            Arrays.asList(SweepDefinition.LONG_RUN), List.of());
        assertEquals("sweep co-player 'tf2t' must be a memory-one strategy",
            assertThrows(IllegalArgumentException.class, () -> Sweep.run(d, 1)).getMessage());
    }

    private static String csv(SweepTable t, int threads) {
        StringWriter w = new StringWriter();
        SweepCsv.write(t, w, threads);
        return w.toString();
    }
}
