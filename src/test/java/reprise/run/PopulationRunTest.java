package reprise.run;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.math.BigInteger;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import reprise.cli.Main;
import reprise.experiment.PopulationAnalysis;
import reprise.experiment.PopulationExperiment;
import reprise.experiment.PopulationFile;
import reprise.sim.InvasionTally;

/**
 * The population entry point: the bundled demo (experiments/quota-spread.yaml) with few invasions, its
 * files, thread-independence of the tallies, and that a disagreement of basis (c) with the invasions is
 * caught (exit code 1).
 */
class PopulationRunTest {

    private static final Path DEMO = Path.of("experiments/quota-spread.yaml");

    @TempDir
    Path tmp;

    /** The demo with N = 10 only, 150 invasions and alpha = 0.001. */
    private static PopulationExperiment smallDemo() {
        PopulationExperiment e = PopulationFile.read(DEMO);
        return new PopulationExperiment(e.file(), e.sha256(), e.name(), e.description(), e.gameText(), e.game(),
            e.strategyNames(), e.strategies(), e.update(), e.fitness(), e.coPlayers(), e.mutation(), e.mu(), 150, 0,
            e.tolerance(), List.of(10), e.selections(), e.noise(), e.misperception(), e.horizons(), e.seed(), 0.001,
            e.correction(), e.output());
    }

    @Test
    void demoFileHasTheDocumentedShape() {
        PopulationExperiment e = PopulationFile.read(DEMO);
        assertEquals(List.of("tft", "gtft", "wsls", "alld"), e.strategyNames());
        assertEquals(PopulationExperiment.Mutation.RARE, e.mutation());
        assertEquals(2 * 2 * 2 * 2, e.points().size());
    }

    /**
     * The demo at N = 10 through the run layer. Failure budget: the 96 (c) tests are Holm-corrected at
     * alpha = 0.001, so when (c) is right (the claim under test) the run reports a disagreement with
     * probability at most 0.001 (Holm 1979: family-wise error rate at most alpha under any dependence).
     */
    @Test
    void smallDemoRunsWritesItsFilesAndAgrees() throws Exception {
        PopulationExperiment e = smallDemo();
        Path out = tmp.resolve("out");
        RunSettings settings = new RunSettings(out, 2, false, false, List.of("check"), "test");
        int[] seen = {0};
        PopulationRun.Done done = PopulationRun.run(e, settings, (d, t) -> seen[0] = d);
        assertEquals(8 * 12, seen[0]);
        assertEquals(0, done.exitCode(), "a (c) row disagrees");
        for (String f : List.of("population.csv", "abundance.csv", "report.md", "run.json")) {
            assertTrue(Files.isRegularFile(out.resolve(f)), f);
        }
        List<String> csv = Files.readAllLines(out.resolve("population.csv"));
        assertEquals(1 + 8 * 12 * 3, csv.size());
        assertEquals(1 + 8 * 3 * 4, Files.readAllLines(out.resolve("abundance.csv")).size());
        try (var s = Files.list(out.resolve("figures"))) {
            assertEquals(4 * 12 + 4 + 8, s.count(), "one fixation figure per N, noise, length and ordered pair, "
                + "one abundance figure per N, selection and noise, one invasion graph per grid point");
        }
        String report = Files.readString(out.resolve("report.md"));
        assertTrue(report.contains("(c) realised payoffs against the invasions: 96 of 96 consistent"), report);
        assertThrows(IllegalArgumentException.class, () -> PopulationRun.run(e, settings, (d, t) -> { }),
            "a finished run is not replaced without --force");
    }

    /**
     * An interrupted run (stopped after 30 of 96 questions) continues with --resume and writes a
     * population.csv byte-identical to an uninterrupted run's; without --resume or --force the folder is
     * refused; a changed unit file is refused naming it.
     */
    @Test
    void interruptedRunResumesToIdenticalResults() throws Exception {
        PopulationExperiment e = smallDemo();
        Path whole = tmp.resolve("whole");
        PopulationRun.run(e, new RunSettings(whole, 2, false, false, List.of("check"), "test"), (d, t) -> { });
        Path cut = tmp.resolve("cut");
        RunSettings plain = new RunSettings(cut, 2, false, false, List.of("check"), "test");
        assertThrows(IllegalStateException.class, () -> PopulationRun.run(e, plain, (d, t) -> {
            if (d == 30) {
                throw new IllegalStateException("stop");
            }
        }));
        Path units = cut.resolve(PopulationCheckpoint.FOLDER);
        try (var s = Files.list(units)) {
            assertEquals(30, s.count());
        }
        IllegalArgumentException refused = assertThrows(IllegalArgumentException.class,
            () -> PopulationRun.run(e, plain, (d, t) -> { }));
        assertTrue(refused.getMessage().contains("holds an interrupted population run (30 finished"),
            refused.getMessage());
        Path one = units.resolve("q-1.json");
        String original = Files.readString(one);
        Files.writeString(one, original.replace("\"fixations\":", "\"fixations\":1"));
        RunSettings resume = new RunSettings(cut, 1, false, true, List.of("check", "--resume"), "test");
        IllegalArgumentException edited = assertThrows(IllegalArgumentException.class,
            () -> PopulationRun.run(e, resume, (d, t) -> { }));
        assertTrue(edited.getMessage().contains("q-1.json: fails its sha256 checksum"), edited.getMessage());
        Files.writeString(one, original);
        PopulationRun.run(e, resume, (d, t) -> { });
        assertEquals(Files.readString(whole.resolve("population.csv")), Files.readString(cut.resolve("population.csv")));
        assertEquals(Files.readString(whole.resolve("abundance.csv")), Files.readString(cut.resolve("abundance.csv")));
        assertTrue(!Files.exists(units), "the checkpoint is deleted after the outputs");
    }

    /** Invasion streams derive from (question seed, invasion index): the tallies do not depend on threads. */
    @Test
    void talliesDoNotDependOnThreads() {
        PopulationExperiment e = smallDemo();
        PopulationAnalysis.Result one = PopulationRun.compute(e, 1, (d, t) -> { });
        PopulationAnalysis.Result two = PopulationRun.compute(e, 2, (d, t) -> { });
        for (int i = 0; i < one.rows().size(); i++) {
            assertEquals(one.rows().get(i).tally(), two.rows().get(i).tally(), "row " + i);
        }
    }

    /** A simulated count far from (c)'s rho is a disagreement and sets the exit code. */
    @Test
    void aDisagreementOfBasisCIsCaught() {
        PopulationExperiment e = smallDemo();
        PopulationExperiment.Point p = e.points().get(0);
        PopulationAnalysis.PointExact x = PopulationAnalysis.exact(e, p);
        Map<PopulationAnalysis.Key, InvasionTally> t = new HashMap<>();
        t.put(new PopulationAnalysis.Key(0, 0, 1), new InvasionTally(1000, 900, 900, BigInteger.valueOf(900), 1000,
            1000));
        PopulationAnalysis.Result r = PopulationAnalysis.analyse(e, List.of(x), t);
        assertEquals(1, r.exitCode());
        assertEquals("disagrees", r.rows().get(2).verdict());
    }

    /**
     * An explicit mutation rate: the simulated abundance of one long run (batch means) against the exact
     * stationary distribution of the population chain with basis (c). Failure budget: one test at alpha =
     * 0.001 (batch means is asymptotic in the run length; 2 x 10^5 updates are many mixing times for N = 6).
     */
    @Test
    void explicitMutationAbundanceIsSimulatedAndAgrees() throws Exception {
        Path f = tmp.resolve("m.yaml");
        Files.writeString(f, "experiment: m\npopulation:\n  strategies: [wsls, alld]\n  mutation: 0.05\n"
            + "  invasions: 0\n  updates: 200000\ngrid:\n  size: [6]\n  selection: [1]\n  noise: [0.05]\n"
            + "  rounds: [5]\nseed: 5\nalpha: 0.001\n");
        PopulationExperiment e = PopulationFile.read(f);
        PopulationAnalysis.Result r = PopulationRun.compute(e, 2, (d, t) -> { });
        assertEquals(0, r.exitCode());
        PopulationAnalysis.AbundanceRow c = r.abundances().stream().filter(a -> a.basis()
            == PopulationAnalysis.Basis.REALISED && a.strategy() == 0).findFirst().orElseThrow();
        assertEquals("consistent", c.verdict());
        assertTrue(c.interval().contains(c.abundance()), c.toString());
        assertEquals(3 * 2, r.abundances().size());
    }

    /** check on a population file refuses --resume and --shard with one line and exit 2. */
    @Test
    void checkRefusesShardsForPopulations() {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Main.run(new String[] {"check", DEMO.toString(), "--shard", "1/2", "--out", tmp.resolve("o")
            .toString()}, new PrintWriter(out), new PrintWriter(err));
        assertEquals(Main.BAD_INPUT, code);
        assertTrue(err.toString().contains("not available for population experiments"), err.toString());
    }
}
