package reprise.experiment;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import reprise.game.Horizon;

class ExperimentFileTest {

    @TempDir
    Path dir;

    static final String VALID = String.join("\n",
        "experiment: sweep",
        "description: a small sweep",
        "game: pd:3,0,5,1",
        "pairs:",
        "  - {name: keepers, x: tft, y: gtft}",
        "  - name: extorted",
        "    x: 'extort:chi={chi},phi=0.05'",
        "    y: wsls",
        "grid:",
        "  noise: [0.01, '0.02,0.03']",
        "  rounds: [50, 200]",
        "  parameters:",
        "    chi: [2, 3]",
        "replicates: 500",
        "seed: 7",
        "snapshots: [1, 10]",
        "");

    private Path write(String name, String text) throws IOException {
        Path p = dir.resolve(name);
        Files.writeString(p, text);
        return p;
    }

    @Test
    void validFileExpandsPairMajorWithTheHorizonInnermost() throws IOException {
        Experiment e = ExperimentFile.read(write("ok.yaml", VALID));
        assertEquals("sweep", e.name());
        assertEquals(500, e.replicates());
        assertEquals(Path.of("results/sweep"), e.output(), "the default is relative to the working directory");
        List<Case> cases = e.cases();
        // keepers: 2 noise x 2 rounds; extorted: 2 chi x 2 noise x 2 rounds
        assertEquals(4 + 8, cases.size());
        assertEquals("keepers/noise=0.01/rounds=50", cases.get(0).id());
        assertEquals("keepers/noise=0.01/rounds=200", cases.get(1).id());
        assertEquals("extorted/chi=3/noise=0.02,0.03/rounds=200", cases.get(11).id());
        assertEquals("extort:chi=3,phi=0.05", cases.get(11).xSpec());
        assertEquals(0.03, cases.get(11).match().noise().executionY());
        assertEquals(Horizon.rounds(200), cases.get(11).horizon());
        assertEquals(Map.of("chi", 3.0), cases.get(11).parameters());
    }

    /**
     * Pairs that use different subsets of the parameters: each pair varies over its own parameters only,
     * first parameter outermost, and the count taken before expansion (which refuses huge grids) is the
     * number of cases expanded. Expected ids written out by hand from the rule in README ("Experiment files").
     */
    @Test
    void eachPairVariesOverItsOwnParametersAndTheCountMatches() throws IOException {
        Experiment e = ExperimentFile.read(write("subsets.yaml", String.join("\n",
            "experiment: subsets",
            "pairs:",
            "  - {name: one, x: 'reactive:{p},0.1', y: tft}",
            "  - {name: both, x: 'reactive:{p},{q}', y: tft}",
            "  - {name: other, x: 'reactive:0.9,{q}', y: tft}",
            "grid:",
            "  rounds: [20]",
            "  parameters:",
            "    p: [0.9, 0.8]",
            "    q: [0.1, 0.2, 0.3]",
            "")));
        List<String> ids = e.cases().stream().map(Case::id).toList();
        assertEquals(List.of("one/p=0.9", "one/p=0.8",
            "both/p=0.9/q=0.1", "both/p=0.9/q=0.2", "both/p=0.9/q=0.3",
            "both/p=0.8/q=0.1", "both/p=0.8/q=0.2", "both/p=0.8/q=0.3",
            "other/q=0.1", "other/q=0.2", "other/q=0.3"), ids);
    }

    static Stream<Path> bundledExperiments() throws IOException {
        try (Stream<Path> s = Files.list(Path.of("experiments"))) {
            return s.filter(p -> p.toString().endsWith(".yaml") && !PopulationFile.declares(p)).sorted().toList()
                .stream();
        }
    }

    @ParameterizedTest
    @MethodSource("bundledExperiments")
    void bundledExperimentsAreValid(Path file) {
        Experiment e = ExperimentFile.read(file);
        assertTrue(e.cases().size() >= 2, file.toString());
    }

    @Test
    void continuationCanBeWrittenIntoAStrategy() {
        Experiment e = ExperimentFile.read(Path.of("experiments/zd-continuation.yaml"));
        Case c = e.cases().get(2);
        assertEquals("extort:chi=2,phi=0.1,delta=0.9", c.xSpec());
    }

    @Test
    void theReadmeExamplesAreValid() throws IOException {
        String readme = Files.readString(Path.of("README.md"));
        java.util.regex.Matcher yaml = java.util.regex.Pattern.compile("```yaml\n(.*?)```", java.util.regex.Pattern.DOTALL)
            .matcher(readme);
        java.util.regex.Matcher csv = java.util.regex.Pattern.compile("```csv\n(.*?)```", java.util.regex.Pattern.DOTALL)
            .matcher(readme);
        assertTrue(yaml.find() && csv.find(), "README shows an experiment file and a claims file");
        write("length-claims.csv", csv.group(1));
        Experiment e = ExperimentFile.read(write("length-study.yaml", yaml.group(1)));
        List<Case> cases = e.cases();
        assertEquals(18, cases.size());
        Map<Integer, Map<BaseQuantity, Claims.Claim>> claims = Claims.read(e.claims(), e, cases);
        // The README's value: Nowak & Sigmund (1990), s1 = (q1 + r1 q2)/(1 - r1 r2) with p' = 0.99 p + 0.01 (1 - p),
        // (0.206 + 0.686 * 0.402) / (1 - 0.686 * 0.294) = 0.603485 (computed by hand); here only its parsing is checked.
        assertEquals(0.60349, claims.get(2).get(BaseQuantity.COOPERATION_X).value());
        assertEquals(6, claims.values().stream().filter(m -> m.containsKey(BaseQuantity.PAYOFF_X)).count());
    }

    static Stream<Arguments> badFiles() {
        return Stream.of(
            Arguments.of("experiment: x\npairs: [\n", "syntax: not valid YAML"),
            Arguments.of("experiment: x\nrepliactes: 3\n", ":2: repliactes: unknown key (did you mean 'replicates'?)"),
            Arguments.of(VALID.replace("replicates: 500", "replicates: many"), ":14: replicates: must be a whole number"),
            Arguments.of(VALID.replace("noise: [0.01, '0.02,0.03']", "noise: [1.5]"),
                ":10: grid.noise: must be a probability in [0, 1]: 1.5"),
            Arguments.of(VALID.replace("noise: [0.01, '0.02,0.03']", "noise: [.nan]"), "grid.noise: must be a finite probability"),
            Arguments.of(VALID.replace("rounds: [50, 200]", "continuation: [0.9, 1]"),
                ":11: grid.continuation: must be a probability in [0, 1)"),
            Arguments.of(VALID.replace("rounds: [50, 200]", "rounds: []"), "grid.rounds: is empty"),
            Arguments.of(VALID.replace("rounds: [50, 200]", "rounds: [0]"), "grid.rounds: must be at least 1: 0"),
            Arguments.of(VALID.replace("name: extorted", "name: keepers"), ":6: pairs.name: duplicate case name 'keepers'"),
            Arguments.of(VALID.replace("chi: [2, 3]", "chj: [2, 3]"), "uses {chi} but grid.parameters has no 'chi'"),
            Arguments.of(VALID.replace("y: gtft", "y: gtfx"), ":5: pairs.keepers.y: unknown strategy 'gtfx'"),
            // a pair written over several lines: the problem is on the field's line, not the "- name:" line (6)
            Arguments.of(VALID.replace("    y: wsls", "    y: wslz"), ":8: pairs.extorted.y: unknown strategy 'wslz'"),
            Arguments.of(VALID.replace("chi={chi},phi=0.05", "chi=0.5,phi=0.05"), ":7: pairs.extorted.x: chi must be"),
            Arguments.of(VALID.replace("chi: [2, 3]", "chj: [2, 3]"), ":7: pairs.extorted: uses {chi}"),
            Arguments.of(VALID.replace("chi: [2, 3]", "chi: [0.5]"), "pairs.extorted.x: chi must be"),
            Arguments.of(VALID.replace("game: pd:3,0,5,1", "game: pd:3,0,2,1"), ":3: game: a prisoner's dilemma needs"),
            Arguments.of(VALID.replace("snapshots: [1, 10]", "snapshots: [1, 60]"), "round 60 is past the end"),
            Arguments.of(VALID + "burn_in: 50\n", "burn_in: must be shorter than the shortest game (50 rounds): 50"),
            Arguments.of(VALID + "alpha: 1.5\n", "alpha: must be in (0, 0.5): 1.5"),
            Arguments.of(VALID + "tests: [frequencies, wlad]\n", "tests: unknown value 'wlad'"),
            Arguments.of(VALID + "claims: missing.csv\n", "claims: no such file"),
            Arguments.of("- just\n- a list\n", ":1: file: must be a mapping"),
            Arguments.of("", "file: is empty"));
    }

    @ParameterizedTest
    @MethodSource("badFiles")
    void badFilesNameFileLineAndField(String text, String fragment) throws IOException {
        Path p = write("bad.yaml", text);
        InvalidExperimentException e = assertThrows(InvalidExperimentException.class, () -> ExperimentFile.read(p));
        assertTrue(e.problems().stream().anyMatch(l -> l.contains(fragment) && l.startsWith(p.toString())),
            String.join("\n", e.problems()));
    }

    @Test
    void everyProblemIsReportedAtOnceInFileOrder() throws IOException {
        Path p = write("many.yaml", VALID.replace("y: gtft", "y: gtfx").replace("rounds: [50, 200]", "rounds: [0]")
            + "repliactes: 3\n");
        InvalidExperimentException e = assertThrows(InvalidExperimentException.class, () -> ExperimentFile.read(p));
        List<String> lines = e.problems();
        assertEquals(3, lines.size(), String.join("\n", lines));
        assertTrue(lines.get(0).contains(":5: pairs.keepers.y: unknown strategy 'gtfx'"), lines.get(0));
        assertTrue(lines.get(1).contains(":11: grid.rounds: must be at least 1"), lines.get(1));
        assertTrue(lines.get(2).contains(":17: repliactes: unknown key"), lines.get(2));
    }

    @Test
    void claimsMatchGridPointsAndRefuseStrayRows() throws IOException {
        Experiment e = ExperimentFile.read(write("ok.yaml", VALID));
        List<Case> cases = e.cases();
        Path ok = write("claims.csv", "pair,noise,rounds,CC,payoff_x\nkeepers,0.01,,0.5,\nextorted,,,,2.5\n");
        Map<Integer, Map<BaseQuantity, Claims.Claim>> claims = Claims.read(ok, e, cases);
        assertEquals(0.5, claims.get(0).get(BaseQuantity.CC).value());
        assertEquals(0.5, claims.get(1).get(BaseQuantity.CC).value());
        assertTrue(claims.get(2) == null || !claims.get(2).containsKey(BaseQuantity.CC));
        assertEquals(2.5, claims.get(11).get(BaseQuantity.PAYOFF_X).value());

        Path stray = write("stray.csv", "pair,rounds,CC\nkeepers,75,0.5\n");
        InvalidExperimentException ex = assertThrows(InvalidExperimentException.class, () -> Claims.read(stray, e, cases));
        assertTrue(ex.getMessage().contains(":2: row: matches no grid point"), ex.getMessage());

        Path noPair = write("nopair.csv", "rounds,CX\n50,0.5\n");
        ex = assertThrows(InvalidExperimentException.class, () -> Claims.read(noPair, e, cases));
        assertTrue(ex.getMessage().contains("pair: column is missing"), ex.getMessage());
        assertTrue(ex.getMessage().contains("CX: unknown column"), ex.getMessage());
    }

    /** output: is relative to the experiment file, like claims: (a file in another folder writes beside itself). */
    @Test
    void outputIsRelativeToTheExperimentFile() throws IOException {
        Path sub = Files.createDirectories(dir.resolve("studies"));
        Path file = sub.resolve("rel.yaml");
        Files.writeString(file, VALID + "output: out/rel\n");
        assertEquals(sub.toAbsolutePath().resolve("out/rel").normalize(), ExperimentFile.read(file).output());
        Files.writeString(file, VALID + "output: ../elsewhere\n");
        assertEquals(dir.toAbsolutePath().resolve("elsewhere").normalize(), ExperimentFile.read(file).output());
        Path absolute = dir.toAbsolutePath().resolve("abs");
        Files.writeString(file, VALID + "output: " + absolute + "\n");
        assertEquals(absolute, ExperimentFile.read(file).output());
    }
}
