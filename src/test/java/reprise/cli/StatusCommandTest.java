package reprise.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import reprise.run.ShardStatus;

/**
 * {@code status} reads a sharded run's state from its files: done, unfinished (a checkpoint), not started,
 * merged; and names the next command (no external source: the states are the run layer's own files).
 */
class StatusCommandTest {

    @TempDir
    Path tmp;

    @Test
    void namesDoneUnfinishedAndMissingShardsAndTheNextCommand() throws IOException {
        Path experiment = tmp.resolve("small.yaml");
        Files.writeString(experiment, ShardsTest.SMALL);
        Path dir = tmp.resolve("run");
        for (int i : new int[] {1, 3}) {
            ShardsTest.Run r = ShardsTest.run("check", experiment.toString(), "--shard", i + "/4", "--out",
                dir.toString(), "--quiet", "--threads", "1");
            assertEquals(0, r.code(), r.err());
        }
        Path checkpoint = Files.createDirectories(dir.resolve("shards/.checkpoint-4-of-4"));
        Files.writeString(checkpoint.resolve("case-00001-chunk-00000.json"), "{}");
        Files.createDirectories(dir.resolve("slurm"));
        Files.writeString(dir.resolve("slurm/jobs"), "array 987654321 merge 987654322 tasks 4 script /x/submit.sh "
            + "submitted 2026-01-01T00:00:00Z \n");

        ShardsTest.Run r = ShardsTest.run("status", dir.toString());
        assertEquals(Main.DISAGREES, r.code(), r.err());
        assertTrue(r.out().startsWith(dir + ": 4 shards: 2 done, 1 started but unfinished, 1 not started; not merged\n"),
            r.out());
        assertTrue(r.out().contains("unfinished (a re-run resumes from the checkpoint): 4 (1 units saved)"), r.out());
        assertTrue(r.out().contains("not started or lost before a unit was saved: 2\n"), r.out());
        assertTrue(r.out().contains("slurm: array job 987654321, merge job 987654322"), r.out());
        assertTrue(r.out().contains("next: bash /x/submit.sh --array=2,4\n"), r.out());

        Files.delete(checkpoint.resolve("case-00001-chunk-00000.json"));
        Files.delete(checkpoint);
        for (int i : new int[] {2, 4}) {
            assertEquals(0, ShardsTest.run("check", experiment.toString(), "--shard", i + "/4", "--out", dir.toString(),
                "--quiet", "--threads", "1").code());
        }
        r = ShardsTest.run("status", dir.toString());
        assertTrue(r.out().contains("next: reprise merge " + dir + "\n"), r.out());
        assertEquals(0, ShardsTest.run("merge", dir.toString(), "--threads", "2").code());
        r = ShardsTest.run("status", dir.toString());
        assertEquals(Main.OK, r.code(), r.out());
        assertTrue(r.out().contains("merged (run.json written)") && r.out().contains("next: nothing"), r.out());
    }

    @Test
    void withoutFilesItAsksForTheTaskCount() {
        ShardsTest.Run r = ShardsTest.run("status", tmp.toString());
        assertEquals(Main.BAD_INPUT, r.code());
        assertTrue(r.err().startsWith("reprise status: " + tmp + " holds no shard files"), r.err());
        r = ShardsTest.run("status", tmp.toString(), "--tasks", "3");
        assertTrue(r.out().contains("next: for each shard I in 1-3: reprise check FILE --shard I/3"), r.out());
    }

    @Test
    void arrayRanges() {
        assertEquals("1-3,7,9-10", ShardStatus.ranges(List.of(1, 2, 3, 7, 9, 10)));
        assertEquals("", ShardStatus.ranges(List.of()));
    }
}
