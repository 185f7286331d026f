package reprise.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Comparator;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.function.Consumer;
import java.util.stream.Stream;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.junit.jupiter.params.provider.ValueSource;
import reprise.experiment.Experiment;
import reprise.experiment.ExperimentFile;
import reprise.run.Part;
import reprise.run.UnitFile;
import reprise.run.WorkPlan;

/**
 * Sharded runs without a scheduler: shard assignment, merged results against an unsharded run, shard
 * numbers from Slurm variables, merge errors (one line, exit 2, nothing written) and the job script.
 */
class ShardsTest {

    /**
     * Four cases of one unit each; N = 7 therefore leaves three shards empty. The runs that use it (here and
     * in SlurmIntegrationTest, two seeds) assert exit 0, so they run at alpha = 1e-4 with Holm's correction:
     * each run raises a false alarm with probability at most 1e-4 (family-wise), so a deliberate simulator
     * change fails these runs with probability at most 2e-4 unless something is really wrong.
     */
    static final String SMALL = """
        experiment: shard-test
        description: Small experiment for sharded runs.
        game: pd:3,0,5,1
        pairs:
          - name: tft-gtft
            x: tft
            y: gtft
          - name: wsls-wsls
            x: wsls
            y: wsls
        grid:
          noise: [0.05]
          rounds: [10, 40]
        replicates: 300
        seed: 77
        alpha: 0.0001
        tolerance: 0.02
        snapshots: [1, 5]
        """;

    /** A plan-only experiment (never simulated here): long games, so cases are cut into several chunks. */
    static final String LARGE = """
        experiment: shard-plan
        game: pd:3,0,5,1
        pairs:
          - name: tft-gtft
            x: tft
            y: gtft
        grid:
          noise: [0.01, 0.05]
          rounds: [10, 1000, 300000, 1000000]
        replicates: 1000
        seed: 1
        """;

    static final List<String> COMPARED = List.of("results.csv", "cases.csv", "curves.csv");

    @TempDir
    static Path tmp;
    static Path experiment;
    static Path unsharded;

    record Run(int code, String out, String err) {
    }

    static Run run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Main.run(args, new PrintWriter(out), new PrintWriter(err));
        return new Run(code, out.toString(), err.toString());
    }

    @BeforeAll
    static void unshardedRun() throws IOException {
        experiment = tmp.resolve("small.yaml");
        Files.writeString(experiment, SMALL);
        unsharded = tmp.resolve("unsharded");
        Run r = run("check", experiment.toString(), "--out", unsharded.toString(), "--quiet", "--threads", "2");
        assertEquals(0, r.code(), r.err());
    }

    static Path shardAll(Path dir, int n) {
        for (int i = 1; i <= n; i++) {
            Run r = run("check", experiment.toString(), "--shard", i + "/" + n, "--out", dir.toString(), "--quiet",
                "--threads", "1");
            assertEquals(0, r.code(), r.err());
            assertTrue(Files.isRegularFile(dir.resolve("shards").resolve(new Part(i, n).fileName())), r.out());
        }
        return dir;
    }

    static Stream<Arguments> assignments() throws IOException {
        Path f = Files.createTempFile("shard-plan", ".yaml");
        Files.writeString(f, LARGE);
        Experiment e = ExperimentFile.read(f);
        Files.delete(f);
        List<WorkPlan.Unit> units = WorkPlan.units(e, e.cases());
        return Stream.of(1, 2, 3, 7, 16, units.size(), units.size() + 5).map(n -> Arguments.of(units, n));
    }

    /**
     * Every unit is in exactly one shard, for N below, at and above the number of units; and the greedy
     * balance bound holds: max load - min load &le; the largest unit (list scheduling, largest first: the
     * last unit added to the fullest shard went to the then least loaded one; Graham, R.L. (1969). Bounds
     * on multiprocessing timing anomalies. SIAM J. Appl. Math. 17, 416-429).
     */
    @ParameterizedTest
    @MethodSource("assignments")
    void everyUnitInExactlyOneShard(List<WorkPlan.Unit> units, int n) {
        assertTrue(units.size() > 8, "the plan must cut cases into chunks: " + units.size());
        Map<WorkPlan.Unit, Integer> seen = new HashMap<>();
        double max = 0;
        double min = Double.POSITIVE_INFINITY;
        for (int i = 1; i <= n; i++) {
            double load = 0;
            for (WorkPlan.Unit u : WorkPlan.shard(units, i, n)) {
                Integer before = seen.put(u, i);
                assertEquals(null, before, u + " in shards " + before + " and " + i);
                load += u.expectedRounds();
            }
            max = Math.max(max, load);
            min = Math.min(min, load);
        }
        assertEquals(units.size(), seen.size());
        double largest = units.stream().mapToDouble(WorkPlan.Unit::expectedRounds).max().orElseThrow();
        assertTrue(max - min <= largest * (1 + 1e-12), "loads " + min + " to " + max + ", largest unit " + largest);
    }

    @ParameterizedTest
    @ValueSource(ints = {1, 2, 3, 7})
    void mergedIsBitIdenticalToUnsharded(int n) throws IOException {
        Path dir = shardAll(tmp.resolve("n" + n), n);
        Run m = n == 2 ? run("check", experiment.toString(), "--merge", dir.toString())
            : run("merge", dir.toString());
        assertEquals(0, m.code(), m.err());
        assertTrue(m.out().startsWith("shard-test: 4 cases"), m.out());
        for (String f : COMPARED) {
            assertArrayEquals(Files.readAllBytes(unsharded.resolve(f)), Files.readAllBytes(dir.resolve(f)), f + ", N = " + n);
        }
        assertTrue(Files.isRegularFile(dir.resolve("run.json")));
        assertTrue(Files.isRegularFile(dir.resolve("report.md")));
    }

    @Test
    void moreShardsThanUnitsCutUnitsFinerAndRerunsReplaceTheirOwn() throws IOException {
        Path dir = shardAll(tmp.resolve("finer"), 7);
        for (int i = 1; i <= 7; i++) {
            ObjectNode s = (ObjectNode) Json.MAPPER.readTree(dir.resolve("shards/shard-" + i + "-of-7.json").toFile());
            assertTrue(s.get("units").size() >= 1, "4 units cut finer for 7 shards leave shard " + i + " without work");
            assertTrue(s.get("units_total").asInt() >= 14, "at least 2N units: " + s.get("units_total"));
            assertEquals(7, s.get("shards").asInt());
        }
        Path one = dir.resolve("shards/shard-1-of-7.json");
        int unitsOfOne = Json.MAPPER.readTree(one.toFile()).get("units").size();
        Files.writeString(one, "not json");
        Run r = run("check", experiment.toString(), "--shard", "1/7", "--out", dir.toString(), "--quiet");
        assertEquals(0, r.code(), r.err());
        try (Stream<Path> files = Files.list(dir.resolve("shards"))) {
            assertEquals(7, files.count(), "a re-run replaces its file and leaves no temporary file or checkpoint");
        }
        assertEquals(unitsOfOne, Json.MAPPER.readTree(one.toFile()).get("units").size());
    }

    @Test
    void shardsBeyondTheGamesStayEmptyButWriteAFile() throws IOException {
        Path tiny = tmp.resolve("tiny.yaml");
        Files.writeString(tiny, SMALL.replace("replicates: 300", "replicates: 2"));
        Path dir = tmp.resolve("tiny");
        for (int i = 1; i <= 9; i++) {
            Run r = run("check", tiny.toString(), "--shard", i + "/9", "--out", dir.toString(), "--quiet");
            assertEquals(0, r.code(), r.err());
        }
        ObjectNode s9 = (ObjectNode) Json.MAPPER.readTree(dir.resolve("shards/shard-9-of-9.json").toFile());
        assertEquals(0, s9.get("units").size(), "4 cases of 2 games are at most 8 units: shard 9 of 9 is empty");
        assertEquals(8, s9.get("units_total").asInt());
    }

    @ParameterizedTest
    @ValueSource(strings = {"2/5", "5/5", "1/1", " 3 / 4 "})
    void explicitShardNumbers(String value) {
        int[] in = Shards.parse(value, Map.of());
        String[] p = value.split("/");
        assertArrayEquals(new int[] {Integer.parseInt(p[0].trim()), Integer.parseInt(p[1].trim())}, in);
    }

    @ParameterizedTest
    @ValueSource(strings = {"0/3", "4/3", "1/0", "a/b", "3", "1/2/3", ""})
    void badShardNumbers(String value) {
        IllegalArgumentException ex = assertThrows(IllegalArgumentException.class, () -> Shards.parse(value, Map.of()));
        assertEquals("--shard must be I/N with 1 <= I <= N <= 4000000 (or 'slurm'): " + value, ex.getMessage());
    }

    static Stream<Arguments> slurmEnvironments() {
        return Stream.of(
            Arguments.of(Map.of("SLURM_ARRAY_TASK_ID", "3", "SLURM_ARRAY_TASK_COUNT", "4", "SLURM_ARRAY_TASK_MIN", "1",
                "SLURM_ARRAY_TASK_MAX", "4"), "3/4"),
            Arguments.of(Map.of("SLURM_ARRAY_TASK_ID", "1", "SLURM_ARRAY_TASK_COUNT", "1", "SLURM_ARRAY_TASK_MIN", "1",
                "SLURM_ARRAY_TASK_MAX", "1"), "1/1"),
            Arguments.of(Map.of("SLURM_ARRAY_TASK_ID", "0", "SLURM_ARRAY_TASK_COUNT", "4", "SLURM_ARRAY_TASK_MIN", "0",
                "SLURM_ARRAY_TASK_MAX", "3"), "task ids 0 to 3 (4 tasks)"),
            Arguments.of(Map.of("SLURM_ARRAY_TASK_ID", "7", "SLURM_ARRAY_TASK_COUNT", "2", "SLURM_ARRAY_TASK_MIN", "3",
                "SLURM_ARRAY_TASK_MAX", "7"), "task ids 3 to 7 (2 tasks)"),
            Arguments.of(Map.of(), "SLURM_ARRAY_TASK_ID is not set"));
    }

    /** Array 1..N maps task id I to shard I; arrays from 0, subsets and missing variables are refused. */
    @ParameterizedTest
    @MethodSource("slurmEnvironments")
    void shardNumbersFromSlurm(Map<String, String> env, String expected) {
        if (expected.matches("\\d+/\\d+")) {
            assertArrayEquals(Shards.parse(expected, Map.of()), Shards.parse(Shards.FROM_SLURM, env));
        } else {
            IllegalArgumentException ex = assertThrows(IllegalArgumentException.class,
                () -> Shards.parse(Shards.FROM_SLURM, env));
            assertTrue(ex.getMessage().contains(expected), ex.getMessage());
            assertTrue(ex.getMessage().contains("--shard"), ex.getMessage());
        }
    }

    static Path base;

    static synchronized Path baseShards() {
        if (base == null) {
            base = shardAll(tmp.resolve("base"), 3);
        }
        return base;
    }

    static void editShard(Path dir, int i, Consumer<ObjectNode> edit) {
        try {
            Path f = dir.resolve("shards").resolve(new Part(i, 3).fileName());
            ObjectNode o = (ObjectNode) Json.MAPPER.readTree(f.toFile());
            edit.accept(o);
            o.put("sha256", UnitFile.checksum(o));
            Files.writeString(f, Json.MAPPER.writeValueAsString(o));
        } catch (IOException ex) {
            throw new java.io.UncheckedIOException(ex);
        }
    }

    interface Damage {
        void apply(Path dir) throws IOException;
    }

    static Stream<Arguments> damagedShards() {
        return Stream.of(
            Arguments.of("missing shard", (Damage) d -> Files.delete(d.resolve("shards/shard-2-of-3.json")),
                "missing shard 2 of 3"),
            Arguments.of("two missing", (Damage) d -> {
                Files.delete(d.resolve("shards/shard-1-of-3.json"));
                Files.delete(d.resolve("shards/shard-3-of-3.json"));
            }, "missing shards 1, 3 of 3"),
            Arguments.of("mismatched hash", (Damage) d -> editShard(d, 3, o -> o.put("experiment_sha256", "0".repeat(64))),
                "shards from different runs: shard-1-of-3.json has experiment file SHA-256"),
            Arguments.of("different seed", (Damage) d -> editShard(d, 2, o -> o.put("seed", 78)),
                "shard-1-of-3.json has seed 77, shard-2-of-3.json has 78"),
            Arguments.of("different tool version", (Damage) d -> editShard(d, 2, o -> o.put("tool_version", "0.9")),
                "has tool version development, shard-2-of-3.json has 0.9"),
            Arguments.of("duplicated shard", (Damage) d -> Files.copy(d.resolve("shards/shard-1-of-3.json"),
                d.resolve("shards/shard-1-of-3-copy.json")), "shard 1 of 3 is there more than once"),
            Arguments.of("stale shard of another N", (Damage) d -> {
                Files.copy(d.resolve("shards/shard-1-of-3.json"), d.resolve("shards/shard-1-of-2.json"));
                Path f = d.resolve("shards/shard-1-of-2.json");
                ObjectNode o = (ObjectNode) Json.MAPPER.readTree(f.toFile());
                o.put("shards", 2);
                Files.writeString(f, Json.MAPPER.writeValueAsString(o.put("sha256", UnitFile.checksum(o))));
            }, "mixes runs cut into 2 and 3 shards (shard-1-of-2.json, shard-1-of-3.json)"),
            Arguments.of("unit moved", (Damage) d -> editShard(d, 1, o -> ((ObjectNode) o.get("units").get(0))
                .put("chunk", 9)), "but this experiment's shard 1 has case"),
            Arguments.of("changed experiment file", (Damage) d -> {
                for (int i = 1; i <= 3; i++) {
                    editShard(d, i, o -> o.put("experiment_file", d.resolve("edited.yaml").toString()));
                }
                Files.writeString(d.resolve("edited.yaml"), SMALL.replace("replicates: 300", "replicates: 301"));
            }, "is not the experiment file the shards ran"),
            Arguments.of("no shards", (Damage) d -> {
                try (Stream<Path> s = Files.walk(d.resolve("shards"))) {
                    s.sorted(Comparator.reverseOrder()).forEach(p -> p.toFile().delete());
                }
            }, "does not exist: no shards to merge"),
            Arguments.of("edited counts", (Damage) d -> {
                Path f = d.resolve("shards/shard-2-of-3.json");
                ObjectNode o = (ObjectNode) Json.MAPPER.readTree(f.toFile());
                com.fasterxml.jackson.databind.node.ArrayNode states = (com.fasterxml.jackson.databind.node.ArrayNode)
                    o.get("units").get(0).get("tally").get("states");
                long first = states.get(0).asLong();
                states.set(0, states.get(3).asLong());
                states.set(3, first);
                Files.writeString(f, Json.MAPPER.writeValueAsString(o));
            }, "shard-2-of-3.json: shard file fails its sha256 checksum"),
            Arguments.of("seed of the wrong kind", (Damage) d -> editShard(d, 2, o -> o.put("seed", "one")),
                "shard-2-of-3.json: field seed must be a whole number: \"one\""),
            Arguments.of("unreadable shard", (Damage) d -> Files.writeString(d.resolve("shards/shard-2-of-3.json"), "{"),
                "shard-2-of-3.json: cannot be read as a shard file"));
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("damagedShards")
    void mergeRefusesDamagedShards(String what, Damage damage, String message) throws IOException {
        Path dir = tmp.resolve("damaged-" + what.replace(' ', '-'));
        copy(baseShards().resolve("shards"), dir.resolve("shards"));
        damage.apply(dir);
        Run r = run("merge", dir.toString());
        assertEquals(2, r.code(), r.err());
        assertEquals("", r.out());
        assertEquals(1, r.err().lines().count(), r.err());
        assertTrue(r.err().startsWith("reprise merge: "), r.err());
        assertTrue(r.err().contains(message), r.err());
        for (String f : List.of("results.csv", "cases.csv", "curves.csv", "report.md", "run.json", "figures")) {
            assertFalse(Files.exists(dir.resolve(f)), f + " written after: " + r.err());
        }
    }

    @Test
    void checkMergeWithAnotherFileIsRefused() throws IOException {
        Path dir = tmp.resolve("other-file");
        copy(baseShards().resolve("shards"), dir.resolve("shards"));
        Path other = tmp.resolve("other.yaml");
        Files.writeString(other, SMALL.replace("seed: 77", "seed: 78"));
        Run r = run("check", other.toString(), "--merge", dir.toString());
        assertEquals(2, r.code(), r.err());
        assertTrue(r.err().contains(other + " is not the experiment file the shards ran"), r.err());
        assertFalse(Files.exists(dir.resolve("results.csv")));
    }

    @ParameterizedTest
    @ValueSource(strings = {"--resume", "--merge"})
    void shardCombinationsAreRefused(String option) {
        Path dir = tmp.resolve("combination");
        String[] args = option.equals("--merge")
            ? new String[] {"check", experiment.toString(), "--shard", "1/2", "--merge", dir.toString()}
            : new String[] {"check", experiment.toString(), "--shard", "1/2", "--resume", "--out", dir.toString()};
        Run r = run(args);
        assertEquals(2, r.code(), r.err());
        assertTrue(r.err().startsWith("reprise check: "), r.err());
        assertFalse(Files.exists(dir));
    }

    /**
     * The estimates of the class comment, computed by hand from the documented rules. 1e12 rounds at 5e7
     * rounds/s need ceil(1e12 / 1.8e11) = 6 cpus and 3 * 1e12 / 3e8 + 60 = 10060 s, rounded up to 10080 s;
     * with 1 MiB tallies and 10 units, heap 128 + 6 * 16 + (6 + 1 + 30) * 1 = 261 MB, rounded up to 320 MB,
     * mem 320 + 192 = 512 MB. A tiny shard gets the minima: 1 cpu, 5 minutes, heap 128 + 16 + 5 * 4096 B,
     * rounded up to 192 MB. With 100 MiB tallies the sum 128 + 16 + 5 * 100 = 644 MB is above the simulator's
     * floor 2 * 2 * 100 = 400 MB: 704 MB. A merge of 18 cases and 20 units at 0.5 s per case: 8 cpus, 60 + 3 *
     * (18 * 0.5 / 8 + 0.02) = 63.4 s, raised to 5 minutes; heap 256 + 8 * 64 + 3 * 20 * 1 = 828 MB, 832 MB.
     */
    @Test
    void resourceEstimate() {
        long mib = 1024 * 1024;
        assertEquals(new SlurmScriptCommand.Estimate(6, 10080, 320, 512), SlurmScriptCommand.estimate(1e12, 5e7, mib,
            10));
        assertEquals(new SlurmScriptCommand.Estimate(1, 300, 192, 384), SlurmScriptCommand.estimate(1e6, 5e7, 4096, 1));
        assertEquals(new SlurmScriptCommand.Estimate(1, 300, 704, 896), SlurmScriptCommand.estimate(1e6, 5e7,
            100 * mib, 1));
        assertEquals(8, SlurmScriptCommand.estimate(1e15, 5e7, 0, 1).cpus(), "capped");
        assertEquals(new SlurmScriptCommand.Estimate(8, 300, 832, 1024), SlurmScriptCommand.mergeEstimate(18, 20, 0.5,
            mib, 8));
    }

    @Test
    void maxArraySizeIsReadFromTheConfiguration() {
        assertEquals(java.util.OptionalLong.of(10001), SlurmScriptCommand.parseMaxArraySize(
            "Configuration data as of 2026-01-01T00:00:00\nMaxArraySize            = 10001\nMaxJobCount = 10000\n"));
        assertTrue(SlurmScriptCommand.parseMaxArraySize("MaxJobCount = 10000\n").isEmpty());
    }

    @Test
    void jobScriptIsValidBash() throws Exception {
        Path script = tmp.resolve("job.sh");
        Run r = run("slurm-script", experiment.toString(), "--tasks", "4", "--out", tmp.resolve("cluster").toString(),
            "--partition", "short", "--account", "proj-7", "--qos", "low", "--constraint", "avx2&ib", "--clusters",
            "c1", "--sbatch=--mail-type=FAIL", "--setup", "module load java/17", "--throttle", "2", "--rate", "5e7",
            "--jar", "/opt/reprise.jar", "--script", script.toString());
        assertEquals(0, r.code(), r.err());
        String text = Files.readString(script, StandardCharsets.UTF_8);
        for (String line : List.of("#SBATCH --array=1-4%2", "#SBATCH --cpus-per-task=1", "#SBATCH --time=0:05:00",
            "#SBATCH --mem=384M", "#SBATCH --partition=short", "#SBATCH --account=proj-7", "#SBATCH --qos=low",
            "#SBATCH --constraint=avx2&ib", "#SBATCH --clusters=c1", "#SBATCH --mail-type=FAIL",
            "site=('--partition=short' '--account=proj-7' '--qos=low' '--constraint=avx2&ib' '--clusters=c1' "
                + "'--mail-type=FAIL')", "--dependency=afterok:\"$array\"", "\"${site[@]}\" --output=",
            "  module load java/17\n", "--shard \"$SLURM_ARRAY_TASK_ID/4\"", "'/opt/reprise.jar'",
            "merge --force --threads 4".replace("merge --force", "merge '" + tmp.resolve("cluster") + "' --force"))) {
            assertTrue(text.contains(line), line + " in\n" + text);
        }
        assertFalse(text.contains("$0\") --merge") || text.contains("--wrap"), "the merge job must not run this script");
        Process p = new ProcessBuilder("bash", "-n", script.toString()).redirectErrorStream(true).start();
        String out = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
        assertEquals(0, p.waitFor(), out);
    }

    @Test
    void moreTasksThanUnitsOrTheArrayLimitAreWarnedOf() {
        Path tiny = tmp.resolve("few-games.yaml");
        try {
            Files.writeString(tiny, SMALL.replace("replicates: 300", "replicates: 2"));
        } catch (IOException ex) {
            throw new java.io.UncheckedIOException(ex);
        }
        Run r = run("slurm-script", tiny.toString(), "--tasks", "20000", "--rate", "5e7", "--jar", "/opt/reprise.jar");
        assertEquals(0, r.code(), r.err());
        assertTrue(r.err().contains("warning: 20000 tasks but only 8 units (the experiment has 8 games in all): tasks 9 "
            + "to 20000 will do no work; ask for --tasks 8 at most"), r.err());
        assertTrue(r.err().contains("exceed this cluster's array limit (MaxArraySize="), r.err());
        assertTrue(r.err().contains("consider --throttle K"), r.err());
        assertTrue(r.out().contains("#   WARNING: 20000 tasks but only 8 units"), r.out());
    }

    @ParameterizedTest
    @ValueSource(strings = {"--tasks=0", "--rate=0", "--partition=a b", "--account=x'y", "--throttle=0",
        "--setup=a\nb", "--sbatch=--array=1-3", "--sbatch=-x"})
    void jobScriptErrors(String option) {
        Run r = option.startsWith("--tasks") ? run("slurm-script", experiment.toString(), option, "--jar", "/opt/r.jar")
            : run("slurm-script", experiment.toString(), "--tasks", "2", option, "--jar", "/opt/reprise.jar");
        assertEquals(2, r.code(), r.err());
        assertEquals("", r.out());
        String name = option.startsWith("--sbatch") ? "sbatch" : option.substring(2, option.indexOf('='));
        assertTrue(r.err().startsWith("reprise slurm-script: --" + name), r.err());
    }

    static void copy(Path from, Path to) throws IOException {
        Files.createDirectories(to);
        try (Stream<Path> s = Files.list(from)) {
            for (Path p : (Iterable<Path>) s::iterator) {
                Files.copy(p, to.resolve(p.getFileName()));
            }
        }
    }
}
