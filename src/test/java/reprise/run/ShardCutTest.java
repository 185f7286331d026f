package reprise.run;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * Sharded runs through the run layer in this process: one experiment cut several ways (3, 16 and 64
 * shards, each cut finer than its unsharded 4 units: too few units, or for 3 shards one unit larger than
 * the mean shard) merges into files byte-identical to an unsharded run, with every shard doing work; a merge refuses a shard of another build; a shard re-run
 * takes back the units saved in its checkpoint. Identity is the design's claim (units are ranges of game
 * indexes with exact integer tallies), so the checks are byte equality, with no external source.
 */
class ShardCutTest {

    static final String EXPERIMENT = String.join("\n",
        "experiment: cut-test",
        "game: pd:3,0,5,1",
        "pairs:",
        "  - {name: tft-gtft, x: tft, y: gtft}",
        "  - {name: wsls-alld, x: wsls, y: alld}",
        "grid:",
        "  noise: [0.05]",
        "  rounds: [10, 40]",
        "replicates: 400",
        "seed: 91",
        "snapshots: [1, 5]",
        "");
    /** The data files and the figures (drawn in parallel by the merge, serially by the unsharded run). */
    static final List<String> DATA = List.of("results.csv", "cases.csv", "curves.csv");
    static final String VERSION = "test-version";

    @TempDir
    static Path tmp;
    static Path file;
    static Path unsharded;

    @BeforeAll
    static void unshardedRun() throws IOException {
        file = tmp.resolve("cut.yaml");
        Files.writeString(file, EXPERIMENT);
        unsharded = tmp.resolve("unsharded");
        LocalRun.run(Job.load(file, 1), settings(unsharded, 1), RunListener.SILENT);
    }

    static RunSettings settings(Path out, int threads) {
        return new RunSettings(out, threads, false, false, List.of("test"), VERSION);
    }

    static Path shardAll(Path dir, int n) {
        Job job = Job.load(file, 1);
        for (int i = 1; i <= n; i++) {
            ShardRun.Written w = ShardRun.run(job, new Part(i, n), settings(dir, 1), RunListener.SILENT);
            assertTrue(w.units() >= 1 && w.rounds() > 0, "shard " + i + " of " + n + " did no work");
            assertFalse(Files.exists(ShardRun.checkpointFolder(dir, new Part(i, n))), "checkpoint left by shard " + i);
        }
        return dir;
    }

    @ParameterizedTest
    @ValueSource(ints = {3, 16, 64})
    void everyCutMergesToTheUnshardedFiles(int n) throws IOException {
        Path dir = shardAll(tmp.resolve("n" + n), n);
        Job job = Job.load(file, 1);
        int units = job.units(n).size();
        assertTrue(units >= 2 * n, "units cut for " + n + " shards: " + units);
        Merge.run(dir, ShardSet.read(dir, VERSION), job, settings(null, 2));
        for (String f : DATA) {
            assertArrayEquals(Files.readAllBytes(unsharded.resolve(f)), Files.readAllBytes(dir.resolve(f)),
                f + ", " + n + " shards");
        }
        List<String> figures = figures(unsharded);
        assertEquals(figures, figures(dir), "the same figure files");
        for (String f : figures) {
            if (f.endsWith(".png") || f.endsWith(".svg")) {
                assertArrayEquals(Files.readAllBytes(unsharded.resolve(f)), Files.readAllBytes(dir.resolve(f)),
                    f + ", " + n + " shards");
            }
        }
    }

    static List<String> figures(Path dir) throws IOException {
        List<String> out = new ArrayList<>();
        try (Stream<Path> s = Files.list(dir.resolve("figures"))) {
            s.map(p -> "figures/" + p.getFileName()).sorted().forEach(out::add);
        }
        return out;
    }

    @Test
    void aShardOfAnotherBuildIsRefusedInOneLine() throws IOException {
        Path dir = shardAll(tmp.resolve("builds"), 3);
        Path two = dir.resolve("shards").resolve(new Part(2, 3).fileName());
        UnitFile.Content c = UnitFile.read(two, "shard file");
        UnitFile.Header h = c.header();
        String other = "jar-sha256 " + "0".repeat(64);
        UnitFile.write(two, new UnitFile.Content(new UnitFile.Header(h.run(), h.part(), h.unitsTotal(), h.threads(),
            h.seconds(), other), c.units()));
        IllegalArgumentException ex = assertThrows(IllegalArgumentException.class, () -> ShardSet.read(dir, VERSION));
        assertEquals(dir.resolve("shards") + ": shards from different builds: shard-1-of-3.json was simulated by build "
            + Build.current() + ", shard-2-of-3.json by " + other + "; re-run the shards of one build (check FILE "
            + "--shard I/N with the same jar)", ex.getMessage());
        assertFalse(ex.getMessage().contains("\n"));
        assertFalse(Files.exists(dir.resolve("results.csv")));
    }

    @Test
    void theBuildNamesTheCodeThatRuns() {
        String b = Build.current();
        assertTrue(b.matches("(jar|classes)-sha256 [0-9a-f]{64}( git [0-9a-f]{40})?"), b);
        assertEquals(b, Build.current(), "computed once");
    }

    @Test
    void aShardReRunTakesBackItsCheckpoint() throws IOException {
        Job job = Job.load(file, 1);
        Part part = new Part(2, 5);
        Path whole = tmp.resolve("resume-whole");
        ShardRun.Written uninterrupted = ShardRun.run(job, part, settings(whole, 1), RunListener.SILENT);
        assertTrue(uninterrupted.units() >= 2, "the shard has " + uninterrupted.units() + " units");

        Path dir = tmp.resolve("resume");
        List<WorkPlan.Unit> mine = WorkPlan.shard(job.units(part.shards()), part.shard(), part.shards());
        UnitFile.UnitTally first = UnitFile.read(uninterrupted.file(), "shard file").units().get(0);
        Checkpoint.in(ShardRun.checkpointFolder(dir, part), part).save(job.identity(VERSION),
            job.units(part.shards()).size(), 1, mine.get(0), first.tally());
        ShardRun.Written resumed = ShardRun.run(job, part, settings(dir, 1), RunListener.SILENT);
        assertEquals(1, resumed.resumed(), "units taken back");
        assertEquals(uninterrupted.rounds() - first.tally().roundsTotal(), resumed.rounds(), "rounds simulated again");
        assertEquals(UnitFile.read(uninterrupted.file(), "shard file").units(), UnitFile.read(resumed.file(),
            "shard file").units());
        assertFalse(Files.exists(ShardRun.checkpointFolder(dir, part)), "checkpoint deleted after the shard file");

        Checkpoint.in(ShardRun.checkpointFolder(dir, part), part).save(job.identity("other-version"),
            job.units(part.shards()).size(), 1, mine.get(0), first.tally());
        ShardRun.Written fresh = ShardRun.run(job, part, settings(dir, 1), RunListener.SILENT);
        assertEquals(0, fresh.resumed(), "a checkpoint of another run is discarded, not taken back");
        assertEquals(uninterrupted.rounds(), fresh.rounds());
    }
}
