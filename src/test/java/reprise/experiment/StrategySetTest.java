package reprise.experiment;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import reprise.chain.StrategyMatrix;
import reprise.game.Horizon;
import reprise.game.MemoryStrategy;
import reprise.game.Player;
import reprise.game.StageGame;
import reprise.game.Strategies;

/**
 * Strategy sets and derived quantities through the experiment path: a file is read, its grid expanded into
 * the matches of the set, every case solved and simulated, and the {@link SetMatrix} built from the results,
 * as {@code check} does. The exact values are pinned to published results.
 */
class StrategySetTest {

    @TempDir
    Path dir;

    private record Run(Experiment e, List<CaseResult> results, Runner.Outcome outcome, List<SetMatrix> matrices) {
        SetMatrix matrix(String noise, Horizon h) {
            return matrices.stream().filter(m -> m.noise().equals(noise) && m.horizon().equals(h)).findFirst()
                .orElseThrow();
        }

        SetMatrix.Value value(SetMatrix m, String row, String column, Quantity q) {
            int i = m.strategies().indexOf(row);
            int j = m.strategies().indexOf(column);
            return m.cell(i, j).orElseThrow(() -> new AssertionError(row + " vs " + column + " not played"))
                .value(q).orElseThrow();
        }

        Quantity derived(String name) {
            return e.derived().stream().filter(d -> d.name().equals(name)).findFirst().orElseThrow();
        }
    }

    private Run run(String yaml) throws IOException {
        Path file = dir.resolve("set.yaml");
        Files.writeString(file, yaml);
        Experiment e = ExperimentFile.read(file);
        List<CaseResult> results = e.cases().stream().map(c -> Runner.runCase(e, c, 1, null)).toList();
        Runner.Outcome o = Runner.analyse(e, results, Map.of());
        return new Run(e, results, o, SetMatrix.of(e, results, o.rows()));
    }

    /**
     * Press &amp; Dyson (2012), Iterated Prisoner's Dilemma contains strategies that dominate any evolutionary
     * opponent, PNAS 109(26), 10409-10413, for 5,3,1,0 without errors: the extortioner with chi = 3 (phi = 1/26)
     * against ALLC scores 41/11 and leaves 21/11; the equalizer (2/3, 0, 2/3, 1/3) holds every co-player at 2
     * and scores 27/11 against WSLS and 11/3 against ALLC (exact arithmetic, team reference list section 4). The
     * derived residual payoff_x - 1 - 3 (payoff_y - 1) is 0 in the long run against every co-player (the
     * relation the extortioner enforces), and its exact value in a 5-round game with 5% execution error equals
     * the brute-force enumeration of all 4^5 histories, written here without the chain code. Tolerance 1e-12:
     * rounding of a few dozen operations on numbers of order 1.
     */
    @Test
    void pressDysonThroughAStrategySetAndItsZeroDeterminantResidual() throws IOException {
        Run run = run(String.join("\n",
            "experiment: press-dyson",
            "game: 3,0,5,1",
            "strategy_set:",
            "  strategies:",
            "    extort3: extort:chi=3",
            "    equalizer: equalizer:score=2,phi=1/3",
            "    allc: allc",
            "    wsls: wsls",
            "    tft: tft",
            "  matches: [[extort3, allc], [extort3, wsls], [extort3, tft], [extort3, extort3], [equalizer, allc],",
            "    [equalizer, wsls]]",
            "  exact_continuation: [0.9]",
            "grid:",
            "  noise: [0, 0.05]",
            "  rounds: [5]",
            "derived:",
            "  zd_residual: payoff_x - 1 - 3 * (payoff_y - 1)",
            "  gap: -(payoff_y) + payoff_x",
            "replicates: 200",
            "seed: 2012",
            ""));
        assertEquals(12, run.e().cases().size(), "6 listed matches x 2 noise levels x 1 length");
        assertEquals("extort3-vs-allc/noise=0", run.e().cases().get(0).id());
        SetMatrix clean = run.matrix("0", Horizon.rounds(5));
        assertEquals(6, clean.cells().size());
        assertTrue(clean.cell(2, 0).isEmpty(), "allc vs extort3 was not listed");
        assertEquals(41 / 11.0, run.value(clean, "extort3", "allc", BaseQuantity.PAYOFF_X).longRun(), 1e-12);
        assertEquals(21 / 11.0, run.value(clean, "extort3", "allc", BaseQuantity.PAYOFF_Y).longRun(), 1e-12);
        assertEquals(27 / 11.0, run.value(clean, "equalizer", "wsls", BaseQuantity.PAYOFF_X).longRun(), 1e-12);
        assertEquals(11 / 3.0, run.value(clean, "equalizer", "allc", BaseQuantity.PAYOFF_X).longRun(), 1e-12);
        assertEquals(2, run.value(clean, "equalizer", "wsls", BaseQuantity.PAYOFF_Y).longRun(), 1e-12);
        Quantity zd = run.derived("zd_residual");
        Quantity gap = run.derived("gap");
        for (String co : List.of("allc", "wsls", "tft", "extort3")) {
            assertEquals(0, run.value(clean, "extort3", co, zd).longRun(), 1e-12, co);
        }
        SetMatrix noisy = run.matrix("0.05", Horizon.rounds(5));
        StageGame pd = run.e().game();
        MemoryStrategy x = (MemoryStrategy) Strategies.parse("extort:chi=3", pd, Player.X);
        for (String co : List.of("allc", "wsls", "tft")) {
            MemoryStrategy y = (MemoryStrategy) Strategies.parse(co, pd, Player.Y);
            double[] brute = enumerate(x, y, 0.05, 5);
            SetMatrix.Value v = run.value(noisy, "extort3", co, zd);
            assertEquals(brute[0] - 1 - 3 * (brute[1] - 1), v.exact(), 1e-12, co);
            assertEquals(brute[0] - brute[1], run.value(noisy, "extort3", co, gap).exact(), 1e-12, co);
            assertTrue(Math.abs(v.exact()) > 0.05, "the finite game breaks the relation: " + v.exact());
            assertTrue(v.lower() <= v.simulated() && v.simulated() <= v.upper());
            assertTrue(v.verdict() != null, "the derived residual has an exact-comparison verdict");
        }
        // the residual's results rows: every case has an exact row for each derived quantity
        for (CaseResult r : run.results()) {
            for (Quantity q : List.of(zd, gap)) {
                assertTrue(run.outcome().rows().stream().anyMatch(row -> row.caseIndex() == r.c().index()
                    && row.subject().equals(q) && row.comparisonKind() == ComparisonKind.EXACT), r.c().id());
            }
        }
        // the exact-only matrices (every ordered pair, StrategyMatrix) agree with the per-case long-run values
        List<SetExactMatrix> exact = SetExactMatrix.of(run.e());
        assertEquals(2 * 3, exact.size(), "per noise level: the grid's length, the long run, continuation 0.9");
        StrategyMatrix longRun = exact.stream().filter(m -> m.noise().equals("0") && m.horizon() == null)
            .findFirst().orElseThrow().matrix();
        assertEquals(5, longRun.rows());
        for (SetMatrix.Cell c : clean.cells()) {
            double viaCase = c.value(BaseQuantity.PAYOFF_X).orElseThrow().longRun();
            assertEquals(viaCase, longRun.payoffX(c.row(), c.column()), 1e-12, c.c().id());
        }
    }

    /**
     * Nowak &amp; Sigmund (1990), The evolution of stochastic strategies in the Prisoner's Dilemma, Acta
     * Applicandae Mathematicae 20, 247-265 (formula from memory, as in the team's reference list section 1):
     * for reactive strategies (p, q) after execution error e, s1 = (q1 + r1 q2)/(1 - r1 r2), s2 = (q2 + r2 q1)/
     * (1 - r1 r2) with r = p - q, and the long-run payoff of X is 1 - s1 + 4 s2 - s1 s2 for 5,3,1,0. Checked for
     * every ordered pair (self-play included) of a set run as an experiment. Tolerance 1e-12.
     */
    @Test
    void nowakSigmundClosedFormAcrossTheSet() throws IOException {
        double[][] set = {{0.9, 0.2}, {0.7, 0.4}, {1, 1 / 3.0}, {0.5, 0.5}};
        Run run = run(String.join("\n",
            "experiment: reactive-set",
            "strategy_set:",
            "  strategies:",
            "    a: reactive:0.9,0.2",
            "    b: reactive:0.7,0.4",
            "    c: reactive:1,0.333333333333333333",
            "    d: reactive:0.5,0.5",
            "grid:",
            "  noise: [0.01]",
            "  rounds: [20]",
            "replicates: 50",
            ""));
        SetMatrix m = run.matrices().get(0);
        assertEquals(16, m.cells().size());
        double e = 0.01;
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
                SetMatrix.Cell c = m.cell(i, j).orElseThrow();
                String what = c.c().id();
                assertEquals(s1, c.value(BaseQuantity.COOPERATION_X).orElseThrow().longRun(), 1e-12, what);
                assertEquals(s2, c.value(BaseQuantity.COOPERATION_Y).orElseThrow().longRun(), 1e-12, what);
                assertEquals(s1 * s2, c.value(BaseQuantity.CC).orElseThrow().longRun(), 1e-12, what);
                assertEquals(1 - s1 + 4 * s2 - s1 * s2, c.value(BaseQuantity.PAYOFF_X).orElseThrow().longRun(), 1e-12,
                    what);
                assertTrue(c.value(BaseQuantity.PAYOFF_X).orElseThrow().unique());
            }
        }
    }

    /**
     * Molander (1985), The optimal level of generosity in a selfish, uncertain environment, J. Conflict
     * Resolution 29(4), 611-618 (from memory; Nowak &amp; Sigmund 1992 for 5,3,1,0): against generous
     * tit-for-tat (1, 1/3) no reactive mutant earns more than R = 3, what the resident earns against itself.
     * Checked for a set of mutants played against gtft as listed matches, without errors. Tolerance 1e-12.
     */
    @Test
    void molanderBoundAgainstGenerousTitForTat() throws IOException {
        Run run = run(String.join("\n",
            "experiment: molander",
            "strategy_set:",
            "  strategies:",
            "    gtft: gtft",
            "    m1: reactive:0.99,0.5",
            "    m2: reactive:0.9,0.0",
            "    m3: reactive:0.5,0.9",
            "    m4: reactive:0.977,0.2",
            "  matches: [[gtft, gtft], [m1, gtft], [m2, gtft], [m3, gtft], [m4, gtft]]",
            "grid:",
            "  rounds: [20]",
            "replicates: 20",
            ""));
        SetMatrix m = run.matrices().get(0);
        assertEquals(3, run.value(m, "gtft", "gtft", BaseQuantity.PAYOFF_X).longRun(), 1e-12);
        for (String mutant : List.of("m1", "m2", "m3", "m4")) {
            double payoff = run.value(m, mutant, "gtft", BaseQuantity.PAYOFF_X).longRun();
            assertTrue(payoff <= 3 + 1e-12, mutant + " earns " + payoff);
            assertTrue(payoff > 1, mutant + " earns " + payoff);
        }
    }

    /** Derived expressions: the parser's forms and its refusals (common practice, no source). */
    @Test
    void derivedExpressionsParseToTheirWeights() {
        StageGame pd = StageGame.DEFAULT;
        DerivedQuantity zd = DerivedQuantity.parse("zd", "payoff_x - 1 - 3 * (payoff_y - 1)", 1);
        // payoff_x - 3 payoff_y + 2 over CC, CD, DC, DD with (3, 0, 5, 1) and (3, 5, 0, 1): (-4, -13, 7, 0)
        assertArrayEquals4(new double[] {-4, -13, 7, 0}, zd.weights(pd));
        assertFalse(zd.isRatio());
        DerivedQuantity c = DerivedQuantity.parse("c", "2*(CC+ CD)-coop_x + -DD*0.5 + 1e-1", 1);
        assertArrayEquals4(new double[] {1.1, 1.1, 0.1, -0.4}, c.weights(pd));
        DerivedQuantity r = DerivedQuantity.parse("r", "ratio(coop_x, 0.5 * coop_y)", 1);
        assertTrue(r.isRatio());
        assertArrayEquals4(new double[] {1, 1, 0, 0}, r.weights(pd));
        assertArrayEquals4(new double[] {0.5, 0, 0.5, 0}, r.denominatorWeights(pd));
        for (String[] bad : new String[][] {{"payoff_x * payoff_y", "not linear"}, {"3", "names no quantity"},
            {"payoff_x +", "expression ends"}, {"ratio(CC, 0)", "denominator is 0"}, {"CC + ratio(CC, DD)",
                "only as the whole expression"}, {"CC $ DD", "unexpected '$' at character 4"},
            {"(CC", "expected ')'"}, {"cc", "did you mean 'CC'"}}) {
            IllegalArgumentException ex = org.junit.jupiter.api.Assertions.assertThrows(
                IllegalArgumentException.class, () -> DerivedQuantity.parse("q", bad[0], 1), bad[0]);
            assertTrue(ex.getMessage().contains(bad[1]), bad[0] + ": " + ex.getMessage());
        }
    }

    private static void assertArrayEquals4(double[] expected, double[] actual) {
        for (int s = 0; s < 4; s++) {
            assertEquals(expected[s], actual[s], 1e-12, "state " + s);
        }
    }

    /** Average payoffs over n rounds by enumerating all 4^n realised histories of two memory-one players. */
    static double[] enumerate(MemoryStrategy x, MemoryStrategy y, double e, int n) {
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
}
